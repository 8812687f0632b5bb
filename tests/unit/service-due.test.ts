import { describe, expect, it } from 'vitest';
import { addMonths, daysUntil, isDue } from '../../shared/service-due';

describe('service due dates', () => {
  it('adds calendar months, a day past a shorter month’s end falling on its last day (worked by hand)', () => {
    expect(addMonths('2026-03-15', 3)).toBe('2026-06-15');
    expect(addMonths('2026-11-30', 3)).toBe('2027-02-28');
    // 2028 is a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400).
    expect(addMonths('2027-11-30', 3)).toBe('2028-02-29');
    expect(addMonths('2026-01-31', 12)).toBe('2027-01-31');
    expect(addMonths('2026-12-03T10:17:00.000Z', 24)).toBe('2028-12-03');
  });

  it('is due on the day and after, not before', () => {
    expect(isDue('2027-03-03', '2027-03-02')).toBe(false);
    expect(isDue('2027-03-03', '2027-03-03')).toBe(true);
    expect(isDue('2027-03-03', '2027-04-01')).toBe(true);
    expect(daysUntil('2027-03-03', '2027-02-28')).toBe(3);
    expect(daysUntil('2027-03-03', '2027-03-05')).toBe(-2);
  });
});
