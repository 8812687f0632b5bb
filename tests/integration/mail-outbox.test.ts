import net from 'node:net';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startMailFake, type MailFake } from '../../fakes/mail/mail-fake';
import { openDatabase } from '../../server/db/client';
import { mailBodies, mailOutbox, orders } from '../../server/db/schema';
import { createMailOutbox, enqueueMail, retryDelayMs, DEFAULT_OUTBOX_POLICY } from '../../server/services/mail-outbox';
import { createMailer, createRecordingMailer, type Mailer, type MailerPort, type OutgoingMail } from '../../server/services/mailer';
import { MailOutboxListSchema } from '../../shared/schemas/mail-outbox';
import { createCustomer, createDealer, createOrder } from '../support/factories';
import { signIn } from '../support/session';
import { createTestDb, startTestApp, type TestApp } from '../support/test-app';
import { freePort } from '../support/server-process';

// An in-stock gasket from the demo catalogue (catalog-seed): cheap, so many orders fit any credit limit.
const GASKET = 'FLG-50-0201';
const FROM = 'Spoolyard Turbo Supply <orders@spoolyard.test>';

async function until<T>(what: string, check: () => T | undefined | null | false, timeoutMs = 20_000, everyMs = 25): Promise<T> {
  const started = Date.now();
  for (;;) {
    const value = check();
    if (value) return value;
    if (Date.now() - started > timeoutMs) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, everyMs));
  }
}

const message = (n: number): OutgoingMail => ({ to: `buyer${n}@retail.test`, subject: `Notice ${n}`, text: `Notice ${n}`, html: `<p>Notice ${n}</p>` });

