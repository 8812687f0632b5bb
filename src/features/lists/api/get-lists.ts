import { queryOptions, useQuery } from '@tanstack/react-query';
import { ListsSchema } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

export const getLists = (signal?: AbortSignal) => api('/lists', ListsSchema, { signal });

export const listsQueryOptions = () => queryOptions({ queryKey: listKeys.index(), queryFn: ({ signal }) => getLists(signal) });

/** The trade account's lists, newest change first; nothing is fetched for anyone but an approved dealer. */
export const useLists = (enabled: boolean) => useQuery({ ...listsQueryOptions(), enabled });
