import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ServiceRequestViewSchema, type ServiceBooking } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

/** Sends the booking as multipart form data: the fields, each ticked symptom, and each photo under "photos". */
export function bookServiceRequest({ booking, photos }: { booking: ServiceBooking; photos: File[] }) {
  const formData = new FormData();
  for (const [k, v] of Object.entries(booking)) {
    if (Array.isArray(v)) for (const one of v) formData.append(k, String(one));
    else formData.append(k, String(v));
  }
  for (const photo of photos) formData.append('photos', photo, photo.name);
  return api('/service', ServiceRequestViewSchema, { method: 'POST', formData });
}

export function useBookServiceRequest() {
  const client = useQueryClient();
  return useMutation({ mutationFn: bookServiceRequest, onSuccess: () => void client.invalidateQueries({ queryKey: serviceKeys.all }) });
}
