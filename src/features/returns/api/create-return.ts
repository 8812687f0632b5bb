import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ReturnViewSchema, type ReturnRequest } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { returnsKeys } from './keys';

/** Sends the request as multipart form data: the fields plus each photo under "photos". */
export function createReturn({ request, photos }: { request: ReturnRequest; photos: File[] }) {
  const formData = new FormData();
  formData.append('orderNumber', request.orderNumber);
  formData.append('lineId', String(request.lineId));
  formData.append('kind', request.kind);
  formData.append('quantity', String(request.quantity));
  formData.append('reason', request.reason);
  for (const photo of photos) formData.append('photos', photo, photo.name);
  return api('/returns', ReturnViewSchema, { method: 'POST', formData });
}

export function useCreateReturn() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createReturn,
    // Not awaited: the buyer moves on to the list at once, which loads the fresh answer itself.
    onSuccess: (_view, { request }) => {
      void client.invalidateQueries({ queryKey: returnsKeys.all });
      // The order's own page shows the request on its timeline.
      void client.invalidateQueries({ queryKey: orderKeys.detail(request.orderNumber) });
    },
  });
}
