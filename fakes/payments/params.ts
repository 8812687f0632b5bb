import { invalidRequest } from './api-error';

/** Parameters as the form decoder hands them over: strings, arrays and nested objects. */
export type Params = Record<string, unknown>;

export function asParams(value: unknown): Params {
  return value && typeof value === 'object' && !Array.isArray(value) ? (value as Params) : {};
}

/** The provider refuses parameters it does not know, which catches typos in the app early. */
export function rejectUnknown(params: Params, allowed: readonly string[]): void {
  for (const key of Object.keys(params)) {
    if (!allowed.includes(key)) {
      throw invalidRequest(`Received unknown parameter: ${key}`, { code: 'parameter_unknown', param: key });
    }
  }
}

export function optString(params: Params, key: string): string | undefined {
  const value = params[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') {
    throw invalidRequest(`Invalid string: ${JSON.stringify(value)}`, { code: 'parameter_invalid_string', param: key });
  }
  return value;
}

export function reqString(params: Params, key: string): string {
  const value = optString(params, key);
  if (value === undefined || value === '') {
    throw invalidRequest(`Missing required param: ${key}.`, { code: 'parameter_missing', param: key });
  }
  return value;
}

export function optInteger(params: Params, key: string): number | undefined {
  const value = params[key];
  if (value === undefined) return undefined;
  if (typeof value !== 'string' || !/^-?\d+$/.test(value)) {
    throw invalidRequest(`Invalid integer: ${String(value)}`, { code: 'parameter_invalid_integer', param: key });
  }
  return Number(value);
}

export function reqInteger(params: Params, key: string): number {
  const value = optInteger(params, key);
  if (value === undefined) {
    throw invalidRequest(`Missing required param: ${key}.`, { code: 'parameter_missing', param: key });
  }
  return value;
}

export function optBoolean(params: Params, key: string): boolean | undefined {
  const value = params[key];
  if (value === undefined) return undefined;
  if (value === 'true') return true;
  if (value === 'false') return false;
  throw invalidRequest(`Invalid boolean: ${String(value)}`, { code: 'parameter_invalid_boolean', param: key });
}

export function optStringList(params: Params, key: string): string[] | undefined {
  const value = params[key];
  if (value === undefined) return undefined;
  // A bracketed list past the decoder's array limit arrives as an index-keyed object.
  const items = Array.isArray(value) ? value : typeof value === 'object' && value ? Object.values(value) : [value];
  if (!items.every((v): v is string => typeof v === 'string')) {
    throw invalidRequest(`Invalid array`, { param: key });
  }
  return items;
}

/**
 * Metadata follows the provider's update rules: an empty string for a key removes it,
 * and `metadata=""` removes all keys.
 */
export function applyMetadata(current: Record<string, string>, params: Params): Record<string, string> {
  const value = params.metadata;
  if (value === undefined) return current;
  if (value === '') return {};
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidRequest('Invalid object', { param: 'metadata' });
  }
  const next = { ...current };
  for (const [key, v] of Object.entries(value)) {
    if (typeof v !== 'string') throw invalidRequest('Invalid metadata value', { param: `metadata[${key}]` });
    if (v === '') delete next[key];
    else next[key] = v;
  }
  return next;
}

export function optObject(params: Params, key: string): Params | null | undefined {
  const value = params[key];
  if (value === undefined) return undefined;
  if (value === '') return null;
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidRequest('Invalid object', { param: key });
  }
  return value as Params;
}
