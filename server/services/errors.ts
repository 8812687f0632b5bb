/** Field → messages, the shape forms show beside each field. */
export type FieldErrors = Record<string, string[]>;

/**
 * Why a service refused, in the domain's words. Services throw only these; the one error middleware turns each kind
 * into its HTTP status, so a service never knows about HTTP.
 */
export type DomainErrorKind = 'invalid' | 'payment-declined' | 'not-allowed' | 'not-found' | 'conflict' | 'too-large' | 'unsupported-type' | 'payment-service';

export abstract class DomainError extends Error {
  abstract readonly kind: DomainErrorKind;

  constructor(
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** The input breaks a rule of ours: a value out of range, a name that is not there to refer to. */
export class InvalidError extends DomainError {
  readonly kind = 'invalid';
}

/** The card was declined: nothing was taken. */
export class PaymentDeclinedError extends DomainError {
  readonly kind = 'payment-declined';
}

/** This account may not do this (a retail buyer asking for trade terms, say). */
export class NotAllowedError extends DomainError {
  readonly kind = 'not-allowed';
}

/** There is no such thing, or none this user may see. */
export class NotFoundError extends DomainError {
  readonly kind = 'not-found';
}

/** The request is sound but the state of things refuses it: out of stock, already applied, over a limit. */
export class ConflictError extends DomainError {
  readonly kind = 'conflict';
}

/** A file or a list is larger than we take. */
export class TooLargeError extends DomainError {
  readonly kind = 'too-large';
}

/** A file is not of a type we take. */
export class UnsupportedTypeError extends DomainError {
  readonly kind = 'unsupported-type';
}

/** The payment service failed us: unreachable, or it refused an operation that should have worked. */
export class PaymentServiceError extends DomainError {
  readonly kind = 'payment-service';
}
