import { keepPreviousData, queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { ImportPreviewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { tradeKeys } from './keys';

export interface TypedLine {
  partNumber: string;
  quantity: string;
}

/** Validates typed rows without touching the cart: ok, replaced (superseded) or error with "did you mean" suggestions. */
export const checkLines = (lines: TypedLine[], signal?: AbortSignal) => api('/cart/check', ImportPreviewSchema, { method: 'POST', body: { lines }, signal });

export const checkLinesQueryOptions = (lines: TypedLine[]) =>
  queryOptions({
    queryKey: tradeKeys.check(lines),
    queryFn: ({ signal }) => checkLines(lines, signal),
    placeholderData: keepPreviousData,
    staleTime: 15_000,
  });

/** Live check of the quick-order pad; the caller debounces `lines`. */
export const useCheckLines = (lines: TypedLine[]) => useQuery({ ...checkLinesQueryOptions(lines), enabled: lines.length > 0 });

/** One row checked again after a fix in the stock-list preview. */
export const useRecheckLine = () => useMutation({ mutationFn: (line: TypedLine) => checkLines([line]) });
