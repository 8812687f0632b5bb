import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SavedFitmentSchema, type SaveFitment } from '../../../../shared/schemas/saved-fitments';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const saveFitment = (body: SaveFitment) => api('/fitments', SavedFitmentSchema, { method: 'POST', body });

export function useSaveFitment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveFitment,
    onSuccess: (saved) => {
      queryClient.setQueryData(fitmentKeys.savedOne(saved.id), saved);
      return queryClient.invalidateQueries({ queryKey: fitmentKeys.saved() });
    },
  });
}
