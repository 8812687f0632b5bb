import type { z } from 'zod';
import { ApiErrorSchema } from '../../shared/schemas/errors';

/** Any failed API call; `status` 0 means the server could not be reached. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
  }
  get isUnauthorized() {
    return this.status === 401;
  }
  get isValidation() {
    return this.status === 400;
  }
  get isNotFound() {
    return this.status === 404;
  }
}

interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  formData?: FormData;
}

/** Fetches from /api and parses the answer with the shared zod schema, so no API type is written twice. */
export async function api<T extends z.ZodType>(path: string, schema: T, options: RequestOptions = {}): Promise<z.infer<T>> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: options.method ?? 'GET',
      credentials: 'same-origin',
      headers: options.body !== undefined ? { 'Content-Type': 'application/json' } : undefined,
      body: options.formData ?? (options.body !== undefined ? JSON.stringify(options.body) : undefined),
      signal: options.signal,
    });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new ApiError(0, 'The server could not be reached. Check your connection and try again.');
  }
  const text = await response.text();
  const json: unknown = text ? safeJson(text) : null;
  if (!response.ok) {
    const parsed = ApiErrorSchema.safeParse(json);
    throw new ApiError(response.status, parsed.success ? parsed.data.error.message : `Request failed (${response.status})`, parsed.success ? parsed.data.error.fieldErrors : {});
  }
  const parsed = schema.safeParse(json);
  if (!parsed.success) throw new ApiError(response.status, 'The server sent an answer we could not read.');
  return parsed.data;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

export function toSearchParams(values: Record<string, string | number | boolean | undefined | null>): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(values)) if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  const s = params.toString();
  return s ? `?${s}` : '';
}
