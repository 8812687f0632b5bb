import type Database from 'better-sqlite3';
import { categoryLabel } from '../../shared/catalog';
import { numberKeys, type NumberKeys } from '../../shared/part-number-search';

/**
 * The catalogue's search index, held in memory by each process: every part's words (title and body) as sorted
 * posting lists, its numbers and aliases in three forms (flat, coarse and fine groups; see part-number-search.ts),
 * and the few properties the catalogue filters and counts by. Built from the database in one read (at start, or in
 * a worker thread after a large change); single parts are then replaced in place as they change, so an edit costs
 * a few reads and no rebuild.
 */

export type AliasKind = 'cross-reference' | 'superseded';
export type NumberKind = 'part-number' | AliasKind;

export interface IndexRow {
  id: number;
  partNumber: string;
  normalizedNumber: string;
  title: string;
  status: string;
  supersededBy: string | null;
  frameCode: string | null;
  category: string;
  bearing: string | null;
  condition: string;
  priceCents: number;
  body: string;
}

export interface AliasRow {
  id: number;
  alias: string;
  kind: AliasKind;
}

interface Postings {
  terms: string[];
  offsets: Int32Array;
  ords: Int32Array;
}

/** What a build produces: plain arrays and typed arrays, so a worker thread can hand it over cheaply. */
export interface Snapshot {
  /** The latest logged part change (part_changes.id) the rows reflect. */
  syncedTo: number;
  rows: Omit<IndexRow, 'body'>[];
  titleLengths: Uint8Array;
  aliases: AliasRow[];
  all: Postings;
  title: Postings;
}

/** Words as the index and the search both read them: lower case, accents dropped, decimals kept whole ("0.63"). */
export function tokenize(text: string): string[] {
  const out: string[] = [];
  const lower = text.toLowerCase();
  // Most text is plain ASCII: decomposing accents is needed only for the rest.
  const plain = !/[^\x20-\x7e\s]/.test(lower) ? lower : lower.normalize('NFKD').replace(/\p{M}+/gu, '');
  for (const raw of plain.split(/[^\p{L}\p{N}.]+/u)) {
    const t = raw.replace(/^\.+|\.+$/g, '');
    if (t.length === 0) continue;
    out.push(t);
    // "0.63" is also found as its pieces; a dotted word ("a.r") likewise.
    if (t.includes('.')) for (const piece of t.split('.')) if (piece.length > 0) out.push(piece);
  }
  return out;
}

/** How many words a title has, as a buyer reads it ("56.3" is one): shorter titles holding the words rank first. */
const wordCount = (text: string) => Math.min(255, text.split(/[^\p{L}\p{N}.]+/u).filter((t) => t.replace(/\./g, '').length > 1 || /\d/.test(t)).length);

/** Single letters ("A/R" gives "a" and "r") are too common to help and too many to keep. */
const indexed = (t: string) => t.length > 1 || /\d/.test(t);

const ROW_SQL = `SELECT p.id, p.part_number AS partNumber, p.normalized_number AS normalizedNumber, p.title, p.status, p.superseded_by AS supersededBy,
         p.frame_code AS frameCode, p.category, p.condition, p.price_cents AS priceCents, p.description,
         f.name AS frameName, s.bearing, s.compressor_ar AS compressorAr, s.turbine_ar AS turbineAr, s.trim_pct AS trimPct, s.inducer_mm AS inducerMm,
         s.flange_pattern AS flangePattern, s.material, s.wastegate, s.cooling, s.gauge_type AS gaugeType, s.range_text AS rangeText, s.mounting, s.connection
  FROM parts p LEFT JOIN frames f ON f.code = p.frame_code LEFT JOIN part_specs s ON s.part_id = p.id`;

type RawRow = Record<string, string | number | null>;

