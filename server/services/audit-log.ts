import { and, count, desc, eq, gte, lt, or, sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import { auditLog, priceImports, user } from '../db/schema';
import { AUDIT_PAGE_SIZE, type AuditPage, type AuditQuery } from '../../shared/schemas/admin-catalog';
import type { AuditAction } from '../../shared/allowed-values';

/** The transaction (or database) an entry is written in: the same one as the change it records. */
type Tx = Pick<Db, 'insert'>;

export type AuditChanges = Record<string, { from: unknown; to: unknown }>;
export interface AuditEntryInput {
  userId: string | null;
  action: AuditAction;
  partId: number | null;
  partNumber: string | null;
  priceImportId?: number | null;
  changes?: AuditChanges;
}

/** Kept well under SQLite's limit on bound values per statement. */
const CHUNK = 500;

/** Writes entries in the caller's transaction, so a change and its record stand or fall together. */
export function recordAudit(tx: Tx, entries: readonly AuditEntryInput[]): void {
  for (let i = 0; i < entries.length; i += CHUNK) {
    const values = entries.slice(i, i + CHUNK).map((e) => ({
      userId: e.userId,
      action: e.action,
      partId: e.partId,
      partNumber: e.partNumber,
      priceImportId: e.priceImportId ?? null,
      changes: e.changes ?? {},
    }));
    if (values.length > 0) tx.insert(auditLog).values(values).run();
  }
}

/** What differs between two flat records, field by field; fields equal on both sides are left out. */
export function diffFields(before: Record<string, unknown>, after: Record<string, unknown>): AuditChanges {
  const changes: AuditChanges = {};
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    const from = before[key] ?? null;
    const to = after[key] ?? null;
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[key] = { from, to };
  }
  return changes;
}

/** LIKE with what was typed taken literally (its own % and _ escaped). */
const contains = (column: SQLiteColumn, text: string, at: 'start' | 'anywhere' = 'anywhere'): SQL =>
  sql`${column} LIKE ${`${at === 'start' ? '' : '%'}${text.replace(/[%_\\]/g, (c) => `\\${c}`)}%`} ESCAPE '\\'`;

/** The day after a YYYY-MM-DD date, so "to" includes the whole of its day. */
const nextDay = (day: string) => new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);

export function createAuditLogReader(deps: { db: Db }) {
  const { db } = deps;

  /** Newest first, filtered by part number, by user (name or e-mail, in part) and by a range of UTC days. */
  function list(query: AuditQuery): AuditPage {
    const where: SQL[] = [];
    // A whole part number or its start ("FLG-50" finds those parts); the user by a piece of their name or e-mail.
    if (query.part) where.push(contains(auditLog.partNumber, query.part.toUpperCase(), 'start'));
    if (query.user) where.push(or(contains(user.name, query.user), contains(user.email, query.user))!);
    if (query.import) where.push(eq(auditLog.priceImportId, query.import));
    if (query.from) where.push(gte(auditLog.createdAt, query.from));
    if (query.to) where.push(lt(auditLog.createdAt, nextDay(query.to)));
    const condition = where.length > 0 ? and(...where) : undefined;
    const total = db.select({ n: count() }).from(auditLog).leftJoin(user, eq(user.id, auditLog.userId)).where(condition).get()?.n ?? 0;
    const items = db
      .select({
        id: auditLog.id,
        createdAt: auditLog.createdAt,
        user: sql<string>`coalesce(${user.name}, 'System')`,
        userEmail: sql<string>`coalesce(${user.email}, '')`,
        action: auditLog.action,
        partNumber: auditLog.partNumber,
        priceImportId: auditLog.priceImportId,
        priceImportFile: priceImports.fileName,
        changes: auditLog.changes,
      })
      .from(auditLog)
      .leftJoin(user, eq(user.id, auditLog.userId))
      .leftJoin(priceImports, eq(priceImports.id, auditLog.priceImportId))
      .where(condition)
      .orderBy(desc(auditLog.id))
      .limit(AUDIT_PAGE_SIZE)
      .offset((query.page - 1) * AUDIT_PAGE_SIZE)
      .all();
    return { items, total, page: query.page, pageSize: AUDIT_PAGE_SIZE };
  }

  return { list };
}

export type AuditLogReader = ReturnType<typeof createAuditLogReader>;
