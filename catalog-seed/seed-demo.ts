import { openDatabase } from '../server/db/client';
import { publicUrl, type Env } from '../server/env';
import { createAuth } from '../server/services/auth';
import { seedDemoAccounts } from './accounts';
import { generateCatalogue } from './generate';
import { catalogueIsEmpty, loadCatalogue } from './load';
import { seedDemoShaftLogs } from './seed-shaft-logs';

/**
 * The demo catalogue, one account per role and the demo dealer's logged check, written into the database before the
 * app starts. A development tool: `npm start` calls it, the server itself never does, and production refuses it.
 */
export async function seedDemo(env: Env): Promise<void> {
  const db = openDatabase(env.DATABASE_FILE);
  try {
    if (catalogueIsEmpty(db)) {
      const { parts } = loadCatalogue(db, generateCatalogue());
      console.log(`Seeded the demo catalogue: ${parts} parts`);
    }
    // Accounts go through the same sign-up as people's, so their passwords are hashed as any other.
    const auth = createAuth({
      db,
      baseURL: publicUrl(env),
      secret: env.AUTH_SECRET,
      trustedOrigins: [],
      secureCookies: false,
      // Demo accounts are marked confirmed right after; nothing is mailed.
      sendResetPassword: async () => {},
      sendConfirmEmail: async () => {},
      sendExistingAccountNotice: async () => {},
      background: () => {},
    });
    const made = await seedDemoAccounts(auth, db);
    if (made > 0) console.log(`Seeded ${made} demo accounts`);
    // Optional demo data: a failure here is reported but does not keep the shop from starting.
    try {
      if (seedDemoShaftLogs(db)) console.log('Seeded the demo dealer’s logged fitment check');
    } catch (err) {
      console.warn('The demo shaft-speed logs were not seeded:', (err as Error).message);
    }
  } finally {
    db.$client.close();
  }
}