function toIndexRow(r: RawRow): IndexRow {
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
  return {
    id: Number(r.id),
    partNumber: String(r.partNumber),
    normalizedNumber: String(r.normalizedNumber),
    title: String(r.title),
    status: String(r.status),
    supersededBy: r.supersededBy === null ? null : String(r.supersededBy),
    frameCode: r.frameCode === null ? null : String(r.frameCode),
    category: String(r.category),
    bearing: r.bearing === null ? null : String(r.bearing),
    condition: String(r.condition),
    priceCents: Number(r.priceCents),
    body: [categoryLabel(String(r.category)), r.frameCode ?? '', r.frameName ?? '', r.condition, r.description, specText].join(' '),
  };
}

/** The rows of the given parts (all parts when no ids), with their aliases. Raw SQL: one wide join read as rows. */
export function readIndexRows(sqlite: Database.Database, ids?: number[]): { rows: IndexRow[]; aliases: AliasRow[] } {
  const list = ids?.map(() => '?').join(',');
  const rows = (sqlite.prepare(`${ROW_SQL}${ids ? ` WHERE p.id IN (${list})` : ''}`).all(...(ids ?? [])) as RawRow[]).map(toIndexRow);
  const aliases = sqlite
    .prepare(`SELECT part_id AS id, alias, kind FROM part_aliases${ids ? ` WHERE part_id IN (${list})` : ''} ORDER BY id`)
    .all(...(ids ?? [])) as AliasRow[];
  return { rows, aliases };
}

function pack(lists: Map<string, number[]>): Postings {
  const terms = [...lists.keys()].sort();
  const offsets = new Int32Array(terms.length + 1);
  let total = 0;
  terms.forEach((t, i) => {
    offsets[i] = total;
    total += lists.get(t)!.length;
  });
  offsets[terms.length] = total;
  const ords = new Int32Array(total);
  terms.forEach((t, i) => ords.set(lists.get(t)!, offsets[i]));
  return { terms, offsets, ords };
}

/** Builds a snapshot: parts in part-number order (a part's ordinal is its place in that order). */
export function buildSnapshot(input: { rows: IndexRow[]; aliases: AliasRow[] }, syncedTo: number): Snapshot {
  const rows = [...input.rows].sort((a, b) => (a.partNumber < b.partNumber ? -1 : a.partNumber > b.partNumber ? 1 : 0));
  const all = new Map<string, number[]>();
  const title = new Map<string, number[]>();
  const titleLengths = new Uint8Array(rows.length);
  const add = (lists: Map<string, number[]>, t: string, ord: number) => {
    const l = lists.get(t);
    if (!l) lists.set(t, [ord]);
    else if (l[l.length - 1] !== ord) l.push(ord);
  };
  rows.forEach((r, ord) => {
    const titleTokens = tokenize(r.title).filter(indexed);
    titleLengths[ord] = wordCount(r.title);
    for (const t of titleTokens) {
      add(title, t, ord);
      add(all, t, ord);
    }
    for (const t of tokenize(r.body)) if (indexed(t)) add(all, t, ord);
  });
  return { syncedTo, rows: rows.map(({ body: _body, ...r }) => r), titleLengths, aliases: input.aliases, all: pack(all), title: pack(title) };
}

/** The whole catalogue in one read transaction, so the rows and the change they reflect agree. */
export function readSnapshot(sqlite: Database.Database): Snapshot {
  return sqlite
    .transaction(() => {
      const syncedTo = Number(sqlite.prepare('SELECT coalesce(max(id), 0) FROM part_changes').pluck().get());
      return buildSnapshot(readIndexRows(sqlite), syncedTo);
    })
    .deferred();
}

/** Typed arrays a snapshot holds, handed over to the receiving thread rather than copied. */
export const transferables = (s: Snapshot): ArrayBuffer[] =>
  [s.titleLengths, s.all.offsets, s.all.ords, s.title.offsets, s.title.ords].map((a) => a.buffer as ArrayBuffer);

export interface NumberEntry {
  ord: number;
  kind: NumberKind;
  /** The number as written (the part's own, or the alias). */
  shown: string;
}

export type Field = 'all' | 'title';

const EMPTY = new Int32Array(0);

