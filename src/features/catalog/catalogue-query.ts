import { PartsQuerySchema, type PartsQuery } from '../../../shared/schemas/parts';

export const CATALOGUE_FILTER_KEYS = ['q', 'category', 'frame', 'bearing', 'minHp', 'maxHp', 'inStock', 'sort', 'page'] as const;

/** The catalogue's filters from its address, dropping any value that is not valid rather than failing the page. */
export function catalogueQueryFrom(params: URLSearchParams): PartsQuery {
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
