import { gt } from 'drizzle-orm';
import type { Db } from '../db/client';
import { changeFeedFor } from '../db/change-feed';
import { frames, parts } from '../db/schema';
import { CATEGORIES, categoryLabel } from '../../shared/catalog';
import type { PartSuggestion, PartSuggestions, PartsListResponse, PartsQuery, PartSummary } from '../../shared/schemas/parts';
import { PAGE_SIZE_DEFAULT, SUGGEST_LIMIT } from '../../shared/schemas/parts';
import type { SearchIndex } from './search-index';
import type { SearchService } from './search';

const ORD_SPACE = 2 ** 23;
const CATEGORY_ORDER = new Map<string, number>(CATEGORIES.map((c, i) => [c.slug, i]));

/**
 * A search's list page: every match counted and faceted in memory from the index (category, frame, bearing, the
 * frame's power band and whether the part is in stock), then only the page's parts read from the database. So a
 * common word's true total costs a pass over its matches, not a join per match.
 */
export function createSearchListing(deps: {
  db: Db;
  search: SearchService;
  /** The summaries of the given parts, by id. */
  summaries: (ids: number[]) => Map<number, PartSummary>;
  frameNames: () => Map<string, string>;
}) {
  const { db, search } = deps;
  const feed = changeFeedFor(db);
  // Which parts are in stock, by ordinal: read again when stock moves (one covering-index scan) or the index changes.
  let stockFor: { version: number; generation: number; index: SearchIndex; flags: Uint8Array } | null = null;
  let powerFor: { version: number; bands: Map<string, [number, number]> } | null = null;

  function inStock(ix: SearchIndex): Uint8Array {
    const version = feed.current().stock;
    if (stockFor && stockFor.version === version && stockFor.index === ix && stockFor.generation === search.generation()) return stockFor.flags;
    const flags = new Uint8Array(ix.capacity);
    for (const r of db.select({ id: parts.id }).from(parts).where(gt(parts.available, 0)).all()) {
      const ord = ix.ordOf(r.id);
      if (ord !== undefined) flags[ord] = 1;
    }
    stockFor = { version, generation: search.generation(), index: ix, flags };
    return flags;
  }

  function powerBands(): Map<string, [number, number]> {
    const version = feed.current().frames;
    if (powerFor?.version !== version) {
      const rows = db.select({ code: frames.code, min: frames.powerMinHp, max: frames.powerMaxHp }).from(frames).all();
      powerFor = { version, bands: new Map(rows.map((r) => [r.code, [r.min, r.max]])) };
    }
    return powerFor.bands;
  }

  function list(query: PartsQuery & { q: string }): PartsListResponse {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? PAGE_SIZE_DEFAULT;
    const result = search.find(query.q);
    const ix = result.index;
    const stocked = inStock(ix);
    const bands = query.minHp !== undefined || query.maxHp !== undefined ? powerBands() : null;

    // Counts by code (category, frame and bearing codes of the index; stock 0 or 1), then named.
    const size = ix.values.length;
    const counts = { category: new Int32Array(size), frame: new Int32Array(size), bearing: new Int32Array(size), stock: new Int32Array(2) };
    const want = (value: string | undefined) => (value === undefined ? -1 : ix.code(value));
    const category = want(query.category);
    const frame = want(query.frame);
    const bearing = want(query.bearing);
    const bandOf = new Map<number, [number, number] | undefined>();
    if (bands) for (const [code, band] of bands) bandOf.set(ix.code(code), band);
    const kept: number[] = [];
    // One pass: a part counts in a facet when it passes every filter but that facet's own (as the plain list does).
    for (const ord of result.ords) {
      if (bands) {
        const band = bandOf.get(ix.frame[ord]!);
        if (!band || (query.minHp !== undefined && band[1] < query.minHp) || (query.maxHp !== undefined && band[0] > query.maxHp)) continue;
      }
      const c = ix.category[ord]!;
      const f = ix.frame[ord]!;
      const b = ix.bearing[ord]!;
      const isStocked = stocked[ord]!;
      const okCategory = category < 0 || c === category;
      const okFrame = frame < 0 || f === frame;
      const okBearing = bearing < 0 || b === bearing;
      const okStock = !query.inStock || isStocked === 1;
      if (okFrame && okBearing && okStock) counts.category[c]!++;
      if (okCategory && okBearing && okStock) counts.frame[f]!++;
      if (okCategory && okFrame && okStock) counts.bearing[b]!++;
      if (okCategory && okFrame && okBearing) counts.stock[isStocked]!++;
      if (okCategory && okFrame && okBearing && okStock) kept.push(ord);
    }
    const named = (by: Int32Array) => {
      const out: Array<[string, number]> = [];
      by.forEach((n, code) => {
        const value = ix.values[code];
        if (n > 0 && code > 0 && value != null) out.push([value, n]);
      });
      return out.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    };
    const stockCounts: Array<[string, number]> = [
      ['false', counts.stock[0]!],
      ['true', counts.stock[1]!],
    ].filter(([, n]) => (n as number) > 0) as Array<[string, number]>;

    const ordered = sortOrds(ix, kept, query.sort);
    const pageOrds = ordered.slice((page - 1) * pageSize, page * pageSize);
    const summaries = pageOrds.length > 0 ? deps.summaries(pageOrds.map((o) => ix.docs[o]!.id)) : new Map<number, PartSummary>();
    const items = pageOrds.flatMap((ord) => {
      const s = summaries.get(ix.docs[ord]!.id);
      return s ? [{ ...s, matched: result.reasons(ord) }] : [];
    });

    const names = deps.frameNames();
    return {
      items,
      total: kept.length,
      page,
      pageSize,
      facets: {
        category: named(counts.category)
          .sort(([a], [b]) => (CATEGORY_ORDER.get(a) ?? 0) - (CATEGORY_ORDER.get(b) ?? 0))
          .map(([value, count]) => ({ value, label: categoryLabel(value), count })),
        frame: named(counts.frame).map(([value, count]) => ({ value, label: `${value} ${names.get(value) ?? ''}`.trim(), count })),
        bearing: named(counts.bearing).map(([value, count]) => ({ value, label: value === 'ball' ? 'Ball bearing' : 'Journal bearing', count })),
        stock: stockCounts.map(([value, count]) => ({ value, label: value === 'true' ? 'In stock' : 'Not in stock', count })),
      },
    };
  }

  /** The first few matches for search as you type, answered from the index alone. */
  function suggest(q: string, limit = SUGGEST_LIMIT): PartSuggestions {
    const result = search.find(q);
    const ix = result.index;
    const items: PartSuggestion[] = [];
    for (let i = 0; i < result.ords.length && items.length < limit; i++) {
      const ord = result.ords[i]!;
      const d = ix.docs[ord]!;
      const reasons = result.reasons(ord);
      items.push({
        partNumber: d.partNumber,
        title: d.title,
        status: d.status as PartSuggestion['status'],
        supersededBy: d.supersededBy,
        reason: reasons[0]?.text ?? '',
        exact: result.exact(ord),
      });
    }
    return { q, items, total: result.ords.length };
  }

  return { list, suggest };
}

/** Relevance keeps the search's order; the other sorts order the matches as the plain list would. */
function sortOrds(ix: SearchIndex, ords: number[], sort: PartsQuery['sort']): number[] {
  if (!sort || sort === 'relevance') return ords;
  const number = (o: number) => ix.docs[o]!.partNumber;
  const byNumber = (a: number, b: number) => (number(a) < number(b) ? -1 : number(a) > number(b) ? 1 : 0);
  if (sort === 'number') return [...ords].sort(byNumber);
  if (sort === 'title') {
    const title = (o: number) => ix.docs[o]!.title;
    return [...ords].sort((a, b) => (title(a) < title(b) ? -1 : title(a) > title(b) ? 1 : byNumber(a, b)));
  }
  // Prices are whole cents: the key packs price and ordinal (part-number order) into one number, sorted natively.
  const sign = sort === 'price-desc' ? -1 : 1;
  const keys = Float64Array.from(ords, (o) => sign * ix.docs[o]!.priceCents * ORD_SPACE + o).sort();
  return Array.from(keys, (k) => ((k % ORD_SPACE) + ORD_SPACE) % ORD_SPACE);
}
