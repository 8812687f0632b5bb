import { eq } from 'drizzle-orm';
import type { Db } from '../server/db/client';
import { meta, user } from '../server/db/schema';
import { createFitmentService } from '../server/services/fitment';
import { createShaftLogService } from '../server/services/shaft-logs';
import type { FitmentRequest } from '../shared/schemas/fitment';
import { DEMO_ACCOUNTS } from './accounts';
import { demoShaftLogCsv } from './demo-logs';

/** Marks the database once the demo logs are in, so a check the dealer deletes stays deleted. */
const SEEDED_KEY = 'demo-shaft-logs';
const DEALER_EMAIL = DEMO_ACCOUNTS.find((a) => a.role === 'dealer')?.email ?? 'dealer@spoolyard.test';

export const DEMO_LOGGED_CHECK: { name: string; input: FitmentRequest } = {
  name: 'Demo: 2.0 L street car on the logger',
  input: { displacementL: 2.0, powerHp: 280, rpm: 6500, fuel: 'petrol', application: 'street' },
};

export const DEMO_LOG_NAMES = ['Second-gear pull, dry day', 'Third-gear pull with a boost spike'] as const;

/**
 * Gives the demo dealer a saved check with two invented logs on its best frame: a clean pull with a near-surge
 * lift-off (boost in kPa), and one that touches past the shaft-speed limit (boost in psi). Once per database;
 * false when it has been done or the dealer is not there yet.
 */
export function seedDemoShaftLogs(db: Db): boolean {
  if (db.select().from(meta).where(eq(meta.key, SEEDED_KEY)).get()) return false;
  const dealer = db.select({ id: user.id }).from(user).where(eq(user.email, DEALER_EMAIL)).get();
  if (!dealer) return false;

  const fitment = createFitmentService(db);
  const logs = createShaftLogService({ db, fitment });
  const saved = fitment.save(dealer.id, DEMO_LOGGED_CHECK.name, DEMO_LOGGED_CHECK.input);
  const result = fitment.check(saved.input);
  const frameCode = saved.bestFrameCode ?? result.candidates[0]?.frameCode;
  const frame = fitment.frameMaps().find((f) => f.code === frameCode);
  if (!frame) return false;
  const base = {
    engine: result.assumptions,
    chargeAirC: result.assumptions.manifoldTempC,
    frame,
    operatingLine: result.operatingLine,
    comments: ['Spoolyard demo shaft-speed log: invented data.'],
  };
  logs.upload(dealer.id, saved.id, { frameCode: frame.code, name: DEMO_LOG_NAMES[0] }, { text: demoShaftLogCsv({ ...base, seed: 21 }) });
  logs.upload(
    dealer.id,
    saved.id,
    { frameCode: frame.code, name: DEMO_LOG_NAMES[1] },
    { text: demoShaftLogCsv({ ...base, seed: 22, boostUnit: 'psi', overspeedTouch: true }) },
  );
  db.insert(meta).values({ key: SEEDED_KEY, value: new Date().toISOString() }).run();
  return true;
}
