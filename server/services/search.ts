import Fuse from 'fuse.js';
import type { Db } from '../db/client';
import { changeFeedFor, searchIndexRewritten } from '../db/change-feed';
import { categoryLabel } from '../../shared/catalog';
import { normalizePartNumber } from '../../shared/part-number';

/** Why a part came up, in words a buyer understands. */
export interface MatchReason {
  kind: 'part-number' | 'part-number-prefix' | 'superseded' | 'cross-reference' | 'near-number' | 'words' | 'corrected-words';
  text: string;
}

export interface SearchHit {
  partId: number;
  reasons: MatchReason[];
}

interface Doc {
  id: number;
  partNumber: string;
  normalizedNumber: string;
  title: string;
  status: string;
  supersededBy: string | null;
  /** The frame's code in lower case ("ful"), which is how people name a frame in a search. */
  frameCode: string;
  aliases: Array<{ alias: string; normalized: string; kind: 'cross-reference' | 'superseded' }>;
}

interface Candidate {
  doc: Doc;
  tier: number;
  reasons: MatchReason[];
}

const WORD_LIMIT = 300;
const RANKED = 100;
const NEAR_LIMIT = 40;
const PREFIX_LIMIT = 60;
/** Suggestions for an unknown number look at no more than this many candidates of each kind. */
const SUGGEST_LIMIT = 10;

/** Levenshtein distance, for ordering a handful of suggested numbers. */
export function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) cur[j] = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = cur;
  }
  return prev[b.length]!;
}

function trigrams(s: string): string[] {
  const out = new Set<string>();
  for (let i = 0; i + 3 <= s.length; i++) out.add(s.slice(i, i + 3));
  return [...out];
}

/** Every string one edit away (a character swapped with its neighbour, dropped, added or changed). */
export function oneEditVariants(n: string): string[] {
  const out = new Set<string>();
  const alphabet = (c: string) => (/\d/.test(c) ? '0123456789' : 'ABCDEFGHIJKLMNOPQRSTUVWXYZ');
  for (let i = 0; i < n.length; i++) {
    if (i + 1 < n.length) out.add(n.slice(0, i) + n[i + 1] + n[i] + n.slice(i + 2));
    out.add(n.slice(0, i) + n.slice(i + 1));
    for (const c of alphabet(n[i]!)) out.add(n.slice(0, i) + c + n.slice(i + 1));
  }
  for (let i = 0; i <= n.length; i++) {
    const near = n[i] ?? n[i - 1] ?? '0';
    for (const c of alphabet(near)) out.add(n.slice(0, i) + c + n.slice(i));
  }
  out.delete(n);
  return [...out];
}

function words(q: string): string[] {
  return q
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^\p{L}\p{N}.]+/gu, ' ')
    .split(' ')
    .map((w) => w.replace(/^\.+|\.+$/g, ''))
    .filter((w, _i, all) => w.length > 1 || all.length === 1)
    .slice(0, 8);
}

const ftsTerm = (w: string) => `"${w.replace(/"/g, '')}"*`;

/**
 * Catalogue search: SQLite finds candidates (exact and prefix part numbers through an index, aliases,
 * trigram near misses, FTS5 words), and fuse.js ranks and forgives typos among that small set.
 */
