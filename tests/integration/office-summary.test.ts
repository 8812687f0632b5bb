import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parts } from '../../server/db/schema';
import { OfficeSummarySchema } from '../../shared/schemas/office-summary';
import { createDealer, createUser } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the Office index counts', () => {
  it('counts what waits for an administrator, and moves when something new waits', async () => {
    const admin = await createUser(t, { role: 'admin' });
    const read = async () => {
      const reply = await admin.client.get('/api/admin/office/summary');
      expect(reply.status).toBe(200);
      return OfficeSummarySchema.parse(reply.body);
    };
    const before = await read();
    const onSale = t.db.select({ n: count() }).from(parts).where(eq(parts.status, 'active')).get()?.n;
    expect(before.activeParts).toBe(onSale);
    expect(before.activeParts).toBeGreaterThan(0);

    await createDealer(t, { status: 'pending' });
    await createDealer(t, { status: 'approved' });
    const after = await read();
    expect(after.pendingApplications).toBe(before.pendingApplications + 1);
    expect(after.activeParts).toBe(before.activeParts);
  });

  it('is for administrators only', async () => {
    const dealer = await createDealer(t);
    expect((await dealer.client.get('/api/admin/office/summary')).status).toBe(403);
    expect((await t.get('/api/admin/office/summary')).status).toBe(401);
  });
});
