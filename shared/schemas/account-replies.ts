import { z } from 'zod';

/** What better-auth answers on sign-in and sign-up (only the part the client reads). */
export const AuthUserReplySchema = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string() }),
});
export type AuthUserReply = z.infer<typeof AuthUserReplySchema>;

/** Sign-up's answer: the same words for a new address and one that has an account; the next step is in the mail. */
export const SignUpReplySchema = z.object({ status: z.literal(true), message: z.string() });

/** better-auth's plain acknowledgements (sign-out, reset request, reset). */
export const AuthStatusReplySchema = z.object({ status: z.boolean().optional(), success: z.boolean().optional() }).loose();

export const DealerApplicationReplySchema = z.object({ id: z.number(), status: z.literal('pending') });

export const DealerDecisionReplySchema = z.object({ id: z.number(), status: z.enum(['approved', 'declined']) });
export type DealerDecisionReply = z.infer<typeof DealerDecisionReplySchema>;

export const PAYMENT_TERMS_DAYS = [7, 14, 30, 45, 60] as const;
