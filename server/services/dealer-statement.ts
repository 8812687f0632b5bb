import { and, eq, inArray, isNotNull, ne } from 'drizzle-orm';
import type { Db } from '../db/client';
import { creditNotes, dealerAccounts, dealerPayments, orderEvents, orders, returns, serviceRequests } from '../db/schema';
import { ageInvoices, ageingBucket, daysPastDue, overdueCents, utcDate } from '../../shared/ageing';
import { availableCreditCents, invoiceDueDate, invoiceOpenCents, isOpenInvoice } from '../../shared/credit';
import { STATEMENT_DEFAULT_DAYS, STATEMENT_MAX_DAYS, type AccountStatement, type StatementLine } from '../../shared/schemas/statement';
import { InvalidError, NotFoundError } from './errors';

const DAY_MS = 86_400_000;
const dayOffset = (day: string, days: number) => utcDate(new Date(Date.parse(`${day}T00:00:00Z`) + days * DAY_MS));

/** A ledger event before it gets its running balance; `at` orders events, invoices first on the same instant. */
type Event = Omit<StatementLine, 'balanceCents' | 'date'> & { at: string };
const KIND_ORDER: Record<StatementLine['kind'], number> = { 'brought-forward': 0, invoice: 1, 'credit-note': 2, payment: 3 };

/**
 * A dealer's account statement: the invoices on account (cancelled orders were never owed), the payments the office
 * recorded and the credit notes from returns, as a ledger with a running balance; the open invoices aged by days past
 * their due date (shared/ageing.ts); and the balance against the credit limit. Read-only.
 */
