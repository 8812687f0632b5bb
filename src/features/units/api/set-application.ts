import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Application } from '../../../../shared/schemas/fitment';
import { UnitSummarySchema } from '../../../../shared/schemas/units';
import { api } from '../../../lib/api-client';
import { unitsKeys } from './keys';

export const setUnitApplication = (serial: string, application: Application) => api(`/units/${encodeURIComponent(serial)}`, UnitSummarySchema, { method: 'PATCH', body: { application } });

/** The owner sets how the unit is used; its service interval follows. */
export function useSetApplication(serial: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (application: Application) => setUnitApplication(serial, application),
    onSuccess: () => qc.invalidateQueries({ queryKey: unitsKeys.all }),
  });
}
