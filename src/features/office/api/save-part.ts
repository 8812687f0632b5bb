import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PartForm } from '../../../../shared/schemas/admin-catalog';
import { AnyReplySchema, CreatedPartSchema } from '../../../../shared/schemas/office-views';
import { api } from '../../../lib/api-client';

export const createPart = (part: PartForm) => api('/admin/parts', CreatedPartSchema, { method: 'POST', body: part });

export const updatePart = (partNumber: string, part: PartForm) =>
  api(`/admin/parts/${encodeURIComponent(partNumber)}`, AnyReplySchema, { method: 'PUT', body: part }).then(() => ({ partNumber }));

/** Creates the part, or updates it when `existing` names it. */
export function useSavePart(existing: string | undefined) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (part: PartForm) => (existing ? updatePart(existing, part) : createPart(part)),
    // Buyer-facing caches (catalogue, part pages) belong to other features: mark everything stale rather than reach into their keys.
    onSuccess: () => client.invalidateQueries(),
  });
}
