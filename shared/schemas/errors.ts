import { z } from 'zod';

/** The one error shape every API route answers with. */
export const ApiErrorSchema = z.object({
  error: z.object({ message: z.string(), fieldErrors: z.record(z.string(), z.array(z.string())).optional() }),
});
export type ApiErrorBody = z.infer<typeof ApiErrorSchema>;
