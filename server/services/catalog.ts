import type { Db } from '../db/client';
import { CATEGORY_ORDER_EXPR } from '../db/schema';
import { CATEGORIES, categoryLabel, stockState, trimPct, type PartStatus } from '../../shared/catalog';
import { normalizePartNumber } from '../../shared/part-number';
import type { FrameSummary, PartDetail, PartsListResponse, PartsQuery, PartSummary, Specs } from '../../shared/schemas/parts';
import { PAGE_SIZE_DEFAULT } from '../../shared/schemas/parts';
import type { SearchService } from './search';

interface PartRow {
  id: number;
  partNumber: string;
  title: string;
  category: PartSummary['category'];
  frameCode: string | null;
  status: PartStatus;
  condition: 'new' | 'exchange';
  priceCents: number;
  coreDepositCents: number;
  weightGrams: number;
  supersededBy: string | null;
  minStock: number;
  available: number;
  compressorAr: number | null;
  turbineAr: number | null;
  trimPct: number | null;
  inducerMm: number | null;
  exducerMm: number | null;
  flangePattern: string | null;
  inletMm: number | null;
  outletMm: number | null;
  material: string | null;
  bearing: 'journal' | 'ball' | null;
  wastegate: string | null;
  cooling: string | null;
  gaugeType: string | null;
  rangeText: string | null;
  mounting: string | null;
  connection: string | null;
  photo: string | null;
}

// Kept on the part by the stock service, so lists and facets need no sum over the bins.
const AVAILABLE = 'p.available';

const SELECT_SUMMARY = `SELECT p.id, p.part_number AS partNumber, p.title, p.category, p.frame_code AS frameCode, p.status, p.condition,
  p.price_cents AS priceCents, p.core_deposit_cents AS coreDepositCents, p.weight_grams AS weightGrams, p.superseded_by AS supersededBy,
  p.min_stock AS minStock, ${AVAILABLE} AS available,
  s.compressor_ar AS compressorAr, s.turbine_ar AS turbineAr, s.trim_pct AS trimPct, s.inducer_mm AS inducerMm, s.exducer_mm AS exducerMm,
  s.flange_pattern AS flangePattern, s.inlet_mm AS inletMm, s.outlet_mm AS outletMm, s.material, s.bearing, s.wastegate, s.cooling,
  s.gauge_type AS gaugeType, s.range_text AS rangeText, s.mounting, s.connection, json_extract(p.images, '$[0]') AS photo`;

const FROM = 'FROM parts p LEFT JOIN part_specs s ON s.part_id = p.id LEFT JOIN frames f ON f.code = p.frame_code';

function toSummary(r: PartRow): PartSummary {
  const specs: Specs = {
    compressorAr: r.compressorAr,
    turbineAr: r.turbineAr,
    trimPct: r.trimPct,
    inducerMm: r.inducerMm,
    exducerMm: r.exducerMm,
    flangePattern: r.flangePattern,
    inletMm: r.inletMm,
    outletMm: r.outletMm,
    material: r.material,
    bearing: r.bearing,
    wastegate: r.wastegate,
    cooling: r.cooling,
    gaugeType: r.gaugeType,
    rangeText: r.rangeText,
    mounting: r.mounting,
    connection: r.connection,
  };
  const available = Math.max(0, r.available);
  return {
    partNumber: r.partNumber,
    title: r.title,
    category: r.category,
    frameCode: r.frameCode,
    status: r.status,
    condition: r.condition,
    priceCents: r.priceCents,
    coreDepositCents: r.coreDepositCents,
    weightGrams: r.weightGrams,
    supersededBy: r.supersededBy,
    stock: { available, state: stockState(available, r.minStock, r.status) },
    specs,
    photo: r.photo,
  };
}

type Filter = 'category' | 'frame' | 'bearing' | 'stock' | 'power';

function whereFor(query: PartsQuery, skip: Filter | null, includeSuperseded: boolean) {
  const clauses: string[] = [];
  const params: Array<string | number> = [];
  if (!includeSuperseded) clauses.push("p.status <> 'superseded'");
  if (query.category && skip !== 'category') {
    clauses.push('p.category = ?');
    params.push(query.category);
  }
  if (query.frame && skip !== 'frame') {
    clauses.push('p.frame_code = ?');
    params.push(query.frame);
  }
  if (query.bearing && skip !== 'bearing') {
    clauses.push('s.bearing = ?');
    params.push(query.bearing);
  }
  if (query.inStock && skip !== 'stock') clauses.push(`${AVAILABLE} > 0`);
  if (query.minHp !== undefined) {
    clauses.push('f.power_max_hp >= ?');
    params.push(query.minHp);
  }
  if (query.maxHp !== undefined) {
    clauses.push('f.power_min_hp <= ?');
    params.push(query.maxHp);
  }
  return { clauses, params };
}

