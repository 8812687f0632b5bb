import { z } from 'zod';
import { isStrongPassword, WEAK_PASSWORD_MESSAGE } from '../password-strength';
import { EMAIL_MAX, PASSWORD_MAX, PASSWORD_MIN, PersonNameSchema } from './accounts';

/*
 * Kept apart from accounts.ts: the password rule carries the common-password dictionary, which only the sign-up,
 * reset and password screens (and the server) should load.
 */

/** A password someone chooses (sign-up, reset, change): long enough, and not a common one. */
export const NewPasswordSchema = z
  .string({ error: 'enter a password' })
  .min(PASSWORD_MIN, `password must be at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, 'password is too long')
  .refine((p) => isStrongPassword(p), WEAK_PASSWORD_MESSAGE);

export const SignUpSchema = z.object({
  name: PersonNameSchema,
  email: z.email('enter a valid e-mail address').max(EMAIL_MAX, 'e-mail address is too long'),
  password: NewPasswordSchema,
});
export type SignUp = z.infer<typeof SignUpSchema>;
