import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Bearing } from '../../../../shared/catalog';
import type { Application } from '../../../../shared/schemas/fitment';
import { ServiceIntervalSchema, ServiceIntervalsSchema } from '../../../../shared/schemas/units';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getServiceIntervals = (signal?: AbortSignal) => api('/admin/service-intervals', ServiceIntervalsSchema, { signal });
export const serviceIntervalsQueryOptions = () => queryOptions({ queryKey: officeKeys.serviceIntervals(), queryFn: ({ signal }) => getServiceIntervals(signal) });
export const useServiceIntervals = (enabled = true) => useQuery({ ...serviceIntervalsQueryOptions(), enabled });

export const setServiceInterval = (bearing: Bearing, application: Application, months: number) =>
  api(`/admin/service-intervals/${bearing}/${application}`, ServiceIntervalSchema, { method: 'PUT', body: { months } });

/** Changes one interval; reminders follow it from the next housekeeping round. */
export function useSetServiceInterval() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { bearing: Bearing; application: Application; months: number }) => setServiceInterval(v.bearing, v.application, v.months),
    onSuccess: () => qc.invalidateQueries({ queryKey: officeKeys.serviceIntervals() }),
  });
}
