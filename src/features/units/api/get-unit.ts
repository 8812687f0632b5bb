import { queryOptions, useQuery } from '@tanstack/react-query';
import { UnitHistorySchema } from '../../../../shared/schemas/units';
import { api } from '../../../lib/api-client';
import { unitsKeys } from './keys';

export const getUnit = (serial: string, signal?: AbortSignal) => api(`/units/${encodeURIComponent(serial)}`, UnitHistorySchema, { signal });
export const unitQueryOptions = (serial: string) => queryOptions({ queryKey: unitsKeys.one(serial), queryFn: ({ signal }) => getUnit(serial, signal) });

/** One unit: what it is and its history, for its owner and for staff. */
export const useUnit = (serial: string, enabled = true) => useQuery({ ...unitQueryOptions(serial), enabled });