describe('mail server down for a while', () => {
  let t: TestApp;
  let deadPort: number;
  let mailer: Mailer;
  let restored: MailFake | null = null;

  beforeAll(async () => {
    deadPort = await freePort();
    // The app's mailer points at a port where nothing listens yet: the mail server is down from the start.
    mailer = createMailer({ host: '127.0.0.1', port: deadPort, from: FROM, timeoutMs: 2_000 });
    // No giving up during the outage: on a busy machine writing all the messages can outlast twelve fast retries.
    t = await startTestApp({ fakes: true, accounts: true, deps: { mailer, mailPolicy: { baseDelayMs: 50, maxDelayMs: 1_000, maxAttempts: 10_000 } } });
  }, 60_000);
  afterAll(async () => {
    await t.close();
    await mailer.close();
    await restored?.close();
  });

  it('keeps every message while it is down and delivers each exactly once after it returns', async () => {
    const before = t.db.select({ id: mailOutbox.id }).from(mailOutbox).all().map((r) => r.id);
    const latencies: number[] = [];
    const timed = async <T>(work: () => Promise<T>) => {
      const started = performance.now();
      const result = await work();
      latencies.push(performance.now() - started);
      return result;
    };

    // Four orders on account from two dealers, three card orders paid through the provider's webhook, three
    // reset requests, and one reset for an address with no account (which must write nothing).
    // Each account the test makes is sent its confirmation link too.
    const dealers = [await createDealer(t), await createDealer(t)];
    const customers = [await createCustomer(t), await createCustomer(t), await createCustomer(t)];
    const expected: Array<{ to: string; subject: RegExp }> = [...dealers, ...customers].map((u) => ({ to: u.email, subject: /confirm your/i }));
    for (let i = 0; i < 4; i += 1) {
      const dealer = dealers[i % 2]!;
      const placed = await timed(() => createOrder(dealer, [{ partNumber: GASKET, quantity: 1 }]));
      expected.push({ to: dealer.email, subject: new RegExp(`Order ${placed.order.number} confirmed`) });
    }
    for (const customer of customers) {
      const placed = await timed(() => createOrder(customer, [{ partNumber: GASKET, quantity: 1 }]));
      expected.push({ to: customer.email, subject: new RegExp(`Order ${placed.order.number} confirmed`) });
      await until(`order ${placed.order.number} paid`, () => t.db.select({ s: orders.status }).from(orders).where(eq(orders.number, placed.order.number)).get()?.s === 'paid');
    }
    const resetMs: number[] = [];
    for (const customer of customers) {
      const started = performance.now();
      const reply = await timed(() => t.send('POST', '/api/auth/request-password-reset', { email: customer.email, redirectTo: '/reset-password' }, { origin: t.url }));
      resetMs.push(performance.now() - started);
      expect(reply.status).toBe(200);
      expected.push({ to: customer.email, subject: /reset your spoolyard password/i });
    }
    const unknownStarted = performance.now();
    expect((await t.send('POST', '/api/auth/request-password-reset', { email: 'nobody-here@retail.test', redirectTo: '/reset-password' }, { origin: t.url })).status).toBe(200);
    const unknownMs = performance.now() - unknownStarted;

    const ours = () =>
      t.db
        .select()
        .from(mailOutbox)
        .innerJoin(mailBodies, eq(mailBodies.outboxId, mailOutbox.id))
        .all()
        .map((r) => ({ ...r.mail_outbox, text: r.mail_bodies.text, html: r.mail_bodies.html }))
        .filter((r) => !before.includes(r.id));
    // Every message was written, and the worker has tried each at least once and kept it waiting with the reason.
    const queued = await until('every message tried once', () => {
      const rows = ours();
      return rows.length === expected.length && rows.every((r) => r.attempts >= 1 && r.state === 'queued' && r.lastError) ? rows : null;
    });
    expect(queued.every((r) => /ECONNREFUSED/.test(r.lastError ?? ''))).toBe(true);
    expect(queued.some((r) => r.recipient === 'nobody-here@retail.test')).toBe(false);

    // Staff see the same in the Office.
    const admin = await signIn(t, 'admin@spoolyard.test');
    const office = MailOutboxListSchema.parse((await admin.get('/api/admin/mail?state=queued')).body);
    expect(office.counts.queued).toBeGreaterThanOrEqual(expected.length);
    expect(office.messages.filter((m) => m.lastError?.includes('ECONNREFUSED')).length).toBeGreaterThanOrEqual(expected.length);

    // The mail server comes back on its port.
    const outageAttempts = queued.reduce((sum, r) => sum + r.attempts, 0);
    const back = performance.now();
    restored = await startMailFake({ smtpPort: deadPort, httpPort: 0, host: '127.0.0.1' });
    await until('every message sent', () => ours().every((r) => r.state === 'sent'), 30_000);
    const drainMs = performance.now() - back;
    // More passes change nothing: a sent message is not sent again.
    await t.mailSettled();
    await new Promise((r) => setTimeout(r, 200));

    const inbox = (await restored.messages());
    for (const e of expected) {
      const copies = inbox.filter((m) => m.to.includes(e.to.toLowerCase()) && e.subject.test(m.subject));
      expect(copies, `${e.to} ${String(e.subject)}`).toHaveLength(1);
    }
    // Nothing else arrived twice either: one delivery per outbox row (the demo accounts' own confirmations included).
    const everyRow = t.db.select({ state: mailOutbox.state }).from(mailOutbox).all();
    expect(everyRow.every((r) => r.state === 'sent')).toBe(true);
    expect(inbox).toHaveLength(everyRow.length);
    const rows = ours();
    expect(rows.every((r) => r.sentAt !== null && r.claimedBy === null)).toBe(true);
    // A reset or confirmation link is not kept once it has gone.
    expect(rows.filter((r) => r.kind === 'password-reset' || r.kind === 'account-confirm').every((r) => r.text === '' && r.html === '')).toBe(true);
    expect(rows.filter((r) => r.kind === 'order-confirmation').every((r) => r.text !== '')).toBe(true);

    const slowest = Math.max(...latencies);
    console.log(
      [
        'mail outage figures:',
        `  messages queued during the outage: ${queued.length} (5 account-confirmation links, 4 account-order confirmations, 3 card-order confirmations from the webhook, 3 reset links)`,
        `  attempts made while down: ${outageAttempts}`,
        `  delivered after the mail server came back: ${inbox.length} (these ${expected.length} and the ${inbox.length - expected.length} demo accounts' confirmations), each exactly once`,
        `  time to drain after it came back: ${Math.round(drainMs)} ms (test retry policy: 50 ms doubling, capped at 1 s; worker every 20 ms)`,
        `  slowest request while mail was down: ${Math.round(slowest)} ms`,
        `  reset requests while mail was down: ${resetMs.map((ms) => Math.round(ms)).join(', ')} ms for accounts, ${Math.round(unknownMs)} ms for an unknown address`,
      ].join('\n'),
    );
  }, 90_000);
});

