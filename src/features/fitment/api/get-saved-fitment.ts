import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

// The fitment page asks for a saved check only when its address names one; the schema (and the validation library)
// loads beside that request, not with the page.
const schema = () => import('../../../lib/action-schemas').then((m) => m.SavedFitmentSchema);

export const getSavedFitment = (id: number, signal?: AbortSignal) => api(`/fitments/${id}`, schema, { signal });

export const savedFitmentQueryOptions = (id: number) =>
  queryOptions({ queryKey: fitmentKeys.savedOne(id), queryFn: ({ signal }) => getSavedFitment(id, signal) });

export const useSavedFitment = (id: number | null) => useQuery({ ...savedFitmentQueryOptions(id ?? 0), enabled: id !== null });
