import { z } from 'zod';

const EnvSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_FILE: z.string().min(1).default('data/spoolyard.db'),
  /** Seed the demo catalogue when the database has no parts. */
  SEED_DEMO: z.enum(['true', 'false']).default('true').transform((v) => v === 'true'),
});

export type Env = z.infer<typeof EnvSchema>;

/** Parses the environment once at boot; a malformed variable stops start-up with a message that names it. */
export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = EnvSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return result.data;
}