describe('no request waits for the mail server', () => {
  it('answers a checkout while the mail server accepts the connection and never speaks', async () => {
    // A black hole: it takes the connection and says nothing, so a sender would wait for its greeting timeout.
    const sockets = new Set<net.Socket>();
    const hole = net.createServer((s) => {
      sockets.add(s);
    });
    await new Promise<void>((resolve) => hole.listen(0, '127.0.0.1', () => resolve()));
    const port = (hole.address() as AddressInfo).port;
    const greetingMs = 3_000;
    const mailer = createMailer({ host: '127.0.0.1', port, from: FROM, timeoutMs: greetingMs });
    const t = await startTestApp({ deps: { mailer } });
    try {
      const dealer = await createDealer(t);
      // The worker is already holding a connection to the black hole for an earlier message.
      enqueueMail(t.db, 'dispatch', () => message(0));
      await until('the worker to be waiting on the black hole', () => sockets.size > 0, 5_000);
      const started = performance.now();
      const placed = await createOrder(dealer, [{ partNumber: GASKET, quantity: 1 }]);
      const elapsed = performance.now() - started;
      expect(placed.order.status).toBe('on_account');
      // Far under the greeting timeout a request that waited for the mail server would take (generous bound).
      expect(elapsed).toBeLessThan(greetingMs);
      const row = t.db.select().from(mailOutbox).where(eq(mailOutbox.kind, 'order-confirmation')).get();
      expect(row?.state).not.toBe('sent');
      console.log(`checkout answered in ${Math.round(elapsed)} ms while the mail server held its greeting (a waiting request would take ≥ ${greetingMs} ms)`);
    } finally {
      // Stop the worker first, then cut its hanging connection, so no new attempt starts while the test app closes.
      const stopping = t.app.mailOutbox.stop();
      for (const s of sockets) s.destroy();
      await stopping;
      await t.close();
      await mailer.close();
      await new Promise<void>((resolve) => hole.close(() => resolve()));
    }
  }, 60_000);
});

describe('a message belongs to the transaction of its cause', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ accounts: true });
  }, 60_000);
  afterAll(async () => {
    await t.close();
  });
  const outboxCount = () => t.db.select({ n: sql<number>`count(*)` }).from(mailOutbox).get()!.n;
  const orderCount = () => t.db.select({ n: sql<number>`count(*)` }).from(orders).get()!.n;

  it('a checkout refused for credit writes no message', async () => {
    const dealer = await createDealer(t, { creditLimitCents: 100 });
    const mails = outboxCount();
    expect((await dealer.client.send('POST', '/api/cart/lines', { partNumber: GASKET, quantity: 1 })).status).toBe(201);
    const refused = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-REFUSED' });
    expect(refused.status).toBe(409);
    expect(outboxCount()).toBe(mails);
  });

  it('a change that fails after its message was written leaves no message', () => {
    const dealer = t.db.select({ id: orders.id }).from(orders).limit(1).get();
    const mails = outboxCount();
    const orderId = dealer?.id ?? 1;
    expect(() =>
      t.db.transaction((tx) => {
        t.app.notifications.orders.orderConfirmed(tx, orderId);
        t.app.notifications.dealerApplied(tx, 1);
        throw new Error('the cause failed after its messages were written');
      }),
    ).toThrow(/the cause failed/);
    expect(outboxCount()).toBe(mails);
  });

  it('an order whose confirmation cannot be written is not placed either (one transaction)', async () => {
    const dealer = await createDealer(t);
    expect((await dealer.client.send('POST', '/api/cart/lines', { partNumber: GASKET, quantity: 2 })).status).toBe(201);
    const stockBefore = t.db.$client.prepare('SELECT available FROM parts WHERE part_number = ?').pluck().get(GASKET);
    const orders0 = orderCount();
    const mails = outboxCount();
    t.db.$client.exec(
      "CREATE TRIGGER test_refuse_confirmation BEFORE INSERT ON mail_outbox WHEN NEW.kind = 'order-confirmation' BEGIN SELECT RAISE(ABORT, 'outbox refused for the test'); END",
    );
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      const res = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-ROLLBACK' });
      expect(res.status).toBe(500);
    } finally {
      logged.mockRestore();
      t.db.$client.exec('DROP TRIGGER test_refuse_confirmation');
    }
    expect(orderCount()).toBe(orders0);
    expect(outboxCount()).toBe(mails);
    expect(t.db.$client.prepare('SELECT available FROM parts WHERE part_number = ?').pluck().get(GASKET)).toBe(stockBefore);
    const cart = (await dealer.client.get('/api/cart')).body as { lines: Array<{ partNumber: string; quantity: number }> };
    expect(cart.lines).toEqual([expect.objectContaining({ partNumber: GASKET, quantity: 2 })]);
    // With the outbox writable again the same cart goes through, with its confirmation.
    const placed = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-ROLLBACK' });
    expect(placed.status).toBe(201);
    expect(outboxCount()).toBe(mails + 1);
  });
});

