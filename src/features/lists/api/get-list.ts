import { queryOptions, useQuery } from '@tanstack/react-query';
import { ListDetailSchema } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

export const getList = (id: number, signal?: AbortSignal) => api(`/lists/${id}`, ListDetailSchema, { signal });

// Colleagues edit the same list: read it fresh on each visit.
export const listQueryOptions = (id: number) => queryOptions({ queryKey: listKeys.detail(id), queryFn: ({ signal }) => getList(id, signal), staleTime: 0 });

export const useList = (id: number) => useQuery(listQueryOptions(id));
