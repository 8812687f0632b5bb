import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import Fuse from 'fuse.js';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { parts } from '../db/schema';
import { isValidGtin13, normalizeGtinInput } from '../../shared/gtin';
import { changeFeedFor } from '../db/change-feed';
import { normalizePartNumber } from '../../shared/part-number';
import { EXCHANGE_SUFFIX } from '../../shared/part-number';
import { typoCandidates, type TypoCandidate } from '../../shared/part-number-search';
import { ACTIVE, EXCHANGE, readIndexRows, readSnapshot, SearchIndex, tokenize, type NumberEntry, type Snapshot } from './search-index';

/** Why a part came up, in words a buyer understands. */
export interface MatchReason {
  kind: 'gtin' | 'part-number' | 'part-number-prefix' | 'superseded' | 'cross-reference' | 'near-number' | 'words' | 'corrected-words';
  text: string;
}

export interface SearchHit {
  partId: number;
  reasons: MatchReason[];
}

/** Every match of a query, best first, over the index that answered it. */
export interface SearchResult {
  index: SearchIndex;
  /** Ordinals in the index, best first. */
  ords: Int32Array;
  reasons(ord: number): MatchReason[];
  /** Whether the query was exactly this part's number or one of its aliases. */
  exact(ord: number): boolean;
}

/** More changed parts than this at once are indexed again in a worker thread, the current index serving meanwhile. */
export const BACKGROUND_REBUILD_ABOVE = 300;

// Scores: the tier (how it matched) above, how well within the tier below.
const TIER = 4096;

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

function words(q: string): string[] {
  const all = tokenize(q.replace(/\./g, (m, at: number, s: string) => (/\d/.test(s[at - 1] ?? '') && /\d/.test(s[at + 1] ?? '') ? m : ' ')));
  return [...new Set(all.filter((w, _i, list) => w.length > 1 || list.length === 1))].slice(0, 8);
}

const KIND_WORDS: Record<NumberEntry['kind'], string> = { 'part-number': 'part number', superseded: 'earlier number', 'cross-reference': 'cross-reference' };

/** Starts the index build in a worker thread: the compiled worker beside the bundle, or the source through tsx. */
function buildInWorker(file: string): Promise<Snapshot> {
  const here = import.meta.url;
  const workerData = { file };
  let worker: Worker;
  if (here.endsWith('.ts')) {
    // The package's ESM entry beside the CommonJS one that require() resolves.
    const tsx = pathToFileURL(createRequire(here).resolve('tsx/esm/api').replace(/\.cjs$/, '.mjs')).href;
    const source = new URL('./search-worker.ts', here).href;
    const boot = `import(${JSON.stringify(tsx)}).then((m) => { m.register(); return import(${JSON.stringify(source)}); })`;
    worker = new Worker(boot, { eval: true, workerData });
  } else {
    worker = new Worker(new URL('./search-worker.mjs', here), { workerData });
  }
  return new Promise((resolve, reject) => {
    worker.once('message', (snapshot: Snapshot) => resolve(snapshot));
    worker.once('error', reject);
    worker.once('exit', (code) => {
      if (code !== 0) reject(new Error(`the search index worker stopped with code ${code}`));
    });
  });
}

/**
 * Catalogue search over an in-memory index (search-index.ts): exact, prefix and mistyped part numbers and aliases,
 * and words (all of them, the last one perhaps still being typed; mistyped ones corrected against the catalogue's
 * vocabulary). Every match is ranked, none is cut off: tier (how it matched), then how well, then part number.
 */