export const ACTIVE = 1;
export const EXCHANGE = 2;

const lowerBound = (sorted: string[], x: string) => {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
};

export class SearchIndex {
  readonly syncedTo: number;
  /** By ordinal; a removed part keeps its ordinal with `alive` 0. */
  readonly docs: Array<Omit<IndexRow, 'body'> & { aliases: AliasRow[] }>;
  /**
   * Columns by ordinal, in typed arrays: a pass over tens of thousands of matches reads these rather than the
   * scattered part objects (which costs a cache miss each).
   */
  titleLengths = new Uint8Array(0);
  /** ACTIVE (on sale), EXCHANGE (an exchange unit). */
  flags = new Uint8Array(0);
  /** Codes into `values`: 0 is none. */
  category = new Uint8Array(0);
  frame = new Uint16Array(0);
  bearing = new Uint8Array(0);
  private readonly codes = new Map<string, number>();
  /** What a category, frame or bearing code stands for. */
  readonly values: Array<string | null> = [null];
  private alive = new Uint8Array(0);
  /** Parts whose base postings no longer hold: their words are in the overlay instead. */
  private stale = new Uint8Array(0);
  private readonly byId = new Map<number, number>();
  private readonly base: Record<Field, Postings>;
  private readonly overlay: Record<Field, Map<string, Set<number>>> = { all: new Map(), title: new Map() };
  private readonly overlayTerms = new Map<number, Record<Field, string[]>>();
  private readonly numbers: Record<keyof NumberKeys, Map<string, NumberEntry[]>> = { flat: new Map(), coarse: new Map(), fine: new Map() };
  private sortedFlat: string[];
  private readonly addedFlat = new Set<string>();
  private live = 0;
  /** Frame codes in lower case, as people type them ("ful cartridge"). */
  readonly frameCodes = new Set<string>();

  constructor(snapshot: Snapshot) {
    this.syncedTo = snapshot.syncedTo;
    const aliasesOf = new Map<number, AliasRow[]>();
    for (const a of snapshot.aliases) (aliasesOf.get(a.id) ?? aliasesOf.set(a.id, []).get(a.id)!).push(a);
    this.docs = snapshot.rows.map((r) => ({ ...r, aliases: aliasesOf.get(r.id) ?? [] }));
    this.base = { all: snapshot.all, title: snapshot.title };
    this.grow(this.docs.length);
    this.titleLengths.set(snapshot.titleLengths);
    this.alive.fill(1);
    this.docs.forEach((d, ord) => {
      this.byId.set(d.id, ord);
      this.setColumns(ord);
      if (d.frameCode) this.frameCodes.add(d.frameCode.toLowerCase());
      this.addNumbers(ord);
    });
    this.live = this.docs.length;
    this.sortedFlat = [...this.numbers.flat.keys()].sort();
  }

  get size(): number {
    return this.live;
  }

  /** Ordinals are dense: arrays of this length can be indexed by them. */
  get capacity(): number {
    return this.docs.length;
  }

  code(value: string | null): number {
    if (value === null) return 0;
    let c = this.codes.get(value);
    if (c === undefined) {
      c = this.values.length;
      this.values.push(value);
      this.codes.set(value, c);
    }
    return c;
  }

  private setColumns(ord: number) {
    const d = this.docs[ord]!;
    this.flags[ord] = (d.status === 'active' ? ACTIVE : 0) | (d.condition === 'exchange' ? EXCHANGE : 0);
    this.category[ord] = this.code(d.category);
    this.frame[ord] = this.code(d.frameCode);
    this.bearing[ord] = this.code(d.bearing);
  }

  ordOf(id: number): number | undefined {
    return this.byId.get(id);
  }

  isAlive(ord: number): boolean {
    return this.alive[ord] === 1;
  }

