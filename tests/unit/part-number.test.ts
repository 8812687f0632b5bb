import { describe, expect, it } from 'vitest';
import { formatOrderNumber, formatPartNumber, normalizePartNumber, ORDER_NUMBER_PATTERN, parsePartNumber } from '../../shared/part-number';

describe('normalizePartNumber', () => {
  it('ignores case, dashes, spaces and dots, as people type numbers', () => {
    expect(normalizePartNumber('CHS-10-0203')).toBe('CHS100203');
    expect(normalizePartNumber('chs100203')).toBe('CHS100203');
    expect(normalizePartNumber(' chs 10 0203 ')).toBe('CHS100203');
    expect(normalizePartNumber('IX 412-5531')).toBe('IX4125531');
    expect(normalizePartNumber('chs.10/0203-xch')).toBe('CHS100203XCH');
  });
  it('folds full-width and accented characters to plain letters', () => {
    expect(normalizePartNumber('ＣＨＳ－１０')).toBe('CHS10');
  });
});

describe('our part numbering', () => {
  it('writes and reads frame code, category group and line, serial and the exchange suffix', () => {
    expect(formatPartNumber({ prefix: 'GIM', group: 1, line: 0, serial: 203 })).toBe('GIM-10-0203');
    expect(formatPartNumber({ prefix: 'GIM', group: 1, line: 0, serial: 203, exchange: true })).toBe('GIM-10-0203-XCH');
    expect(parsePartNumber('INS-63-0412')).toEqual({ prefix: 'INS', group: 6, line: 3, serial: 412, exchange: false });
    expect(parsePartNumber('GIM-10-0203-XCH')).toMatchObject({ serial: 203, exchange: true });
    expect(parsePartNumber('GIM100203')).toBeNull();
  });
});

describe('order numbers', () => {
  it('are SY- and the order id past 100000, one pattern for server and client', () => {
    expect(formatOrderNumber(7)).toBe('SY-100007');
    expect(ORDER_NUMBER_PATTERN.test(formatOrderNumber(7))).toBe(true);
    for (const bad of ['SY-12', 'sy-100007', 'SY-100007x', 'XY-100007']) expect(ORDER_NUMBER_PATTERN.test(bad), bad).toBe(false);
  });
});