export function createSearchService(db: Db, options: { log?: (err: unknown) => void } = {}) {
  const sqlite = db.$client;
  const feed = changeFeedFor(db);
  let index: SearchIndex | null = null;
  let syncedTo = 0;
  let framesSeen = -1;
  let generation = 0;
  let rebuilding: Promise<void> | null = null;
  let correctionTerms: { generation: number; overlay: number; terms: string[] } | null = null;

  function install(next: SearchIndex) {
    index = next;
    syncedTo = next.syncedTo;
    generation++;
  }

  /**
   * Builds the index anew. At start (and for an in-memory database) it is built here; otherwise `background` builds
   * it in a worker thread while the current index keeps answering, and swaps it in when ready.
   */
  function rebuild(opts: { background?: boolean } = {}): Promise<void> {
    if (!opts.background || !index || sqlite.memory) {
      install(new SearchIndex(readSnapshot(sqlite)));
      framesSeen = feed.current().frames;
      return Promise.resolve();
    }
    rebuilding ??= buildInWorker(sqlite.name)
      .then((snapshot) => {
        rebuilding = null;
        install(new SearchIndex(snapshot));
        follow();
      })
      .catch((err: unknown) => {
        rebuilding = null;
        (options.log ?? console.error)(err);
      });
    return rebuilding;
  }

  /** Brings the index up to the latest part change, whichever process made it (and the given parts). */
  function follow(extra: number[] = []) {
    if (!index) return;
    const { ids, latest } = feed.partsChangedSince(syncedTo);
    const all = ids === null ? null : [...new Set([...ids, ...extra])];
    if (all === null || all.length > BACKGROUND_REBUILD_ABOVE || index.overlaySize + all.length > 20 * BACKGROUND_REBUILD_ABOVE) {
      void rebuild({ background: true });
      return;
    }
    if (all.length > 0) {
      index.apply(all, readIndexRows(sqlite, all));
      generation++;
    }
    syncedTo = latest;
  }

  function current(): SearchIndex {
    const versions = feed.current();
    // A frame's name is among its parts' words: a renamed frame has its parts indexed again.
    if (framesSeen !== versions.frames) {
      framesSeen = versions.frames;
      if (index) void rebuild({ background: true });
    }
    if (!index) rebuild();
    else if (!rebuilding && versions.parts !== syncedTo) follow();
    return index!;
  }

  /** Refreshes the index for parts changed here, at once; a large change is built again in a worker thread. */
  function refresh(ids: number[]) {
    if (ids.length === 0 || !index) return;
    if (ids.length > BACKGROUND_REBUILD_ABOVE) {
      void rebuild({ background: true });
      return;
    }
    index.apply(ids, readIndexRows(sqlite, ids));
    generation++;
    if (!rebuilding) follow();
  }

  function correctWord(ix: SearchIndex, w: string): string | null {
    if (ix.hasTerm(w) || w.length < 4 || /\d/.test(w)) return null;
    if (!correctionTerms || correctionTerms.generation !== generation) {
      correctionTerms = { generation, overlay: ix.overlaySize, terms: [...new Set(ix.terms())].filter((t) => t.length >= 3 && /[a-z]/.test(t) && !/\d/.test(t)) };
    }
    // fuse.js scores the few terms of a similar length that share a first or second letter; a typo rarely changes
    // both, and scoring the whole vocabulary for every word costs milliseconds.
    const near = correctionTerms.terms.filter((t) => Math.abs(t.length - w.length) <= 2 && (t[0] === w[0] || t[1] === w[1]));
    if (near.length === 0) return null;
    const best = new Fuse(near, { threshold: 0.34, ignoreLocation: true, includeScore: true, minMatchCharLength: 3 }).search(w, { limit: 1 })[0];
    return best && best.item !== w ? best.item : null;
  }

  /**
   * The part whose GTIN this query is (13 digits, spaces allowed, check digit right), by the unique index on
   * parts.gtin: one look-up, and only for a query shaped like a GTIN. GTINs are not in the in-memory index, so a
   * run of digits typed in part is not matched against 200,000 of them.
   */
  function partIdByGtin(query: string): number | undefined {
    const gtin = normalizeGtinInput(query.slice(0, 40));
    if (!gtin || !isValidGtin13(gtin)) return undefined;
    return db.select({ id: parts.id }).from(parts).where(eq(parts.gtin, gtin)).get()?.id;
  }

  function find(query: string): SearchResult {
    const ix = current();
    const byGtin = partIdByGtin(query);
    return findIn(ix, query, (w) => correctWord(ix, w), byGtin === undefined ? undefined : ix.ordOf(byGtin));
  }

  /** The best matches as part ids with their reasons (all of them ranked; `limit` only shortens the answer). */
  function search(query: string, limit = 300): SearchHit[] {
    const r = find(query);
    const out: SearchHit[] = [];
    for (let i = 0; i < r.ords.length && i < limit; i++) out.push({ partId: r.index.docs[r.ords[i]!]!.id, reasons: r.reasons(r.ords[i]!) });
    return out;
  }

  /**
   * Suggestions for a part number that matched nothing (the order pad, a file upload): exact aliases, numbers it
   * begins, and near misses by the slip model; when none, numbers of the same series. Map look-ups only.
   */
  function suggest(query: string, limit = 3): number[] {
    const n = normalizePartNumber(query.trim().slice(0, 40));
    if (n.length < 3 || n.length > 24) return [];
    const ix = current();
    const found = new Map<number, number>();
    const take = (ord: number, score: number) => {
      if (ix.isAlive(ord) && (found.get(ord) ?? Infinity) > score) found.set(ord, score);
    };
    const penalty = (ord: number) => (ix.flags[ord]! & EXCHANGE && !n.endsWith(EXCHANGE_SUFFIX) ? 1 : 0);
    for (const e of ix.numbersAt('flat', n)) if (e.kind !== 'part-number') take(e.ord, 0);
    ix.numbersStartingWith(n, (e) => take(e.ord, 10 + penalty(e.ord)));
    if (n.length >= 5) {
      for (const c of typoCandidates(query)) for (const e of ix.numbersAt(c.form, c.key)) take(e.ord, 20 + c.cost * 2 + penalty(e.ord));
      if (found.size === 0) {
        // Nothing one slip away: numbers that share all but the last few characters (same family and frame).
        const stem = n.slice(0, Math.max(4, n.length - 3));
        ix.numbersStartingWith(stem, (e) => take(e.ord, 100 + editDistance(n, normalizePartNumber(e.shown)) * 2 + penalty(e.ord)));
      }
    }
    return [...found]
      .sort((a, b) => a[1] - b[1] || a[0] - b[0])
      .slice(0, limit)
      .map(([ord]) => ix.docs[ord]!.id);
  }

  /**
   * The parts a typed number names exactly: its own number, a cross-reference or an earlier number (as search
   * resolves it first). The order pad accepts a number that names exactly one part.
   */
  function exactParts(typed: string): number[] {
    const n = normalizePartNumber(typed.trim().slice(0, 40));
    if (n.length < 2) return [];
    const byGtin = partIdByGtin(typed);
    if (byGtin !== undefined) return [byGtin];
    const ix = current();
    return [...new Set(ix.numbersAt('flat', n).filter((e) => ix.isAlive(e.ord)).map((e) => ix.docs[e.ord]!.id))];
  }

  return {
    rebuild,
    refresh,
    exactParts,
    search,
    find,
    suggest,
    size: () => current().size,
    /** Moves whenever the index changes in this process (an edit applied, a rebuild swapped in). */
    generation: () => generation,
    /** Resolves when a rebuild under way (if any) has been swapped in. */
    settled: () => rebuilding ?? Promise.resolve(),
  };
}