/** A mailer that takes a moment per message, so two workers' passes overlap. */
function slowRecorder(ms: number): MailerPort & { sent: OutgoingMail[] } {
  const sent: OutgoingMail[] = [];
  return {
    sent,
    async send(m) {
      await new Promise((r) => setTimeout(r, ms));
      sent.push(m);
    },
  };
}

describe('the outbox worker', () => {
  it('with two processes on one database file, each message is sent by one of them only', async () => {
    const { db, dir } = createTestDb();
    const other = openDatabase(path.join(dir, 'test.db'));
    try {
      for (let i = 0; i < 60; i += 1) enqueueMail(db, 'dispatch', () => message(i));
      const a = slowRecorder(3);
      const b = slowRecorder(3);
      const first = createMailOutbox({ db, mailer: a, policy: { batchSize: 5 }, holder: 'process-a' });
      const second = createMailOutbox({ db: other, mailer: b, policy: { batchSize: 5 }, holder: 'process-b' });
      await Promise.all([first.drain(), second.drain(), first.drain(), second.drain()]);
      const all = [...a.sent, ...b.sent].map((m) => m.to).sort();
      expect(all).toHaveLength(60);
      expect(new Set(all).size).toBe(60);
      expect(a.sent.length).toBeGreaterThan(0);
      expect(b.sent.length).toBeGreaterThan(0);
      expect(db.select().from(mailOutbox).all().every((r) => r.state === 'sent' && r.attempts === 1)).toBe(true);
      console.log(`two workers on one file: ${a.sent.length} + ${b.sent.length} = 60 messages, none twice`);
    } finally {
      other.$client.close();
      db.$client.close();
    }
  });

  it('gives a claim back when its process stopped mid-send', async () => {
    const { db } = createTestDb();
    enqueueMail(db, 'dispatch', () => message(1));
    // A process claimed it and died: its claim ran out a minute ago.
    db.update(mailOutbox).set({ state: 'sending', claimedBy: 'gone', claimExpiresAt: Date.now() - 60_000, attempts: 1 }).run();
    const recorder = createRecordingMailer();
    await createMailOutbox({ db, mailer: recorder }).drain();
    expect(recorder.sent.map((m) => m.to)).toEqual(['buyer1@retail.test']);
    expect(db.select().from(mailOutbox).get()).toMatchObject({ state: 'sent', attempts: 2 });
    db.$client.close();
  });

  it('backs off 5 s, 10 s, 20 s … up to 15 min, with jitter of a fifth either way', () => {
    const mid = () => 0.5;
    const plain = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11].map((n) => retryDelayMs(n, DEFAULT_OUTBOX_POLICY, mid));
    expect(plain).toEqual([5_000, 10_000, 20_000, 40_000, 80_000, 160_000, 320_000, 640_000, 900_000, 900_000, 900_000]);
    expect(retryDelayMs(3, DEFAULT_OUTBOX_POLICY, () => 0)).toBe(16_000);
    expect(retryDelayMs(3, DEFAULT_OUTBOX_POLICY, () => 0.999999)).toBeLessThanOrEqual(24_000);
    expect(retryDelayMs(30, DEFAULT_OUTBOX_POLICY, () => 0.999999)).toBeLessThanOrEqual(1.2 * 15 * 60_000);
  });

  it('gives up after the last attempt, shows why, and a re-send goes once', async () => {
    const { db } = createTestDb();
    const recorder = createRecordingMailer();
    recorder.failWith(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:9'), { code: 'ECONNREFUSED' }));
    const outbox = createMailOutbox({ db, mailer: recorder, policy: { baseDelayMs: 1, maxDelayMs: 4, maxAttempts: 3 } });
    enqueueMail(db, 'dispatch', () => message(7));
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
    try {
      await until('the message to be given up', () => {
        void outbox.runOnce();
        return db.select().from(mailOutbox).get()?.state === 'failed';
      });
      await outbox.drain();
    } finally {
      warn.mockRestore();
    }
    const failed = db.select().from(mailOutbox).get()!;
    expect(failed).toMatchObject({ state: 'failed', attempts: 3, lastError: 'connect ECONNREFUSED 127.0.0.1:9', sentAt: null });
    expect(outbox.list({ state: 'failed', limit: 50, offset: 0 }).messages).toEqual([expect.objectContaining({ id: failed.id, resendable: true })]);

    recorder.failWith(null);
    outbox.resend(failed.id);
    await outbox.drain();
    expect(recorder.sent).toHaveLength(1);
    expect(db.select().from(mailOutbox).get()).toMatchObject({ state: 'sent', lastError: null });
    // A sent message re-sent goes again, once.
    outbox.resend(failed.id);
    await outbox.drain();
    await outbox.drain();
    expect(recorder.sent).toHaveLength(2);
    db.$client.close();
  });

  it('does not keep a reset link once it has gone, so it cannot be re-sent', async () => {
    const { db } = createTestDb();
    const recorder = createRecordingMailer();
    const outbox = createMailOutbox({ db, mailer: recorder });
    enqueueMail(db, 'password-reset', () => ({ ...message(3), text: 'http://127.0.0.1/reset/secret-token' }));
    await outbox.drain();
    const row = db.select().from(mailOutbox).get()!;
    expect(row).toMatchObject({ state: 'sent' });
    expect(db.select().from(mailBodies).where(eq(mailBodies.outboxId, row.id)).get()).toMatchObject({ text: '', html: '' });
    expect(() => outbox.resend(row.id)).toThrow(/ask for a new one/);
    expect(outbox.list({ limit: 50, offset: 0 }).messages[0]).toMatchObject({ resendable: false });
    db.$client.close();
  });

  it('keeps a message that could not be written as failed, with the reason, and the cause still commits', () => {
    const { db } = createTestDb();
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => {});
    try {
      db.transaction((tx) =>
        enqueueMail(tx, 'dispatch', () => {
          throw new Error('Mail links must be http(s), got javascript:');
        }),
      );
    } finally {
      warn.mockRestore();
    }
    expect(db.select().from(mailOutbox).all()).toEqual([expect.objectContaining({ state: 'failed', lastError: 'Could not be written: Mail links must be http(s), got javascript:' })]);
    db.$client.close();
  });
});

