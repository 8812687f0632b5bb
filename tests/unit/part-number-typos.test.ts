import { beforeAll, describe, expect, it } from 'vitest';
import { generateCatalogue } from '../../catalog-seed/generate';
import { buildSnapshot, SearchIndex } from '../../server/services/search-index';
import { findIn } from '../../server/services/search';
import { numberKeys, typoCandidates } from '../../shared/part-number-search';

/** The generated catalogue's numbers in an index (numbers and titles only: words are not what this tries). */
function numbersIndex(parts: number): SearchIndex {
  const seed = generateCatalogue({ parts });
  const rows = seed.parts.map((p, i) => ({
    id: i + 1,
    partNumber: p.partNumber,
    normalizedNumber: numberKeys(p.partNumber).flat,
    title: '',
    status: p.status,
    supersededBy: p.supersededBy,
    frameCode: p.frameCode,
    category: p.category,
    bearing: p.specs.bearing ?? null,
    condition: p.condition,
    priceCents: p.priceCents,
    body: '',
  }));
  const aliases = seed.parts.flatMap((p, i) => p.aliases.map((a) => ({ id: i + 1, alias: a.alias, kind: a.kind })));
  return new SearchIndex(buildSnapshot({ rows, aliases }, 0));
}

const first = (ix: SearchIndex, typed: string) => {
  const r = findIn(ix, typed);
  const ord = r.ords[0];
  return ord === undefined ? undefined : ix.docs[ord]!.partNumber;
};

// Slips as buyers make them, each on a number of the generated catalogue, none of them a real number.
// In a catalogue of 200,000 parts most series run from serial 0201 to past 0400, so nearly every one-character
// change of a number is another real part: only the slip model (inside one group, swaps first) finds the one meant.
const TYPOS: Array<[typed: string, meant: string]> = [
  ['BUR-25-0498', 'BUR-52-0498'], // the group's digits swapped
  ['INS-66-0157', 'INS-66-0517'], // the serial's digits swapped
  ['FUL-29-0638', 'FUL-29-0368'],
  ['KRF-51-05233', 'KRF-51-0523'], // a digit doubled
  ['BUR-11-0059-XCH', 'BUR-11-0509-XCH'], // an exchange unit's number
  ['GIM-71-0621-XCH', 'GIM-17-0621-XCH'],
  ['KFR-15-0813', 'KRF-15-0813'], // the frame code's letters swapped
  ['ful290638', 'FUL-29-0368'], // without dashes
  ['DRF-17-308', 'DRF-17-0308'], // the serial's leading zero left out
  ['IX 354-3101', 'AWL-10-0202'], // a cross-reference number (IX 354-3110) with two digits swapped
];

describe('mistyped part numbers', () => {
  let large: SearchIndex;
  beforeAll(() => {
    large = numbersIndex(200_000);
  }, 60_000);

  it.each(TYPOS)('finds %s as %s first among 200,000 parts', (typed, meant) => {
    expect(large.numbersAt('flat', numberKeys(typed).flat), 'the typo is not itself a number').toEqual([]);
    expect(first(large, typed)).toBe(meant);
  });

  it('ranks a new unit before its exchange unit when neither was typed exactly', () => {
    // FUL-10-0203 and FUL-10-0203-XCH both exist; a slip in the serial finds the new unit first.
    expect(first(large, 'FUL-10-0230')).toBe('FUL-10-0203');
    expect(first(large, 'FUL-10-0203-XHC')).toBe('FUL-10-0203-XCH');
  });

  it('keeps a slip inside its group: the cost of a change across groups is higher', () => {
    const costs = new Map(typoCandidates('FUL-21-5021').map((c) => [`${c.form}:${c.key}`, c.cost]));
    expect(costs.get('fine:FUL-21-0521')).toBeLessThan(costs.get('coarse:FUL-215201') ?? Infinity);
  });
});
