import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MailState } from '../../../../shared/allowed-values';
import { MAIL_OUTBOX_PAGE_SIZE, MailOutboxListSchema } from '../../../../shared/schemas/mail-outbox';
import { api, toSearchParams } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getMailOutbox = (state: MailState | null, page: number, signal?: AbortSignal) =>
  api(`/admin/mail${toSearchParams({ state, limit: MAIL_OUTBOX_PAGE_SIZE, offset: page * MAIL_OUTBOX_PAGE_SIZE })}`, MailOutboxListSchema, { signal });

export const mailOutboxQueryOptions = (state: MailState | null, page: number) =>
  queryOptions({
    queryKey: officeKeys.mailList(state ?? 'all', page),
    queryFn: ({ signal }) => getMailOutbox(state, page, signal),
    placeholderData: keepPreviousData,
    // Waiting messages move on their own; the list follows without a reload.
    refetchInterval: 10_000,
  });

/** The outbox, newest first, with a count per state (admins only). */
export const useMailOutbox = (state: MailState | null, page: number, enabled = true) => useQuery({ ...mailOutboxQueryOptions(state, page), enabled });
