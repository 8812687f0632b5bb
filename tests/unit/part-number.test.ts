import { describe, expect, it } from 'vitest';
import { normalizePartNumber } from '../../shared/part-number';

describe('normalizePartNumber', () => {
  it('ignores case, dashes, spaces and dots, as people type numbers', () => {
    expect(normalizePartNumber('VC-T42-1003')).toBe('VCT421003');
    expect(normalizePartNumber('vct421003')).toBe('VCT421003');
    expect(normalizePartNumber(' vc t42 1003 ')).toBe('VCT421003');
    expect(normalizePartNumber('IX 412-5531')).toBe('IX4125531');
    expect(normalizePartNumber('vc.t42/1003x')).toBe('VCT421003X');
  });
  it('folds full-width and accented characters to plain letters', () => {
    expect(normalizePartNumber('ＶＣ－Ｔ４２')).toBe('VCT42');
  });
});
