import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AccountStatement } from '../../shared/schemas/statement';
import { createCustomer, createDealer, createPart, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let floor: Client;
let admin: Client;
let retail: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  [floor, admin, retail] = (await Promise.all([createUser(t, { role: 'warehouse' }), createUser(t, { role: 'admin' }), createCustomer(t)])).map((u) => u.client) as [Client, Client, Client];
}, 60_000);
afterAll(async () => {
  await t.close();
});

const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;
const DAY = 86_400_000;
const daysAgo = (n: number) => new Date(Date.now() - n * DAY).toISOString();

async function accountOrder(client: Client, partNumber: string, po: string) {
  expect((await client.send('POST', '/api/cart/lines', { partNumber, quantity: 1 })).status).toBe(201);
  const res = await client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: po });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return (res.body as { order: { number: string; totalCents: number } }).order;
}

async function dispatch(number: string) {
  const lines = ((await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> }).lines;
  for (const l of lines) expect((await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick })).status).toBe(200);
  expect((await floor.send('POST', `/api/warehouse/orders/${number}/dispatch`, { carrier: 'Tern Parcel', trackingNumber: `TP-${number}`, cartons: 1, weightKg: 2.5 })).status).toBe(200);
}

/** Sends the exchange unit's old core back; the floor credits its deposit to the account as a credit note. */
async function coreCredit(client: Client, number: string) {
  const line = ((await client.get(`/api/orders/${number}`)).body as { lines: Array<{ id: number }> }).lines[0]!;
  const form = new FormData();
  for (const [k, v] of Object.entries({ orderNumber: number, lineId: String(line.id), kind: 'core', quantity: '1', reason: 'Old unit back for the deposit' })) form.set(k, v);
  form.append('photos', new Blob([Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex')], { type: 'image/png' }), 'core.png');
  const created = await client.upload('/api/returns', form);
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const decided = await floor.send('POST', `/api/warehouse/returns/${(created.body as { id: number }).id}/receive`, { decision: 'core-refund', conditionGrade: 'rebuildable' });
  expect(decided.status, JSON.stringify(decided.body)).toBe(200);
  return decided.body as { refundCents: number; creditNoteNumber: string };
}

describe('dealer account statement', () => {
  it('ages open invoices by days past due and reconciles invoices, payments and credit notes to the balance, on screen and in CSV', async () => {
    const { client: dealer, dealerAccountId } = await createDealer(t, { creditLimitCents: 5_000_000, paymentTermsDays: 30 });
    const exchangeA = createPart(t, { condition: 'exchange', priceCents: 60_000, stock: 1 }).partNumber;
    const exchangeD = createPart(t, { condition: 'exchange', priceCents: 80_000, stock: 1 }).partNumber;
    const [plainB, plainC] = [createPart(t, { priceCents: 12_345 }).partNumber, createPart(t, { priceCents: 2_500 }).partNumber];

    const a = await accountOrder(dealer, exchangeA, 'PO-A');
    await dispatch(a.number);
    const creditA = await coreCredit(dealer, a.number);
    const b = await accountOrder(dealer, plainB, 'PO-B');
    const c = await accountOrder(dealer, plainC, 'PO-C');
    const d = await accountOrder(dealer, exchangeD, 'PO-D');
    await dispatch(d.number);
    expect((await admin.send('POST', `/api/admin/dealers/${dealerAccountId}/invoices/${d.number}/paid`, { reference: 'BANK-7781' })).status).toBe(200);
    // A credit note after the invoice was paid is owed to the dealer.
    const creditD = await coreCredit(dealer, d.number);
    // A was placed 100 days ago (due 70 days ago), B 50 days ago (due 20 days ago); C is new.
    t.db.$client.prepare('UPDATE orders SET created_at = ? WHERE number = ?').run(daysAgo(100), a.number);
    t.db.$client.prepare('UPDATE orders SET created_at = ? WHERE number = ?').run(daysAgo(50), b.number);

    const from = daysAgo(200).slice(0, 10);
    const res = await dealer.get(`/api/account/statement?from=${from}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const s = res.body as AccountStatement;
    expect(s.openInvoices.map((i) => [i.number, i.bucket, i.daysPastDue])).toEqual([
      [a.number, 'days61to90', 70],
      [b.number, 'days1to30', 20],
      [c.number, 'current', -30],
    ]);
    expect(s.openInvoices[0]).toMatchObject({ totalCents: a.totalCents, creditedCents: creditA.refundCents, openCents: a.totalCents - creditA.refundCents, purchaseOrder: 'PO-A' });
    expect(s.ageing).toEqual({ current: c.totalCents, days1to30: b.totalCents, days31to60: 0, days61to90: a.totalCents - creditA.refundCents, over90: 0 });

    // The figures reconcile with the database, worked out here independently of the statement.
    const invoiced = one<{ n: number }>("SELECT SUM(total_cents) AS n FROM orders WHERE dealer_account_id = ? AND payment_method = 'account' AND status <> 'cancelled'", dealerAccountId).n;
    const paid = one<{ n: number }>('SELECT SUM(amount_cents) AS n FROM dealer_payments WHERE dealer_account_id = ?', dealerAccountId).n;
    const credited = one<{ n: number }>('SELECT SUM(amount_cents) AS n FROM credit_notes WHERE dealer_account_id = ?', dealerAccountId).n;
    expect(paid).toBe(d.totalCents);
    expect(s.totals).toMatchObject({ broughtForwardCents: 0, invoicedCents: invoiced, paidCents: paid, creditedCents: credited, balanceCents: invoiced - paid - credited });
    const me = (await dealer.get('/api/account/me')).body as { user: { dealer: { openBalanceCents: number } } };
    expect(s.totals.openInvoicesCents).toBe(me.user.dealer.openBalanceCents);
    expect(Object.values(s.ageing).reduce((x, y) => x + y, 0)).toBe(s.totals.openInvoicesCents);
    expect(s.totals.unappliedCreditCents).toBe(creditD.refundCents);
    expect(s.totals.balanceCents).toBe(s.totals.openInvoicesCents - s.totals.unappliedCreditCents);
    expect(s.totals.overdueCents).toBe(s.ageing.days1to30 + s.ageing.days61to90);
    expect(s.totals.availableCreditCents).toBe(5_000_000 - s.totals.openInvoicesCents);
    expect(s.lines.at(-1)!.balanceCents).toBe(s.totals.balanceCents);
    expect(s.lines.map((l) => l.kind)).toEqual(['brought-forward', 'invoice', 'invoice', 'credit-note', 'invoice', 'invoice', 'payment', 'credit-note']);
    expect(s.lines.find((l) => l.kind === 'payment')).toMatchObject({ reference: 'BANK-7781', orderNumber: d.number, creditCents: d.totalCents });
    // The dealer's own credit notes, with the return each came from.
    expect(s.creditNotes.map((n) => [n.number, n.orderNumber, n.amountCents])).toEqual([
      [creditA.creditNoteNumber, a.number, creditA.refundCents],
      [creditD.creditNoteNumber, d.number, creditD.refundCents],
    ]);

    // A later start brings the earlier lines forward as one balance.
    const recent = (await dealer.get(`/api/account/statement?from=${daysAgo(60).slice(0, 10)}`)).body as AccountStatement;
    expect(recent.totals.broughtForwardCents).toBe(a.totalCents);
    expect(recent.totals.balanceCents).toBe(s.totals.balanceCents);
    expect(recent.lines.filter((l) => l.kind === 'invoice').map((l) => l.reference)).toEqual([b.number, c.number, d.number]);

    // The CSV holds the same ledger: brought forward plus debits less credits is the closing balance.
    const csv = await dealer.get(`/api/account/statement.csv?from=${from}`);
    expect(csv.status).toBe(200);
    expect(csv.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(csv.headers.get('content-disposition')).toMatch(/^attachment; filename="statement-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = parse(csv.body as string, { columns: true }) as Array<Record<string, string>>;
    expect(Object.keys(rows[0]!)).toEqual(['date', 'type', 'reference', 'order', 'detail', 'debit_usd', 'credit_usd', 'balance_usd']);
    const cents = (v: string | undefined) => Math.round(Number(v || '0') * 100);
    const invoiceA = rows.find((r) => r.type === 'Invoice' && r.reference === a.number)!;
    expect(invoiceA.debit_usd).toBe((a.totalCents / 100).toFixed(2));
    expect(invoiceA.detail).toContain('PO-A');
    const closing = rows.at(-1)!;
    expect(closing.type).toBe('Closing balance');
    expect(cents(closing.balance_usd)).toBe(s.totals.balanceCents);
    const body = rows.slice(0, -1);
    expect(cents(body[0]!.balance_usd) + body.reduce((sum, r) => sum + cents(r.debit_usd) - cents(r.credit_usd), 0)).toBe(s.totals.balanceCents);
    expect(rows.filter((r) => r.type === 'Credit note').map((r) => r.reference)).toEqual([creditA.creditNoteNumber, creditD.creditNoteNumber]);

    expect((await dealer.get('/api/account/statement?from=tomorrow')).status).toBe(400);
    expect((await dealer.get(`/api/account/statement?from=${daysAgo(-3).slice(0, 10)}`)).status).toBe(400);
    expect((await retail.get('/api/account/statement')).status).toBe(403);
    expect((await t.get('/api/account/statement.csv')).status).toBe(401);
  }, 60_000);

  it('refuses an order on account over the limit, saying by how much with separators in every amount', async () => {
    const { client: dealer } = await createDealer(t, { creditLimitCents: 100_000, paymentTermsDays: 30 });
    const part = createPart(t, { priceCents: 150_000 }).partNumber;
    expect((await dealer.send('POST', '/api/cart/lines', { partNumber: part, quantity: 1 })).status).toBe(201);
    const res = await dealer.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-BIG' });
    expect(res.status).toBe(409);
    const message = (res.body as { error: { message: string } }).error.message;
    expect(message).toMatch(/over your credit limit of \$1,000\.00/);
    // Every dollar amount in it has its thousands separated.
    for (const amount of message.match(/\$[\d,]+\.\d\d/g) ?? []) expect(amount).toMatch(/^\$\d{1,3}(,\d{3})*\.\d\d$/);
    expect(message).toMatch(/over your credit limit of \$1,000\.00 by \$\d{3}\.\d\d/);
  });
});
