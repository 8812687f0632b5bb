import { BEARINGS, CATEGORY_SLUGS } from '../../../shared/catalog';
import { FRAME_CODE_PATTERN } from '../../../shared/part-number';
import { HP_FILTER_MAX, PAGE_MAX, PART_SORTS, QUERY_MAX_LENGTH } from '../../../shared/parts-query';
import type { PartsQuery } from '../../../shared/schemas/parts';

export const CATALOGUE_FILTER_KEYS = ['q', 'category', 'frame', 'bearing', 'minHp', 'maxHp', 'inStock', 'sort', 'page'] as const;

const oneOf = <T extends string>(values: readonly T[], value: string | undefined): T | undefined =>
  value !== undefined && (values as readonly string[]).includes(value) ? (value as T) : undefined;

/** A whole number in range, read as the server's schema coerces it (`Number(text)`). */
function wholeNumber(value: string | undefined, min: number, max: number): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  return Number.isInteger(n) && n >= min && n <= max ? n : undefined;
}

/**
 * The catalogue's filters from its address, dropping any value that is not valid rather than failing the page. It
 * reads them as the server's PartsQuerySchema does, without the validation library the first page would otherwise
 * download; tests/unit/catalogue-query.test.ts holds the two to agreeing on every address.
 */
export function catalogueQueryFrom(params: URLSearchParams): PartsQuery {
  const raw = (key: (typeof CATALOGUE_FILTER_KEYS)[number]) => {
    const v = params.get(key);
    return v === null || v === '' ? undefined : v;
  };
  const query: PartsQuery = {};
  const q = raw('q')?.trim();
  if (q !== undefined && q.length <= QUERY_MAX_LENGTH) query.q = q;
  const category = oneOf(CATEGORY_SLUGS, raw('category'));
  if (category) query.category = category;
  const frame = raw('frame')?.trim();
  if (frame !== undefined && FRAME_CODE_PATTERN.test(frame)) query.frame = frame;
  const bearing = oneOf(BEARINGS, raw('bearing'));
  if (bearing) query.bearing = bearing;
  const minHp = wholeNumber(raw('minHp'), 0, HP_FILTER_MAX);
  const maxHp = wholeNumber(raw('maxHp'), 0, HP_FILTER_MAX);
  // A minimum above the maximum is the minimum's fault, as the schema says.
  if (minHp !== undefined && !(maxHp !== undefined && minHp > maxHp)) query.minHp = minHp;
  if (maxHp !== undefined) query.maxHp = maxHp;
  const inStock = oneOf(['true', 'false'], raw('inStock'));
  if (inStock) query.inStock = inStock === 'true';
  const sort = oneOf(PART_SORTS, raw('sort'));
  if (sort) query.sort = sort;
  const page = wholeNumber(raw('page'), 1, PAGE_MAX);
  if (page !== undefined) query.page = page;
  return query;
}
