import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PickResultSchema, type Pick, type PickList } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { warehouseKeys } from './keys';

export const recordPick = ({ orderNumber, pick }: { orderNumber: string; pick: Pick }) =>
  api(`/warehouse/orders/${encodeURIComponent(orderNumber)}/picks`, PickResultSchema, { method: 'POST', body: pick });

/** A scan (or a short pick) against one line; a part that is not the line's is refused with 409 and nothing recorded. */
export function useRecordPick() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: recordPick,
    onSuccess: (result, { orderNumber }) => {
      // The next scan follows within a second: put the answered line in place now rather than wait for the refetch.
      qc.setQueriesData<PickList>({ queryKey: warehouseKeys.pickLists() }, (old) =>
        old ? { ...old, lines: old.lines.map((l) => (l.lineId === result.line.lineId ? result.line : l)) } : old,
      );
      // Not awaited, so the picker sees the answer before the refetch finishes.
      void Promise.all([
        qc.invalidateQueries({ queryKey: warehouseKeys.pickLists() }),
        qc.invalidateQueries({ queryKey: warehouseKeys.queue() }),
        qc.invalidateQueries({ queryKey: orderKeys.detail(orderNumber) }),
      ]);
    },
  });
}