describe('who sees the outbox and the development tools', () => {
  let t: TestApp;
  let production: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ fakes: true, accounts: true });
    production = await startTestApp({ accounts: true, config: { devTools: false } });
  }, 60_000);
  afterAll(async () => {
    await t.close();
    await production.close();
  });

  it('the Office mail list and re-send are for administrators only', async () => {
    const list = await t.send('GET', '/api/admin/mail', undefined, { origin: t.url });
    expect(list.status).toBe(401);
    const customer = await createCustomer(t);
    expect((await customer.client.get('/api/admin/mail')).status).toBe(403);
    expect((await customer.client.send('POST', '/api/admin/mail/1/resend')).status).toBe(403);
    const warehouse = await signIn(t, 'warehouse@spoolyard.test');
    expect((await warehouse.get('/api/admin/mail')).status).toBe(403);
    const admin = await signIn(t, 'admin@spoolyard.test');
    const ok = await admin.get('/api/admin/mail?state=sent');
    expect(ok.status).toBe(200);
    expect(MailOutboxListSchema.parse(ok.body).messages.every((m) => m.state === 'sent')).toBe(true);
    expect((await admin.get('/api/admin/mail?state=lost')).status).toBe(400);
    expect((await admin.send('POST', '/api/admin/mail/999999/resend')).status).toBe(404);
  });

  it('the caught-mail inbox needs a signed-in administrator, even in development', async () => {
    expect((await t.get('/api/dev/mail')).status).toBe(401);
    const customer = await createCustomer(t);
    expect((await customer.client.get('/api/dev/mail')).status).toBe(403);
    const dealer = await signIn(t, 'dealer@spoolyard.test');
    expect((await dealer.get('/api/dev/mail')).status).toBe(403);
    const admin = await signIn(t, 'admin@spoolyard.test');
    expect((await admin.get('/api/dev/mail')).status).toBe(200);
  });

  it('the development tools are absent in production, for an administrator too', async () => {
    const admin = await signIn(production, 'admin@spoolyard.test');
    expect((await admin.get('/api/dev/mail')).status).toBe(404);
    expect((await admin.send('POST', '/api/dev/payments/pi_any/authenticate', { outcome: 'succeed' })).status).toBe(404);
    expect((await production.get('/api/dev/mail')).status).toBe(404);
  });

  it('the card-authentication step stays with the buyer, for their own order only', async () => {
    const stranger = await createCustomer(t);
    expect((await t.send('POST', '/api/dev/payments/pi_someone/authenticate', { outcome: 'succeed' }, { origin: t.url })).status).toBe(401);
    expect((await stranger.client.send('POST', '/api/dev/payments/pi_someone/authenticate', { outcome: 'succeed' })).status).toBe(404);
  });
});
