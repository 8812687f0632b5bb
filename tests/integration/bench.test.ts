import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEST_PAYMENT_METHODS } from '../../shared/payment-test-methods';
import { priceInspectionFee, priceQuote } from '../../shared/service';
import type { AccountStatement } from '../../shared/schemas/statement';
import type { BenchRequest, ServiceInvoice, ServiceRequestView } from '../../shared/schemas/service';
import { createDealer, createPart, createUser, type TestDealer, type TestUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let bench: Client;
const TAX = 8;

beforeAll(async () => {
  t = await startTestApp({ fakes: true, config: { taxRatePct: TAX } });
  bench = (await createUser(t, { role: 'workshop' })).client;
}, 60_000);
afterAll(async () => {
  await t.close();
});

const booking = (extra: Record<string, string | string[]> = {}) => ({
  noSerial: 'true',
  frameCode: 'CHS',
  bearing: 'journal',
  symptoms: ['oil-smoke', 'shaft-play'],
  symptomNotes: 'Smokes on overrun after a track day',
  application: 'circuit',
  returnName: 'Pit Lane Garage',
  returnLine1: '4 Anvil Street',
  returnCity: 'Quenchfold',
  returnPostcode: 'QF2 3AB',
  ...extra,
});

async function book(client: Client, fields: Record<string, string | string[]> = {}) {
  const form = new FormData();
  for (const [k, v] of Object.entries(booking(fields))) for (const one of Array.isArray(v) ? v : [v]) form.append(k, one);
  return client.upload('/api/service', form);
}

const inspection = { axialPlayMm: 0.12, radialPlayMm: 0.3, compressorWheel: 'light', turbineWheel: 'none', oilCompressorSide: true, notes: 'Thrust bearing worn' };
const inspect = (ref: string, fields: Record<string, string | number | boolean> = inspection) => {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, String(v));
  return bench.upload(`/api/bench/requests/${ref}/inspect`, form);
};
const rebuildBody = {
  balance: { checkSpeedRpm: 2400, before: { compressorGmm: 0.9, turbineGmm: 0.7 }, after: { compressorGmm: 0.004, turbineGmm: 0.005 } },
  test: { oilPressureKpa: 280, leakCheck: 'pass', endFloatMm: 0.04, result: 'pass', notes: '' },
};

/** Books a unit in, receives it by scan, inspects and quotes it; answers the request as quoted. */
async function toQuoted(buyer: TestUser, kit: { partNumber: string }, quantity = 1) {
  const booked = await book(buyer.client);
  expect(booked.status, JSON.stringify(booked.body)).toBe(201);
  const ref = (booked.body as ServiceRequestView).reference;
  const scanned = await bench.send('POST', '/api/bench/scan', { code: ref.toLowerCase().replace('-', ' ') });
  expect(scanned.body).toMatchObject({ action: 'received', reference: ref });
  expect((await inspect(ref)).status).toBe(200);
  const quoted = await bench.send('POST', `/api/bench/requests/${ref}/quote`, { lines: [{ partNumber: kit.partNumber, quantity }], labourHours: 1.5, balancing: true });
  expect(quoted.status, JSON.stringify(quoted.body)).toBe(200);
  return quoted.body as ServiceRequestView;
}

const ledgerMismatches = () =>
  t.db.$client
    .prepare(
      `SELECT s.part_id FROM stock s LEFT JOIN (SELECT part_id, bin_code, sum(on_hand_delta) AS oh, sum(reserved_delta) AS rs FROM stock_movements GROUP BY part_id, bin_code) m
       ON m.part_id = s.part_id AND m.bin_code = s.bin_code WHERE s.on_hand <> coalesce(m.oh, 0) OR s.reserved <> coalesce(m.rs, 0)`,
    )
    .all();

