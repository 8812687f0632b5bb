import { queryOptions, useQuery } from '@tanstack/react-query';
import { MyUnitsPageSchema } from '../../../../shared/schemas/units';
import { api } from '../../../lib/api-client';
import { unitsKeys } from './keys';

export const getMyUnits = (page: number, signal?: AbortSignal) => api(`/units/mine?page=${page}`, MyUnitsPageSchema, { signal });
export const myUnitsQueryOptions = (page = 1) => queryOptions({ queryKey: unitsKeys.mine(page), queryFn: ({ signal }) => getMyUnits(page, signal) });

/** The buyer's units and their trade account's, newest first, a page at a time. */
export const useMyUnits = (page = 1, enabled = true) => useQuery({ ...myUnitsQueryOptions(page), enabled, placeholderData: (previous) => previous });
