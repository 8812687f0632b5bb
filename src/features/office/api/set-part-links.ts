import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AnyReplySchema } from '../../../../shared/schemas/office-views';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const setPartLinks = (partNumber: string, partNumbers: string[]) =>
  api(`/admin/parts/${encodeURIComponent(partNumber)}/links`, AnyReplySchema, { method: 'PUT', body: { partNumbers } });

export function useSetPartLinks(partNumber: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (partNumbers: string[]) => setPartLinks(partNumber, partNumbers),
    onSuccess: () => client.invalidateQueries({ queryKey: officeKeys.part(partNumber) }),
  });
}
