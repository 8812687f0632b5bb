import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShaftLogSchema } from '../../../../shared/schemas/shaft-logs';
import { api } from '../../../lib/api-client';
import { shaftLogsPath } from './get-shaft-logs';
import { fitmentKeys } from './keys';

export interface ShaftLogUploadInput {
  savedId: number;
  file: File;
  frameCode: string;
  name?: string;
}

export function uploadShaftLog({ savedId, file, frameCode, name }: ShaftLogUploadInput) {
  const formData = new FormData();
  formData.append('frameCode', frameCode);
  if (name) formData.append('name', name);
  formData.append('file', file);
  return api(shaftLogsPath(savedId), ShaftLogSchema, { method: 'POST', formData });
}

export function useUploadShaftLog() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadShaftLog,
    onSuccess: (log) => queryClient.invalidateQueries({ queryKey: fitmentKeys.shaftLogs(log.savedFitmentId) }),
  });
}
