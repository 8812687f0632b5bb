import { useMutation, useQueryClient } from '@tanstack/react-query';
import { UnreadNoticesSchema } from '../../../../shared/schemas/notices';
import { api } from '../../../lib/api-client';
import { noticesKeys } from './keys';

export const markNoticeRead = (id: number) => api(`/notices/${id}/read`, UnreadNoticesSchema, { method: 'POST' });
export const markAllNoticesRead = () => api('/notices/read-all', UnreadNoticesSchema, { method: 'POST' });

/** Marks one notice read (`id`) or all of them (`'all'`); the header's count updates from the answer. */
export function useMarkRead() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number | 'all') => (id === 'all' ? markAllNoticesRead() : markNoticeRead(id)),
    onSuccess: (answer) => {
      qc.setQueryData(noticesKeys.unread(), answer);
      return qc.invalidateQueries({ queryKey: noticesKeys.lists() });
    },
  });
}
