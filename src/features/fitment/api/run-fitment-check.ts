import { useMutation } from '@tanstack/react-query';
import { FitmentResponseSchema, type FitmentRequest } from '../../../../shared/schemas/fitment';
import { api } from '../../../lib/api-client';

export const runFitmentCheck = (request: FitmentRequest) => api('/fitment', FitmentResponseSchema, { method: 'POST', body: request });

/** The check is a computation, not a stored resource, so it runs as a mutation and is not cached. */
export const useRunFitmentCheck = () => useMutation({ mutationFn: runFitmentCheck });