describe('the Bench: booking in to shipping back', () => {
  let dealer: TestDealer;
  beforeAll(async () => {
    dealer = await createDealer(t, { tier: 'preferred', paymentTermsDays: 30 });
  });

  it('takes a dealer’s unit from booking to a rebuild on account, stock through the ledger, and an invoice on the statement', async () => {
    const kit = createPart(t, { stock: 3, priceCents: 18_000 });
    const booked = await book(dealer.client);
    expect(booked.status, JSON.stringify(booked.body)).toBe(201);
    const req = booked.body as ServiceRequestView;
    expect(req.reference).toMatch(/^SR-70\d\d$/);
    expect(req.serial).toMatch(/^VC\d\d-\d{6}-\d$/);
    expect(req).toMatchObject({ status: 'booked', unitOrigin: 'booked-in', symptoms: ['oil-smoke', 'shaft-play'] });

    // The label carries a Code 128 of the request number.
    const label = await dealer.client.get(`/api/service/${req.reference}/label`);
    expect(label.status).toBe(200);
    expect((label.body as { barcodeSvg: string }).barcodeSvg).toMatch(/^<svg /);

    // Receiving by scan: the serial plate works as well as the label; a wrong scan is refused plainly, through the
    // same resolver as the Floor's fields (a part's label is named as such; a code that names nothing is not found).
    const partLabel = await bench.send('POST', '/api/bench/scan', { code: kit.partNumber });
    expect(partLabel.status).toBe(400);
    expect(JSON.stringify(partLabel.body)).toContain(`That is ${kit.partNumber}'s part label, not a service request label`);
    const nothing = await bench.send('POST', '/api/bench/scan', { code: 'SY-100001' });
    expect(nothing.status).toBe(404);
    expect(JSON.stringify(nothing.body)).toMatch(/scan a request number such as SR-7001|service request/);
    expect((await bench.send('POST', '/api/bench/scan', { code: 'SR-999999' })).status).toBe(404);
    const scanned = await bench.send('POST', '/api/bench/scan', { code: req.serial.replace(/-/g, '') });
    expect(scanned.body).toMatchObject({ action: 'received', reference: req.reference, status: 'received' });
    expect((await bench.send('POST', '/api/bench/scan', { code: req.reference })).body).toMatchObject({ action: 'opened', status: 'received' });

    // Rebuilding before a quote is approved is refused.
    expect((await bench.send('POST', `/api/bench/requests/${req.reference}/rebuild`, rebuildBody)).status).toBe(409);

    const inspected = (await inspect(req.reference)).body as ServiceRequestView;
    // CHS (42 mm inducer) journal bearing: our own limits 0.08 mm axial, 0.35 mm radial.
    expect(inspected.inspection).toMatchObject({ limits: { axial: 0.08, radial: 0.35 }, axialOver: true, radialOver: false });

    expect((await bench.send('POST', `/api/bench/requests/${req.reference}/quote`, { lines: [], labourHours: 1 })).status).toBe(400);
    const quoted = (await bench.send('POST', `/api/bench/requests/${req.reference}/quote`, { lines: [{ partNumber: kit.partNumber.toLowerCase(), quantity: 2 }], labourHours: 1.5, balancing: true }))
      .body as ServiceRequestView;
    // Preferred tier: 15 % off parts only; tax on parts, labour and balancing, as orders are taxed.
    const expected = priceQuote({ lines: [{ partNumber: kit.partNumber, quantity: 2, retailUnitCents: 18_000 }], labourHours: 1.5, labourRateCents: 9_500, balancingCents: 4_800, tier: 'preferred', taxRatePct: TAX });
    expect(quoted.quote).toMatchObject({ partsCents: 30_600, discountCents: 5_400, labourCents: 14_250, balancingCents: 4_800, taxCents: expected.taxCents, totalCents: expected.totalCents });
    expect(expected.taxCents).toBe(Math.round((30_600 + 14_250 + 4_800) * 0.08));

    // The customer is told by mail and notice; the workshop may not decide for them.
    await t.mailSettled();
    await t.mail!.waitForMessage((m) => m.to.includes(dealer.email) && m.subject.includes(`${req.reference}`) && m.subject.includes('quote ready'));
    expect((await bench.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'account', purchaseOrder: 'PO-1' })).status).toBe(403);

    const approved = await dealer.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'account', purchaseOrder: 'PO-SR-1' });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body).toMatchObject({ status: 'approved', paymentState: 'on_account', chargeCents: expected.totalCents });
    expect((await dealer.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'account', purchaseOrder: 'PO-SR-1' })).status).toBe(409);

    // Bench work on account counts against the same credit limit as orders: the account's balance carries it, and an
    // order that would go past the limit with it is refused at checkout.
    const me = (await dealer.client.get('/api/account/me')).body as { user: { dealer: { openBalanceCents: number } } };
    expect(me.user.dealer.openBalanceCents).toBe(expected.totalCents);
    t.db.$client.prepare('UPDATE dealer_accounts SET credit_limit_cents = ? WHERE id = ?').run(expected.totalCents + 1_000, dealer.dealerAccountId);
    const pricey = createPart(t, { stock: 1, priceCents: 20_000 });
    const added = (await dealer.client.send('POST', '/api/cart/lines', { partNumber: pricey.partNumber, quantity: 1 })).body as { lines: Array<{ id: number }> };
    const refused = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-OVER' });
    expect(refused.status).toBe(409);
    expect(JSON.stringify(refused.body)).toMatch(/credit/i);
    t.db.$client.prepare('UPDATE dealer_accounts SET credit_limit_cents = ? WHERE id = ?').run(dealer.creditLimitCents, dealer.dealerAccountId);
    for (const line of added.lines) expect((await dealer.client.send('DELETE', `/api/cart/lines/${line.id}`)).status).toBeLessThan(300);

    const before = t.db.$client.prepare('SELECT available FROM parts WHERE id = ?').pluck().get(kit.id) as number;
    // An over-limit balance reading is refused and takes nothing from stock.
    expect((await bench.send('POST', `/api/bench/requests/${req.reference}/rebuild`, { ...rebuildBody, balance: { ...rebuildBody.balance, after: { compressorGmm: 5, turbineGmm: 0 } } })).status).toBe(400);
    expect(t.db.$client.prepare('SELECT available FROM parts WHERE id = ?').pluck().get(kit.id)).toBe(before);
    const rebuilt = await bench.send('POST', `/api/bench/requests/${req.reference}/rebuild`, rebuildBody);
    expect(rebuilt.status, JSON.stringify(rebuilt.body)).toBe(200);
    expect((rebuilt.body as ServiceRequestView).rebuild).toMatchObject({ balancePass: true });
    expect(t.db.$client.prepare('SELECT available FROM parts WHERE id = ?').pluck().get(kit.id)).toBe(before - 2);
    expect(t.db.$client.prepare("SELECT sum(on_hand_delta) FROM stock_movements WHERE part_id = ? AND kind = 'workshop'").pluck().get(kit.id)).toBe(-2);
    expect(ledgerMismatches()).toEqual([]);

    expect((await bench.send('POST', `/api/bench/requests/${req.reference}/ship`, { carrier: 'Tern Parcel', trackingNumber: '' })).status).toBe(400);
    const shipped = (await bench.send('POST', `/api/bench/requests/${req.reference}/ship`, { carrier: 'Tern Parcel', trackingNumber: 'TP-SR-1' })).body as ServiceRequestView;
    expect(shipped).toMatchObject({ status: 'shipped', invoiceNumber: expect.stringMatching(/^SV-9\d+$/), shipment: { trackingUrl: 'https://www.ternparcel.example/track?parcel=TP-SR-1' } });

    const invoice = (await dealer.client.get(`/api/service/${req.reference}/invoice`)).body as ServiceInvoice;
    expect(invoice).toMatchObject({ kind: 'repair', totalCents: expected.totalCents, paymentMethod: 'account', purchaseOrder: 'PO-SR-1' });
    expect(invoice.lines.reduce((s, l) => s + l.amountCents, 0) + invoice.taxCents).toBe(expected.totalCents);

    const statement = (await dealer.client.get('/api/account/statement')).body as AccountStatement;
    expect(statement.lines).toContainEqual(expect.objectContaining({ kind: 'invoice', reference: shipped.invoiceNumber, debitCents: expected.totalCents }));
    expect(statement.openInvoices).toContainEqual(expect.objectContaining({ number: shipped.invoiceNumber, openCents: expected.totalCents }));
    expect(statement.totals.openInvoicesCents).toBeGreaterThanOrEqual(expected.totalCents);

    // The Office records the dealer's payment of the service invoice as it does an order invoice's.
    const office = (await createUser(t, { role: 'admin' })).client;
    const openList = (await office.get(`/api/admin/dealers/${dealer.dealerAccountId}/invoices`)).body as { items: Array<{ number: string; openCents: number }> };
    expect(openList.items).toContainEqual(expect.objectContaining({ number: shipped.invoiceNumber, openCents: expected.totalCents }));
    const paidRes = await office.send('POST', `/api/admin/dealers/${dealer.dealerAccountId}/invoices/${shipped.invoiceNumber}/paid`, { reference: 'BANK-SV-1' });
    expect(paidRes.status, JSON.stringify(paidRes.body)).toBe(200);
    const after = (await dealer.client.get('/api/account/statement')).body as AccountStatement;
    expect(after.lines).toContainEqual(expect.objectContaining({ kind: 'payment', reference: 'BANK-SV-1', creditCents: expected.totalCents }));
    expect(after.openInvoices.map((i) => i.number)).not.toContain(shipped.invoiceNumber);

    // Every step is in the unit's history and the request's timeline.
    const history = t.db.$client.prepare('SELECT e.kind FROM unit_events e JOIN units u ON u.id = e.unit_id WHERE u.serial = ? ORDER BY e.id').pluck().all(req.serial);
    expect(history).toEqual(['registered', 'booked-in', 'received', 'inspected', 'quoted', 'approved', 'rebuilt', 'tested', 'shipped']);
    const mail = await (async () => {
      await t.mailSettled();
      return t.mail!.waitForMessage((m) => m.to.includes(dealer.email) && m.subject.includes('shipped'));
    })();
    expect(mail.text).toContain('https://www.ternparcel.example/track?parcel=TP-SR-1');
  });

  it('approves by card at the decision, and a declined card takes nothing', async () => {
    const retail = await createUser(t, { role: 'customer' });
    const kit = createPart(t, { stock: 2, priceCents: 9_000 });
    const req = await toQuoted(retail, kit);
    const declined = await retail.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'card', paymentMethod: TEST_PAYMENT_METHODS.declined });
    expect(declined.status).toBe(402);
    expect(((await retail.client.get(`/api/service/${req.reference}`)).body as ServiceRequestView).status).toBe('quoted');
    // A retail buyer has no account to put it on.
    expect((await retail.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'account', purchaseOrder: 'X' })).status).toBe(403);
    const paid = await retail.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'card', paymentMethod: TEST_PAYMENT_METHODS.success });
    expect(paid.status, JSON.stringify(paid.body)).toBe(200);
    expect(paid.body).toMatchObject({ status: 'approved', paymentState: 'paid', chargeCents: req.quote!.totalCents });
    // No discount for a retail buyer.
    expect(req.quote!.discountCents).toBe(0);
    expect((await retail.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'decline', method: 'card', paymentMethod: TEST_PAYMENT_METHODS.success })).status).toBe(409);
  });

  it('two approvals at once with different cards charge once: the loser’s payment is refunded', async () => {
    const retail = await createUser(t, { role: 'customer' });
    const req = await toQuoted(retail, createPart(t, { stock: 1 }));
    const refunds = () => t.payments!.events().filter((e) => e.event.type === 'charge.refunded').length;
    const before = refunds();
    const answers = await Promise.all(
      [TEST_PAYMENT_METHODS.success, TEST_PAYMENT_METHODS.successAlt].map((pm) => retail.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'approve', method: 'card', paymentMethod: pm })),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    expect(refunds()).toBe(before + 1);
  });

  it('a declined quote ships back unrepaired with an invoice for the inspection fee only', async () => {
    const kit = createPart(t, { stock: 1 });
    const req = await toQuoted(dealer, kit);
    const declined = await dealer.client.send('POST', `/api/service/${req.reference}/decision`, { decision: 'decline', method: 'account', purchaseOrder: 'PO-FEE' });
    expect(declined.status, JSON.stringify(declined.body)).toBe(200);
    const fee = priceInspectionFee(6_500, TAX);
    expect(declined.body).toMatchObject({ status: 'declined', decision: 'decline', chargeCents: fee.totalCents });
    expect((await bench.send('POST', `/api/bench/requests/${req.reference}/rebuild`, rebuildBody)).status).toBe(409);
    const shipped = (await bench.send('POST', `/api/bench/requests/${req.reference}/ship`, { carrier: 'Cobbleline Freight', trackingNumber: 'CF-123456' })).body as ServiceRequestView;
    const invoice = (await dealer.client.get(`/api/service/${shipped.reference}/invoice`)).body as ServiceInvoice;
    expect(invoice).toMatchObject({ kind: 'inspection-fee', totalCents: fee.totalCents, taxCents: fee.taxCents });
    expect(t.db.$client.prepare("SELECT count(*) FROM stock_movements WHERE part_id = ? AND kind = 'workshop'").pluck().get(kit.id)).toBe(0);
  });

  it('keeps the Bench to workshop staff and administrators, and each request to its owner', async () => {
    const other = await createUser(t, { role: 'customer' });
    const warehouse = await createUser(t, { role: 'warehouse' });
    expect((await dealer.client.get('/api/bench/queue')).status).toBe(403);
    expect((await warehouse.client.get('/api/bench/queue')).status).toBe(403);
    expect((await bench.get('/api/bench/queue?queue=closed')).status).toBe(200);
    const mine = ((await book(dealer.client)).body as ServiceRequestView).reference;
    expect((await other.client.get(`/api/service/${mine}`)).status).toBe(404);
    expect((await bench.send('POST', `/api/bench/requests/${mine}/receive`)).status).toBe(200);
    expect((await bench.send('POST', `/api/bench/requests/${mine}/receive`)).status).toBe(409);
    // A serial with a wrong check digit is refused at booking.
    const bad = await book(dealer.client, { noSerial: 'false', serial: 'VC26-004217-4' });
    expect(bad.status).toBe(400);
    const page = (await bench.get('/api/bench/queue?queue=received')).body as { items: Array<{ reference: string }>; counts: Record<string, number> };
    expect(page.items.map((i) => i.reference)).toContain(mine);
    const detail = (await bench.get(`/api/bench/requests/${mine}`)).body as BenchRequest;
    expect(detail.limits.balancePerPlaneGmm).toBeGreaterThan(0);
    // The kits offered are the frame's rebuild kits, linked to its cartridges in the catalogue ("goes with").
    const kits = t.db.$client
      .prepare(
        `SELECT DISTINCT k.part_number FROM parts k JOIN part_links l ON k.id IN (l.part_id, l.related_part_id)
         JOIN parts c ON c.id IN (l.part_id, l.related_part_id) AND c.id != k.id
         WHERE k.category = 'rebuild-kits' AND k.status = 'active' AND c.category = 'cartridges' AND c.frame_code = ? ORDER BY 1`,
      )
      .pluck()
      .all(booking().frameCode);
    expect(kits.length).toBeGreaterThan(0);
    expect(detail.suggestedKits.map((k) => k.partNumber)).toEqual(kits);
  });
});
