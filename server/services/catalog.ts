import { createHash } from 'node:crypto';
import zlib from 'node:zlib';
import { and, asc, count, desc, eq, getTableColumns, gt, gte, inArray, lte, ne, sql, type SQL } from 'drizzle-orm';
import type { SelectedFields, SQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import { changeFeedFor, type ChangeVersions } from '../db/change-feed';
import { bins, catalogCounts, CATEGORY_ORDER_EXPR, frames, partAliases, partLinks, parts, partSpecs, stock } from '../db/schema';
import { CATEGORIES, categoryLabel, stockState, trimPct, type CategorySlug } from '../../shared/catalog';
import { gtinForPart } from '../../shared/gtin';
import { normalizePartNumber } from '../../shared/part-number';
import type { FrameDetail, FrameSummary, PartDetail, PartsListResponse, PartsQuery, PartSummary } from '../../shared/schemas/parts';
import { PAGE_SIZE_DEFAULT } from '../../shared/schemas/parts';
import type { SearchService } from './search';
import { createSearchListing } from './catalog-search';

const summaryColumns = {
  id: parts.id,
  partNumber: parts.partNumber,
  gtin: parts.gtin,
  title: parts.title,
  // Plain text in the schema (the seed writes it as a string), but every writer stores one of the shop's categories.
  category: sql<CategorySlug>`${parts.category}`,
  frameCode: parts.frameCode,
  status: parts.status,
  condition: parts.condition,
  priceCents: parts.priceCents,
  coreDepositCents: parts.coreDepositCents,
  weightGrams: parts.weightGrams,
  supersededBy: parts.supersededBy,
  minStock: parts.minStock,
  // Kept on the part by the stock service, so lists and facets need no sum over the bins.
  available: parts.available,
  compressorAr: partSpecs.compressorAr,
  turbineAr: partSpecs.turbineAr,
  trimPct: partSpecs.trimPct,
  inducerMm: partSpecs.inducerMm,
  exducerMm: partSpecs.exducerMm,
  flangePattern: partSpecs.flangePattern,
  inletMm: partSpecs.inletMm,
  outletMm: partSpecs.outletMm,
  material: partSpecs.material,
  bearing: partSpecs.bearing,
  wastegate: partSpecs.wastegate,
  cooling: partSpecs.cooling,
  gaugeType: partSpecs.gaugeType,
  rangeText: partSpecs.rangeText,
  mounting: partSpecs.mounting,
  connection: partSpecs.connection,
  photo: sql<string | null>`json_extract(${parts.images}, '$[0]')`,
};

const specsJoin = eq(partSpecs.partId, parts.id);
const framesJoin = eq(frames.code, parts.frameCode);
const CATEGORY_ORDER = sql.raw(CATEGORY_ORDER_EXPR);

type Filter = 'category' | 'frame' | 'bearing' | 'stock' | 'power';

type EqualityFilter = 'category' | 'frame' | 'bearing';

/**
 * The list's conditions. `indexed` names the equality filters SQLite may read an index by (all when not given); the
 * others are written with a unary +, which SQLite does not use to choose an index (SQLite's query optimizer overview,
 * "Disqualifying WHERE clause terms"), so the list is read through the index of the filter that matches fewest parts.
 */
function whereFor(query: PartsQuery, skip: Filter | null, includeSuperseded: boolean, indexed?: ReadonlySet<EqualityFilter>): SQL | undefined {
  const equals = (filter: EqualityFilter, column: SQLiteColumn, value: string) =>
    !indexed || indexed.has(filter) ? eq(column, value) : sql`+${column} = ${value}`;
  return and(
    includeSuperseded ? undefined : ne(parts.status, 'superseded'),
    query.category && skip !== 'category' ? equals('category', parts.category, query.category) : undefined,
    query.frame && skip !== 'frame' ? equals('frame', parts.frameCode, query.frame) : undefined,
    query.bearing && skip !== 'bearing' ? equals('bearing', parts.bearing, query.bearing) : undefined,
    query.inStock && skip !== 'stock' ? gt(parts.available, 0) : undefined,
    powerFilter(query, parts.frameCode),
  );
}

/**
 * Parts of the frames whose power band meets the range asked for. The frames are listed once (a small subquery) and
 * each part's frame looked up in that list; the unary + keeps SQLite reading parts in the order's index rather than
 * by frame and then sorting them all.
 */
function powerFilter(query: PartsQuery, frameCode: SQLiteColumn): SQL | undefined {
  if (query.minHp === undefined && query.maxHp === undefined) return undefined;
  const fitting = and(
    query.minHp !== undefined ? gte(frames.powerMaxHp, query.minHp) : undefined,
    query.maxHp !== undefined ? lte(frames.powerMinHp, query.maxHp) : undefined,
  );
  return sql`+${frameCode} IN (SELECT ${frames.code} FROM ${frames} WHERE ${fitting})`;
}

export function createCatalogService(db: Db, search: SearchService) {
  const selectSummary = () => db.select(summaryColumns).from(parts).leftJoin(partSpecs, specsJoin).leftJoin(frames, framesJoin);

  // The part page's reads, built at the call like every other query.
  const partByNumber = (number: string) =>
    db
      .select({ ...summaryColumns, description: parts.description, images: parts.images })
      .from(parts)
      .leftJoin(partSpecs, specsJoin)
      .leftJoin(frames, framesJoin)
      .where(eq(parts.normalizedNumber, number))
      .get();
  const frameByCode = (code: string) =>
    db
      .select({ code: frames.code, name: frames.name, minHp: frames.powerMinHp, maxHp: frames.powerMaxHp, maxShaftRpm: frames.maxShaftRpm, flangePattern: frames.flangePattern })
      .from(frames)
      .where(eq(frames.code, code))
      .get();
  const aliasesOf = (id: number) =>
    db
      .select({ alias: partAliases.alias, kind: partAliases.kind, source: partAliases.source })
      .from(partAliases)
      .where(eq(partAliases.partId, id))
      .orderBy(partAliases.alias)
      .all();
  const summaryById = (id: number) => selectSummary().where(eq(parts.id, id)).get();
  const successorOf = (number: string) =>
    db.select({ id: parts.id, supersededBy: parts.supersededBy }).from(parts).where(eq(parts.normalizedNumber, number)).get();
  const goesWithOf = (id: number) =>
    selectSummary()
      .innerJoin(partLinks, eq(partLinks.relatedPartId, parts.id))
      .where(and(eq(partLinks.partId, id), ne(parts.status, 'superseded')))
      .orderBy(parts.category, parts.partNumber)
      .all();

  type SummaryRow = ReturnType<ReturnType<typeof selectSummary>['all']>[number];

  function toSummary(r: SummaryRow): PartSummary {
    const available = Math.max(0, r.available);
    return {
      partNumber: r.partNumber,
      // Filled by the database from the id when a writer leaves it out (the gtin_backfill migration); the same number either way.
      gtin: r.gtin ?? gtinForPart(r.id),
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
      specs: {
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
      },
      photo: r.photo,
    };
  }

  const frameNames = () => new Map(db.select({ code: frames.code, name: frames.name }).from(frames).all().map((f) => [f.code, f.name]));

  type RawFacets = Record<keyof PartsListResponse['facets'], Array<{ value: string; count: number }>>;
  /** Facet values with the words a buyer reads, categories in the shop's order. */
  function labelFacets(raw: RawFacets): PartsListResponse['facets'] {
    const names = frameNames();
    const order0 = new Map<string, number>(CATEGORIES.map((c, i) => [c.slug, i]));
    return {
      category: raw.category
        .map((r) => ({ value: r.value, label: categoryLabel(r.value), count: r.count }))
        .sort((a, b) => (order0.get(a.value) ?? 0) - (order0.get(b.value) ?? 0)),
      frame: raw.frame.map((r) => ({ value: r.value, label: `${r.value} ${names.get(r.value) ?? ''}`.trim(), count: r.count })),
      bearing: raw.bearing.map((r) => ({ value: r.value, label: r.value === 'ball' ? 'Ball bearing' : 'Journal bearing', count: r.count })),
      stock: raw.stock.map((r) => ({ value: r.value, label: r.value === 'true' ? 'In stock' : 'Not in stock', count: r.count })),
    };
  }

  // A search's page is counted and faceted from the search index (catalog-search.ts).
  const searchListing = createSearchListing({
    db,
    search,
    summaries: (ids) => new Map(selectSummary().where(inArray(parts.id, ids)).all().map((r) => [r.id, toSummary(r)])),
    frameNames: () => frameNames(),
  });

  function listParts(query: PartsQuery): PartsListResponse {
    if (query.q) return searchListing.list({ ...query, q: query.q });
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? PAGE_SIZE_DEFAULT;
    const hits = query.q ? search.search(query.q) : null;
    if (hits !== null && hits.length === 0) {
      return { items: [], total: 0, page, pageSize, facets: { category: [], frame: [], bearing: [], stock: [] } };
    }
    // The search's order travels as a VALUES table (columns column1 = part id, column2 = rank). Its numbers are
    // integers from the search index, written as literals: binding 600 parameters costs the builder ~2 ms per query.
    const ranked = hits
      ? db
          .$with('ranked', { id: sql<number>``.as('column1'), r: sql<number>``.as('column2') })
          .as(sql.raw(`VALUES ${hits.map((h, i) => `(${Math.trunc(h.partId)}, ${i})`).join(',')}`))
      : null;
    const select = <T extends SelectedFields>(columns: T) => (ranked ? db.with(ranked).select(columns) : db.select(columns));
    // A search may find superseded numbers: show them, so a buyer sees what replaced the number typed.
    const searching = hits !== null;

    const { total, facets, indexed } = ranked ? countRanked() : countFromTable();
    // The default order is the category's place in the shop, then frame and number; within one category the first
    // term is the same for every row, so it is left out and the category's own index gives the order.
    const order =
      query.sort === 'price-asc'
        ? [asc(parts.priceCents), parts.partNumber]
        : query.sort === 'price-desc'
          ? [desc(parts.priceCents), parts.partNumber]
          : query.sort === 'number'
            ? [parts.partNumber]
            : query.sort === 'title'
              ? [parts.title, parts.partNumber]
              : ranked
                ? [sql`${ranked.r}`]
                : query.category
                  ? [parts.frameCode, parts.partNumber]
                  : [CATEGORY_ORDER, parts.frameCode, parts.partNumber];
    let rows: SummaryRow[] = [];
    if ((page - 1) * pageSize < total) {
      let listed = select(summaryColumns).from(parts).leftJoin(partSpecs, specsJoin).$dynamic();
      if (ranked) listed = listed.innerJoin(ranked, eq(ranked.id, parts.id));
      rows = listed
        .where(whereFor(query, null, searching, indexed))
        .orderBy(...order)
        .limit(pageSize)
        .offset((page - 1) * pageSize)
        .all();
    }
    const reasons = new Map(hits?.map((h) => [h.partId, h.reasons]) ?? []);
    const items = rows.map((r) => ({ ...toSummary(r), ...(hits ? { matched: reasons.get(r.id) ?? [] } : {}) }));

    /** A search's total and facets, counted over the parts it found. */
    function countRanked(): Pick<PartsListResponse, 'total' | 'facets'> & { indexed?: ReadonlySet<EqualityFilter> } {
      let counted = select({ n: count() }).from(parts).$dynamic();
      if (ranked) counted = counted.innerJoin(ranked, eq(ranked.id, parts.id));
      const total = counted.where(whereFor(query, null, searching)).get()?.n ?? 0;
      const facet = (skip: Filter, value: SQL<string | null>) => {
        let q = select({ value, count: count() }).from(parts).$dynamic();
        if (ranked) q = q.innerJoin(ranked, eq(ranked.id, parts.id));
        return q
          .where(whereFor(query, skip, searching))
          .groupBy(value)
          .orderBy(value)
          .all()
          .flatMap((r) => (r.value === null ? [] : [{ value: r.value, count: r.count }]));
      };
      return {
        total,
        facets: labelFacets({
          category: facet('category', sql<string>`${parts.category}`),
          frame: facet('frame', sql<string | null>`${parts.frameCode}`),
          bearing: facet('bearing', sql<string | null>`${parts.bearing}`),
          stock: facet('stock', sql<string>`CASE WHEN ${parts.available} > 0 THEN 'true' ELSE 'false' END`),
        }),
      };
    }

    /**
     * The catalogue's total and facets from the kept counts (catalogCounts): a few hundred rows however many parts,
     * each facet counted with every filter but its own, as the search's are.
     */
    function countFromTable(): Pick<PartsListResponse, 'total' | 'facets'> & { indexed?: ReadonlySet<EqualityFilter> } {
      const groups = db
        .select({ category: catalogCounts.category, frame: catalogCounts.frameCode, bearing: catalogCounts.bearing, inStock: catalogCounts.inStock, n: catalogCounts.partCount })
        .from(catalogCounts)
        .where(
          and(
            ne(catalogCounts.status, 'superseded'),
            gt(catalogCounts.partCount, 0),
            powerFilter(query, catalogCounts.frameCode),
          ),
        )
        .all();
      const passes = (g: (typeof groups)[number], skip: Filter | null) =>
        (!query.category || skip === 'category' || g.category === query.category) &&
        (!query.frame || skip === 'frame' || g.frame === query.frame) &&
        (!query.bearing || skip === 'bearing' || g.bearing === query.bearing) &&
        (!query.inStock || skip === 'stock' || g.inStock);
      const facet = (skip: Filter, valueOf: (g: (typeof groups)[number]) => string) => {
        const counts = new Map<string, number>();
        for (const g of groups) {
          const value = valueOf(g);
          // '' is no frame or no bearing: not offered as a choice, as a null value is not.
          if (value !== '' && passes(g, skip)) counts.set(value, (counts.get(value) ?? 0) + g.n);
        }
        // Sorted as SQLite's ORDER BY on the text does (byte order), the order the search's facets come in.
        return [...counts].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([value, count]) => ({ value, count }));
      };
      // With two or three equality filters, the list is read by the one that matches fewest parts: an index read in
      // the list's order then passes over at most that many parts, however the others are spread along the order.
      // A category and a frame in the default order are read together: one index holds both, in that order.
      const asked = (['category', 'frame', 'bearing'] as const).filter((f) => query[f] !== undefined);
      let indexed: Set<EqualityFilter> | undefined;
      if (query.category && query.frame && (query.sort ?? 'relevance') === 'relevance') {
        indexed = new Set(['category', 'frame']);
      } else if (asked.length > 1) {
        const size = (f: EqualityFilter) => groups.reduce((sum, g) => (g[f] === query[f] ? sum + g.n : sum), 0);
        indexed = new Set([asked.reduce((a, b) => (size(b) < size(a) ? b : a))]);
      }
      return {
        indexed,
        total: groups.reduce((sum, g) => (passes(g, null) ? sum + g.n : sum), 0),
        facets: labelFacets({
          category: facet('category', (g) => g.category),
          frame: facet('frame', (g) => g.frame),
          bearing: facet('bearing', (g) => g.bearing),
          stock: facet('stock', (g) => String(g.inStock)),
        }),
      };
    }
    return { items, total, page, pageSize, facets };
  }

  function getPart(partNumber: string, opts: { withBins?: boolean } = {}): PartDetail | null {
    const row = partByNumber(normalizePartNumber(partNumber));
    if (!row) return null;
    const frame = row.frameCode ? frameByCode(row.frameCode) : undefined;
    const aliases = aliasesOf(row.id);
    let replacement: PartSummary | null = null;
    if (row.supersededBy) {
      // Follow a chain of supersessions to the part sold today.
      let next: string | null = row.supersededBy;
      for (let hops = 0; next && hops < 5; hops++) {
        const r = successorOf(normalizePartNumber(next));
        if (!r) break;
        const summary = summaryById(r.id);
        replacement = summary ? toSummary(summary) : null;
        next = r.supersededBy;
      }
    }
    const detail: PartDetail = {
      ...toSummary(row),
      description: row.description,
      images: row.images,
      frame: frame ? { code: frame.code, name: frame.name, powerBandHp: [frame.minHp, frame.maxHp], maxShaftRpm: frame.maxShaftRpm, flangePattern: frame.flangePattern } : null,
      crossReferences: aliases.filter((a) => a.kind === 'cross-reference').map((a) => ({ number: a.alias, source: a.source })),
      earlierNumbers: aliases.filter((a) => a.kind === 'superseded').map((a) => a.alias),
      replacement,
      goesWith: goesWithOf(row.id).map(toSummary),
    };
    if (opts.withBins) {
      detail.stockByBin = db
        .select({ binCode: stock.binCode, onHand: stock.onHand, reserved: stock.reserved })
        .from(stock)
        .innerJoin(bins, eq(bins.code, stock.binCode))
        .where(eq(stock.partId, row.id))
        .orderBy(bins.walkOrder)
        .all();
    }
    return detail;
  }

  // Every column but the compressor map, which only the fitment check reads.
  const { compressorMap: _map, ...frameColumns } = getTableColumns(frames);
  type FrameRow = ReturnType<ReturnType<typeof selectFrames>['all']>[number];
  const selectFrames = () => db.select(frameColumns).from(frames);

  function listFrames(): FrameSummary[] {
    return selectFrames().orderBy(frames.maxFlowLbMin).all().map(frameSummary);
  }

  /** A frame with its parts on sale (superseded numbers left out, as the catalogue lists them), or null. */
  function getFrame(code: string): FrameDetail | null {
    const row = selectFrames().where(eq(frames.code, code.toUpperCase())).get();
    if (!row) return null;
    const items = selectSummary()
      .where(and(eq(parts.frameCode, row.code), ne(parts.status, 'superseded')))
      .orderBy(CATEGORY_ORDER, parts.partNumber)
      .all()
      .map(toSummary);
    const arsOf = (pick: (p: PartSummary) => number | null, category: CategorySlug) =>
      [...new Set(items.flatMap((p) => (p.category === category && p.status === 'active' && pick(p) !== null ? [pick(p)!] : [])))].sort((a, b) => a - b);
    return {
      ...frameSummary(row),
      turbineWheelMm: row.turbineWheelMm,
      compressorArOptions: arsOf((p) => p.specs.compressorAr, 'compressor-housings'),
      turbineArOptions: arsOf((p) => p.specs.turbineAr, 'turbine-housings'),
      parts: items,
    };
  }

  function frameSummary(r: FrameRow): FrameSummary {
    return {
      code: r.code,
      name: r.name,
      powerBandHp: [r.powerMinHp, r.powerMaxHp],
      maxFlowLbMin: r.maxFlowLbMin,
      flowReference: { temperatureK: r.flowRefTempK, pressureKpa: r.flowRefPressureKpa },
      maxPressureRatio: r.maxPressureRatio,
      maxShaftRpm: r.maxShaftRpm,
      inducerMm: r.inducerMm,
      exducerMm: r.exducerMm,
      trimPct: trimPct(r.inducerMm, r.exducerMm),
      weightKg: r.weightKg,
      flangePattern: r.flangePattern,
      bearingOptions: r.bearingOptions,
    };
  }

  /**
   * The list answer as JSON, cached until the catalogue or stock changes — in this process or any other on the same
   * database (the change feed) — so repeated browsing of the same page costs a map lookup, and cart lines, sessions
   * and orders without stock moves leave it alone.
   */
  const cache = new Map<string, CachedList>();
  const feed = changeFeedFor(db);
  let cachedFor: ChangeVersions | null = null;
  // The search index may change without a version moving (a rebuild swapped in): its answers are cached only with it.
  let searchGeneration = -1;
  function listPartsJson(query: PartsQuery): CachedList {
    const versions = feed.current();
    // The catalogue, its search index, stock and frames shape a list; sessions and accounts moving leave it alone.
    const stale = !cachedFor || (['parts', 'search', 'stock', 'frames'] as const).some((k) => versions[k] !== cachedFor![k]) || searchGeneration !== search.generation();
    if (stale) {
      cache.clear();
      cachedFor = versions;
      searchGeneration = search.generation();
    }
    const key = JSON.stringify(query);
    let entry = cache.get(key);
    if (entry === undefined) {
      const json = JSON.stringify(listParts(query));
      entry = cachedList(json);
      if (cache.size >= 500) cache.delete(cache.keys().next().value!);
      cache.set(key, entry);
    }
    return entry;
  }

  return { listParts, listPartsJson, getPart, listFrames, getFrame, suggestParts: (q: string) => searchListing.suggest(q) };
}

/** A list answer as sent, with its entity tag and its compressed bytes (made when first asked for, then kept). */
export interface CachedList {
  json: string;
  etag: string;
  encoded(encoding: 'br' | 'gzip'): Buffer;
}

function cachedList(json: string): CachedList {
  const made: Partial<Record<'br' | 'gzip', Buffer>> = {};
  return {
    json,
    // The validator is made once per cached answer, not hashed again on every request that reads it.
    etag: `W/"${createHash('sha1').update(json).digest('base64url')}"`,
    encoded(encoding) {
      // Brotli at quality 5 and gzip at level 6: most of the gain for a little CPU, once per cached answer.
      made[encoding] ??=
        encoding === 'br'
          ? zlib.brotliCompressSync(json, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 5, [zlib.constants.BROTLI_PARAM_MODE]: zlib.constants.BROTLI_MODE_TEXT } })
          : zlib.gzipSync(json, { level: 6 });
      return made[encoding];
    },
  };
}

export type CatalogService = ReturnType<typeof createCatalogService>;
