import fs from 'node:fs';
import path from 'node:path';
import type Stripe from 'stripe';
import type { Db } from '../db/client';
import { HttpError } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session';
import type { ReturnDecision, ReturnRequest, ReturnView } from '../../shared/schemas/warehouse';
import type { StockService } from './stock';
import type { StoredImage } from './uploads';

export interface ReturnsNotifier {
  returnDecided(returnId: number): void;
}

interface ReturnRow {
  id: number;
  reference: string;
  orderId: number;
  orderNumber: string;
  orderLineId: number;
  userId: string;
  partId: number;
  partNumber: string;
  title: string;
  quantity: number;
  kind: ReturnView['kind'];
  reason: string;
  status: ReturnView['status'];
  conditionGrade: ReturnView['conditionGrade'];
  decision: string | null;
  refundCents: number;
  rejectReason: string | null;
  creditNoteNumber: string | null;
  paymentMethod: 'card' | 'account';
  paymentState: string;
  paymentIntentId: string | null;
  dealerAccountId: number | null;
  orderTotalCents: number;
  orderRefundedCents: number;
  unitPriceCents: number;
  lineCoreDepositCents: number;
  customer: string;
  createdAt: string;
  decidedAt: string | null;
}

const SELECT = `SELECT r.id, r.reference, r.order_id AS orderId, o.number AS orderNumber, r.order_line_id AS orderLineId, r.user_id AS userId, l.part_id AS partId,
  l.part_number AS partNumber, l.title, r.quantity, r.kind, r.reason, r.status, r.condition_grade AS conditionGrade, r.decision, r.refund_cents AS refundCents,
  r.reject_reason AS rejectReason, c.number AS creditNoteNumber, o.payment_method AS paymentMethod, o.payment_state AS paymentState,
  o.payment_intent_id AS paymentIntentId, o.dealer_account_id AS dealerAccountId, o.total_cents AS orderTotalCents, o.refunded_cents AS orderRefundedCents,
  l.unit_price_cents AS unitPriceCents, l.core_deposit_cents AS lineCoreDepositCents, o.ship_name AS customer, r.created_at AS createdAt, r.decided_at AS decidedAt
  FROM returns r JOIN orders o ON o.id = r.order_id JOIN order_lines l ON l.id = r.order_line_id LEFT JOIN credit_notes c ON c.return_id = r.id`;

