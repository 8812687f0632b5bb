import { and, count, desc, eq, exists, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { creditNotes, dealerAccounts, dealerMembers, dealerPayments, orderEvents, orders, serviceRequests, user } from '../db/schema';
import { invoiceDueDate, invoiceOpenCents, isOpenInvoice, openBalanceCents, type CreditOrder } from '../../shared/credit';
import { DEALERS_PAGE_SIZE, type DealerAccounts, type DealerApplication, type DealerDecision, type OpenInvoice } from '../../shared/schemas/accounts';
import type { PageQuery } from '../../shared/schemas/paging';
import { ConflictError, NotFoundError } from './errors';

/** The transaction a notice is written in (the mail outbox in the app). */
type Tx = Pick<Db, 'select' | 'insert' | 'update'>;

/** What the trade-account flow tells people, written in the transaction of the change that causes it. */
export interface DealerNotifier {
  applied(tx: Tx, dealerAccountId: number): void;
  decided(tx: Tx, dealerAccountId: number, decision: DealerDecision['decision']): void;
}

type DealerStatus = (typeof dealerAccounts.$inferSelect)['status'];

/** The database or the transaction a query runs in: better-sqlite3 has one connection, so both see the same data. */
type Query = Pick<Db, 'select'>;

/** The same expression as the schema's timestamp defaults. */
const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

/** The order columns the credit rule in shared/credit.ts reads. */
const creditColumns = {
  paymentMethod: orders.paymentMethod,
  paymentState: orders.paymentState,
  status: orders.status,
  totalCents: orders.totalCents,
  refundedCents: orders.refundedCents,
};

/**
 * What trade accounts owe for Bench work put on account (a repair approved or an inspection fee, until its service
 * invoice is paid), by account. It counts against the same credit limit as orders.
 */
function serviceOwedByDealer(q: Query, dealerAccountIds: number[]): Map<number, number> {
  if (dealerAccountIds.length === 0) return new Map();
  const rows = q
    .select({ dealerAccountId: serviceRequests.dealerAccountId, owed: sql<number>`coalesce(sum(${serviceRequests.chargeCents}), 0)` })
    .from(serviceRequests)
    .where(and(inArray(serviceRequests.dealerAccountId, dealerAccountIds), eq(serviceRequests.paymentState, 'on_account'), isNull(serviceRequests.invoicePaidAt)))
    .groupBy(serviceRequests.dealerAccountId)
    .all();
  return new Map(rows.map((r) => [r.dealerAccountId!, r.owed]));
}

/**
 * A dealer's open balance, orders and Bench work on account together; order placement and the Bench's approval call
 * this inside their transactions to check the credit limit.
 */
export function dealerOpenBalance(q: Query, dealerAccountId: number): number {
  const ordersOpen = openBalanceCents(q.select(creditColumns).from(orders).where(eq(orders.dealerAccountId, dealerAccountId)).all());
  return ordersOpen + (serviceOwedByDealer(q, [dealerAccountId]).get(dealerAccountId) ?? 0);
}

export function createDealerAccountsService(deps: { db: Db; notify: DealerNotifier }) {
  const { db, notify } = deps;

  /**
   * One page of trade accounts with their open balances, pending applications first, then newest first: one query for
   * the page's accounts (each with one member's e-mail), one for the orders of those accounts only, whose open
   * balance the shared credit rule adds up, and the counts.
   */
  function list(query: PageQuery = { page: 1, pageSize: DEALERS_PAGE_SIZE }): DealerAccounts {
    const firstMember = db
      .select({ dealerAccountId: dealerMembers.dealerAccountId, userId: sql<string>`min(${dealerMembers.userId})`.as('user_id') })
      .from(dealerMembers)
      .groupBy(dealerMembers.dealerAccountId)
      .as('first_member');
    const accounts = db
      .select({
        id: dealerAccounts.id,
        companyName: dealerAccounts.companyName,
        contactName: dealerAccounts.contactName,
        email: user.email,
        phone: dealerAccounts.phone,
        city: dealerAccounts.city,
        status: dealerAccounts.status,
        tier: dealerAccounts.tier,
        creditLimitCents: dealerAccounts.creditLimitCents,
        paymentTermsDays: dealerAccounts.paymentTermsDays,
        createdAt: dealerAccounts.createdAt,
      })
      .from(dealerAccounts)
      .innerJoin(firstMember, eq(firstMember.dealerAccountId, dealerAccounts.id))
      .innerJoin(user, eq(user.id, firstMember.userId))
      .orderBy(sql`case ${dealerAccounts.status} when 'pending' then 0 else 1 end`, desc(dealerAccounts.id))
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize)
      .all();
    const byDealer = new Map<number, CreditOrder[]>();
    if (accounts.length > 0) {
      const dealerOrders = db
        .select({ dealerAccountId: orders.dealerAccountId, ...creditColumns })
        .from(orders)
        .where(
          and(
            inArray(
              orders.dealerAccountId,
              accounts.map((a) => a.id),
            ),
            eq(orders.paymentMethod, 'account'),
          ),
        )
        .all();
      for (const { dealerAccountId, ...order } of dealerOrders) {
        if (dealerAccountId === null) continue;
        const held = byDealer.get(dealerAccountId);
        if (held) held.push(order);
        else byDealer.set(dealerAccountId, [order]);
      }
    }
    const counts = db
      .select({ total: count(), pending: sql<number>`coalesce(sum(${dealerAccounts.status} = 'pending'), 0)` })
      .from(dealerAccounts)
      .where(exists(db.select({ one: sql`1` }).from(dealerMembers).where(eq(dealerMembers.dealerAccountId, dealerAccounts.id))))
      .get();
    const serviceOwed = serviceOwedByDealer(db, accounts.map((a) => a.id));
    return {
      items: accounts.map((a) => ({ ...a, openBalanceCents: openBalanceCents(byDealer.get(a.id) ?? []) + (serviceOwed.get(a.id) ?? 0) })),
      total: counts?.total ?? 0,
      pending: counts?.pending ?? 0,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  function openBalance(dealerAccountId: number): number {
    return dealerOpenBalance(db, dealerAccountId);
  }

  /** Open invoices of a dealer, oldest first, with their due dates from the payment terms. */
  function openInvoices(dealerAccountId: number): OpenInvoice[] {
    const found = db.select({ id: dealerAccounts.id }).from(dealerAccounts).where(eq(dealerAccounts.id, dealerAccountId)).get();
    if (!found) throw new NotFoundError('No such dealer account');
    const open = db
      .select({
        id: orders.id,
        number: orders.number,
        createdAt: orders.createdAt,
        purchaseOrder: orders.purchaseOrder,
        termsDays: orders.paymentTermsDays,
        ...creditColumns,
      })
      .from(orders)
      .where(eq(orders.dealerAccountId, dealerAccountId))
      .orderBy(orders.id)
      .all()
      .filter(isOpenInvoice);
    const notes = new Map<number, string[]>();
    if (open.length > 0) {
      const rows = db
        .select({ orderId: creditNotes.orderId, number: creditNotes.number })
        .from(creditNotes)
        .where(inArray(creditNotes.orderId, open.map((o) => o.id)))
        .orderBy(creditNotes.id)
        .all();
      for (const n of rows) notes.set(n.orderId, [...(notes.get(n.orderId) ?? []), n.number]);
    }
    // Service invoices from the Bench on account, issued when the unit shipped, so the office can record their payment too.
    const service = db
      .select({ number: serviceRequests.invoiceNumber, shippedAt: serviceRequests.shippedAt, purchaseOrder: serviceRequests.purchaseOrder, totalCents: serviceRequests.chargeCents, termsDays: serviceRequests.paymentTermsDays })
      .from(serviceRequests)
      .where(and(eq(serviceRequests.dealerAccountId, dealerAccountId), eq(serviceRequests.paymentMethod, 'account'), isNull(serviceRequests.invoicePaidAt)))
      .orderBy(serviceRequests.id)
      .all()
      .flatMap((v) =>
        v.number && v.shippedAt
          ? [{ number: v.number, createdAt: v.shippedAt, purchaseOrder: v.purchaseOrder, totalCents: v.totalCents, creditedCents: 0, openCents: v.totalCents, termsDays: v.termsDays, dueDate: invoiceDueDate(v.shippedAt, v.termsDays), creditNotes: null }]
          : [],
      );
    return [...open.map((o) => ({
      number: o.number,
      createdAt: o.createdAt,
      purchaseOrder: o.purchaseOrder,
      totalCents: o.totalCents,
      creditedCents: o.refundedCents,
      openCents: invoiceOpenCents(o),
      termsDays: o.termsDays,
      dueDate: invoiceDueDate(o.createdAt, o.termsDays),
      creditNotes: notes.get(o.id)?.join(', ') ?? null,
    })), ...service].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  }

  /** The office records a dealer's payment of an on-account invoice; it then no longer counts against the limit. */
  function recordInvoicePaid(dealerAccountId: number, number: string, reference: string): { number: string; paymentState: 'paid' } {
    return db.transaction((tx): { number: string; paymentState: 'paid' } => {
      if (number.startsWith('SV-')) {
        // A service invoice from the Bench: its payment is kept on the service request.
        const done = tx
          .update(serviceRequests)
          .set({ invoicePaidAt: now, invoicePaymentReference: reference, paymentState: 'paid', updatedAt: now })
          .where(and(eq(serviceRequests.invoiceNumber, number), eq(serviceRequests.dealerAccountId, dealerAccountId), eq(serviceRequests.paymentMethod, 'account'), isNull(serviceRequests.invoicePaidAt)))
          .run();
        if (done.changes !== 1) throw new NotFoundError('No such open invoice on this account');
        return { number, paymentState: 'paid' };
      }
      const order = tx
        .select({ id: orders.id, paymentState: orders.paymentState, totalCents: orders.totalCents, refundedCents: orders.refundedCents })
        .from(orders)
        .where(and(eq(orders.number, number), eq(orders.dealerAccountId, dealerAccountId), eq(orders.paymentMethod, 'account')))
        .get();
      if (!order) throw new NotFoundError('No such invoice on this account');
      if (order.paymentState !== 'on_account') throw new ConflictError('This invoice is already paid');
      tx.update(orders).set({ paymentState: 'paid', updatedAt: now }).where(eq(orders.id, order.id)).run();
      // What was owed then; the dealer's statement lists it as a payment.
      tx.insert(dealerPayments).values({ dealerAccountId, orderId: order.id, amountCents: invoiceOpenCents(order), reference }).run();
      tx.insert(orderEvents).values({ orderId: order.id, status: 'invoice_paid', note: `Payment received, reference ${reference}` }).run();
      return { number, paymentState: 'paid' };
    });
  }

  /** Approving sets tier, limit and terms and makes the members dealers; an approved account is not declined. */
  function decide(dealerAccountId: number, input: DealerDecision): { id: number; status: 'approved' | 'declined' } {
    const result = db.transaction((tx): { id: number; status: 'approved' | 'declined' } => {
      const dealer = tx.select({ status: dealerAccounts.status }).from(dealerAccounts).where(eq(dealerAccounts.id, dealerAccountId)).get();
      if (!dealer) throw new NotFoundError('No such dealer account');
      if (input.decision === 'approve') {
        tx.update(dealerAccounts)
          .set({
            status: 'approved',
            tier: input.tier,
            creditLimitCents: input.creditLimitCents,
            paymentTermsDays: input.paymentTermsDays,
            declineReason: null,
            decidedAt: now,
          })
          .where(eq(dealerAccounts.id, dealerAccountId))
          .run();
        const members = tx.select({ userId: dealerMembers.userId }).from(dealerMembers).where(eq(dealerMembers.dealerAccountId, dealerAccountId));
        tx.update(user)
          .set({ role: 'dealer' })
          .where(and(inArray(user.id, members), eq(user.role, 'customer')))
          .run();
        notify.decided(tx, dealerAccountId, 'approve');
        return { id: dealerAccountId, status: 'approved' };
      }
      if (dealer.status === 'approved') throw new ConflictError('An approved account is not declined; change its terms instead');
      tx.update(dealerAccounts).set({ status: 'declined', declineReason: input.reason, decidedAt: now }).where(eq(dealerAccounts.id, dealerAccountId)).run();
      notify.decided(tx, dealerAccountId, 'decline');
      return { id: dealerAccountId, status: 'declined' };
    });
    return result;
  }

  /** Refuses, saying why, a user who may not apply for a trade account. */
  function assertMayApply(applicant: { role: string; dealer: { status: DealerStatus } | null }): void {
    if (applicant.role !== 'customer') throw new ConflictError('This account cannot apply for a trade account');
    if (applicant.dealer) throw new ConflictError(applicant.dealer.status === 'pending' ? 'Your application is already with us' : 'You already have a trade account');
  }

  /** A customer applies: the account is made pending with them as its member, and the office is told. */
  function apply(applicant: { id: string; role: string; dealer: { status: DealerStatus } | null }, input: DealerApplication): { id: number; status: 'pending' } {
    assertMayApply(applicant);
    const id = db.transaction((tx) => {
      const row = tx
        .insert(dealerAccounts)
        .values({
          companyName: input.companyName,
          contactName: input.contactName,
          phone: input.phone,
          taxNumber: input.taxNumber ?? null,
          addressLine1: input.addressLine1,
          city: input.city,
          postcode: input.postcode,
          deliveryZone: input.deliveryZone,
        })
        .returning({ id: dealerAccounts.id })
        .get();
      tx.insert(dealerMembers).values({ userId: applicant.id, dealerAccountId: row.id }).run();
      notify.applied(tx, row.id);
      return row.id;
    });
    return { id, status: 'pending' };
  }

  return { list, openBalance, openInvoices, recordInvoicePaid, decide, assertMayApply, apply };
}

export type DealerAccountsService = ReturnType<typeof createDealerAccountsService>;
