import type Database from 'better-sqlite3';
import { createRandom } from '../catalog-seed/generate';

/** The ways buyers type what they look for; each kind is timed on its own too. */
export const QUERY_KINDS = ['exact', 'lower-no-dashes', 'digit-swapped', 'superseded', 'cross-reference', 'words', 'words-typo'] as const;
export type QueryKind = (typeof QUERY_KINDS)[number];

export interface BenchQuery {
  kind: QueryKind;
  q: string;
  /** The part number a buyer expects first, where that is unambiguous. */
  expectFirst?: string;
}

// 100 queries: 16 for the two exact forms, 14 for each of the others.
const MIX: Record<QueryKind, number> = {
  exact: 16,
  'lower-no-dashes': 16,
  'digit-swapped': 14,
  superseded: 14,
  'cross-reference': 14,
  words: 13,
  'words-typo': 13,
};

const STOP = new Set(['vanecraft', 'variant', 'and', 'the', 'for', 'with', 'unit', 'earlier', 'number']);

function swapDigit(partNumber: string, random: () => number): string {
  const chars = [...partNumber];
  const digits = chars.map((c, i) => (/\d/.test(c) ? i : -1)).filter((i) => i >= 0);
  // Adjacent differing digits in the last group are swapped; otherwise one digit is changed.
  const pairs = digits.filter((i, k) => digits[k + 1] === i + 1 && chars[i] !== chars[i + 1]);
  if (pairs.length > 0) {
    const i = pairs[Math.floor(random() * pairs.length)]!;
    [chars[i], chars[i + 1]] = [chars[i + 1]!, chars[i]!];
  } else {
    const i = digits.at(-1)!;
    chars[i] = String((Number(chars[i]) + 1) % 10);
  }
  return chars.join('');
}

function wordsFrom(title: string, random: () => number): string {
  const tokens = title
    .toLowerCase()
    .replace(/[,()—–]/g, ' ')
    .split(/\s+/)
    .filter((t) => t.length > 0);
  const wordsOnly = tokens.filter((t) => /^[a-z]{3,}$/.test(t) && !STOP.has(t));
  const numbers = tokens.filter((t) => /^\d+(\.\d+)?$/.test(t));
  const pickedWords = wordsOnly.filter(() => random() < 0.7).slice(0, 3);
  const chosen = pickedWords.length > 0 ? pickedWords : wordsOnly.slice(0, 2);
  const number = numbers.length > 0 && random() < 0.6 ? numbers[Math.floor(random() * numbers.length)] : undefined;
  return [...chosen, ...(number ? [number] : [])].join(' ');
}

function typo(query: string, random: () => number): string {
  const parts = query.split(' ');
  const candidates = parts.map((w, i) => (/^[a-z]{5,}$/.test(w) ? i : -1)).filter((i) => i >= 0);
  const index = candidates.length > 0 ? candidates[Math.floor(random() * candidates.length)]! : 0;
  const w = parts[index] ?? query;
  const at = 1 + Math.floor(random() * (w.length - 2));
  const mode = Math.floor(random() * 3);
  // A dropped letter, two neighbours swapped, or a neighbouring key: the common slips.
  const next =
    mode === 0
      ? w.slice(0, at) + w.slice(at + 1)
      : mode === 1 && w[at] !== w[at + 1]
        ? w.slice(0, at) + (w[at + 1] ?? '') + (w[at] ?? '') + w.slice(at + 2)
        : w.slice(0, at) + (w[at] === 'e' ? 'r' : 'e') + w.slice(at + 1);
  parts[index] = next;
  return parts.join(' ');
}

/** Builds a deterministic mix of 100 queries from what is actually in the catalogue. */
export function buildQueries(sqlite: Database.Database, seed = 7): BenchQuery[] {
  const random = createRandom(seed);
  // Without replacement, so no query is timed twice as often as the others (unless the catalogue runs out).
  const decks = new Map<unknown[], unknown[]>();
  const pick = <T>(rows: T[]): T => {
    if (rows.length === 0) throw new Error('the catalogue has nothing to build this kind of query from');
    let deck = decks.get(rows) as T[] | undefined;
    if (!deck || deck.length === 0) {
      deck = [...rows];
      decks.set(rows, deck);
    }
    const i = Math.floor(random() * deck.length);
    const [item] = deck.splice(i, 1);
    return item!;
  };
  const active = sqlite.prepare("SELECT part_number AS n, title FROM parts WHERE status = 'active'").all() as Array<{ n: string; title: string }>;
  const aliases = (kind: string) => (sqlite.prepare('SELECT alias FROM part_aliases WHERE kind = ?').all(kind) as Array<{ alias: string }>).map((r) => r.alias);
  const superseded = aliases('superseded');
  const crossRefs = aliases('cross-reference');

  const out: BenchQuery[] = [];
  for (let i = 0; i < MIX.exact; i++) {
    const p = pick(active);
    out.push({ kind: 'exact', q: p.n, expectFirst: p.n });
  }
  for (let i = 0; i < MIX['lower-no-dashes']; i++) {
    const p = pick(active);
    out.push({ kind: 'lower-no-dashes', q: p.n.toLowerCase().replace(/[-\s]/g, ''), expectFirst: p.n });
  }
  for (let i = 0; i < MIX['digit-swapped']; i++) out.push({ kind: 'digit-swapped', q: swapDigit(pick(active).n, random) });
  for (let i = 0; i < MIX.superseded; i++) out.push({ kind: 'superseded', q: pick(superseded) });
  for (let i = 0; i < MIX['cross-reference']; i++) out.push({ kind: 'cross-reference', q: pick(crossRefs) });
  for (let i = 0; i < MIX.words; i++) out.push({ kind: 'words', q: wordsFrom(pick(active).title, random) });
  for (let i = 0; i < MIX['words-typo']; i++) out.push({ kind: 'words-typo', q: typo(wordsFrom(pick(active).title, random), random) });
  return out;
}