export function createCatalogService(db: Db, search: SearchService) {
  const sqlite = db.$client;
  const frameNames = () => new Map((sqlite.prepare('SELECT code, name FROM frames').all() as Array<{ code: string; name: string }>).map((f) => [f.code, f.name]));

  function listParts(query: PartsQuery): PartsListResponse {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? PAGE_SIZE_DEFAULT;
    const hits = query.q ? search.search(query.q) : null;
    const rankCte = hits && hits.length > 0 ? `WITH ranked(id, r) AS (VALUES ${hits.map(() => '(?, ?)').join(',')}) ` : '';
    const rankParams = hits ? hits.flatMap((h, i) => [h.partId, i]) : [];
    const rankJoin = rankCte ? ' JOIN ranked ON ranked.id = p.id' : '';
    const empty = hits !== null && hits.length === 0;

    const run = <T>(sql: string, params: Array<string | number>) => sqlite.prepare(sql).all(...params) as T[];
    const build = (skip: Filter | null, joinSpecs = false) => {
      // A search may find superseded numbers: show them, so a buyer sees what replaced the number typed.
      const w = whereFor(query, skip, hits !== null);
      // Join only what the filter needs: counting 50,000 parts through two joins costs ten times a bare scan.
      const specs = joinSpecs || (query.bearing !== undefined && skip !== 'bearing');
      const frames = query.minHp !== undefined || query.maxHp !== undefined;
      const from = `FROM parts p${specs ? ' LEFT JOIN part_specs s ON s.part_id = p.id' : ''}${frames ? ' LEFT JOIN frames f ON f.code = p.frame_code' : ''}`;
      return { where: w.clauses.length ? ` WHERE ${w.clauses.join(' AND ')}` : '', params: w.params, from };
    };

    if (empty) {
      return { items: [], total: 0, page, pageSize, facets: { category: [], frame: [], bearing: [], stock: [] } };
    }

    const main = build(null);
    const order =
      query.sort === 'price-asc'
        ? 'p.price_cents ASC, p.part_number'
        : query.sort === 'price-desc'
          ? 'p.price_cents DESC, p.part_number'
          : query.sort === 'number'
            ? 'p.part_number'
            : query.sort === 'title'
              ? 'p.title, p.part_number'
              : rankCte
                ? 'ranked.r'
                : `${CATEGORY_ORDER_EXPR}, p.frame_code, p.part_number`;
    const total = (run<{ n: number }>(`${rankCte}SELECT count(*) AS n ${main.from}${rankJoin}${main.where}`, [...rankParams, ...main.params])[0]?.n ?? 0);
    const rows = run<PartRow>(`${rankCte}${SELECT_SUMMARY} ${FROM}${rankJoin}${main.where} ORDER BY ${order} LIMIT ? OFFSET ?`, [
      ...rankParams,
      ...main.params,
      pageSize,
      (page - 1) * pageSize,
    ]);
    const reasons = new Map(hits?.map((h) => [h.partId, h.reasons]) ?? []);
    const items = rows.map((r) => ({ ...toSummary(r), ...(hits ? { matched: reasons.get(r.id) ?? [] } : {}) }));

    const facet = (skip: Filter, expr: string) => {
      const w = build(skip, expr.startsWith('s.'));
      return run<{ value: string | null; count: number }>(
        `${rankCte}SELECT ${expr} AS value, count(*) AS count ${w.from}${rankJoin}${w.where} GROUP BY value ORDER BY value`,
        [...rankParams, ...w.params],
      ).filter((r): r is { value: string; count: number } => r.value !== null);
    };
    const names = frameNames();
    const order0 = new Map<string, number>(CATEGORIES.map((c, i) => [c.slug, i]));
    const facets = {
      category: facet('category', 'p.category')
        .map((r) => ({ value: r.value, label: categoryLabel(r.value), count: r.count }))
        .sort((a, b) => (order0.get(a.value) ?? 0) - (order0.get(b.value) ?? 0)),
      frame: facet('frame', 'p.frame_code').map((r) => ({ value: r.value, label: `${r.value} ${names.get(r.value) ?? ''}`.trim(), count: r.count })),
      bearing: facet('bearing', 's.bearing').map((r) => ({ value: r.value, label: r.value === 'ball' ? 'Ball bearing' : 'Journal bearing', count: r.count })),
      stock: facet('stock', `CASE WHEN ${AVAILABLE} > 0 THEN 'true' ELSE 'false' END`).map((r) => ({
        value: r.value,
        label: r.value === 'true' ? 'In stock' : 'Not in stock',
        count: r.count,
      })),
    };
    return { items, total, page, pageSize, facets };
  }

  const summaryById = (id: number) => {
    const r = sqlite.prepare(`${SELECT_SUMMARY} ${FROM} WHERE p.id = ?`).get(id) as PartRow | undefined;
    return r ? toSummary(r) : null;
  };

  function getPart(partNumber: string, opts: { withBins?: boolean } = {}): PartDetail | null {
    const n = normalizePartNumber(partNumber);
    const row = sqlite.prepare(`${SELECT_SUMMARY}, p.description, p.images ${FROM} WHERE p.normalized_number = ?`).get(n) as
      | (PartRow & { description: string; images: string })
      | undefined;
    if (!row) return null;
    const frame = row.frameCode
      ? (sqlite
          .prepare('SELECT code, name, power_min_hp AS minHp, power_max_hp AS maxHp, max_shaft_rpm AS maxShaftRpm, flange_pattern AS flangePattern FROM frames WHERE code = ?')
          .get(row.frameCode) as { code: string; name: string; minHp: number; maxHp: number; maxShaftRpm: number; flangePattern: string } | undefined)
      : undefined;
    const aliases = sqlite.prepare('SELECT alias, kind, source FROM part_aliases WHERE part_id = ? ORDER BY alias').all(row.id) as Array<{
      alias: string;
      kind: string;
      source: string | null;
    }>;
    let replacement: PartSummary | null = null;
    if (row.supersededBy) {
      // Follow a chain of supersessions to the part sold today.
      let next: string | null = row.supersededBy;
      for (let hops = 0; next && hops < 5; hops++) {
        const r = sqlite.prepare('SELECT id, superseded_by AS s FROM parts WHERE normalized_number = ?').get(normalizePartNumber(next)) as { id: number; s: string | null } | undefined;
        if (!r) break;
        replacement = summaryById(r.id);
        next = r.s;
      }
    }
    const linked = sqlite
      .prepare(`${SELECT_SUMMARY} ${FROM} JOIN part_links l ON l.related_part_id = p.id WHERE l.part_id = ? AND p.status <> 'superseded' ORDER BY p.category, p.part_number`)
      .all(row.id) as PartRow[];
    const detail: PartDetail = {
      ...toSummary(row),
      description: row.description,
      images: JSON.parse(row.images) as string[],
      frame: frame ? { code: frame.code, name: frame.name, powerBandHp: [frame.minHp, frame.maxHp], maxShaftRpm: frame.maxShaftRpm, flangePattern: frame.flangePattern } : null,
      crossReferences: aliases.filter((a) => a.kind === 'cross-reference').map((a) => ({ number: a.alias, source: a.source })),
      earlierNumbers: aliases.filter((a) => a.kind === 'superseded').map((a) => a.alias),
      replacement,
      goesWith: linked.map(toSummary),
    };
    if (opts.withBins) {
      detail.stockByBin = sqlite
        .prepare('SELECT st.bin_code AS binCode, st.on_hand AS onHand, st.reserved FROM stock st JOIN bins b ON b.code = st.bin_code WHERE st.part_id = ? ORDER BY b.walk_order')
        .all(row.id) as Array<{ binCode: string; onHand: number; reserved: number }>;
    }
    return detail;
  }

  function listFrames(): FrameSummary[] {
    const rows = sqlite
      .prepare(
        `SELECT code, name, power_min_hp AS minHp, power_max_hp AS maxHp, max_flow_lb_min AS maxFlowLbMin, flow_ref_temp_k AS refT, flow_ref_pressure_kpa AS refP,
          max_pressure_ratio AS maxPressureRatio, max_shaft_rpm AS maxShaftRpm, inducer_mm AS inducerMm, exducer_mm AS exducerMm, weight_kg AS weightKg,
          flange_pattern AS flangePattern, bearing_options AS bearingOptions
         FROM frames ORDER BY max_flow_lb_min`,
      )
      .all() as Array<Record<string, number | string>>;
    return rows.map((r) => ({
      code: String(r.code),
      name: String(r.name),
      powerBandHp: [Number(r.minHp), Number(r.maxHp)],
      maxFlowLbMin: Number(r.maxFlowLbMin),
      flowReference: { temperatureK: Number(r.refT), pressureKpa: Number(r.refP) },
      maxPressureRatio: Number(r.maxPressureRatio),
      maxShaftRpm: Number(r.maxShaftRpm),
      inducerMm: Number(r.inducerMm),
      exducerMm: Number(r.exducerMm),
      trimPct: trimPct(Number(r.inducerMm), Number(r.exducerMm)),
      weightKg: Number(r.weightKg),
      flangePattern: String(r.flangePattern),
      bearingOptions: JSON.parse(String(r.bearingOptions)) as Array<'journal' | 'ball'>,
    }));
  }

  /**
   * The list answer as JSON, cached until anything in the database changes (total_changes() moves on every
   * write through this connection), so repeated browsing of the same page costs a map lookup.
   */
  const cache = new Map<string, string>();
  const changes = sqlite.prepare('SELECT total_changes() AS n').pluck();
  let cachedAt = -1;
  function listPartsJson(query: PartsQuery): string {
    const version = changes.get() as number;
    if (version !== cachedAt) {
      cache.clear();
      cachedAt = version;
    }
    const key = JSON.stringify(query);
    let json = cache.get(key);
    if (json === undefined) {
      json = JSON.stringify(listParts(query));
      if (cache.size >= 500) cache.delete(cache.keys().next().value!);
      cache.set(key, json);
    }
    return json;
  }

  return { listParts, listPartsJson, getPart, listFrames };
}

export type CatalogService = ReturnType<typeof createCatalogService>;
