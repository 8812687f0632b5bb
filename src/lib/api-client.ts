import type { z } from 'zod';
import type { ApiErrorBody } from '../../shared/schemas/errors';

/**
 * A response schema, or a function that imports it. The schemas bring the validation library (a quarter of the
 * first page's script) with them; the requests a page makes first name theirs lazily, so the library arrives beside
 * the answers instead of delaying every page's first paint.
 */
export type SchemaSource<T extends z.ZodType> = T | (() => Promise<T>);

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
export async function api<T extends z.ZodType>(path: string, schema: SchemaSource<T>, options: RequestOptions = {}): Promise<z.infer<T>> {
  const schemaReady = typeof schema === 'function' ? schema() : Promise.resolve(schema);
  // Settled here as well, so a request that fails first leaves no unhandled rejection behind.
  schemaReady.catch(() => undefined);
  const { status, json } = await request(path, options);
  const parsed = (await loadSchema(schemaReady)).safeParse(json);
  if (!parsed.success) throw new ApiError(status, 'The server sent an answer we could not read.');
  return parsed.data;
}

/**
 * Fetches from /api and takes the answer as the shared schema's type without parsing it: for the reads every first
 * page makes (who is signed in, the cart, parts, frames, the fitment maps, the unread count), so a first visit does not
 * download the validation library. Only for answers whose schema has no defaults or transforms the server leaves to
 * it: tests/integration/first-reads.test.ts shows, for real answers of each, that parsing changes nothing.
 */
export async function apiRead<T>(path: string, options: Pick<RequestOptions, 'signal'> = {}): Promise<T> {
  const { status, json } = await request(path, options);
  if (json === null || typeof json !== 'object') throw new ApiError(status, 'The server sent an answer we could not read.');
  return json as T;
}

async function request(path: string, options: RequestOptions): Promise<{ status: number; json: unknown }> {
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
    const error = readApiError(json);
    throw new ApiError(response.status, error?.message ?? `Request failed (${response.status})`, error?.fieldErrors ?? {});
  }
  return { status: response.status, json };
}

async function loadSchema<T>(ready: Promise<T>): Promise<T> {
  try {
    return await ready;
  } catch {
    throw new ApiError(0, 'Part of the page did not load. Check your connection and reload the page.');
  }
}

/**
 * The server's one error shape (shared/schemas/errors.ts), read without the validation library, which an error on a
 * first page would otherwise download; tests/unit/api-error-reader.test.ts holds it to the schema.
 */
export function readApiError(json: unknown): ApiErrorBody['error'] | null {
  if (!isRecord(json) || !isRecord(json.error)) return null;
  const { message, fieldErrors } = json.error;
  if (typeof message !== 'string') return null;
  if (fieldErrors === undefined) return { message };
  if (!isRecord(fieldErrors)) return null;
  const fields: Record<string, string[]> = {};
  for (const [key, value] of Object.entries(fieldErrors)) {
    if (!Array.isArray(value) || !value.every((v) => typeof v === 'string')) return null;
    fields[key] = value as string[];
  }
  return { message, fieldErrors: fields };
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
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
