import { z } from 'zod';
import { DEALER_STATUSES, ROLES } from '../allowed-values';
import { DEALER_TIER_KEYS, DELIVERY_ZONE_KEYS } from '../pricing';
import { pageFields, pageQuerySchema } from './paging';

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 128;
export const NAME_MAX = 80;
export const EMAIL_MAX = 254;

export const PersonNameSchema = z.string({ error: 'enter your name' }).trim().min(2, 'enter your name').max(NAME_MAX, 'name is too long');

export const SignInSchema = z.object({
  email: z.email('enter your e-mail address'),
  password: z.string().min(1, 'enter your password').max(128),
});
export type SignIn = z.infer<typeof SignInSchema>;


export const DealerApplicationSchema = z.object({
  companyName: z.string().trim().min(2, 'enter the company name').max(100),
  contactName: z.string().trim().min(2, 'enter a contact name').max(80),
  phone: z.string().trim().regex(/^[+\d][\d\s\-()]{5,20}$/, 'enter a phone number'),
  taxNumber: z.string().trim().max(30).optional(),
  addressLine1: z.string().trim().min(3, 'enter the street address').max(120),
  city: z.string().trim().min(2, 'enter the town or city').max(60),
  postcode: z.string().trim().min(3, 'enter the postcode').max(12),
  deliveryZone: z.enum(DELIVERY_ZONE_KEYS, { error: 'choose a delivery zone' }),
});
export type DealerApplication = z.infer<typeof DealerApplicationSchema>;

export const DealerDecisionSchema = z.discriminatedUnion('decision', [
  z.object({
    decision: z.literal('approve'),
    tier: z.enum(DEALER_TIER_KEYS, { error: 'choose a trade tier' }),
    creditLimitCents: z.number().int('credit limit must be whole cents').min(0, 'credit limit cannot be negative').max(100_000_000, 'credit limit is too high'),
    paymentTermsDays: z.number().int().refine((d) => [7, 14, 30, 45, 60].includes(d), 'payment terms must be 7, 14, 30, 45 or 60 days'),
  }),
  z.object({ decision: z.literal('decline'), reason: z.string().trim().min(3, 'give a reason').max(300) }),
]);
export type DealerDecision = z.infer<typeof DealerDecisionSchema>;

export const MeSchema = z.object({
  user: z
    .object({
      id: z.string(),
      email: z.string(),
      name: z.string(),
      role: z.enum(ROLES),
      dealer: z
        .object({
          id: z.number(),
          companyName: z.string(),
          status: z.enum(DEALER_STATUSES),
          tier: z.enum(DEALER_TIER_KEYS).nullable(),
          creditLimitCents: z.number(),
          paymentTermsDays: z.number(),
          deliveryZone: z.string(),
          declineReason: z.string().nullable().optional(),
          address: z.object({ line1: z.string(), city: z.string(), postcode: z.string() }).optional(),
          openBalanceCents: z.number().optional(),
        })
        .nullable(),
    })
    .nullable(),
  demoAccounts: z.array(z.object({ role: z.string(), email: z.string(), password: z.string() })).optional(),
  payments: z.object({ mode: z.enum(['test', 'live']), publishableKey: z.string(), testMethods: z.array(z.object({ id: z.string(), label: z.string() })).optional() }),
});
export type Me = z.infer<typeof MeSchema>;

export const DealerAccountRowSchema = z.object({
  id: z.number(),
  companyName: z.string(),
  contactName: z.string(),
  email: z.string(),
  phone: z.string(),
  city: z.string(),
  status: z.enum(DEALER_STATUSES),
  tier: z.enum(DEALER_TIER_KEYS).nullable(),
  creditLimitCents: z.number(),
  paymentTermsDays: z.number(),
  openBalanceCents: z.number(),
  createdAt: z.string(),
});
export const DEALERS_PAGE_SIZE = 25;
export const DealersQuerySchema = pageQuerySchema(DEALERS_PAGE_SIZE);
/** One page of trade accounts, pending first; `pending` counts every pending application, on any page. */
export const DealerAccountsSchema = z.object({ items: z.array(DealerAccountRowSchema), ...pageFields, pending: z.number().int() });
export type DealerAccounts = z.infer<typeof DealerAccountsSchema>;

/** Recording that a dealer paid an on-account invoice (bank transfer reference, cheque number...). */
export const InvoicePaymentSchema = z.object({
  reference: z.string().trim().min(2, 'enter the payment reference').max(60, 'reference is too long'),
});

export const OpenInvoiceSchema = z.object({
  number: z.string(),
  createdAt: z.string(),
  purchaseOrder: z.string().nullable(),
  totalCents: z.number().int(),
  creditedCents: z.number().int(),
  openCents: z.number().int(),
  termsDays: z.number().int().nullable(),
  dueDate: z.string(),
  creditNotes: z.string().nullable(),
});
export type OpenInvoice = z.infer<typeof OpenInvoiceSchema>;
export const OpenInvoicesSchema = z.object({ items: z.array(OpenInvoiceSchema) });
