import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { bins, partAliases, parts, returns, serviceRequests, units } from '../db/schema';
import { acceptedWords, SCAN_KIND_WORDS, SCAN_KINDS, SCAN_READERS, scanProblem, type ScanKeys, type ScanKind } from '../../shared/scan-code';
import type { ScanReply } from '../../shared/schemas/scan';
import { gtinForPart } from '../../shared/gtin';
import { ConflictError, InvalidError, NotFoundError } from './errors';

type Reply<K extends ScanKind> = Extract<ScanReply, { kind: K }>;

/** The database or a transaction: better-sqlite3 has one connection, so both see the same rows. */
type Reader = Pick<Db, 'select'>;

/**
 * How each kind of code is looked up, once its reader (shared/scan-code.ts) has said what it would be. A new kind
 * adds its reader there and its look-up here; every scan field that lists it in `accepts` then takes it.
 */
const LOOKUPS: { [K in ScanKind]: (q: Reader, key: ScanKeys[K], code: string) => Reply<K> | null } = {
  part(q, key, code) {
    const columns = { id: parts.id, partNumber: parts.partNumber, title: parts.title, gtin: parts.gtin, status: parts.status };
    const shown = (p: { id: number; partNumber: string; title: string; gtin: string | null; status: string }) => ({
      partNumber: p.partNumber,
      title: p.title,
      gtin: p.gtin ?? gtinForPart(p.id),
      status: p.status,
    });
    if (key.by === 'gtin') {
      const p = q.select(columns).from(parts).where(eq(parts.gtin, key.gtin)).get();
      return p ? { kind: 'part', code, via: 'gtin', part: shown(p) } : null;
    }
    const own = q.select(columns).from(parts).where(eq(parts.normalizedNumber, key.normalized)).get();
    if (own) return { kind: 'part', code, via: 'part-number', part: shown(own) };
    const aliases = q
      .select({ ...columns, kind: partAliases.kind })
      .from(partAliases)
      .innerJoin(parts, eq(parts.id, partAliases.partId))
      .where(eq(partAliases.normalizedAlias, key.normalized))
      .all();
    const ids = new Set(aliases.map((a) => a.id));
    if (ids.size > 1) {
      throw new ConflictError(`${code} is a cross-reference of ${ids.size} parts (${[...new Set(aliases.map((a) => a.partNumber))].join(', ')}): scan the part's own label or its GTIN`);
    }
    const a = aliases[0];
    return a ? { kind: 'part', code, via: a.kind, part: shown(a) } : null;
  },
  bin(q, key, code) {
    const b = q.select({ code: bins.code, zone: bins.zone }).from(bins).where(eq(bins.code, key)).get();
    return b ? { kind: 'bin', code, bin: b } : null;
  },
  return(q, key, code) {
    const r = q.select({ id: returns.id, reference: returns.reference, status: returns.status }).from(returns).where(eq(returns.reference, key)).get();
    return r ? { kind: 'return', code, return: r } : null;
  },
  service(q, key, code) {
    const r = q.select({ id: serviceRequests.id, reference: serviceRequests.reference, status: serviceRequests.status }).from(serviceRequests).where(eq(serviceRequests.reference, key)).get();
    return r ? { kind: 'service', code, service: r } : null;
  },
  unit(q, key, code) {
    const u = q.select({ id: units.id, serial: units.serial, frameCode: units.frameCode }).from(units).where(eq(units.serial, key)).get();
    return u ? { kind: 'unit', code, unit: u } : null;
  },
};

/** How a code of another kind is named when a field refuses it. */
function whatItIs(found: ScanReply): string {
  switch (found.kind) {
    case 'part':
      return `${found.part.partNumber}'s part label`;
    case 'bin':
      return `bin ${found.bin.code}'s label`;
    case 'return':
      return `return ${found.return.reference}'s label`;
    case 'service':
      return `service request ${found.service.reference}'s label`;
    case 'unit':
      return `unit ${found.unit.serial}'s serial plate`;
  }
}

function lookUp<K extends ScanKind>(q: Reader, kind: K, code: string): Reply<K> | null {
  const key = SCAN_READERS[kind](code);
  return key === null ? null : LOOKUPS[kind](q, key as ScanKeys[K], code);
}

/**
 * Resolves what a scan field received, for the kinds that field takes. One answer for every Floor field: a code
 * that cannot be read (a wrong GTIN check digit) is refused as invalid; a code of a kind the field does not take
 * is refused saying what it is; a code that names nothing is not found. Kinds are tried in SCAN_KINDS order, so
 * a code that could be two kinds resolves the same everywhere.
 */
export function resolveScan<K extends ScanKind>(q: Reader, raw: string, accepts: readonly K[]): Reply<K> {
  const code = raw.trim();
  const problem = scanProblem(code);
  if (problem) throw new InvalidError(problem, { code: [problem] });
  let other: ScanReply | null = null;
  for (const kind of SCAN_KINDS) {
    const found = lookUp(q, kind, code);
    if (!found) continue;
    if ((accepts as readonly ScanKind[]).includes(kind)) return found as Reply<K>;
    other ??= found;
  }
  const wanted = acceptedWords(accepts);
  if (other) {
    throw new InvalidError(`That is ${whatItIs(other)}, not ${SCAN_KIND_WORDS[accepts[0] ?? 'part'].label}: scan ${wanted}`, { code: [`scan ${wanted}`] });
  }
  throw new NotFoundError(`Nothing here has the code ${code.slice(0, 40)}: scan ${wanted}`);
}

export function createScanResolver(db: Db) {
  return {
    resolve: <K extends ScanKind>(code: string, accepts: readonly K[]) => resolveScan(db, code, accepts),
  };
}
export type ScanResolver = ReturnType<typeof createScanResolver>;
