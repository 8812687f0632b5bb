import { describe, expect, it } from 'vitest';
import { formatSerial, luhnCheckDigit, normalizeSerial, serialParts } from '../../shared/unit-serial';

describe('unit serials', () => {
  it('computes the Luhn check digit of the standard worked example', () => {
    // ISO/IEC 7812-1 Annex B's method; the worked number 7992739871 → check digit 3 (79927398713) is the example
    // commonly printed with it (quoted from memory).
    expect(luhnCheckDigit('7992739871')).toBe(3);
    // Another from memory: the test card number 4111 1111 1111 1111 passes the Luhn check.
    expect(luhnCheckDigit('411111111111111')).toBe(1);
  });

  it('writes and reads back a serial', () => {
    const s = formatSerial(2026, 4217);
    expect(s).toMatch(/^VC26-004217-\d$/);
    expect(normalizeSerial(s)).toBe(s);
    expect(normalizeSerial(s.toLowerCase().replace(/-/g, ' '))).toBe(s);
    expect(normalizeSerial(s.replace(/-/g, ''))).toBe(s);
    expect(serialParts(s)).toEqual({ year: 2026, sequence: 4217 });
  });

  it('refuses a mistyped digit, swapped neighbours and other text', () => {
    const s = formatSerial(2026, 4217);
    const digits = s.replace(/\D/g, '');
    for (let i = 0; i < digits.length; i += 1) {
      const wrong = digits.slice(0, i) + String((Number(digits[i]) + 1) % 10) + digits.slice(i + 1);
      expect(normalizeSerial(`VC${wrong}`)).toBeNull();
    }
    // 0 and 9 swapped is the one transposition Luhn cannot see; these neighbours are not that pair.
    expect(normalizeSerial('VC26-004127-' + s.slice(-1))).toBeNull();
    expect(normalizeSerial('RT-5001')).toBeNull();
    expect(normalizeSerial('VC26-000000-0')).toBeNull();
    expect(() => formatSerial(2026, 0)).toThrow();
  });
});
