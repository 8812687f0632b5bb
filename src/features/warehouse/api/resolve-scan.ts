import { api } from '../../../lib/api-client';
import type { ScanKind } from '../../../../shared/scan-code';

const scanReplySchema = () => import('../../../../shared/schemas/scan').then((m) => m.ScanReplySchema);

/**
 * What a scanned code is, for a field that takes the given kinds (GET /api/warehouse/scan). A refusal comes back as
 * an ApiError whose message says why: a wrong GTIN check digit, a label of another kind, or nothing with that code.
 */
export const resolveScan = (code: string, accepts: readonly ScanKind[]) =>
  api(`/warehouse/scan?${new URLSearchParams({ code, accepts: accepts.join(',') }).toString()}`, scanReplySchema);
