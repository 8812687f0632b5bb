import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema, type PriceImport } from '../../../../shared/schemas/admin-catalog';
import { ApiErrorSchema } from '../../../../shared/schemas/errors';
import { ApiError } from '../../../lib/api-client';
import { officeKeys } from './keys';

export interface UploadProgress {
  loaded: number;
  total: number;
}

/**
 * Sends the CSV with XMLHttpRequest because fetch cannot report upload progress.
 * Errors come back as the same ApiError that api() throws.
 */
export function uploadPriceImport(file: File, onProgress?: (p: UploadProgress) => void, signal?: AbortSignal): Promise<PriceImport> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/admin/price-imports');
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.({ loaded: e.loaded, total: e.total });
    };
    xhr.onerror = () => reject(new ApiError(0, 'The server could not be reached. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'));
    xhr.onload = () => {
      const json = safeJson(xhr.responseText);
      if (xhr.status < 200 || xhr.status >= 300) {
        const parsed = ApiErrorSchema.safeParse(json);
        reject(new ApiError(xhr.status, parsed.success ? parsed.data.error.message : `Upload failed (${xhr.status})`, parsed.success ? parsed.data.error.fieldErrors : {}));
        return;
      }
      const parsed = PriceImportSchema.safeParse(json);
      if (parsed.success) resolve(parsed.data);
      else reject(new ApiError(xhr.status, 'The server sent an answer we could not read.'));
    };
    signal?.addEventListener('abort', () => xhr.abort());
    const body = new FormData();
    body.append('file', file);
    xhr.send(body);
  });
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

export function useUploadPriceImport(onProgress: (p: UploadProgress) => void) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadPriceImport(file, onProgress),
    onSuccess: (result) => client.setQueryData(officeKeys.priceImport(result.id), result),
  });
}
