import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AnyReplySchema } from '../../../../shared/schemas/office-views';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const supersedePart = (partNumber: string, replacedBy: string) =>
  api(`/admin/parts/${encodeURIComponent(partNumber)}/supersede`, AnyReplySchema, { method: 'POST', body: { replacedBy } });

export function useSupersedePart(partNumber: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (replacedBy: string) => supersedePart(partNumber, replacedBy),
    onSuccess: () => client.invalidateQueries({ queryKey: officeKeys.part(partNumber) }),
  });
}
