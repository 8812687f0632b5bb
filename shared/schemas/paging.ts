import { z } from 'zod';

/** The most rows one page of an office or floor list holds. */
export const LIST_PAGE_SIZE_MAX = 100;

/** `?page=&pageSize=` of a paged list: page from 1, a size up to LIST_PAGE_SIZE_MAX, each with its default. */
export const pageQuerySchema = (defaultSize: number) =>
  z.object({
    page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page must be at least 1').max(100_000).default(1),
    pageSize: z.coerce
      .number({ error: 'page size must be a number' })
      .int('page size must be a whole number')
      .min(1, 'page size must be at least 1')
      .max(LIST_PAGE_SIZE_MAX, `page size must be at most ${LIST_PAGE_SIZE_MAX}`)
      .default(defaultSize),
  });
export type PageQuery = z.infer<ReturnType<typeof pageQuerySchema>>;

/** What every paged answer carries beside its items. */
export const pageFields = { total: z.number().int(), page: z.number().int(), pageSize: z.number().int() };
