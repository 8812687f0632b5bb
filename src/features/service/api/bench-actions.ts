import { useMutation, useQueryClient } from '@tanstack/react-query';
import { BenchScanReplySchema, ServiceRequestViewSchema, type Inspection, type Quote, type Rebuild, type ServiceShip } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

const path = (reference: string, step: string) => `/bench/requests/${encodeURIComponent(reference)}/${step}`;

export const scanAtBench = (code: string) => api('/bench/scan', BenchScanReplySchema, { method: 'POST', body: { code } });
export const receiveAtBench = (reference: string) => api(path(reference, 'receive'), ServiceRequestViewSchema, { method: 'POST' });
export function inspectAtBench({ reference, inspection, photos }: { reference: string; inspection: Inspection; photos: File[] }) {
  const formData = new FormData();
  for (const [k, v] of Object.entries(inspection)) formData.append(k, String(v));
  for (const photo of photos) formData.append('photos', photo, photo.name);
  return api(path(reference, 'inspect'), ServiceRequestViewSchema, { method: 'POST', formData });
}
export const quoteAtBench = ({ reference, quote }: { reference: string; quote: Quote }) => api(path(reference, 'quote'), ServiceRequestViewSchema, { method: 'POST', body: quote });
export const rebuildAtBench = ({ reference, rebuild }: { reference: string; rebuild: Rebuild }) => api(path(reference, 'rebuild'), ServiceRequestViewSchema, { method: 'POST', body: rebuild });
export const shipFromBench = ({ reference, ship }: { reference: string; ship: ServiceShip }) => api(path(reference, 'ship'), ServiceRequestViewSchema, { method: 'POST', body: ship });

/** Every Bench step refreshes the queues and the open request. */
function useBenchMutation<A, R>(fn: (a: A) => Promise<R>) {
  const client = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => void client.invalidateQueries({ queryKey: serviceKeys.bench }) });
}

export const useBenchScan = () => useBenchMutation(scanAtBench);
export const useReceive = () => useBenchMutation(receiveAtBench);
export const useInspect = () => useBenchMutation(inspectAtBench);
export const useQuote = () => useBenchMutation(quoteAtBench);
export const useRebuild = () => useBenchMutation(rebuildAtBench);
export const useShip = () => useBenchMutation(shipFromBench);
