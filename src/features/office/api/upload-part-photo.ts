import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PartPhotosSchema } from '../../../../shared/schemas/office-views';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export function uploadPartPhoto(partNumber: string, file: File) {
  const formData = new FormData();
  formData.append('photo', file);
  return api(`/admin/parts/${encodeURIComponent(partNumber)}/photos`, PartPhotosSchema, { method: 'POST', formData });
}

export function useUploadPartPhoto(partNumber: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadPartPhoto(partNumber, file),
    onSuccess: () => client.invalidateQueries({ queryKey: officeKeys.part(partNumber) }),
  });
}