  private addNumbers(ord: number) {
    const d = this.docs[ord]!;
    const put = (text: string, kind: NumberKind) => {
      const keys = numberKeys(text);
      for (const form of ['flat', 'coarse', 'fine'] as const) {
        const list = this.numbers[form].get(keys[form]);
        const entry = { ord, kind, shown: text };
        if (list) list.push(entry);
        else this.numbers[form].set(keys[form], [entry]);
      }
      return keys.flat;
    };
    const flats = [put(d.partNumber, 'part-number'), ...d.aliases.map((a) => put(a.alias, a.kind))];
    return flats;
  }

  private removeNumbers(ord: number) {
    const d = this.docs[ord]!;
    for (const text of [d.partNumber, ...d.aliases.map((a) => a.alias)]) {
      const keys = numberKeys(text);
      for (const form of ['flat', 'coarse', 'fine'] as const) {
        const list = this.numbers[form].get(keys[form]);
        if (!list) continue;
        const kept = list.filter((e) => e.ord !== ord);
        if (kept.length > 0) this.numbers[form].set(keys[form], kept);
        else this.numbers[form].delete(keys[form]);
      }
    }
  }

  /** Numbers (parts' own and aliases) whose key in the given form is exactly this. */
  numbersAt(form: keyof NumberKeys, key: string): NumberEntry[] {
    return this.numbers[form].get(key) ?? [];
  }

  /** Numbers whose flat form starts with the prefix (and is longer than it). */
  numbersStartingWith(prefix: string, visit: (e: NumberEntry) => void) {
    const upper = `${prefix}\uffff`;
    for (let i = lowerBound(this.sortedFlat, prefix); i < this.sortedFlat.length && this.sortedFlat[i]! < upper; i++) {
      const key = this.sortedFlat[i]!;
      if (key !== prefix) for (const e of this.numbers.flat.get(key) ?? []) visit(e);
    }
    for (const key of this.addedFlat) {
      const inBase = this.sortedFlat[lowerBound(this.sortedFlat, key)] === key;
      if (!inBase && key !== prefix && key.startsWith(prefix)) for (const e of this.numbers.flat.get(key) ?? []) visit(e);
    }
  }

  /** Calls `visit` once for each part holding the term in the field. */
  forEachPosting(field: Field, term: string, visit: (ord: number) => void) {
    const p = this.base[field];
    const i = lowerBound(p.terms, term);
    if (p.terms[i] === term) {
      const end = p.offsets[i + 1]!;
      for (let k = p.offsets[i]!; k < end; k++) {
        const ord = p.ords[k]!;
        if (this.stale[ord] === 0) visit(ord);
      }
    }
    const extra = this.overlay[field].get(term);
    if (extra) for (const ord of extra) visit(ord);
  }

  /**
   * The term's postings as a slice of the base list (skip ordinals where `stale` is set) and the overlay's set, for
   * loops too hot for a callback per posting.
   */
  postings(field: Field, term: string): { base: Int32Array; stale: Uint8Array; extra: Set<number> | undefined } {
    const p = this.base[field];
    const i = lowerBound(p.terms, term);
    const base = p.terms[i] === term ? p.ords.subarray(p.offsets[i]!, p.offsets[i + 1]!) : EMPTY;
    return { base, stale: this.stale, extra: this.overlay[field].get(term) };
  }

  /** About how many parts hold the term (an upper bound), to take the rarest word first. */
  postingCount(field: Field, term: string): number {
    const p = this.base[field];
    const i = lowerBound(p.terms, term);
    return (p.terms[i] === term ? p.offsets[i + 1]! - p.offsets[i]! : 0) + (this.overlay[field].get(term)?.size ?? 0);
  }

  hasTerm(term: string): boolean {
    const p = this.base.all;
    const i = lowerBound(p.terms, term);
    return (p.terms[i] === term && p.offsets[i + 1]! > p.offsets[i]!) || (this.overlay.all.get(term)?.size ?? 0) > 0;
  }

  /** Terms that start with the prefix, the prefix itself included. */
  termsStartingWith(prefix: string): string[] {
    const p = this.base.all;
    const out: string[] = [];
    for (let i = lowerBound(p.terms, prefix); i < p.terms.length && p.terms[i]!.startsWith(prefix); i++) out.push(p.terms[i]!);
    for (const t of this.overlay.all.keys()) if (t.startsWith(prefix) && !out.includes(t)) out.push(t);
    return out;
  }

