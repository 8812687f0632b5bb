import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { shaftLogsPath } from './get-shaft-logs';
import { fitmentKeys } from './keys';

export const deleteShaftLog = ({ savedId, logId }: { savedId: number; logId: number }) =>
  api(`${shaftLogsPath(savedId)}/${logId}`, z.null(), { method: 'DELETE' });

export function useDeleteShaftLog() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteShaftLog,
    onSuccess: (_data, { savedId, logId }) => {
      queryClient.removeQueries({ queryKey: fitmentKeys.shaftLog(savedId, logId) });
      return queryClient.invalidateQueries({ queryKey: fitmentKeys.shaftLogs(savedId) });
    },
  });
}
