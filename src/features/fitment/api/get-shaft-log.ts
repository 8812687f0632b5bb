import { queryOptions, useQuery } from '@tanstack/react-query';
import { ShaftLogDetailSchema } from '../../../../shared/schemas/shaft-logs';
import { api } from '../../../lib/api-client';
import { shaftLogsPath } from './get-shaft-logs';
import { fitmentKeys } from './keys';

export const getShaftLog = (savedId: number, logId: number, signal?: AbortSignal) =>
  api(`${shaftLogsPath(savedId)}/${logId}`, ShaftLogDetailSchema, { signal });

export const shaftLogQueryOptions = (savedId: number, logId: number) =>
  queryOptions({ queryKey: fitmentKeys.shaftLog(savedId, logId), queryFn: ({ signal }) => getShaftLog(savedId, logId, signal) });

/** One log's points on its frame's map, worked out by the server from the saved check as it is run today. */
export const useShaftLog = (savedId: number, logId: number | null) => useQuery({ ...shaftLogQueryOptions(savedId, logId ?? 0), enabled: logId !== null });
