import { queryOptions, useQuery } from '@tanstack/react-query';
import { AccountStatementSchema } from '../../../../shared/schemas/statement';
import { api, toSearchParams } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';

/** Under the orders' keys, so a new order, payment or credit note refreshes the statement too. */
export const statementKey = (from: string | null) => [...orderKeys.all, 'statement', from ?? 'default'] as const;

export const statementCsvHref = (from: string | null) => `/api/account/statement.csv${toSearchParams({ from })}`;

export const getStatement = (from: string | null, signal?: AbortSignal) => api(`/account/statement${toSearchParams({ from })}`, AccountStatementSchema, { signal });

export const statementQueryOptions = (from: string | null) => queryOptions({ queryKey: statementKey(from), queryFn: ({ signal }) => getStatement(from, signal) });

export const useStatement = (from: string | null) => useQuery(statementQueryOptions(from));