export function createSearchService(db: Db) {
  const sqlite = db.$client;
  const docs = new Map<number, Doc>();
  let vocabulary = new Set<string>();

  const stmt = {
    exact: sqlite.prepare('SELECT id FROM parts WHERE normalized_number = ?'),
    aliasExact: sqlite.prepare('SELECT part_id AS id, alias, kind FROM part_aliases WHERE normalized_alias = ?'),
    prefix: sqlite.prepare(`SELECT id FROM parts WHERE normalized_number > ? AND normalized_number < ? ORDER BY normalized_number LIMIT ${PREFIX_LIMIT}`),
    aliasPrefix: sqlite.prepare(`SELECT part_id AS id, alias, kind FROM part_aliases WHERE normalized_alias > ? AND normalized_alias < ? LIMIT ${PREFIX_LIMIT}`),
    oneEdit: sqlite.prepare('SELECT id, normalized_number AS number FROM parts WHERE normalized_number IN (SELECT value FROM json_each(?))'),
    aliasOneEdit: sqlite.prepare('SELECT part_id AS id, alias, kind FROM part_aliases WHERE normalized_alias IN (SELECT value FROM json_each(?))'),
    near: sqlite.prepare(`SELECT part_id AS id, kind, number FROM numbers_tri WHERE numbers_tri MATCH ? ORDER BY rank LIMIT ${NEAR_LIMIT}`),
    suggestPrefix: sqlite.prepare(`SELECT id, normalized_number AS number FROM parts WHERE normalized_number > ? AND normalized_number < ? ORDER BY normalized_number LIMIT ${SUGGEST_LIMIT}`),
    // No ORDER BY rank: scoring every match is what costs; fuse.js ranks the candidates instead.
    words: sqlite.prepare(`SELECT part_id AS id FROM parts_fts WHERE parts_fts MATCH ? LIMIT ${WORD_LIMIT}`),
  };

  function loadDocs(ids?: number[]) {
    const where = ids ? `WHERE p.id IN (${ids.map(() => '?').join(',')})` : '';
    const rows = sqlite
      .prepare(`SELECT p.id, p.part_number AS partNumber, p.normalized_number AS normalizedNumber, p.title, p.status, p.superseded_by AS supersededBy, lower(COALESCE(p.frame_code, '')) AS frameCode FROM parts p ${where}`)
      .all(...(ids ?? [])) as Array<Omit<Doc, 'aliases'>>;
    const aliasRows = sqlite
      .prepare(`SELECT a.part_id AS id, a.alias, a.normalized_alias AS normalized, a.kind FROM part_aliases a ${ids ? `WHERE a.part_id IN (${ids.map(() => '?').join(',')})` : ''}`)
      .all(...(ids ?? [])) as Array<{ id: number; alias: string; normalized: string; kind: 'cross-reference' | 'superseded' }>;
    if (ids) for (const id of ids) docs.delete(id);
    for (const r of rows) docs.set(r.id, { ...r, aliases: [] });
    for (const a of aliasRows) docs.get(a.id)?.aliases.push({ alias: a.alias, normalized: a.normalized, kind: a.kind });
  }

  function writeIndexRows(ids?: number[]) {
    const where = ids ? `WHERE p.id IN (${ids.map(() => '?').join(',')})` : '';
    const rows = sqlite
      .prepare(
        `SELECT p.id, p.part_number AS partNumber, p.normalized_number AS normalizedNumber, p.title, p.description, p.category, p.condition, p.status,
                f.code AS frameCode, f.name AS frameName,
                s.compressor_ar AS compressorAr, s.turbine_ar AS turbineAr, s.trim_pct AS trimPct, s.inducer_mm AS inducerMm, s.exducer_mm AS exducerMm,
                s.flange_pattern AS flangePattern, s.material, s.bearing, s.wastegate, s.cooling, s.gauge_type AS gaugeType, s.range_text AS rangeText,
                s.mounting, s.connection
         FROM parts p LEFT JOIN frames f ON f.code = p.frame_code LEFT JOIN part_specs s ON s.part_id = p.id ${where}`,
      )
      .all(...(ids ?? [])) as Array<Record<string, string | number | null>>;
    const aliasRows = sqlite
      .prepare(`SELECT part_id AS id, normalized_alias AS normalized, kind FROM part_aliases ${ids ? `WHERE part_id IN (${ids.map(() => '?').join(',')})` : ''}`)
      .all(...(ids ?? [])) as Array<{ id: number; normalized: string; kind: string }>;
    const insertFts = sqlite.prepare('INSERT INTO parts_fts (part_id, title, body) VALUES (?, ?, ?)');
    const insertTri = sqlite.prepare('INSERT INTO numbers_tri (part_id, kind, number) VALUES (?, ?, ?)');
    sqlite.transaction(() => {
      if (ids) {
        const list = ids.map(() => '?').join(',');
        sqlite.prepare(`DELETE FROM parts_fts WHERE part_id IN (${list})`).run(...ids);
        sqlite.prepare(`DELETE FROM numbers_tri WHERE part_id IN (${list})`).run(...ids);
      } else {
        sqlite.exec('DELETE FROM parts_fts; DELETE FROM numbers_tri;');
      }
      for (const r of rows) {
        const specText = [
          r.compressorAr != null ? `${r.compressorAr} A/R compressor` : '',
          r.turbineAr != null ? `${r.turbineAr} A/R turbine` : '',
          r.trimPct != null ? `${r.trimPct} trim` : '',
          r.inducerMm != null ? `${r.inducerMm} mm inducer` : '',
          r.bearing != null ? `${r.bearing} bearing` : '',
          r.flangePattern ?? '',
          r.material ?? '',
          r.wastegate != null ? `${r.wastegate} wastegate` : '',
          r.cooling != null ? `${r.cooling} cooled` : '',
          r.gaugeType ?? '',
          r.rangeText ?? '',
          r.mounting ?? '',
          r.connection ?? '',
        ].join(' ');
        const body = [categoryLabel(String(r.category)), r.frameCode ?? '', r.frameName ?? '', r.condition, r.description, specText].join(' ');
        insertFts.run(r.id, r.title, body);
        insertTri.run(r.id, 'part-number', r.normalizedNumber);
      }
      for (const a of aliasRows) insertTri.run(a.id, a.kind, a.normalized);
      searchIndexRewritten(db);
    }).immediate();
  }

  function loadVocabulary() {
    sqlite.exec("CREATE VIRTUAL TABLE IF NOT EXISTS temp.parts_fts_vocab USING fts5vocab('main', 'parts_fts', 'row')");
    const terms = (sqlite.prepare("SELECT term FROM temp.parts_fts_vocab WHERE length(term) >= 3 AND term GLOB '*[a-z]*'").all() as Array<{ term: string }>).map((r) => r.term);
    vocabulary = new Set(terms);
  }

  /** Rebuilds the whole index: at start and after bulk changes. */
  /** What the index was built from: the catalogue's size and its latest change. */
  const signature = () =>
    JSON.stringify(sqlite.prepare('SELECT count(*) AS n, max(updated_at) AS at, (SELECT count(*) FROM part_aliases) AS aliases FROM parts').get());
  const builtFrom = () => sqlite.prepare("SELECT value FROM meta WHERE key = 'search_index'").pluck().get() as string | undefined;

  // The latest part change (change feed) this process's documents and vocabulary reflect.
  const feed = changeFeedFor(db);
  let syncedTo = 0;

  function rebuild(options: { ifStale?: boolean } = {}) {
    syncedTo = feed.current().parts;
    const now = signature();
    // At start the index on disk is reused when the catalogue has not changed since it was written.
    if (!options.ifStale || builtFrom() !== now) {
      writeIndexRows();
      sqlite.prepare("INSERT INTO meta (key, value) VALUES ('search_index', ?) ON CONFLICT (key) DO UPDATE SET value = excluded.value").run(now);
    }
    docs.clear();
    loadDocs();
    loadVocabulary();
  }

  /** Refreshes the index for parts that changed here: rewrites their index rows, which every process shares. */
  function refresh(ids: number[]) {
    if (ids.length === 0) return;
    const wasCurrent = builtFrom() !== undefined;
    writeIndexRows(ids);
    if (wasCurrent) sqlite.prepare("UPDATE meta SET value = ? WHERE key = 'search_index'").run(signature());
    follow(ids);
  }

  /**
   * Brings this process's documents and vocabulary up to the latest part change, whichever process made it: the
   * parts logged since it last looked (and any given) are reloaded; after a bulk change, everything is.
   */
  function follow(extra: number[] = []) {
    const { ids, latest } = feed.partsChangedSince(syncedTo);
    if (ids === null) {
      docs.clear();
      loadDocs();
    } else {
      const all = [...new Set([...ids, ...extra])];
      if (all.length === 0) return;
      loadDocs(all);
    }
    loadVocabulary();
    syncedTo = latest;
  }

  function correctWord(w: string): string | null {
    if (vocabulary.has(w) || w.length < 4 || /\d/.test(w)) return null;
    // fuse.js scores the few terms of a similar length that share a first or second letter; a typo rarely
    // changes both, and scoring the whole vocabulary for every word costs milliseconds.
    const near = [...vocabulary].filter((t) => Math.abs(t.length - w.length) <= 2 && (t[0] === w[0] || t[1] === w[1]));
    if (near.length === 0) return null;
    const best = new Fuse(near, { threshold: 0.34, ignoreLocation: true, includeScore: true, minMatchCharLength: 3 }).search(w, { limit: 1 })[0];
    return best && best.item !== w ? best.item : null;
  }

  function search(query: string, limit = 300): SearchHit[] {
    const q = query.trim().slice(0, 100);
    if (q.length === 0) return [];
    if (feed.current().parts !== syncedTo) follow();
    const n = normalizePartNumber(q);
    const candidates = new Map<number, Candidate>();
    const note = (id: number, tier: number, reason: MatchReason) => {
      const doc = docs.get(id);
      if (!doc) return;
      const c = candidates.get(id);
      if (!c) {
        candidates.set(id, { doc, tier, reasons: [reason] });
        return;
      }
      c.tier = Math.min(c.tier, tier);
      if (!c.reasons.some((r) => r.kind === reason.kind)) c.reasons.push(reason);
    };

    if (n.length >= 2) {
      for (const r of stmt.exact.all(n) as Array<{ id: number }>) {
        const d = docs.get(r.id);
        note(r.id, 0, { kind: 'part-number', text: d?.supersededBy ? `Exact part number; superseded by ${d.supersededBy}` : 'Exact part number' });
      }
      for (const r of stmt.aliasExact.all(n) as Array<{ id: number; alias: string; kind: string }>) {
        note(r.id, 1, r.kind === 'superseded' ? { kind: 'superseded', text: `Replaces the earlier number ${r.alias}` } : { kind: 'cross-reference', text: `Cross-reference ${r.alias}` });
      }
    }
    if (n.length >= 3) {
      const upper = `${n}\uffff`;
      for (const r of stmt.prefix.all(n, upper) as Array<{ id: number }>) note(r.id, 2, { kind: 'part-number-prefix', text: `Part number starts with ${q.trim()}` });
      for (const r of stmt.aliasPrefix.all(n, upper) as Array<{ id: number; alias: string; kind: string }>) {
        note(r.id, 2, { kind: r.kind === 'superseded' ? 'superseded' : 'cross-reference', text: `${r.kind === 'superseded' ? 'Earlier number' : 'Cross-reference'} ${r.alias} starts with ${q.trim()}` });
      }
    }
    const hasDigits = /\d/.test(n);
    const oneToken = !/\s/.test(q);
    // A number typed in pieces ("ful 20 0203") is still a number; a phrase with words is not.
    const numberLike = hasDigits && (oneToken || q.split(/\s+/).every((w) => /\d/.test(w) || w.length <= 3));
    const exactHit = [...candidates.values()].some((c) => c.tier <= 1);
    // A number typed exactly needs no near misses or word search; that keeps the common case cheap.
    if (numberLike && n.length >= 5 && n.length <= 24 && !exactHit) {
      // One edit away: a digit swapped with its neighbour, dropped, doubled or mistyped; found by index lookups.
      const variants = JSON.stringify(oneEditVariants(n));
      for (const r of stmt.oneEdit.all(variants) as Array<{ id: number }>) {
        const d = docs.get(r.id);
        if (d) note(r.id, 3, { kind: 'near-number', text: `Close to part number ${d.partNumber}` });
      }
      for (const r of stmt.aliasOneEdit.all(variants) as Array<{ id: number; alias: string; kind: string }>) {
        note(r.id, 3, { kind: 'near-number', text: `Close to ${r.kind === 'superseded' ? 'earlier number' : 'cross-reference'} ${r.alias}` });
      }
      // Further misses, only when nothing closer was found: numbers sharing most three-character pieces.
      const grams = trigrams(n.toLowerCase()).map((g) => `"${g}"`);
      const nearRows = candidates.size === 0 ? (stmt.near.all(grams.join(' OR ')) as Array<{ id: number; kind: string; number: string }>) : [];
      for (const r of nearRows) {
        const d = docs.get(r.id);
        if (!d) continue;
        const shown = r.kind === 'part-number' ? d.partNumber : (d.aliases.find((a) => a.normalized === r.number)?.alias ?? r.number);
        note(r.id, 4, { kind: 'near-number', text: `Close to ${r.kind === 'part-number' ? 'part number' : r.kind === 'superseded' ? 'earlier number' : 'cross-reference'} ${shown}` });
      }
    }

    const ws = words(q);
    if (ws.length > 0 && !(numberLike && candidates.size > 0)) {
      // Whole words known to the catalogue match exactly (cheap); the last word may be a prefix, as it may still
      // be being typed. Unknown words are corrected against the catalogue's vocabulary.
      const term = (w: string, last: boolean) => (last && !vocabulary.has(w) && !/\d/.test(w) ? ftsTerm(w) : `"${w.replace(/"/g, '')}"`);
      const found = stmt.words.all(ws.map((w, i) => term(w, i === ws.length - 1)).join(' AND ')) as Array<{ id: number }>;
      for (const r of found) note(r.id, 2, { kind: 'words', text: `Matches “${ws.join(' ')}”` });
      if (found.length === 0) {
        const corrected = ws.map((w) => correctWord(w) ?? w);
        const changed = corrected.some((w, i) => w !== ws[i]);
        const terms = corrected.map((w, i) => term(w, i === corrected.length - 1));
        const tryAnd = changed ? (stmt.words.all(terms.join(' AND ')) as Array<{ id: number }>) : [];
        const rows = tryAnd.length > 0 || terms.length === 1 ? tryAnd : (stmt.words.all(terms.join(' OR ')) as Array<{ id: number }>);
        const text = changed ? `Matches “${corrected.join(' ')}” (did you mean?)` : `Matches some of “${ws.join(' ')}”`;
        for (const r of rows) note(r.id, tryAnd.length > 0 ? 3 : 5, { kind: 'corrected-words', text });
      }
    }

    const list = [...candidates.values()].sort((a, b) => a.tier - b.tier);
    if (list.length === 0) return [];
    // Ranking is for the top of the list; past RANKED candidates, order by tier and number is as good as any.
    const ranked = list.slice(0, RANKED);
    // fuse.js orders the candidates within a tier: a number against numbers, words word by word against titles
    // (its token search, which keeps a long query cheap and still forgives a typo in each word).
    const numberQuery = hasDigits && oneToken;
    const fuse = numberQuery
      ? new Fuse(ranked, {
          includeScore: true,
          ignoreLocation: true,
          threshold: 1,
          keys: [
            { name: 'number', weight: 3, getFn: (c) => c.doc.normalizedNumber },
            { name: 'aliases', weight: 2, getFn: (c) => c.doc.aliases.map((a) => a.normalized) },
          ],
        })
      : new Fuse(ranked, { includeScore: true, ignoreLocation: true, threshold: 0.6, useTokenSearch: true, keys: [{ name: 'title', getFn: (c) => c.doc.title }] });
    const score = new Map<number, number>();
    // People name a frame by its code ("ful cartridge"): a word equal to the part's frame code counts for more.
    const typed = new Set(ws);
    for (const r of fuse.search(numberQuery ? n : q.slice(0, 100))) score.set(r.item.doc.id, (r.score ?? 1) - (!numberQuery && typed.has(r.item.doc.frameCode) ? 0.2 : 0));
    const statusPenalty = (d: Doc) => (d.status === 'active' ? 0 : 0.05);
    list.sort((a, b) => {
      if (a.tier !== b.tier) return a.tier - b.tier;
      const sa = (score.get(a.doc.id) ?? 1) + statusPenalty(a.doc);
      const sb = (score.get(b.doc.id) ?? 1) + statusPenalty(b.doc);
      return sa - sb || a.doc.partNumber.localeCompare(b.doc.partNumber);
    });
    return list.slice(0, limit).map((c) => ({ partId: c.doc.id, reasons: c.reasons }));
  }

  /**
   * Suggestions for a part number that matched nothing (the order pad, a file upload): index look-ups only, each
   * with a small LIMIT, ranked by edit distance in a few microseconds. No word search and no fuzzy ranking, so a
   * file of 500 unknown numbers costs a few look-ups per row rather than a full search per row.
   */
  function suggest(query: string, limit = 3): number[] {
    const n = normalizePartNumber(query.trim().slice(0, 40));
    if (n.length < 3 || n.length > 24) return [];
    if (feed.current().parts !== syncedTo) follow();
    const found = new Map<number, string>();
    const take = (id: number, number: string) => {
      if (docs.has(id) && !found.has(id)) found.set(id, number);
    };
    for (const r of stmt.aliasExact.all(n) as Array<{ id: number; alias: string }>) take(r.id, n);
    for (const r of stmt.suggestPrefix.all(n, `${n}\uffff`) as Array<{ id: number; number: string }>) take(r.id, r.number);
    if (n.length >= 5) {
      const variants = JSON.stringify(oneEditVariants(n));
      for (const r of stmt.oneEdit.all(variants) as Array<{ id: number; number: string }>) take(r.id, r.number);
      // Nothing one edit away: numbers that share all but the last few characters (same family and frame).
      if (found.size === 0) {
        const stem = n.slice(0, Math.max(4, n.length - 3));
        for (const r of stmt.suggestPrefix.all(stem, `${stem}\uffff`) as Array<{ id: number; number: string }>) take(r.id, r.number);
      }
    }
    return [...found]
      .map(([id, number]) => ({ id, d: editDistance(n, number) }))
      .sort((a, b) => a.d - b.d || a.id - b.id)
      .slice(0, limit)
      .map((c) => c.id);
  }

  return { rebuild, refresh, search, suggest, size: () => docs.size };
}

export type SearchService = ReturnType<typeof createSearchService>;
