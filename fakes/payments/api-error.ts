/** An error answered in the provider's `{ error: { type, code, message, param, ... } }` body. */
export type ApiErrorType = 'invalid_request_error' | 'card_error' | 'idempotency_error' | 'api_error';

export interface ApiErrorFields {
  code?: string;
  param?: string;
  decline_code?: string;
  charge?: string;
  payment_intent?: unknown;
  payment_method?: unknown;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly fields: ApiErrorFields = {},
  ) {
    super(message);
  }

  toBody(): { error: Record<string, unknown> } {
    const error: Record<string, unknown> = { type: this.type, message: this.message };
    for (const [key, value] of Object.entries(this.fields)) {
      if (value !== undefined) error[key] = value;
    }
    if (this.fields.code) error.doc_url = `https://stripe.com/docs/error-codes/${this.fields.code.replaceAll('_', '-')}`;
    return { error };
  }
}

export function invalidRequest(message: string, fields: ApiErrorFields = {}): ApiError {
  return new ApiError(400, 'invalid_request_error', message, fields);
}

export function noSuch(kind: string, id: string, param: string, status = 404): ApiError {
  return new ApiError(status, 'invalid_request_error', `No such ${kind}: '${id}'`, { code: 'resource_missing', param });
}
