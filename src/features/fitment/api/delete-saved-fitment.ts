import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const deleteSavedFitment = (id: number) => api(`/fitments/${id}`, z.null(), { method: 'DELETE' });

export function useDeleteSavedFitment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteSavedFitment,
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: fitmentKeys.savedOne(id) });
      return queryClient.invalidateQueries({ queryKey: fitmentKeys.saved() });
    },
  });
}
