import { queryOptions, useQuery } from '@tanstack/react-query';
import { OfficeSummarySchema } from '../../../../shared/schemas/office-summary';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getOfficeSummary = (signal?: AbortSignal) => api('/admin/office/summary', OfficeSummarySchema, { signal });

export const officeSummaryQueryOptions = () => queryOptions({ queryKey: officeKeys.summary(), queryFn: ({ signal }) => getOfficeSummary(signal) });

export const useOfficeSummary = (enabled: boolean) => useQuery({ ...officeSummaryQueryOptions(), enabled });