export function createReturnsService(deps: { db: Db; stock: StockService; payments: Stripe; notify: ReturnsNotifier; photosDir: string; taxRatePct: number }) {
  const { db, stock, payments } = deps;
  const sqlite = db.$client;
  const byId = sqlite.prepare(`${SELECT} WHERE r.id = ?`);
  const photosOf = sqlite.prepare('SELECT stored_name AS name FROM return_photos WHERE return_id = ? ORDER BY id').pluck();

  /** The most a return can refund: the line's value with tax and deposit, capped by what is left of the payment. */
  function limits(r: ReturnRow) {
    const unitWithTax = Math.round(r.unitPriceCents * (1 + deps.taxRatePct / 100));
    const lineValue = r.quantity * (unitWithTax + r.lineCoreDepositCents);
    const paid = r.paymentMethod === 'card' ? (['paid', 'partially_refunded', 'refunded'].includes(r.paymentState) ? r.orderTotalCents : 0) : r.orderTotalCents;
    const left = Math.max(0, paid - r.orderRefundedCents);
    return { full: Math.min(lineValue, left), core: Math.min(r.quantity * r.lineCoreDepositCents, left), max: Math.min(lineValue, left) };
  }

  function view(r: ReturnRow): ReturnView {
    const l = limits(r);
    return {
      id: r.id,
      reference: r.reference,
      orderNumber: r.orderNumber,
      partNumber: r.partNumber,
      title: r.title,
      quantity: r.quantity,
      kind: r.kind,
      reason: r.reason,
      status: r.status,
      conditionGrade: r.conditionGrade,
      decision: r.decision,
      refundCents: r.refundCents,
      rejectReason: r.rejectReason,
      creditNoteNumber: r.creditNoteNumber,
      paymentMethod: r.paymentMethod,
      maxRefundCents: r.status === 'requested' ? l.max : 0,
      coreDepositCents: r.quantity * r.lineCoreDepositCents,
      photos: photosOf.all(r.id) as string[],
      customer: r.customer,
      createdAt: r.createdAt,
      decidedAt: r.decidedAt,
    };
  }

  const get = (id: number) => {
    const r = byId.get(id) as ReturnRow | undefined;
    if (!r) throw new HttpError(404, 'No such return');
    return r;
  };

  const create = sqlite.transaction((user: CurrentUser, input: ReturnRequest, photos: StoredImage[]) => {
    const line = sqlite
      .prepare(
        `SELECT l.id, l.quantity_dispatched AS dispatched, p.condition, o.id AS orderId, o.user_id AS userId, o.status
         FROM order_lines l JOIN orders o ON o.id = l.order_id JOIN parts p ON p.id = l.part_id WHERE l.id = ? AND o.number = ?`,
      )
      .get(input.lineId, input.orderNumber) as { id: number; dispatched: number; condition: string; orderId: number; userId: string; status: string } | undefined;
    if (!line || line.userId !== user.id) throw new HttpError(404, `No such line on order ${input.orderNumber}`);
    if (input.kind === 'core' && line.condition !== 'exchange') throw new HttpError(409, 'Only exchange units come back as cores');
    const already = sqlite.prepare("SELECT COALESCE(SUM(quantity), 0) FROM returns WHERE order_line_id = ? AND status <> 'rejected'").pluck().get(line.id) as number;
    const left = line.dispatched - already;
    if (left <= 0) throw new HttpError(409, line.dispatched === 0 ? 'This line has not been dispatched yet' : 'Everything on this line is already being returned');
    if (input.quantity > left) throw new HttpError(409, `At most ${left} of this line can come back`);
    const id = (sqlite.prepare('SELECT COALESCE(MAX(id), 0) + 1 FROM returns').pluck().get() as number);
    sqlite
      .prepare('INSERT INTO returns (id, reference, order_id, order_line_id, user_id, kind, quantity, reason) VALUES (?, ?, ?, ?, ?, ?, ?, ?)')
      .run(id, `RT-${String(5000 + id)}`, line.orderId, line.id, user.id, input.kind, input.quantity, input.reason);
    for (const p of photos) sqlite.prepare('INSERT INTO return_photos (return_id, stored_name, mime_type, bytes) VALUES (?, ?, ?, ?)').run(id, p.storedName, p.mimeType, p.bytes);
    sqlite.prepare('INSERT INTO order_events (order_id, status, note) VALUES (?, ?, ?)').run(line.orderId, 'return_requested', `RT-${5000 + id}: ${input.quantity} × ${input.kind}`);
    return id;
  });

  function request(user: CurrentUser, input: ReturnRequest, photos: StoredImage[]) {
    try {
      return view(get(create(user, input, photos)));
    } catch (err) {
      for (const p of photos) fs.rmSync(path.join(deps.photosDir, p.storedName), { force: true });
      throw err;
    }
  }

  const record = sqlite.transaction((id: number, d: ReturnDecision, amount: number, refundId: string | null) => {
    const r = get(id);
    if (r.status !== 'requested') throw new HttpError(409, `${r.reference} was already decided`);
    let status: ReturnView['status'] = 'rejected';
    if (d.decision !== 'reject') {
      if (r.paymentMethod === 'card') {
        status = 'refunded';
      } else {
        status = 'credited';
        const n = (sqlite.prepare('SELECT COALESCE(MAX(id), 0) + 1 FROM credit_notes').pluck().get() as number);
        sqlite.prepare('INSERT INTO credit_notes (number, dealer_account_id, order_id, return_id, amount_cents) VALUES (?, ?, ?, ?, ?)').run(`CN-${7000 + n}`, r.dealerAccountId, r.orderId, r.id, amount);
      }
      sqlite.prepare('UPDATE orders SET refunded_cents = refunded_cents + ? WHERE id = ?').run(amount, r.orderId);
      if (r.paymentMethod === 'card') {
        sqlite.prepare("UPDATE orders SET payment_state = CASE WHEN refunded_cents >= total_cents THEN 'refunded' ELSE 'partially_refunded' END WHERE id = ?").run(r.orderId);
      }
      if (d.decision === 'full-refund' && d.restock && d.conditionGrade === 'as-new') {
        const bin = stock.defaultBin(r.partId) ?? 'A-01-1';
        stock.returnIn(r.partId, bin, r.quantity, r.orderId, `${r.reference} back to stock`);
      }
    }
    sqlite
      .prepare("UPDATE returns SET status = ?, condition_grade = ?, decision = ?, refund_cents = ?, reject_reason = ?, payment_refund_id = ?, decided_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?")
      .run(status, d.conditionGrade, d.decision, amount, d.decision === 'reject' ? d.rejectReason : null, refundId, id);
    const note = d.decision === 'reject' ? `${r.reference} rejected` : `${r.reference}: ${status === 'credited' ? 'credit note' : 'refund'} of $${(amount / 100).toFixed(2)}`;
    sqlite.prepare('INSERT INTO order_events (order_id, status, note) VALUES (?, ?, ?)').run(r.orderId, d.decision === 'reject' ? 'return_rejected' : 'returned', note);
    const fully = sqlite.prepare('SELECT refunded_cents >= total_cents FROM orders WHERE id = ?').pluck().get(r.orderId) as number;
    if (fully) sqlite.prepare("UPDATE orders SET status = 'returned' WHERE id = ?").run(r.orderId);
  });

  /**
   * Grades a received return and settles it. Card refunds go through the payment service with an idempotency key
   * per return, so a repeated request refunds once; the amount never exceeds what is left of the payment.
   */
  async function decide(id: number, d: ReturnDecision): Promise<ReturnView> {
    const r = get(id);
    if (r.status !== 'requested') throw new HttpError(409, `${r.reference} was already decided`);
    const l = limits(r);
    let amount = 0;
    if (d.decision === 'core-refund') {
      if (r.kind !== 'core' && r.lineCoreDepositCents === 0) throw new HttpError(409, 'This line carried no core deposit');
      amount = l.core;
    } else if (d.decision === 'full-refund') {
      amount = l.full;
    } else if (d.decision === 'partial-refund') {
      if (d.amountCents > l.max) throw new HttpError(400, `At most $${(l.max / 100).toFixed(2)} can be refunded on this return`, { amountCents: [`at most ${l.max} cents`] });
      amount = d.amountCents;
    }
    if (d.decision !== 'reject' && amount <= 0) throw new HttpError(409, 'Nothing is left to refund on this order');
    let refundId: string | null = null;
    if (d.decision !== 'reject' && r.paymentMethod === 'card') {
      if (!r.paymentIntentId) throw new HttpError(409, 'This order has no card payment to refund');
      try {
        const refund = await payments.refunds.create(
          { payment_intent: r.paymentIntentId, amount, reason: 'requested_by_customer', metadata: { return_reference: r.reference } },
          { idempotencyKey: `return-${r.reference}-refund` },
        );
        refundId = refund.id;
      } catch (err) {
        throw new HttpError(502, `The payment service refused the refund: ${(err as Error).message}`);
      }
    }
    record(id, d, amount, refundId);
    deps.notify.returnDecided(id);
    return view(get(id));
  }

  function listOwn(user: CurrentUser) {
    return (sqlite.prepare(`${SELECT} WHERE r.user_id = ? ORDER BY r.id DESC`).all(user.id) as ReturnRow[]).map(view);
  }
  function listAll(status: 'requested' | 'all') {
    const where = status === 'requested' ? "WHERE r.status = 'requested'" : '';
    return (sqlite.prepare(`${SELECT} ${where} ORDER BY r.status <> 'requested', r.id`).all() as ReturnRow[]).map(view);
  }
  function photoAllowed(user: CurrentUser, storedName: string) {
    const owner = sqlite.prepare('SELECT r.user_id FROM return_photos p JOIN returns r ON r.id = p.return_id WHERE p.stored_name = ?').pluck().get(storedName) as string | undefined;
    return owner !== undefined && (owner === user.id || user.role === 'warehouse' || user.role === 'admin');
  }

  return { request, decide, listOwn, listAll, photoAllowed, get: (id: number) => view(get(id)), row: get };
}

export type ReturnsService = ReturnType<typeof createReturnsService>;