/**
 * Every match of the query in the index, ranked. `correct` offers a known word for a mistyped one (or null).
 * Pure over the index, so it can be tried on a catalogue held only in memory.
 */
export function findIn(ix: SearchIndex, query: string, correct: (word: string) => string | null = () => null, gtinOrd?: number): SearchResult {
  const q = query.trim().slice(0, 100);
  const empty: SearchResult = { index: ix, ords: new Int32Array(0), reasons: () => [], exact: () => false };
  if (q.length === 0) return empty;
  const n = normalizePartNumber(q);
  const typedExchange = n.endsWith(EXCHANGE_SUFFIX);
  // Number candidates: ordinal → score (lower is better) and why.
  const numbers = new Map<number, { score: number; reasons: MatchReason[] }>();
  const note = (ord: number, score: number, reason: MatchReason) => {
    if (!ix.isAlive(ord)) return;
    const c = numbers.get(ord);
    if (!c) numbers.set(ord, { score, reasons: [reason] });
    else {
      c.score = Math.min(c.score, score);
      if (!c.reasons.some((r) => r.kind === reason.kind)) c.reasons.push(reason);
    }
  };
  // Within a tier: on sale before the rest, and a new unit before its exchange unit unless the exchange was typed.
  const docPenalty = (ord: number) => {
    const f = ix.flags[ord]!;
    return (f & ACTIVE ? 0 : 2) + (f & EXCHANGE && !typedExchange ? 1 : 0);
  };

  // A GTIN typed or scanned names one part exactly: it comes first, with the exact part numbers.
  if (gtinOrd !== undefined) note(gtinOrd, 0, { kind: 'gtin', text: 'Exact GTIN' });
  if (n.length >= 2) {
    for (const e of ix.numbersAt('flat', n)) {
      if (e.kind === 'part-number') {
        const d = ix.docs[e.ord]!;
        note(e.ord, 0, { kind: 'part-number', text: d.supersededBy ? `Exact part number; superseded by ${d.supersededBy}` : 'Exact part number' });
      } else {
        note(e.ord, TIER + docPenalty(e.ord), e.kind === 'superseded' ? { kind: 'superseded', text: `Replaces the earlier number ${e.shown}` } : { kind: 'cross-reference', text: `Cross-reference ${e.shown}` });
      }
    }
  }
  if (n.length >= 3) {
    const startsWith: MatchReason = { kind: 'part-number-prefix', text: `Part number starts with ${q}` };
    ix.numbersStartingWith(n, (e) => {
      if (e.kind === 'part-number') note(e.ord, 2 * TIER + docPenalty(e.ord), startsWith);
      else note(e.ord, 2 * TIER + docPenalty(e.ord), { kind: e.kind, text: `${e.kind === 'superseded' ? 'Earlier number' : 'Cross-reference'} ${e.shown} starts with ${q}` });
    });
  }
  const hasDigits = /\d/.test(n);
  const oneToken = !/\s/.test(q);
  // A number typed in pieces ("ful 20 0203") is still a number; a phrase with words is not.
  const numberLike = hasDigits && (oneToken || q.split(/\s+/).every((w) => /\d/.test(w) || w.length <= 3));
  const exactHit = [...numbers.values()].some((c) => c.score < 2 * TIER);
  // A number typed exactly needs no near misses or word search; that keeps the common case cheap.
  if (numberLike && n.length >= 5 && n.length <= 24 && !exactHit) {
    const near = (candidates: TypoCandidate[], tier: number) => {
      let found = false;
      for (const c of candidates) {
        for (const e of ix.numbersAt(c.form, c.key)) {
          found = true;
          note(e.ord, tier * TIER + c.cost * 8 + docPenalty(e.ord), { kind: 'near-number', text: `Close to ${KIND_WORDS[e.kind]} ${e.shown}` });
        }
      }
      return found;
    };
    // One slip inside a group, then one across groups; only when none is found, two slips inside one group.
    if (!near(typoCandidates(q), 3)) near(typoCandidates(q, { twoSlips: true }), 4);
  }

  const ws = words(q);
  let wordOrds: number[] = [];
  let wordScores: Int32Array | null = null;
  let wordReason: MatchReason | null = null;
  if (ws.length > 0 && !(numberLike && numbers.size > 0)) {
    // Whole words known to the catalogue match exactly; the last word may be a prefix, as it may still be being
    // typed. Unknown words are corrected against the catalogue's vocabulary.
    const termsFor = (list: string[]) =>
      list.map((w, i) => (ix.hasTerm(w) || /\d/.test(w) ? [w] : i === list.length - 1 ? ix.termsStartingWith(w) : []));
    let terms = termsFor(ws);
    let hits = matchWords(ix, terms, 'all');
    let tier = 2;
    wordReason = { kind: 'words', text: `Matches “${ws.join(' ')}”` };
    if (hits.ords.length === 0) {
      const corrected = ws.map((w) => correct(w) ?? w);
      const changed = corrected.some((w, i) => w !== ws[i]);
      terms = termsFor(corrected);
      hits = changed ? matchWords(ix, terms, 'all') : hits;
      tier = 3;
      wordReason = { kind: 'corrected-words', text: `Matches “${corrected.join(' ')}” (did you mean?)` };
      if (hits.ords.length === 0 && terms.length > 1) {
        hits = matchWords(ix, terms, 'some');
        tier = 5;
        wordReason = changed ? wordReason : { kind: 'corrected-words', text: `Matches some of “${ws.join(' ')}”` };
      }
    }
    wordOrds = hits.ords;
    wordScores = new Int32Array(wordOrds.length);
    const typedFrames = new Set(ws.filter((w) => ix.frameCodes.has(w)).map((w) => ix.code(w.toUpperCase())));
    wordOrds.forEach((ord, k) => {
      // People name a frame by its code ("ful cartridge"): a part of a frame typed comes before the others.
      const frameMiss = typedFrames.size > 0 && !typedFrames.has(ix.frame[ord]!) ? 1 : 0;
      wordScores![k] =
        tier * TIER + (terms.length - hits.matched[k]!) * 800 + (terms.length - hits.inTitle[k]!) * 400 + frameMiss * 200 + (ix.flags[ord]! & ACTIVE ? 0 : 100) + Math.min(ix.titleLengths[ord]!, 99);
    });
  }

  if (wordOrds.length + numbers.size === 0) return empty;
  // Every match is ordered by score, then ordinal (part-number order). Many matches: a counting sort by score over
  // the ordinals, which come out in order without comparing strings.
  const score = new Int32Array(ix.capacity);
  const inWords = new Uint8Array(ix.capacity);
  const found: number[] = [];
  wordOrds.forEach((ord, i) => {
    inWords[ord] = 1;
    score[ord] = wordScores![i]! + 1;
    found.push(ord);
  });
  for (const [ord, c] of numbers) {
    if (score[ord] === 0) found.push(ord);
    if (score[ord] === 0 || c.score + 1 < score[ord]!) score[ord] = c.score + 1;
  }
  let ords: Int32Array;
  if (found.length < 2048) {
    ords = Int32Array.from(found).sort((a, b) => score[a]! - score[b]! || a - b);
  } else {
    let top = 0;
    for (const ord of found) if (score[ord]! > top) top = score[ord]!;
    const start = new Int32Array(top + 2);
    for (const ord of found) start[score[ord]! + 1]!++;
    for (let v = 1; v < start.length; v++) start[v]! += start[v - 1]!;
    ords = new Int32Array(found.length);
    for (let ord = 0; ord < score.length; ord++) if (score[ord]! > 0) ords[start[score[ord]!]!++] = ord;
  }
  const shared = wordReason;
  return {
    index: ix,
    ords,
    reasons: (ord) => {
      const num = numbers.get(ord)?.reasons ?? [];
      return inWords[ord] === 1 && shared ? (num.length > 0 ? [...num, shared] : [shared]) : num;
    },
    exact: (ord) => (numbers.get(ord)?.score ?? Infinity) < 2 * TIER,
  };
}

