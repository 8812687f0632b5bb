import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ShaftLogSchema } from '../../../../shared/schemas/shaft-logs';
import { api } from '../../../lib/api-client';
import { unitsKeys } from './keys';

export interface UnitLogForm {
  file: File;
  savedFitmentId: number;
  name?: string;
}

export function uploadUnitLog(serial: string, input: UnitLogForm) {
  const form = new FormData();
  form.append('savedFitmentId', String(input.savedFitmentId));
  if (input.name) form.append('name', input.name);
  form.append('file', input.file);
  return api(`/units/${encodeURIComponent(serial)}/logs`, ShaftLogSchema, { method: 'POST', formData: form });
}

/** A shaft-speed log uploaded from the unit's page; the unit's history shows it after. */
export function useUploadUnitLog(serial: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UnitLogForm) => uploadUnitLog(serial, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: unitsKeys.one(serial) }),
  });
}
