import { describe, expect, it } from 'vitest';
import { generateCatalogue } from '../../catalog-seed/generate';
import {
  buildGtin13,
  gs1CheckDigit,
  GTIN_COMPANY_PREFIX,
  GTIN_MAX_ITEM_REFERENCE,
  gtinForPart,
  gtinProblem,
  isValidGtin13,
  itemReferenceOf,
  normalizeGtinInput,
} from '../../shared/gtin';
import { normalizeBinCode, readPartCode, scanProblem } from '../../shared/scan-code';
import { shortName } from '../../shared/schemas/labels';

describe('GS1 check digit', () => {
  it('matches the worked GTIN-13 example: 629104150021 → 3', () => {
    // The worked example of the standard check digit calculation in the GS1 General Specifications, §7.9.1 (cited
    // from memory), and the same number worked step by step on GS1 Hong Kong's check digit calculator page: weighted
    // sum 57, check digit 3.
    expect(gs1CheckDigit('629104150021')).toBe(3);
    expect(isValidGtin13('6291041500213')).toBe(true);
  });

  it('matches the worked SSCC example of the same section: 37610425002123456 → 9 (from memory)', () => {
    // The 17 digits before an SSCC's check digit, GS1 General Specifications §7.9.1 (from memory): the weights still
    // start with 3 on the rightmost digit whatever the length.
    expect(gs1CheckDigit('37610425002123456')).toBe(9);
  });

  it('weights 3 and 1 from the right and takes the sum up to the next multiple of ten', () => {
    // By hand: 0·1 + 0·3 + … + 0·1 + 1·3 = 3 → 10 − 3 = 7; a sum already a multiple of ten gives 0.
    expect(gs1CheckDigit('000000000001')).toBe(7);
    expect(gs1CheckDigit('000000000000')).toBe(0);
    expect(gs1CheckDigit('000000000010')).toBe(9);
  });

  it('catches every single-digit error and every swap of neighbouring digits that differ by other than 5', () => {
    const good = gtinForPart(123_456);
    for (let i = 0; i < 13; i++) {
      for (let d = 0; d <= 9; d++) {
        if (String(d) === good[i]) continue;
        expect(isValidGtin13(`${good.slice(0, i)}${d}${good.slice(i + 1)}`)).toBe(false);
      }
    }
    for (let i = 0; i < 12; i++) {
      const a = Number(good[i]);
      const b = Number(good[i + 1]);
      if (a === b || Math.abs(a - b) === 5) continue;
      expect(isValidGtin13(`${good.slice(0, i)}${good[i + 1]}${good[i]}${good.slice(i + 2)}`)).toBe(false);
    }
  });

  it('refuses anything but 13 digits', () => {
    expect(isValidGtin13('629104150021')).toBe(false);
    expect(isValidGtin13('62910415002130')).toBe(false);
    expect(isValidGtin13('629104150021a')).toBe(false);
    expect(() => gs1CheckDigit('12a')).toThrow();
  });
});

describe('our GTINs', () => {
  it('sit in the restricted-circulation range 200–299 of the GS1 General Specifications', () => {
    const prefix = Number(GTIN_COMPANY_PREFIX.slice(0, 3));
    expect(prefix).toBeGreaterThanOrEqual(200);
    expect(prefix).toBeLessThanOrEqual(299);
  });

  it('leave room for at least 500,000 parts', () => {
    expect(GTIN_MAX_ITEM_REFERENCE).toBeGreaterThanOrEqual(500_000);
    expect(isValidGtin13(gtinForPart(GTIN_MAX_ITEM_REFERENCE))).toBe(true);
    expect(() => gtinForPart(GTIN_MAX_ITEM_REFERENCE + 1)).toThrow();
    expect(() => gtinForPart(0)).toThrow();
  });

  it('are built from prefix, item reference and check digit, and read back to the part id', () => {
    expect(gtinForPart(1)).toBe(`${GTIN_COMPANY_PREFIX}0000001${gs1CheckDigit(`${GTIN_COMPANY_PREFIX}0000001`)}`);
    expect(buildGtin13('629104150', 21)).toBe('6291041500213');
    expect(itemReferenceOf(gtinForPart(4242))).toBe(4242);
    expect(itemReferenceOf('6291041500213')).toBeNull();
    expect(() => buildGtin13('629104150', 1000)).toThrow();
  });
});

describe('what a scanner types', () => {
  it('reads digits with spaces, dashes or a leading 0 (the 14-digit field) as the GTIN', () => {
    expect(normalizeGtinInput(' 6291041500213\n')).toBe('6291041500213');
    expect(normalizeGtinInput('6 291041 500213')).toBe('6291041500213');
    expect(normalizeGtinInput('06291041500213')).toBe('6291041500213');
    expect(normalizeGtinInput('FUL-20-0203')).toBeNull();
    expect(normalizeGtinInput('629104150021')).toBeNull();
  });

  it('says plainly what is wrong with a bad check digit', () => {
    expect(gtinProblem('6291041500213')).toBeNull();
    expect(gtinProblem('6291041500214')).toMatch(/not a valid GTIN: its check digit is 4, it should be 3/);
    expect(scanProblem('6291041500214')).toMatch(/check digit/);
    expect(scanProblem('   ')).toBe('Nothing was scanned');
    expect(scanProblem('FUL-20-0203')).toBeNull();
  });

  it('reads part numbers, GTINs and bin codes in the forms people type them', () => {
    expect(readPartCode('ful200203')).toEqual({ by: 'number', normalized: 'FUL200203' });
    expect(readPartCode('6291041500213')).toEqual({ by: 'gtin', gtin: '6291041500213' });
    expect(readPartCode('6291041500214')).toBeNull();
    expect(normalizeBinCode('a012')).toBe('A-01-2');
    expect(normalizeBinCode('a-01-2')).toBe('A-01-2');
    expect(normalizeBinCode('B 7 3')).toBe('B-07-3');
    expect(normalizeBinCode('FUL-20-0203')).toBeNull();
  });
});

describe('GTINs of generated catalogues', () => {
  for (const parts of [undefined, 200_000]) {
    it(`are valid, unique and numbered by the part's place (${parts === undefined ? 'demo catalogue' : `${parts.toLocaleString('en-US')} parts`})`, () => {
      const catalogue = generateCatalogue(parts === undefined ? {} : { parts });
      if (parts) expect(catalogue.parts.length).toBe(parts);
      const seen = new Set<string>();
      catalogue.parts.forEach((p, i) => {
        if (!isValidGtin13(p.gtin)) expect.fail(`${p.partNumber} has an invalid GTIN ${p.gtin}`);
        if (itemReferenceOf(p.gtin) !== i + 1) expect.fail(`${p.partNumber}'s GTIN ${p.gtin} is not numbered by its place ${i + 1}`);
        seen.add(p.gtin);
      });
      expect(seen.size).toBe(catalogue.parts.length);
    }, 60_000);
  }
});

describe('label names', () => {
  it('cut long titles at a word with an ellipsis', () => {
    expect(shortName('Short title')).toBe('Short title');
    const cut = shortName('Vanecraft Fuller (FUL) turbocharger, ball bearing, 0.63 A/R turbine (exchange unit)');
    expect(cut.length).toBeLessThanOrEqual(44);
    expect(cut.endsWith('…')).toBe(true);
    expect(cut).not.toMatch(/[\s,]…$/);
  });
});
