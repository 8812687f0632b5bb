import { z } from 'zod';
import { NOTICE_KINDS } from '../allowed-values';

export const NOTICES_PAGE_SIZE = 20;

export const NoticeSchema = z.object({
  id: z.number().int(),
  kind: z.enum(NOTICE_KINDS),
  title: z.string(),
  body: z.string(),
  link: z.string(),
  read: z.boolean(),
  createdAt: z.string(),
});
export type Notice = z.infer<typeof NoticeSchema>;

export const NoticesPageSchema = z.object({
  items: z.array(NoticeSchema),
  total: z.number().int(),
  unread: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type NoticesPage = z.infer<typeof NoticesPageSchema>;

export const UnreadNoticesSchema = z.object({ unread: z.number().int() });
export type UnreadNotices = z.infer<typeof UnreadNoticesSchema>;
