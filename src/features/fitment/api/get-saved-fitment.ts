import { queryOptions, useQuery } from '@tanstack/react-query';
import { SavedFitmentSchema } from '../../../../shared/schemas/saved-fitments';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const getSavedFitment = (id: number, signal?: AbortSignal) => api(`/fitments/${id}`, SavedFitmentSchema, { signal });

export const savedFitmentQueryOptions = (id: number) =>
  queryOptions({ queryKey: fitmentKeys.savedOne(id), queryFn: ({ signal }) => getSavedFitment(id, signal) });

export const useSavedFitment = (id: number | null) => useQuery({ ...savedFitmentQueryOptions(id ?? 0), enabled: id !== null });
