import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { AuditPageSchema } from '../../../../shared/schemas/admin-catalog';
import { api, toSearchParams } from '../../../lib/api-client';
import { officeKeys } from './keys';

export interface AuditFilters {
  part?: string;
  user?: string;
  from?: string;
  to?: string;
  import?: number;
  page: number;
}

export const getAuditLog = (filters: AuditFilters, signal?: AbortSignal) => api(`/admin/audit${toSearchParams({ ...filters })}`, AuditPageSchema, { signal });

export const auditLogQueryOptions = (filters: AuditFilters) =>
  queryOptions({ queryKey: officeKeys.audit({ ...filters }), queryFn: ({ signal }) => getAuditLog(filters, signal), placeholderData: keepPreviousData });

export const useAuditLog = (filters: AuditFilters) => useQuery(auditLogQueryOptions(filters));