/**
 * Parts holding every word (`all`) or any (`some`); each word is a list of terms (a prefix gives several). Counts,
 * per part found, the words matched and those in its title. Posting lists are walked with a count per ordinal, the
 * rarest word first, so a phrase of common words costs a few passes over arrays.
 */
function matchWords(ix: SearchIndex, words: string[][], mode: 'all' | 'some') {
  const n = words.length;
  const count = new Uint8Array(ix.capacity);
  const seen = new Uint8Array(ix.capacity);
  const ords: number[] = [];
  const order = words.map((terms, i) => ({ terms, i, size: terms.reduce((s, t) => s + ix.postingCount('all', t), 0) })).sort((a, b) => a.size - b.size);
  if (mode === 'all' && order.some((w) => w.size === 0)) return { ords, matched: new Uint8Array(0), inTitle: new Uint8Array(0) };
  const visit = (field: 'all' | 'title', term: string, each: (ord: number) => void) => {
    const { base, stale, extra } = ix.postings(field, term);
    for (let k = 0; k < base.length; k++) {
      const ord = base[k]!;
      if (stale[ord] === 0) each(ord);
    }
    if (extra) for (const ord of extra) each(ord);
  };
  order.forEach(({ terms }, step) => {
    const last = step === n - 1;
    for (const t of terms) {
      if (mode === 'all') {
        // Inlined: this loop runs once per posting of every word.
        const { base, stale, extra } = ix.postings('all', t);
        for (let k = 0; k < base.length; k++) {
          const ord = base[k]!;
          if (count[ord] === step && stale[ord] === 0) {
            count[ord] = step + 1;
            if (last) ords.push(ord);
          }
        }
        if (extra) {
          for (const ord of extra) {
            if (count[ord] === step) {
              count[ord] = step + 1;
              if (last) ords.push(ord);
            }
          }
        }
      } else {
        visit('all', t, (ord) => {
          if (seen[ord] === step + 1) return;
          seen[ord] = step + 1;
          if (count[ord] === 0) ords.push(ord);
          count[ord] = count[ord]! + 1;
        });
      }
    }
  });
  const titleCount = new Uint8Array(ix.capacity);
  seen.fill(0);
  words.forEach((terms, i) => {
    for (const t of terms) {
      visit('title', t, (ord) => {
        if (seen[ord] !== i + 1 && (mode === 'all' ? count[ord] === n : count[ord]! > 0)) {
          seen[ord] = i + 1;
          titleCount[ord] = titleCount[ord]! + 1;
        }
      });
    }
  });
  const matched = new Uint8Array(ords.length);
  const inTitle = new Uint8Array(ords.length);
  for (let k = 0; k < ords.length; k++) {
    matched[k] = count[ords[k]!]!;
    inTitle[k] = titleCount[ords[k]!]!;
  }
  return { ords, matched, inTitle };
}

export type SearchService = ReturnType<typeof createSearchService>;
