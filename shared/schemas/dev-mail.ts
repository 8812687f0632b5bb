import { z } from 'zod';

/** One message the development mail catcher holds (GET /api/dev/mail). */
export const CaughtMailSchema = z.object({
  id: z.string(),
  to: z.array(z.string()),
  from: z.string().nullable(),
  subject: z.string(),
  text: z.string().nullable(),
  html: z.string().nullable(),
  date: z.string(),
});
export type CaughtMail = z.infer<typeof CaughtMailSchema>;

export const CaughtMailListSchema = z.object({ messages: z.array(CaughtMailSchema) });