export function createDealerStatements(deps: { db: Db; now: () => Date }) {
  const { db } = deps;

  function statement(dealerAccountId: number, fromDay?: string): AccountStatement {
    const dealer = db
      .select({
        companyName: dealerAccounts.companyName,
        contactName: dealerAccounts.contactName,
        addressLine1: dealerAccounts.addressLine1,
        city: dealerAccounts.city,
        postcode: dealerAccounts.postcode,
        creditLimitCents: dealerAccounts.creditLimitCents,
        paymentTermsDays: dealerAccounts.paymentTermsDays,
      })
      .from(dealerAccounts)
      .where(eq(dealerAccounts.id, dealerAccountId))
      .get();
    if (!dealer) throw new NotFoundError('No such dealer account');
    const asOf = utcDate(deps.now());
    const from = fromDay ?? dayOffset(asOf, -STATEMENT_DEFAULT_DAYS);
    if (from > asOf) throw new InvalidError('The statement cannot start after today', { from: ['choose a day up to today'] });
    if (from < dayOffset(asOf, -STATEMENT_MAX_DAYS)) throw new InvalidError('A statement covers at most ten years', { from: ['choose a later day'] });

    const invoices = db
      .select({
        id: orders.id,
        number: orders.number,
        createdAt: orders.createdAt,
        purchaseOrder: orders.purchaseOrder,
        termsDays: orders.paymentTermsDays,
        paymentMethod: orders.paymentMethod,
        paymentState: orders.paymentState,
        status: orders.status,
        totalCents: orders.totalCents,
        refundedCents: orders.refundedCents,
      })
      .from(orders)
      .where(and(eq(orders.dealerAccountId, dealerAccountId), eq(orders.paymentMethod, 'account'), ne(orders.status, 'cancelled')))
      .orderBy(orders.id)
      .all();
    const ids = invoices.map((i) => i.id);
    const numberOf = new Map(invoices.map((i) => [i.id, i.number]));
    const notes =
      ids.length === 0
        ? []
        : db
            .select({ number: creditNotes.number, at: creditNotes.createdAt, orderId: creditNotes.orderId, amountCents: creditNotes.amountCents, returnReference: returns.reference })
            .from(creditNotes)
            .innerJoin(returns, eq(returns.id, creditNotes.returnId))
            .where(inArray(creditNotes.orderId, ids))
            .orderBy(creditNotes.id)
            .all();
    const payments =
      ids.length === 0
        ? []
        : db
            .select({ orderId: dealerPayments.orderId, at: dealerPayments.createdAt, amountCents: dealerPayments.amountCents, reference: dealerPayments.reference })
            .from(dealerPayments)
            .where(inArray(dealerPayments.orderId, ids))
            .orderBy(dealerPayments.id)
            .all();
    // Invoices recorded paid before payments had rows of their own: the payment is read from the order's history, for
    // what was owed then (the total less the credit notes before it).
    const recorded = new Set(payments.map((p) => p.orderId));
    const unrecorded = invoices.filter((i) => i.paymentState === 'paid' && !recorded.has(i.id));
    if (unrecorded.length > 0) {
      const events = db
        .select({ orderId: orderEvents.orderId, at: orderEvents.createdAt, note: orderEvents.note })
        .from(orderEvents)
        .where(and(inArray(orderEvents.orderId, unrecorded.map((i) => i.id)), eq(orderEvents.status, 'invoice_paid')))
        .all();
      for (const i of unrecorded) {
        const paid = events.find((e) => e.orderId === i.id);
        const at = paid?.at ?? i.createdAt;
        const creditedBefore = notes.filter((n) => n.orderId === i.id && n.at <= at).reduce((s, n) => s + n.amountCents, 0);
        payments.push({ orderId: i.id, at, amountCents: i.totalCents - creditedBefore, reference: paid?.note?.replace(/^Payment received, reference /, '') ?? 'payment' });
      }
    }

    // Service invoices from the Bench on account: issued when the unit ships back, paid when the office records it.
    const service = db
      .select({
        number: serviceRequests.invoiceNumber,
        reference: serviceRequests.reference,
        shippedAt: serviceRequests.shippedAt,
        termsDays: serviceRequests.paymentTermsDays,
        purchaseOrder: serviceRequests.purchaseOrder,
        totalCents: serviceRequests.chargeCents,
        paidAt: serviceRequests.invoicePaidAt,
        paymentReference: serviceRequests.invoicePaymentReference,
      })
      .from(serviceRequests)
      .where(and(eq(serviceRequests.dealerAccountId, dealerAccountId), eq(serviceRequests.paymentMethod, 'account'), isNotNull(serviceRequests.invoiceNumber), isNotNull(serviceRequests.shippedAt)))
      .orderBy(serviceRequests.id)
      .all()
      .map((v) => ({ ...v, number: v.number ?? '', at: v.shippedAt ?? '' }));

    const events: Event[] = [
      ...service.map((v): Event => ({
        at: v.at,
        kind: 'invoice',
        reference: v.number,
        orderNumber: null,
        detail: `Service ${v.reference} · due ${invoiceDueDate(v.at, v.termsDays)}${v.purchaseOrder ? ` · your PO ${v.purchaseOrder}` : ''}`,
        debitCents: v.totalCents,
        creditCents: 0,
      })),
      ...service
        .filter((v) => v.paidAt !== null)
        .map((v): Event => ({ at: v.paidAt ?? v.at, kind: 'payment', reference: v.paymentReference ?? 'payment', orderNumber: null, detail: `Payment of ${v.number}`, debitCents: 0, creditCents: v.totalCents })),
      ...invoices.map((i): Event => ({
        at: i.createdAt,
        kind: 'invoice',
        reference: i.number,
        orderNumber: i.number,
        detail: `Due ${invoiceDueDate(i.createdAt, i.termsDays)}${i.purchaseOrder ? ` · your PO ${i.purchaseOrder}` : ''}`,
        debitCents: i.totalCents,
        creditCents: 0,
      })),
      ...notes.map((n): Event => ({
        at: n.at,
        kind: 'credit-note',
        reference: n.number,
        orderNumber: numberOf.get(n.orderId) ?? null,
        detail: `Return ${n.returnReference}`,
        debitCents: 0,
        creditCents: n.amountCents,
      })),
      ...payments.map((p): Event => ({
        at: p.at,
        kind: 'payment',
        reference: p.reference,
        orderNumber: numberOf.get(p.orderId) ?? null,
        detail: `Payment of ${numberOf.get(p.orderId) ?? 'an invoice'}`,
        debitCents: 0,
        creditCents: p.amountCents,
      })),
    ].sort((a, b) => a.at.slice(0, 10).localeCompare(b.at.slice(0, 10)) || a.at.localeCompare(b.at) || KIND_ORDER[a.kind] - KIND_ORDER[b.kind]);

    const before = events.filter((e) => e.at.slice(0, 10) < from);
    const during = events.filter((e) => e.at.slice(0, 10) >= from && e.at.slice(0, 10) <= asOf);
    const broughtForward = before.reduce((s, e) => s + e.debitCents - e.creditCents, 0);
    let running = broughtForward;
    const lines: StatementLine[] = [
      { date: from, kind: 'brought-forward', reference: '', orderNumber: null, detail: 'Balance at the start of the period', debitCents: 0, creditCents: 0, balanceCents: broughtForward },
      ...during.map(({ at, ...e }) => {
        running += e.debitCents - e.creditCents;
        return { ...e, date: at.slice(0, 10), balanceCents: running };
      }),
    ];

    const open = invoices.filter(isOpenInvoice).map((i) => {
      const dueDate = invoiceDueDate(i.createdAt, i.termsDays);
      return {
        number: i.number,
        date: i.createdAt.slice(0, 10),
        purchaseOrder: i.purchaseOrder,
        dueDate,
        daysPastDue: daysPastDue(dueDate, asOf),
        bucket: ageingBucket(dueDate, asOf),
        totalCents: i.totalCents,
        creditedCents: i.refundedCents,
        openCents: invoiceOpenCents(i),
      };
    });
    for (const v of service.filter((x) => x.paidAt === null)) {
      const dueDate = invoiceDueDate(v.at, v.termsDays);
      open.push({ number: v.number, date: v.at.slice(0, 10), purchaseOrder: v.purchaseOrder, dueDate, daysPastDue: daysPastDue(dueDate, asOf), bucket: ageingBucket(dueDate, asOf), totalCents: v.totalCents, creditedCents: 0, openCents: v.totalCents });
    }
    const ageing = ageInvoices(open, asOf);
    const openInvoicesCents = open.reduce((s, i) => s + i.openCents, 0);
    const sum = (kind: StatementLine['kind'], pick: 'debitCents' | 'creditCents') => during.filter((e) => e.kind === kind).reduce((s, e) => s + e[pick], 0);
    return {
      dealer,
      asOf,
      from,
      openInvoices: open,
      ageing,
      lines,
      creditNotes: notes.map((n) => ({ number: n.number, date: n.at.slice(0, 10), orderNumber: numberOf.get(n.orderId) ?? '', returnReference: n.returnReference, amountCents: n.amountCents })),
      totals: {
        broughtForwardCents: broughtForward,
        invoicedCents: sum('invoice', 'debitCents'),
        paidCents: sum('payment', 'creditCents'),
        creditedCents: sum('credit-note', 'creditCents'),
        balanceCents: running,
        openInvoicesCents,
        unappliedCreditCents: Math.max(0, openInvoicesCents - running),
        overdueCents: overdueCents(ageing),
        creditLimitCents: dealer.creditLimitCents,
        availableCreditCents: availableCreditCents({ openBalanceCents: openInvoicesCents, creditLimitCents: dealer.creditLimitCents }),
      },
    };
  }

  return { statement };
}

export type DealerStatements = ReturnType<typeof createDealerStatements>;
