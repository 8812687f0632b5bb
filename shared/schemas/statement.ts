import { z } from 'zod';
import { AGEING_BUCKETS } from '../ageing';

const BUCKET_KEYS = AGEING_BUCKETS.map((b) => b.key) as [(typeof AGEING_BUCKETS)[number]['key'], ...Array<(typeof AGEING_BUCKETS)[number]['key']>];
const cents = z.number().int();

export const STATEMENT_LINE_KINDS = ['brought-forward', 'invoice', 'payment', 'credit-note'] as const;

export const StatementInvoiceSchema = z.object({
  number: z.string(),
  date: z.string(),
  purchaseOrder: z.string().nullable(),
  dueDate: z.string(),
  daysPastDue: z.number().int(),
  bucket: z.enum(BUCKET_KEYS),
  totalCents: cents,
  creditedCents: cents,
  openCents: cents,
});
export type StatementInvoice = z.infer<typeof StatementInvoiceSchema>;

export const StatementLineSchema = z.object({
  date: z.string(),
  kind: z.enum(STATEMENT_LINE_KINDS),
  reference: z.string(),
  orderNumber: z.string().nullable(),
  detail: z.string(),
  /** What the line adds to what is owed (an invoice) and what it takes off (a payment, a credit note). */
  debitCents: cents,
  creditCents: cents,
  balanceCents: cents,
});
export type StatementLine = z.infer<typeof StatementLineSchema>;

export const StatementCreditNoteSchema = z.object({
  number: z.string(),
  date: z.string(),
  orderNumber: z.string(),
  returnReference: z.string(),
  amountCents: cents,
});

export const AccountStatementSchema = z.object({
  dealer: z.object({
    companyName: z.string(),
    contactName: z.string(),
    addressLine1: z.string(),
    city: z.string(),
    postcode: z.string(),
    creditLimitCents: cents,
    paymentTermsDays: z.number().int(),
  }),
  /** The statement date (UTC), and the first day its activity covers. */
  asOf: z.string(),
  from: z.string(),
  openInvoices: z.array(StatementInvoiceSchema),
  ageing: z.object(Object.fromEntries(BUCKET_KEYS.map((k) => [k, cents])) as Record<(typeof BUCKET_KEYS)[number], typeof cents>),
  lines: z.array(StatementLineSchema),
  creditNotes: z.array(StatementCreditNoteSchema),
  totals: z.object({
    broughtForwardCents: cents,
    invoicedCents: cents,
    paidCents: cents,
    creditedCents: cents,
    /** What the account owes on the statement date: brought forward + invoiced − paid − credited. */
    balanceCents: cents,
    /** The open invoices, which count against the credit limit. */
    openInvoicesCents: cents,
    /** Credit notes on invoices already paid: owed to the dealer, taken off the balance. */
    unappliedCreditCents: cents,
    overdueCents: cents,
    creditLimitCents: cents,
    availableCreditCents: cents,
  }),
});
export type AccountStatement = z.infer<typeof AccountStatementSchema>;

/** How far back a statement's activity may start: ten years is plenty for a trade account. */
export const STATEMENT_MAX_DAYS = 3660;
export const STATEMENT_DEFAULT_DAYS = 90;
export const StatementQuerySchema = z.object({
  from: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD')
    .optional(),
});
