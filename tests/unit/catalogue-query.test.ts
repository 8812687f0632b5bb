import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BEARINGS, CATEGORY_SLUGS } from '../../shared/catalog';
import { PART_SORTS, PartsQuerySchema, type PartsQuery } from '../../shared/schemas/parts';
import { CATALOGUE_FILTER_KEYS, catalogueQueryFrom } from '../../src/features/catalog/catalogue-query';

/** What the catalogue page did with the shared schema: parse, and drop the first key it refuses until it passes. */
function withSchema(params: URLSearchParams): PartsQuery {
  const raw: Record<string, string> = {};
  for (const key of CATALOGUE_FILTER_KEYS) {
    const v = params.get(key);
    if (v !== null && v !== '') raw[key] = v;
  }
  for (;;) {
    const parsed = PartsQuerySchema.safeParse(raw);
    if (parsed.success) return parsed.data;
    const bad = parsed.error.issues[0]?.path[0];
    if (typeof bad !== 'string' || !(bad in raw)) return {};
    delete raw[bad];
  }
}

const padded = (s: fc.Arbitrary<string>) => fc.tuple(fc.constantFrom('', ' ', '  ', '\t'), s, fc.constantFrom('', ' ', '\n')).map(([a, b, c]) => a + b + c);
const numberText = fc.oneof(
  fc.integer({ min: -10, max: 10_100 }).map(String),
  fc.constantFrom('0', '-0', '1e3', '0x10', '1.5', '12.0', '5000', '5001', '10000', '10001', 'NaN', 'Infinity', '', ' ', 'abc', '+7'),
  padded(fc.integer({ min: 0, max: 6000 }).map(String)),
  fc.string({ maxLength: 6 }),
);
const valueFor: Record<(typeof CATALOGUE_FILTER_KEYS)[number], fc.Arbitrary<string>> = {
  q: fc.oneof(fc.string({ maxLength: 20 }), padded(fc.string({ minLength: 95, maxLength: 105 })), fc.constantFrom('   ', 'CHS-20', ' ball ')),
  category: fc.oneof(fc.constantFrom(...CATEGORY_SLUGS), fc.constantFrom('', 'Cartridges', 'nope'), fc.string({ maxLength: 8 })),
  frame: fc.oneof(padded(fc.constantFrom('CHS', 'FUL', 'chs', 'AB', 'ABCD', 'A1C')), fc.stringMatching(/^[A-Za-z]{2,4}$/), fc.string({ maxLength: 5 })),
  bearing: fc.oneof(fc.constantFrom(...BEARINGS), fc.constantFrom('Ball', ' ball', ''), fc.string({ maxLength: 6 })),
  minHp: numberText,
  maxHp: numberText,
  inStock: fc.oneof(fc.constantFrom('true', 'false', 'TRUE', '1', ' true', ''), fc.string({ maxLength: 5 })),
  sort: fc.oneof(fc.constantFrom(...PART_SORTS), fc.constantFrom('price', 'Title', ''), fc.string({ maxLength: 6 })),
  page: numberText,
};
const addresses = fc.record(valueFor, { requiredKeys: [] }).map((values) => new URLSearchParams(values as Record<string, string>));

describe('reading the catalogue’s filters from its address without the validation library', () => {
  it('agrees with the shared schema on every address, valid values or not (fast-check)', () => {
    fc.assert(
      fc.property(addresses, (params) => {
        expect(catalogueQueryFrom(params)).toEqual(withSchema(params));
      }),
      { numRuns: 3000 },
    );
  });

  it('keeps every valid query whole (fast-check)', () => {
    const valid = fc.record(
      {
        q: fc.string({ maxLength: 100 }).map((s) => s.trim()).filter((s) => s !== ''),
        category: fc.constantFrom(...CATEGORY_SLUGS),
        frame: fc.stringMatching(/^[A-Z]{3}$/),
        bearing: fc.constantFrom(...BEARINGS),
        minHp: fc.integer({ min: 0, max: 2500 }),
        maxHp: fc.integer({ min: 2500, max: 5000 }),
        inStock: fc.boolean(),
        sort: fc.constantFrom(...PART_SORTS),
        page: fc.integer({ min: 1, max: 10_000 }),
      },
      { requiredKeys: [] },
    );
    fc.assert(
      fc.property(valid, (query) => {
        const params = new URLSearchParams(Object.entries(query).map(([k, v]) => [k, String(v)]));
        const read = catalogueQueryFrom(params);
        expect(read).toEqual(query);
        expect(read).toEqual(PartsQuerySchema.parse(Object.fromEntries(params)));
      }),
      { numRuns: 2000 },
    );
  });

  it('drops a minimum power above the maximum, and only the minimum', () => {
    expect(catalogueQueryFrom(new URLSearchParams('minHp=400&maxHp=300&sort=title'))).toEqual({ maxHp: 300, sort: 'title' });
  });
});
