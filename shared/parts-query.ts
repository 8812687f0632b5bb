/**
 * The catalogue's search options and their limits, without the validation library: the catalogue page reads its
 * filters from the address with these (src/features/catalog/catalogue-query.ts) and the server validates the same
 * options with PartsQuerySchema (shared/schemas/parts.ts), built from them.
 */
export const PAGE_SIZE_MAX = 100;
export const PAGE_SIZE_DEFAULT = 24;
export const QUERY_MAX_LENGTH = 100;
export const PART_SORTS = ['relevance', 'price-asc', 'price-desc', 'number', 'title'] as const;
export type PartSort = (typeof PART_SORTS)[number];
/** The power filter's range, in hp. */
export const HP_FILTER_MAX = 5000;
export const PAGE_MAX = 10_000;
