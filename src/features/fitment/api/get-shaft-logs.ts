import { queryOptions, useQuery } from '@tanstack/react-query';
import { ShaftLogsResponseSchema } from '../../../../shared/schemas/shaft-logs';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const shaftLogsPath = (savedId: number) => `/fitments/${savedId}/shaft-logs`;

export const getShaftLogs = (savedId: number, signal?: AbortSignal) => api(shaftLogsPath(savedId), ShaftLogsResponseSchema, { signal });

export const shaftLogsQueryOptions = (savedId: number) =>
  queryOptions({ queryKey: fitmentKeys.shaftLogs(savedId), queryFn: ({ signal }) => getShaftLogs(savedId, signal) });

/** The logs uploaded to one saved check, newest first. */
export const useShaftLogs = (savedId: number | null) => useQuery({ ...shaftLogsQueryOptions(savedId ?? 0), enabled: savedId !== null });
