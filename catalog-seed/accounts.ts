import { eq } from 'drizzle-orm';
import type { Db } from '../server/db/client';
import { dealerAccounts, dealerMembers, user } from '../server/db/schema';
import type { Auth } from '../server/services/auth';

export const DEMO_PASSWORD = 'spoolyard-demo-1';

/**
 * One account per role, a second dealer, a second buyer of the first dealer, and a pending trade application; all
 * invented, at the reserved .test domain.
 */
export const DEMO_ACCOUNTS = [
  { role: 'customer', email: 'retail@spoolyard.test', name: 'Robin Ashdown' },
  { role: 'dealer', email: 'dealer@spoolyard.test', name: 'Morgan Tillbrook', dealer: { companyName: 'Tillbrook Boost Works', tier: 'preferred', creditLimitCents: 2_500_000, paymentTermsDays: 30, zone: 'national', line1: '14 Kiln Lane', city: 'Emberleigh', postcode: 'EM4 2QT' } },
  { role: 'dealer', email: 'dealer2@spoolyard.test', name: 'Sam Okonedo-Hale', dealer: { companyName: 'Quayside Marine Engines', tier: 'standard', creditLimitCents: 500_000, paymentTermsDays: 14, zone: 'remote', line1: '3 Slipway Road', city: 'Port Fennick', postcode: 'PF1 8LD' } },
  { role: 'warehouse', email: 'warehouse@spoolyard.test', name: 'Jo Ferrand' },
  // The Bench: service requests, inspections, quotes and rebuilds.
  { role: 'workshop', email: 'workshop@spoolyard.test', name: 'Dana Quillfeather' },
  // A second buyer at the first dealer: the account's parts lists are shared between its users.
  { role: 'dealer', email: 'dealer-bench@spoolyard.test', name: 'Rowan Kestleby', memberOf: 'Tillbrook Boost Works' },
  { role: 'admin', email: 'admin@spoolyard.test', name: 'Alex Varga-Moor' },
  { role: 'customer', email: 'applicant@spoolyard.test', name: 'Casey Penhallow', application: { companyName: 'Penhallow Performance', line1: '88 Mill Street', city: 'Wickerholt', postcode: 'WH9 3AB' } },
] as const;

export function demoAccountList() {
  return DEMO_ACCOUNTS.map((a) => ({ role: 'application' in a ? 'applicant (customer)' : a.role, email: a.email, password: DEMO_PASSWORD }));
}

export async function seedDemoAccounts(auth: Auth, db: Db): Promise<number> {
  let made = 0;
  for (const a of DEMO_ACCOUNTS) {
    if (db.select({ id: user.id }).from(user).where(eq(user.email, a.email)).get()) continue;
    const { user: created } = await auth.api.signUpEmail({ body: { name: a.name, email: a.email, password: DEMO_PASSWORD } });
    db.update(user).set({ role: a.role, emailVerified: true }).where(eq(user.id, created.id)).run();
    if ('dealer' in a) {
      const d = a.dealer;
      const row = db
        .insert(dealerAccounts)
        .values({
          companyName: d.companyName,
          contactName: a.name,
          phone: '+10 555 0100',
          addressLine1: d.line1,
          city: d.city,
          postcode: d.postcode,
          deliveryZone: d.zone,
          status: 'approved',
          tier: d.tier,
          creditLimitCents: d.creditLimitCents,
          paymentTermsDays: d.paymentTermsDays,
          decidedAt: new Date().toISOString(),
        })
        .returning({ id: dealerAccounts.id })
        .get();
      db.insert(dealerMembers).values({ userId: created.id, dealerAccountId: row.id }).run();
    }
    if ('memberOf' in a) {
      const dealer = db.select({ id: dealerAccounts.id }).from(dealerAccounts).where(eq(dealerAccounts.companyName, a.memberOf)).get();
      if (dealer) db.insert(dealerMembers).values({ userId: created.id, dealerAccountId: dealer.id }).run();
    }
    if ('application' in a) {
      const p = a.application;
      const row = db
        .insert(dealerAccounts)
        .values({ companyName: p.companyName, contactName: a.name, phone: '+10 555 0199', addressLine1: p.line1, city: p.city, postcode: p.postcode, deliveryZone: 'local' })
        .returning({ id: dealerAccounts.id })
        .get();
      db.insert(dealerMembers).values({ userId: created.id, dealerAccountId: row.id }).run();
    }
    made++;
  }
  return made;
}
