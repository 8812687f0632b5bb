import { normalizePartNumber } from './part-number';

/**
 * How a typed number is compared with the catalogue's numbers, keeping its series boundaries.
 *
 * Normalising a number to letters and digits alone ("FUL-21-0243" → "FUL210243") makes one edit in the group and
 * one in the serial look alike, and in a large catalogue most one-edit neighbours of a mistyped number are real
 * parts of other series. So each number is also kept in groups: split where the buyer typed a dash or space and
 * where letters turn to digits ("fine": FUL|21|0243), and split only where letters turn to digits ("coarse":
 * FUL|210243, for a number typed without dashes). A slip inside one group (two digits swapped, one dropped,
 * doubled or mistyped) costs less than an edit that moves a group boundary, which is found only on the flat form.
 */
export interface NumberKeys {
  flat: string;
  coarse: string;
  fine: string;
}

const groupsOf = (text: string, splitAtSeparators: boolean): string[] =>
  text
    .normalize('NFKD')
    .toUpperCase()
    .split(splitAtSeparators ? /[^A-Z0-9]+/ : /(?!)/)
    .flatMap((piece) => normalizePartNumber(piece).match(/[A-Z]+|[0-9]+/g) ?? []);

export function numberKeys(text: string): NumberKeys {
  return { flat: normalizePartNumber(text), coarse: groupsOf(text, false).join('-'), fine: groupsOf(text, true).join('-') };
}

const DIGITS = '0123456789';
const LETTERS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';

/**
 * Every string one edit away inside a group of one kind (digits or letters): neighbours swapped, one dropped, added
 * or changed, each passed to `put` with its cost. Built by slicing, with no map or pattern per variant: an order pad
 * of 500 unknown numbers runs this for each.
 */
export function forEachOneEdit(n: string, put: (variant: string, cost: number) => void) {
  const alphabet = /\d/.test(n) ? DIGITS : LETTERS;
  for (let i = 0; i < n.length; i++) {
    const head = n.slice(0, i);
    const c = n[i]!;
    // Swapped neighbours and a doubled character dropped are the commonest slips when typing a number.
    if (i + 1 < n.length && n[i + 1] !== c) put(head + n[i + 1] + c + n.slice(i + 2), COST.swap);
    if (n.length > 1 && (i === 0 || n[i - 1] !== c)) put(head + n.slice(i + 1), n[i + 1] === c ? COST.swap : COST.drop);
    const tail = n.slice(i + 1);
    for (const x of alphabet) if (x !== c) put(head + x + tail, COST.change);
  }
  for (let i = 0; i <= n.length; i++) {
    const head = n.slice(0, i);
    const tail = n.slice(i);
    for (const x of alphabet) if (x !== n[i]) put(head + x + tail, x === n[i - 1] ? COST.drop : COST.add);
  }
}

/** Relative costs of a slip (lower is likelier); an edit across a group boundary costs the most. */
export const COST = { pad: 1, swap: 2, drop: 3, add: 3, change: 4, acrossGroups: 6, twoSlips: 8 } as const;

export interface TypoCandidate {
  key: string;
  /** Which form of the catalogue's numbers the key is compared with. */
  form: keyof NumberKeys;
  cost: number;
}

/**
 * Keys of the numbers a mistyped number may have meant, each with the cost of the slip: one edit inside one group
 * (on the fine groups when the buyer typed separators, else on the coarse ones), a short serial padded with
 * zeros, and one edit of the flat form (which may cross a group boundary). `twoSlips` adds two edits inside one
 * group, for when nothing one edit away exists.
 */
export function typoCandidates(typed: string, options: { twoSlips?: boolean } = {}): TypoCandidate[] {
  const keys = numberKeys(typed);
  const form: keyof NumberKeys = keys.fine !== keys.coarse ? 'fine' : 'coarse';
  const out = new Map<string, TypoCandidate>();
  const put = (key: string, f: keyof NumberKeys, cost: number) => {
    const id = f === form ? key : `${f}:${key}`;
    const seen = out.get(id);
    if (!seen) out.set(id, { key, form: f, cost });
    else if (seen.cost > cost) seen.cost = cost;
  };
  const inGroups = (key: string, f: keyof NumberKeys, cost: (slip: number) => number) => {
    const groups = key.split('-');
    let pre = '';
    groups.forEach((g, i) => {
      const post = i + 1 < groups.length ? `-${groups.slice(i + 1).join('-')}` : '';
      // A serial typed without its leading zeros ("FUL-21-243").
      if (g.length < 4 && /^\d+$/.test(g)) put(pre + g.padStart(4, '0') + post, f, cost(COST.pad));
      forEachOneEdit(g, (v, c) => put(pre + v + post, f, cost(c)));
      if (options.twoSlips && g.length >= 3 && /^\d+$/.test(g)) {
        forEachOneEdit(g, (v, c) => forEachOneEdit(v, (w, c2) => w !== g && put(pre + w + post, f, Math.max(COST.twoSlips, cost(c + c2)))));
      }
      pre += `${g}-`;
    });
  };
  inGroups(keys[form], form, (c) => c);
  out.delete(keys[form]);
  // Typed with separators in the wrong places ("FUL-2-10203"): a slip anywhere in a run of digits, across groups.
  if (form === 'fine' && !options.twoSlips) inGroups(keys.coarse, 'coarse', () => COST.acrossGroups);
  out.delete(`coarse:${keys.coarse}`);
  return [...out.values()];
}
