import { useMutation } from '@tanstack/react-query';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import { api } from '../../../lib/api-client';

// The answer's schema (and the validation library) loads with the request, not with the fitment page.
const schema = () => import('../../../lib/action-schemas').then((m) => m.FitmentResponseSchema);

export const runFitmentCheck = (request: FitmentRequest) => api('/fitment', schema, { method: 'POST', body: request });

/** The check is a computation, not a stored resource, so it runs as a mutation and is not cached. */
export const useRunFitmentCheck = () => useMutation({ mutationFn: runFitmentCheck });
