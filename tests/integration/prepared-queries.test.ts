import fs from 'node:fs';
import { eq, sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { orderEvents, parts } from '../../server/db/schema';
import { preparedOn } from '../../server/db/prepared';
import { createTestDb } from '../support/test-app';

describe('queries prepared once per connection', () => {
  const a = createTestDb();
  const b = createTestDb();
  afterAll(() => {
    for (const { db, dir } of [a, b]) {
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
  const priceOf = (q: typeof a.db, id: number) =>
    preparedOn(q, 'test:price', (h) => h.select({ price: parts.priceCents }).from(parts).where(eq(parts.id, sql.placeholder('id'))).prepare()).get({ id })?.price;

  it('runs the same prepared query on the database and inside its transactions, seeing the transaction\'s writes', () => {
    const { db } = a;
    const id = db.select({ id: parts.id }).from(parts).limit(1).get()!.id;
    const before = priceOf(db, id)!;
    db.transaction((tx) => {
      tx.update(parts).set({ priceCents: before + 1 }).where(eq(parts.id, id)).run();
      expect(priceOf(tx as unknown as typeof db, id)).toBe(before + 1);
    });
    expect(priceOf(db, id)).toBe(before + 1);
    // A rolled-back write is gone for the prepared query too.
    expect(() =>
      db.transaction((tx) => {
        tx.update(parts).set({ priceCents: 1 }).where(eq(parts.id, id)).run();
        throw new Error('roll back');
      }),
    ).toThrow('roll back');
    expect(priceOf(db, id)).toBe(before + 1);
  });

  it('keeps each connection\'s queries apart', () => {
    const id = a.db.select({ id: parts.id }).from(parts).limit(1).get()!.id;
    b.db.update(parts).set({ priceCents: 4242 }).where(eq(parts.id, id)).run();
    expect(priceOf(b.db, id)).toBe(4242);
    expect(priceOf(a.db, id)).not.toBe(4242);
    const insert = (q: typeof a.db) => preparedOn(q, 'test:event', (h) => h.insert(orderEvents).values({ orderId: sql.placeholder('orderId'), status: 'note', note: null }).prepare());
    expect(insert(a.db)).toBe(insert(a.db));
    expect(insert(a.db)).not.toBe(insert(b.db));
  });
});
