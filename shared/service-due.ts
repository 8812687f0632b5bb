/**
 * When a unit is next due for service: the last service (or the sale, before any) plus the interval for its bearing
 * and use, in calendar months. Dates are UTC calendar days written YYYY-MM-DD; a due day past the end of a shorter month
 * falls on that month's last day (31 January + 1 month = 28 or 29 February), as calendars and contracts usually count.
 */
export function addMonths(isoDay: string, months: number): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(isoDay);
  if (!m) throw new Error(`not a calendar day: ${isoDay}`);
  const [year, month, day] = [Number(m[1]), Number(m[2]) - 1, Number(m[3])];
  const target = new Date(Date.UTC(year, month + months, 1));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(day, lastDay));
  return target.toISOString().slice(0, 10);
}

/** The calendar day (UTC) of a timestamp. */
export const dayOf = (iso: string | Date): string => (typeof iso === 'string' ? iso.slice(0, 10) : iso.toISOString().slice(0, 10));

/** Due on or before `today` (both YYYY-MM-DD: they compare as text). */
export const isDue = (dueOn: string, today: string): boolean => dueOn <= today;

/** Whole days from `today` to `dueOn`; negative when overdue. */
export function daysUntil(dueOn: string, today: string): number {
  return Math.round((Date.parse(`${dueOn}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
}
