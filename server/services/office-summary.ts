import { count, eq, ne } from 'drizzle-orm';
import type { Db } from '../db/client';
import { dealerAccounts, mailOutbox, parts, paymentAlerts, priceImports } from '../db/schema';
import type { OfficeSummary } from '../../shared/schemas/office-summary';

/** The Office index's counts: one indexed or small-table count each, so the page costs next to nothing. */
export function officeSummary(db: Db): OfficeSummary {
  const countOf = (rows: Array<{ n: number }>) => rows[0]?.n ?? 0;
  return {
    activeParts: countOf(db.select({ n: count() }).from(parts).where(eq(parts.status, 'active')).all()),
    pendingApplications: countOf(db.select({ n: count() }).from(dealerAccounts).where(eq(dealerAccounts.status, 'pending')).all()),
    openPaymentAlerts: countOf(db.select({ n: count() }).from(paymentAlerts).where(ne(paymentAlerts.refundState, 'refunded')).all()),
    failedMail: countOf(db.select({ n: count() }).from(mailOutbox).where(eq(mailOutbox.state, 'failed')).all()),
    priceImportPreviews: countOf(db.select({ n: count() }).from(priceImports).where(eq(priceImports.status, 'preview')).all()),
  };
}
