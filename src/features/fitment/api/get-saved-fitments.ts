import { queryOptions, useQuery } from '@tanstack/react-query';
import { SavedFitmentsResponseSchema } from '../../../../shared/schemas/saved-fitments';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const getSavedFitments = (signal?: AbortSignal) => api('/fitments', SavedFitmentsResponseSchema, { signal });

export const savedFitmentsQueryOptions = () => queryOptions({ queryKey: fitmentKeys.saved(), queryFn: ({ signal }) => getSavedFitments(signal) });

/** The signed-in user's saved checks, newest first. */
export const useSavedFitments = (enabled = true) => useQuery({ ...savedFitmentsQueryOptions(), enabled });
