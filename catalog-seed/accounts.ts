import type { Db } from '../server/db/client';
import type { Auth } from '../server/services/auth';

export const DEMO_PASSWORD = 'spoolyard-demo-1';

/** One account per role, a second dealer, and a pending trade application; all invented, at the reserved .test domain. */
export const DEMO_ACCOUNTS = [
  { role: 'customer', email: 'retail@spoolyard.test', name: 'Robin Ashdown' },
  { role: 'dealer', email: 'dealer@spoolyard.test', name: 'Morgan Tillbrook', dealer: { companyName: 'Tillbrook Boost Works', tier: 'preferred', creditLimitCents: 2_500_000, paymentTermsDays: 30, zone: 'national', line1: '14 Kiln Lane', city: 'Emberleigh', postcode: 'EM4 2QT' } },
  { role: 'dealer', email: 'dealer2@spoolyard.test', name: 'Sam Okonedo-Hale', dealer: { companyName: 'Quayside Marine Engines', tier: 'standard', creditLimitCents: 500_000, paymentTermsDays: 14, zone: 'remote', line1: '3 Slipway Road', city: 'Port Fennick', postcode: 'PF1 8LD' } },
  { role: 'warehouse', email: 'warehouse@spoolyard.test', name: 'Jo Ferrand' },
  { role: 'admin', email: 'admin@spoolyard.test', name: 'Alex Varga-Moor' },
  { role: 'customer', email: 'applicant@spoolyard.test', name: 'Casey Penhallow', application: { companyName: 'Penhallow Performance', line1: '88 Mill Street', city: 'Wickerholt', postcode: 'WH9 3AB' } },
] as const;

export function demoAccountList() {
  return DEMO_ACCOUNTS.map((a) => ({ role: 'application' in a ? 'applicant (customer)' : a.role, email: a.email, password: DEMO_PASSWORD }));
}

export async function seedDemoAccounts(auth: Auth, db: Db): Promise<number> {
  const sqlite = db.$client;
  let made = 0;
  for (const a of DEMO_ACCOUNTS) {
    if (sqlite.prepare('SELECT 1 FROM user WHERE email = ?').get(a.email)) continue;
    const { user } = await auth.api.signUpEmail({ body: { name: a.name, email: a.email, password: DEMO_PASSWORD } });
    sqlite.prepare('UPDATE user SET role = ?, email_verified = 1 WHERE id = ?').run(a.role, user.id);
    if ('dealer' in a) {
      const d = a.dealer;
      const row = sqlite
        .prepare(
          `INSERT INTO dealer_accounts (company_name, contact_name, phone, address_line1, city, postcode, delivery_zone, status, tier, credit_limit_cents, payment_terms_days, decided_at)
           VALUES (?, ?, '+10 555 0100', ?, ?, ?, ?, 'approved', ?, ?, ?, strftime('%Y-%m-%dT%H:%M:%fZ','now')) RETURNING id`,
        )
        .get(d.companyName, a.name, d.line1, d.city, d.postcode, d.zone, d.tier, d.creditLimitCents, d.paymentTermsDays) as { id: number };
      sqlite.prepare('INSERT INTO dealer_members (user_id, dealer_account_id) VALUES (?, ?)').run(user.id, row.id);
    }
    if ('application' in a) {
      const p = a.application;
      const row = sqlite
        .prepare(
          `INSERT INTO dealer_accounts (company_name, contact_name, phone, address_line1, city, postcode, delivery_zone) VALUES (?, ?, '+10 555 0199', ?, ?, ?, 'local') RETURNING id`,
        )
        .get(p.companyName, a.name, p.line1, p.city, p.postcode) as { id: number };
      sqlite.prepare('INSERT INTO dealer_members (user_id, dealer_account_id) VALUES (?, ?)').run(user.id, row.id);
    }
    made++;
  }
  return made;
}
