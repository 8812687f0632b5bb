import { queryOptions, useQuery } from '@tanstack/react-query';
import { AdminPartSchema } from '../../../../shared/schemas/office-views';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getAdminPart = (partNumber: string, signal?: AbortSignal) => api(`/admin/parts/${encodeURIComponent(partNumber)}`, AdminPartSchema, { signal });

export const adminPartQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: officeKeys.part(partNumber), queryFn: ({ signal }) => getAdminPart(partNumber, signal), staleTime: 0 });

export const useAdminPart = (partNumber: string | undefined) => useQuery({ ...adminPartQueryOptions(partNumber ?? ''), enabled: Boolean(partNumber) });
