import { describe, expect, it } from 'vitest';
import { formatMoneyInput, parseMoneyToCents } from '../../shared/format';
import { moneyFieldCents, moneyFieldText } from '../../src/features/office/lib/money';
import { gramsToKilogramsText, kilogramsFieldGrams } from '../../src/features/office/lib/weight';

describe('the part form’s price box', () => {
  it('reads what the one money parser reads, to whole cents', () => {
    for (const typed of ['123.45', '$1,234.5', '7500', ' 0.99 ']) expect(moneyFieldCents(typed), typed).toBe(parseMoneyToCents(typed));
    expect(moneyFieldCents('1,234.50')).toBe(123_450);
    // 0.1 + 0.2 style rounding would miss by a hair; read from the digits it is exact.
    expect(moneyFieldCents('10.01')).toBe(1001);
  });

  it('keeps a fraction of a cent as a fraction, so the schema can say "whole cents"', () => {
    expect(moneyFieldCents('12.345')).toBe(1234.5);
    expect(Number.isInteger(moneyFieldCents('12.3456'))).toBe(false);
  });

  it('gives NaN for text that is no amount, so the form asks for dollars', () => {
    for (const typed of ['', 'abc', '-5', '1.2.3', '12,34']) expect(moneyFieldCents(typed), typed).toBeNaN();
  });

  it('writes a stored price back with separators, and the box reads it again unchanged', () => {
    expect(moneyFieldText(123_450)).toBe('1,234.50');
    expect(formatMoneyInput(5)).toBe('0.05');
    expect(moneyFieldText(Number.NaN)).toBe('');
    for (const cents of [1, 99, 100, 123_456_78, 100_000_000]) expect(moneyFieldCents(moneyFieldText(cents))).toBe(cents);
  });
});

describe('the part form’s weight box (kilograms typed, grams stored; 1 kg = 1000 g by definition of the SI prefix)', () => {
  it('reads kilograms to whole grams from the digits', () => {
    expect(kilogramsFieldGrams('9.2')).toBe(9200);
    expect(kilogramsFieldGrams('0.06')).toBe(60);
    expect(kilogramsFieldGrams('.5')).toBe(500);
    expect(kilogramsFieldGrams('12')).toBe(12_000);
    expect(kilogramsFieldGrams('0.001')).toBe(1);
  });

  it('keeps a fraction of a gram so the schema can say "whole grams"; trailing zeros are no fraction', () => {
    expect(kilogramsFieldGrams('1.0005')).toBe(1000.5);
    expect(kilogramsFieldGrams('1.2500')).toBe(1250);
  });

  it('gives NaN for text that is no number', () => {
    for (const typed of ['', '.', 'kg', '1,5', '-1', '1.2.3']) expect(kilogramsFieldGrams(typed), typed).toBeNaN();
  });

  it('writes grams back as kilograms without trailing zeros, and reads them again unchanged', () => {
    expect(gramsToKilogramsText(9200)).toBe('9.2');
    expect(gramsToKilogramsText(60)).toBe('0.06');
    expect(gramsToKilogramsText(12_000)).toBe('12');
    expect(gramsToKilogramsText(Number.NaN)).toBe('');
    for (const grams of [1, 60, 999, 1000, 9200, 200_000]) expect(kilogramsFieldGrams(gramsToKilogramsText(grams))).toBe(grams);
  });
});