  /** Every term (base and overlay), for correcting a mistyped word. */
  *terms(): Generator<string> {
    yield* this.base.all.terms;
    for (const t of this.overlay.all.keys()) yield t;
  }

  /**
   * Puts changed parts in place: each given part's row replaces its old one (or is added), and ids with no row are
   * removed. Their words go to the overlay; their base postings are ignored from now on.
   */
  apply(changedIds: number[], input: { rows: IndexRow[]; aliases: AliasRow[] }) {
    const rowsById = new Map(input.rows.map((r) => [r.id, r]));
    const aliasesOf = new Map<number, AliasRow[]>();
    for (const a of input.aliases) (aliasesOf.get(a.id) ?? aliasesOf.set(a.id, []).get(a.id)!).push(a);
    for (const id of new Set(changedIds)) {
      const row = rowsById.get(id);
      let ord = this.byId.get(id);
      if (ord !== undefined) {
        this.removeNumbers(ord);
        this.dropOverlay(ord);
        this.markStale(ord);
        if (this.alive[ord] === 1 && !row) {
          this.alive[ord] = 0;
          this.live--;
        }
      }
      if (!row) continue;
      const { body, ...doc } = row;
      if (ord === undefined) {
        ord = this.docs.length;
        this.docs.push({ ...doc, aliases: [] });
        this.byId.set(id, ord);
        this.grow(this.docs.length);
        this.markStale(ord);
      }
      if (this.alive[ord] === 0) {
        this.alive[ord] = 1;
        this.live++;
      }
      this.docs[ord] = { ...doc, aliases: aliasesOf.get(id) ?? [] };
      this.setColumns(ord);
      if (doc.frameCode) this.frameCodes.add(doc.frameCode.toLowerCase());
      for (const flat of this.addNumbers(ord)) this.addedFlat.add(flat);
      const titleTokens = [...new Set(tokenize(doc.title).filter(indexed))];
      this.titleLengths[ord] = wordCount(doc.title);
      const allTokens = [...new Set([...titleTokens, ...tokenize(body).filter(indexed)])];
      for (const [field, terms] of [['title', titleTokens], ['all', allTokens]] as const) {
        for (const t of terms) (this.overlay[field].get(t) ?? this.overlay[field].set(t, new Set()).get(t)!).add(ord);
      }
      this.overlayTerms.set(ord, { title: titleTokens, all: allTokens });
    }
  }

  /** How many parts are held in the overlay: past a few thousand, a rebuild folds them into the base. */
  get overlaySize(): number {
    return this.overlayTerms.size;
  }

  private markStale(ord: number) {
    this.stale[ord] = 1;
  }

  private dropOverlay(ord: number) {
    const held = this.overlayTerms.get(ord);
    if (!held) return;
    for (const field of ['all', 'title'] as const) {
      for (const t of held[field]) {
        const set = this.overlay[field].get(t);
        set?.delete(ord);
        if (set?.size === 0) this.overlay[field].delete(t);
      }
    }
    this.overlayTerms.delete(ord);
  }

  private grow(needed: number) {
    if (needed <= this.alive.length) return;
    const size = this.alive.length === 0 ? needed : Math.max(needed, Math.ceil(this.alive.length * 1.5));
    const wider = <T extends Uint8Array | Uint16Array>(a: T, make: (n: number) => T): T => {
      const b = make(size);
      b.set(a);
      return b;
    };
    const u8 = (n: number) => new Uint8Array(n);
    this.alive = wider(this.alive, u8);
    this.stale = wider(this.stale, u8);
    this.flags = wider(this.flags, u8);
    this.category = wider(this.category, u8);
    this.bearing = wider(this.bearing, u8);
    this.titleLengths = wider(this.titleLengths, u8);
    this.frame = wider(this.frame, (n) => new Uint16Array(n));
  }
}
