import { queryOptions, useQuery } from '@tanstack/react-query';
import { PartsListResponseSchema } from '../../../../shared/schemas/parts';
import { api, toSearchParams } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const getFrameParts = (frameCode: string, signal?: AbortSignal) =>
  api(`/parts${toSearchParams({ frame: frameCode, pageSize: 100, sort: 'number' })}`, PartsListResponseSchema, { signal });

export const framePartsQueryOptions = (frameCode: string) =>
  queryOptions({ queryKey: fitmentKeys.frameParts(frameCode), queryFn: ({ signal }) => getFrameParts(frameCode, signal) });

/** The parts built on one frame, to buy straight from the results. */
export const useFrameParts = (frameCode: string | null) => useQuery({ ...framePartsQueryOptions(frameCode ?? ''), enabled: frameCode !== null });
