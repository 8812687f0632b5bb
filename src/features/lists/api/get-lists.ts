import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

// The schema (and the validation library) loads with the request: the part page asks only when its list form opens.
const schema = () => import('../../../lib/action-schemas').then((m) => m.ListsSchema);

export const getLists = (signal?: AbortSignal) => api('/lists', schema, { signal });

export const listsQueryOptions = () => queryOptions({ queryKey: listKeys.index(), queryFn: ({ signal }) => getLists(signal) });

/** The trade account's lists, newest change first; nothing is fetched for anyone but an approved dealer. */
export const useLists = (enabled: boolean) => useQuery({ ...listsQueryOptions(), enabled });
