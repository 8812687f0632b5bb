import { randomFillSync } from 'node:crypto';
import { ApiError, invalidRequest, noSuch } from './api-error';
import {
  applyMetadata,
  optBoolean,
  optInteger,
  optObject,
  optString,
  optStringList,
  rejectUnknown,
  reqInteger,
  reqString,
  type Params,
} from './params';
import { TEST_CARDS, isTestPaymentMethodId, type TestCard } from '../../shared/payment-test-methods';

/*
 * The in-memory state of the payments fake and the rules that move it: the objects are shaped like the
 * provider's wire objects (the fields the SDK's types declare), with the status flow of card payments.
 */

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** Random bytes drawn a few kilobytes at a time: one call to the system's generator serves many ids. */
const pool = Buffer.alloc(4096);
let poolAt = pool.length;

export function newId(prefix: string, length = 24): string {
  if (poolAt + length > pool.length) {
    randomFillSync(pool);
    poolAt = 0;
  }
  let out = '';
  for (let i = 0; i < length; i++) out += ALPHABET[pool[poolAt + i]! % ALPHABET.length];
  poolAt += length;
  return `${prefix}_${out}`;
}

type Metadata = Record<string, string>;

export interface CustomerObject {
  id: string;
  object: 'customer';
  address: Params | null;
  balance: number;
  created: number;
  currency: string | null;
  default_source: string | null;
  delinquent: boolean;
  description: string | null;
  discount: null;
  email: string | null;
  invoice_prefix: string;
  invoice_settings: {
    custom_fields: null;
    default_payment_method: string | null;
    footer: null;
    rendering_options: null;
  };
  livemode: false;
  metadata: Metadata;
  name: string | null;
  next_invoice_sequence: number;
  phone: string | null;
  preferred_locales: string[];
  shipping: Params | null;
  tax_exempt: string;
  test_clock: null;
}

export interface PaymentMethodObject {
  id: string;
  object: 'payment_method';
  allow_redisplay: 'unspecified';
  billing_details: {
    address: { city: null; country: null; line1: null; line2: null; postal_code: null; state: null };
    email: null;
    name: null;
    phone: null;
  };
  card: {
    brand: string;
    checks: { address_line1_check: null; address_postal_code_check: null; cvc_check: 'unchecked' };
    country: string;
    display_brand: string;
    exp_month: number;
    exp_year: number;
    fingerprint: string;
    funding: 'credit';
    last4: string;
    networks: { available: string[]; preferred: null };
    three_d_secure_usage: { supported: boolean };
    wallet: null;
  };
  created: number;
  customer: string | null;
  livemode: false;
  metadata: Metadata;
  type: 'card';
}

export type PaymentIntentStatus =
  | 'requires_payment_method'
  | 'requires_confirmation'
  | 'requires_action'
  | 'processing'
  | 'succeeded'
  | 'canceled';

export interface LastPaymentError {
  type: 'card_error' | 'invalid_request_error';
  code: string;
  decline_code?: string;
  message: string;
  charge?: string;
  doc_url: string;
  payment_method: PaymentMethodObject | null;
}

export interface NextAction {
  type: 'redirect_to_url' | 'use_stripe_sdk';
  redirect_to_url?: { return_url: string; url: string };
  use_stripe_sdk?: { type: 'three_d_secure_redirect'; stripe_js: string; source: string };
}

export interface PaymentIntentObject {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_details: { tip: Record<string, never> };
  amount_received: number;
  application: null;
  application_fee_amount: null;
  automatic_payment_methods: { enabled: boolean } | null;
  canceled_at: number | null;
  cancellation_reason: string | null;
  capture_method: string;
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  last_payment_error: LastPaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  next_action: NextAction | null;
  on_behalf_of: null;
  payment_method: string | null;
  payment_method_configuration_details: null;
  payment_method_options: { card: { installments: null; mandate_options: null; network: null; request_three_d_secure: 'automatic' } };
  payment_method_types: string[];
  processing: null;
  receipt_email: string | null;
  review: null;
  setup_future_usage: string | null;
  shipping: Params | null;
  source: null;
  statement_descriptor: string | null;
  statement_descriptor_suffix: string | null;
  status: PaymentIntentStatus;
  transfer_data: null;
  transfer_group: null;
}

export interface ChargeObject {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  application: null;
  application_fee: null;
  application_fee_amount: null;
  balance_transaction: string | null;
  billing_details: PaymentMethodObject['billing_details'];
  calculated_statement_descriptor: string | null;
  captured: boolean;
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  disputed: boolean;
  failure_balance_transaction: null;
  failure_code: string | null;
  failure_message: string | null;
  fraud_details: Record<string, never>;
  livemode: false;
  metadata: Metadata;
  on_behalf_of: null;
  outcome: {
    network_status: string;
    reason: string | null;
    risk_level: string;
    seller_message: string;
    type: string;
  };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: {
    card: { brand: string; last4: string; exp_month: number; exp_year: number; funding: string; country: string; three_d_secure: { result: string } | null };
    type: 'card';
  };
  receipt_email: string | null;
  receipt_number: null;
  receipt_url: null;
  refunded: boolean;
  review: null;
  shipping: Params | null;
  source: null;
  source_transfer: null;
  statement_descriptor: string | null;
  statement_descriptor_suffix: string | null;
  status: 'succeeded' | 'failed';
  transfer_data: null;
  transfer_group: null;
}

export interface RefundObject {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: string;
  charge: string;
  created: number;
  currency: string;
  destination_details: { card: { type: 'refund' }; type: 'card' };
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  receipt_number: null;
  source_transfer_reversal: null;
  status: 'succeeded';
  transfer_reversal: null;
}

export interface EventObject {
  id: string;
  object: 'event';
  api_version: string | null;
  created: number;
  data: { object: unknown; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

/** Who caused a change; copied into the event's `request` field as the provider does. */
export interface RequestContext {
  requestId: string | null;
  idempotencyKey: string | null;
}

export interface LedgerOptions {
  /** Base URL of the fake, for the 3-D Secure page a redirect points at. */
  baseUrl: () => string;
  apiVersion: () => string | null;
  /** Called for every event, in order. */
  onEvent: (event: EventObject) => void;
  /** When above 0, a confirmed card payment waits in `processing` this long before it succeeds. */
  processingDelayMs: number;
}

const CONFIRMABLE: readonly PaymentIntentStatus[] = ['requires_payment_method', 'requires_confirmation', 'requires_action'];
const CANCELABLE: readonly PaymentIntentStatus[] = [
  'requires_payment_method',
  'requires_confirmation',
  'requires_action',
  'processing',
];
const FINAL_OR_BUSY: readonly PaymentIntentStatus[] = ['processing', 'succeeded', 'canceled'];
const REFUND_REASONS = ['duplicate', 'fraudulent', 'requested_by_customer'];
const CANCELLATION_REASONS = ['abandoned', 'duplicate', 'fraudulent', 'requested_by_customer'];

const INTENT_CONFIRM_PARAMS = [
  'payment_method',
  'return_url',
  'receipt_email',
  'off_session',
  'error_on_requires_action',
  'setup_future_usage',
  'payment_method_options',
  'payment_method_types',
  'mandate_data',
  'shipping',
  'use_stripe_sdk',
  'expand',
];
const INTENT_UPDATE_PARAMS = [
  'amount',
  'currency',
  'customer',
  'description',
  'metadata',
  'payment_method',
  'payment_method_types',
  'receipt_email',
  'setup_future_usage',
  'shipping',
  'statement_descriptor',
  'statement_descriptor_suffix',
  'expand',
];
const INTENT_CREATE_PARAMS = [
  ...new Set([
    ...INTENT_UPDATE_PARAMS,
    ...INTENT_CONFIRM_PARAMS,
    'confirm',
    'automatic_payment_methods',
    'capture_method',
    'confirmation_method',
  ]),
];
/** Fields that may still change once a payment is processing, paid or canceled. */
const ALWAYS_UPDATABLE = ['description', 'metadata', 'receipt_email', 'shipping', 'expand'];
const CUSTOMER_PARAMS = [
  'email',
  'name',
  'phone',
  'description',
  'metadata',
  'address',
  'shipping',
  'preferred_locales',
  'tax_exempt',
  'invoice_settings',
  'expand',
];

const BILLING_DETAILS: PaymentMethodObject['billing_details'] = {
  address: { city: null, country: null, line1: null, line2: null, postal_code: null, state: null },
  email: null,
  name: null,
  phone: null,
};

/** Smallest charge per currency (from memory, the provider's documented minimums for these currencies). */
const MINIMUM_AMOUNT: Record<string, number> = { usd: 50, eur: 50, gbp: 30, cad: 50, aud: 50 };

function docUrl(code: string): string {
  return `https://stripe.com/docs/error-codes/${code.replaceAll('_', '-')}`;
}

/** The objects are plain JSON (strings, numbers, booleans, null, arrays, objects), so a JSON round trip copies them whole. */
function clone<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

export class PaymentsLedger {
  private customers = new Map<string, CustomerObject>();
  private intents = new Map<string, PaymentIntentObject>();
  private intentReturnUrls = new Map<string, string>();
  private paymentMethods = new Map<string, { object: PaymentMethodObject; card: TestCard }>();
  private charges = new Map<string, ChargeObject>();
  private refunds = new Map<string, RefundObject>();
  private eventLog = new Map<string, EventObject>();
  private timers = new Set<NodeJS.Timeout>();

  constructor(private readonly options: LedgerOptions) {}

  dispose(): void {
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
  }

  reset(): void {
    this.dispose();
    this.customers.clear();
    this.intents.clear();
    this.intentReturnUrls.clear();
    this.paymentMethods.clear();
    this.charges.clear();
    this.refunds.clear();
    this.eventLog.clear();
  }

  private now(): number {
    return Math.floor(Date.now() / 1000);
  }

  private emit(type: string, object: unknown, ctx: RequestContext, previous?: Record<string, unknown>): void {
    const event: EventObject = {
      id: newId('evt'),
      object: 'event',
      api_version: this.options.apiVersion(),
      created: this.now(),
      data: previous ? { object: clone(object), previous_attributes: clone(previous) } : { object: clone(object) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: ctx.requestId, idempotency_key: ctx.idempotencyKey },
      type,
    };
    this.eventLog.set(event.id, event);
    this.options.onEvent(event);
  }

  // Customers

  createCustomer(params: Params, ctx: RequestContext): CustomerObject {
    rejectUnknown(params, CUSTOMER_PARAMS);
    const customer: CustomerObject = {
      id: newId('cus', 14),
      object: 'customer',
      address: optObject(params, 'address') ?? null,
      balance: 0,
      created: this.now(),
      currency: null,
      default_source: null,
      delinquent: false,
      description: optString(params, 'description') ?? null,
      discount: null,
      email: optString(params, 'email') ?? null,
      invoice_prefix: newId('x', 8).slice(2).toUpperCase(),
      invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
      livemode: false,
      metadata: applyMetadata({}, params),
      name: optString(params, 'name') ?? null,
      next_invoice_sequence: 1,
      phone: optString(params, 'phone') ?? null,
      preferred_locales: optStringList(params, 'preferred_locales') ?? [],
      shipping: optObject(params, 'shipping') ?? null,
      tax_exempt: optString(params, 'tax_exempt') ?? 'none',
      test_clock: null,
    };
    this.customers.set(customer.id, customer);
    this.emit('customer.created', customer, ctx);
    return clone(customer);
  }

  private customer(id: string, param = 'id', status = 404): CustomerObject {
    const customer = this.customers.get(id);
    if (!customer) throw noSuch('customer', id, param, status);
    return customer;
  }

  retrieveCustomer(id: string): CustomerObject {
    return clone(this.customer(id));
  }

  updateCustomer(id: string, params: Params, ctx: RequestContext): CustomerObject {
    const customer = this.customer(id);
    rejectUnknown(params, CUSTOMER_PARAMS);
    const previous: Record<string, unknown> = {};
    const set = <K extends keyof CustomerObject>(key: K, value: CustomerObject[K] | undefined) => {
      if (value === undefined) return;
      previous[key] = customer[key];
      customer[key] = value;
    };
    set('email', optString(params, 'email'));
    set('name', optString(params, 'name'));
    set('phone', optString(params, 'phone'));
    set('description', optString(params, 'description'));
    set('address', optObject(params, 'address'));
    set('shipping', optObject(params, 'shipping'));
    set('preferred_locales', optStringList(params, 'preferred_locales'));
    set('tax_exempt', optString(params, 'tax_exempt'));
    if (params.metadata !== undefined) set('metadata', applyMetadata(customer.metadata, params));
    this.emit('customer.updated', customer, ctx, previous);
    return clone(customer);
  }

  listCustomers(params: Params): ListObject<CustomerObject> {
    const email = optString(params, 'email');
    const all = [...this.customers.values()].filter((c) => email === undefined || c.email === email);
    return this.page(all, params, '/v1/customers', ['email']);
  }

  // Payment methods

  /** Test tokens become a fresh payment method on each use, as in the provider's test mode. */
  private resolvePaymentMethod(id: string, customer: string | null): { object: PaymentMethodObject; card: TestCard } {
    const existing = this.paymentMethods.get(id);
    if (existing) return existing;
    if (!isTestPaymentMethodId(id)) throw noSuch('PaymentMethod', id, 'payment_method', 400);
    const card = TEST_CARDS[id];
    const object: PaymentMethodObject = {
      id: newId('pm'),
      object: 'payment_method',
      allow_redisplay: 'unspecified',
      billing_details: clone(BILLING_DETAILS),
      card: {
        brand: card.brand,
        checks: { address_line1_check: null, address_postal_code_check: null, cvc_check: 'unchecked' },
        country: 'US',
        display_brand: card.brand,
        exp_month: 12,
        exp_year: new Date().getUTCFullYear() + 3,
        fingerprint: `fp${card.last4}${card.behaviour}`,
        funding: 'credit',
        last4: card.last4,
        networks: { available: [card.brand], preferred: null },
        three_d_secure_usage: { supported: true },
        wallet: null,
      },
      created: this.now(),
      customer,
      livemode: false,
      metadata: {},
      type: 'card',
    };
    const entry = { object, card };
    this.paymentMethods.set(object.id, entry);
    return entry;
  }

  retrievePaymentMethod(id: string): PaymentMethodObject {
    const entry = this.paymentMethods.get(id);
    if (!entry) throw noSuch('PaymentMethod', id, 'payment_method');
    return clone(entry.object);
  }

  // Payment intents

  private intent(id: string, param = 'intent', status = 404): PaymentIntentObject {
    const intent = this.intents.get(id);
    if (!intent) throw noSuch('payment_intent', id, param, status);
    return intent;
  }

  retrieveIntent(id: string): PaymentIntentObject {
    return clone(this.intent(id));
  }

  listIntents(params: Params): ListObject<PaymentIntentObject> {
    const customer = optString(params, 'customer');
    const all = [...this.intents.values()].filter((pi) => customer === undefined || pi.customer === customer);
    return this.page(all, params, '/v1/payment_intents', ['customer']);
  }

  createIntent(params: Params, ctx: RequestContext): PaymentIntentObject {
    rejectUnknown(params, INTENT_CREATE_PARAMS);
    const amount = reqInteger(params, 'amount');
    const currency = reqString(params, 'currency').toLowerCase();
    this.checkAmount(amount, currency);
    const customerId = optString(params, 'customer');
    if (customerId !== undefined) this.customer(customerId, 'customer', 400);
    const captureMethod = optString(params, 'capture_method') ?? 'automatic_async';
    if (captureMethod !== 'automatic' && captureMethod !== 'automatic_async') {
      // Manual capture is outside the subset the storefront uses; say so rather than pretend.
      throw invalidRequest(`The payments fake supports only automatic capture, not '${captureMethod}'.`, {
        param: 'capture_method',
      });
    }
    const automatic = optObject(params, 'automatic_payment_methods');
    const enabled = automatic ? optBoolean(automatic, 'enabled') ?? false : false;
    const id = newId('pi');
    const pmToken = optString(params, 'payment_method');
    const intent: PaymentIntentObject = {
      id,
      object: 'payment_intent',
      amount,
      amount_capturable: 0,
      amount_details: { tip: {} },
      amount_received: 0,
      application: null,
      application_fee_amount: null,
      automatic_payment_methods: automatic ? { enabled } : null,
      canceled_at: null,
      cancellation_reason: null,
      capture_method: captureMethod,
      client_secret: `${id}_secret_${newId('x', 25).slice(2)}`,
      confirmation_method: 'automatic',
      created: this.now(),
      currency,
      customer: customerId ?? null,
      description: optString(params, 'description') ?? null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      metadata: applyMetadata({}, params),
      next_action: null,
      on_behalf_of: null,
      payment_method: null,
      payment_method_configuration_details: null,
      payment_method_options: {
        card: { installments: null, mandate_options: null, network: null, request_three_d_secure: 'automatic' },
      },
      payment_method_types: optStringList(params, 'payment_method_types') ?? ['card'],
      processing: null,
      receipt_email: optString(params, 'receipt_email') ?? null,
      review: null,
      setup_future_usage: optString(params, 'setup_future_usage') ?? null,
      shipping: optObject(params, 'shipping') ?? null,
      source: null,
      statement_descriptor: optString(params, 'statement_descriptor') ?? null,
      statement_descriptor_suffix: optString(params, 'statement_descriptor_suffix') ?? null,
      status: 'requires_payment_method',
      transfer_data: null,
      transfer_group: null,
    };
    if (pmToken !== undefined) {
      intent.payment_method = this.resolvePaymentMethod(pmToken, intent.customer).object.id;
      intent.status = 'requires_confirmation';
    }
    const confirm = optBoolean(params, 'confirm') ?? false;
    this.intents.set(id, intent);
    this.emit('payment_intent.created', intent, ctx);
    if (confirm) {
      const confirmParams: Params = {};
      for (const key of ['return_url', 'off_session', 'error_on_requires_action']) {
        if (params[key] !== undefined) confirmParams[key] = params[key];
      }
      return this.confirmIntent(id, confirmParams, ctx);
    }
    return clone(intent);
  }

  private checkAmount(amount: number, currency: string): void {
    if (!/^[a-z]{3}$/.test(currency)) {
      throw invalidRequest(`Invalid currency: ${currency}.`, { param: 'currency' });
    }
    if (amount < 1) {
      throw invalidRequest('This value must be greater than or equal to 1.', { code: 'parameter_invalid_integer', param: 'amount' });
    }
    const minimum = MINIMUM_AMOUNT[currency];
    if (minimum !== undefined && amount < minimum) {
      throw invalidRequest(`Amount must be at least ${minimum} ${currency} minor units.`, {
        code: 'amount_too_small',
        param: 'amount',
      });
    }
  }

  updateIntent(id: string, params: Params, ctx: RequestContext): PaymentIntentObject {
    const intent = this.intent(id);
    rejectUnknown(params, INTENT_UPDATE_PARAMS);
    if (FINAL_OR_BUSY.includes(intent.status)) {
      const blocked = Object.keys(params).find((key) => !ALWAYS_UPDATABLE.includes(key));
      if (blocked) {
        throw invalidRequest(
          `You cannot update ${blocked} on a PaymentIntent with a status of ${intent.status}. It may only be updated while the status is one of: ${CONFIRMABLE.join(', ')}.`,
          { code: 'payment_intent_unexpected_state', param: blocked, payment_intent: clone(intent) },
        );
      }
    }
    const previous: Record<string, unknown> = {};
    const set = <K extends keyof PaymentIntentObject>(key: K, value: PaymentIntentObject[K] | undefined) => {
      if (value === undefined) return;
      previous[key] = intent[key];
      intent[key] = value;
    };
    const amount = optInteger(params, 'amount');
    const currency = optString(params, 'currency')?.toLowerCase();
    if (amount !== undefined || currency !== undefined) this.checkAmount(amount ?? intent.amount, currency ?? intent.currency);
    const customerId = optString(params, 'customer');
    if (customerId !== undefined) this.customer(customerId, 'customer', 400);
    set('amount', amount);
    set('currency', currency);
    set('customer', customerId);
    set('description', optString(params, 'description'));
    set('receipt_email', optString(params, 'receipt_email'));
    set('setup_future_usage', optString(params, 'setup_future_usage'));
    set('shipping', optObject(params, 'shipping'));
    set('statement_descriptor', optString(params, 'statement_descriptor'));
    set('statement_descriptor_suffix', optString(params, 'statement_descriptor_suffix'));
    set('payment_method_types', optStringList(params, 'payment_method_types'));
    if (params.metadata !== undefined) set('metadata', applyMetadata(intent.metadata, params));
    const pmToken = optString(params, 'payment_method');
    if (pmToken !== undefined) {
      set('payment_method', this.resolvePaymentMethod(pmToken, intent.customer).object.id);
    }
    // A new amount or card must be confirmed again, as with the provider.
    if (pmToken !== undefined || (intent.status === 'requires_action' && (amount !== undefined || currency !== undefined))) {
      if (intent.payment_method) {
        set('status', 'requires_confirmation');
        set('next_action', null);
      }
    }
    if (Object.keys(previous).length > 0) this.emit('payment_intent.updated', intent, ctx, previous);
    return clone(intent);
  }

  confirmIntent(id: string, params: Params, ctx: RequestContext): PaymentIntentObject {
    const intent = this.intent(id);
    rejectUnknown(params, INTENT_CONFIRM_PARAMS);
    if (!CONFIRMABLE.includes(intent.status)) {
      throw invalidRequest(
        `You cannot confirm this PaymentIntent because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be confirmed: ${CONFIRMABLE.join(', ')}.`,
        { code: 'payment_intent_unexpected_state', payment_intent: clone(intent) },
      );
    }
    const pmToken = optString(params, 'payment_method');
    const returnUrl = optString(params, 'return_url');
    const offSession = optBoolean(params, 'off_session') ?? false;
    const errorOnAction = optBoolean(params, 'error_on_requires_action') ?? false;
    const receiptEmail = optString(params, 'receipt_email');
    if (receiptEmail !== undefined) intent.receipt_email = receiptEmail;
    if (returnUrl !== undefined) this.intentReturnUrls.set(id, returnUrl);
    if (pmToken !== undefined) intent.payment_method = this.resolvePaymentMethod(pmToken, intent.customer).object.id;
    if (!intent.payment_method) {
      throw invalidRequest(
        "You cannot confirm this PaymentIntent because it's missing a payment method. To confirm the PaymentIntent with a payment method, pass `payment_method`.",
        { code: 'payment_intent_unexpected_state', payment_intent: clone(intent) },
      );
    }
    const pm = this.paymentMethods.get(intent.payment_method);
    if (!pm) throw noSuch('PaymentMethod', intent.payment_method, 'payment_method', 400);
    intent.last_payment_error = null;

    switch (pm.card.behaviour) {
      case 'succeed':
        this.settle(intent, pm, ctx, null);
        break;
      case 'decline':
        this.decline(intent, pm, ctx, {
          code: 'card_declined',
          declineCode: pm.card.declineCode ?? 'generic_decline',
          message: pm.card.declineMessage ?? 'Your card was declined.',
        });
        break;
      case 'authenticate':
        if (offSession || errorOnAction) {
          // Off-session there is no customer to authenticate, so the provider declines instead.
          this.decline(intent, pm, ctx, {
            code: 'authentication_required',
            declineCode: 'authentication_required',
            message: 'Your card was declined. This transaction requires authentication.',
          });
        }
        this.requireAction(intent, ctx);
        break;
    }
    return clone(intent);
  }

  private requireAction(intent: PaymentIntentObject, ctx: RequestContext): void {
    const url = `${this.options.baseUrl()}/_test/authenticate/${intent.id}`;
    const returnUrl = this.intentReturnUrls.get(intent.id);
    intent.status = 'requires_action';
    intent.next_action = returnUrl
      ? { type: 'redirect_to_url', redirect_to_url: { return_url: returnUrl, url } }
      : { type: 'use_stripe_sdk', use_stripe_sdk: { type: 'three_d_secure_redirect', stripe_js: url, source: newId('src') } };
    this.emit('payment_intent.requires_action', intent, ctx);
  }

  /** Completes or fails the 3-D Secure step a browser would normally run. */
  authenticate(id: string, outcome: 'succeed' | 'fail', ctx: RequestContext): PaymentIntentObject {
    const intent = this.intent(id);
    if (intent.status !== 'requires_action') {
      throw invalidRequest(`This PaymentIntent has a status of ${intent.status}; only one in requires_action can be authenticated.`, {
        code: 'payment_intent_unexpected_state',
        payment_intent: clone(intent),
      });
    }
    const pm = intent.payment_method ? this.paymentMethods.get(intent.payment_method) : undefined;
    if (!pm) throw invalidRequest('This PaymentIntent has no payment method to authenticate.');
    intent.next_action = null;
    if (outcome === 'succeed') {
      this.settle(intent, pm, ctx, { result: 'authenticated' });
    } else {
      const previousStatus = intent.status;
      intent.status = 'requires_payment_method';
      intent.payment_method = null;
      intent.last_payment_error = {
        type: 'invalid_request_error',
        code: 'payment_intent_authentication_failure',
        message:
          'The provided PaymentMethod has failed authentication. You can provide payment_method_data or a new PaymentMethod to attempt to fulfill this PaymentIntent again.',
        doc_url: docUrl('payment_intent_authentication_failure'),
        payment_method: clone(pm.object),
      };
      this.emit('payment_intent.payment_failed', intent, ctx, { status: previousStatus });
    }
    return clone(intent);
  }

  private newCharge(
    intent: PaymentIntentObject,
    pm: { object: PaymentMethodObject; card: TestCard },
    outcome: ChargeObject['outcome'],
    failure: { code: string; message: string } | null,
    threeDSecure: { result: string } | null,
  ): ChargeObject {
    const paid = failure === null;
    const charge: ChargeObject = {
      id: newId('ch'),
      object: 'charge',
      amount: intent.amount,
      amount_captured: paid ? intent.amount : 0,
      amount_refunded: 0,
      application: null,
      application_fee: null,
      application_fee_amount: null,
      balance_transaction: paid ? newId('txn') : null,
      billing_details: clone(pm.object.billing_details),
      calculated_statement_descriptor: intent.statement_descriptor ?? 'SPOOLYARD',
      captured: paid,
      created: this.now(),
      currency: intent.currency,
      customer: intent.customer,
      description: intent.description,
      disputed: false,
      failure_balance_transaction: null,
      failure_code: failure?.code ?? null,
      failure_message: failure?.message ?? null,
      fraud_details: {},
      livemode: false,
      metadata: clone(intent.metadata),
      on_behalf_of: null,
      outcome,
      paid,
      payment_intent: intent.id,
      payment_method: pm.object.id,
      payment_method_details: {
        card: {
          brand: pm.card.brand,
          last4: pm.card.last4,
          exp_month: pm.object.card.exp_month,
          exp_year: pm.object.card.exp_year,
          funding: 'credit',
          country: 'US',
          three_d_secure: threeDSecure,
        },
        type: 'card',
      },
      receipt_email: intent.receipt_email,
      receipt_number: null,
      receipt_url: null,
      refunded: false,
      review: null,
      shipping: intent.shipping,
      source: null,
      source_transfer: null,
      statement_descriptor: intent.statement_descriptor,
      statement_descriptor_suffix: intent.statement_descriptor_suffix,
      status: paid ? 'succeeded' : 'failed',
      transfer_data: null,
      transfer_group: null,
    };
    this.charges.set(charge.id, charge);
    return charge;
  }

  private settle(
    intent: PaymentIntentObject,
    pm: { object: PaymentMethodObject; card: TestCard },
    ctx: RequestContext,
    threeDSecure: { result: string } | null,
  ): void {
    const succeed = () => {
      const previousStatus = intent.status;
      const charge = this.newCharge(
        intent,
        pm,
        { network_status: 'approved_by_network', reason: null, risk_level: 'normal', seller_message: 'Payment complete.', type: 'authorized' },
        null,
        threeDSecure,
      );
      intent.status = 'succeeded';
      intent.amount_received = intent.amount;
      intent.latest_charge = charge.id;
      intent.next_action = null;
      this.emit('charge.succeeded', charge, ctx);
      this.emit('payment_intent.succeeded', intent, ctx, { status: previousStatus });
    };
    if (this.options.processingDelayMs <= 0) {
      succeed();
      return;
    }
    intent.status = 'processing';
    this.emit('payment_intent.processing', intent, ctx);
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      if (intent.status === 'processing') succeed();
    }, this.options.processingDelayMs);
    this.timers.add(timer);
  }

  /** Records the failed attempt and answers with the provider's 402 card error. */
  private decline(
    intent: PaymentIntentObject,
    pm: { object: PaymentMethodObject; card: TestCard },
    ctx: RequestContext,
    failure: { code: string; declineCode: string; message: string },
  ): never {
    const charge = this.newCharge(
      intent,
      pm,
      {
        network_status: 'declined_by_network',
        reason: failure.declineCode,
        risk_level: 'normal',
        seller_message: 'The bank did not return any further details with this decline.',
        type: 'issuer_declined',
      },
      { code: failure.code, message: failure.message },
      null,
    );
    const previousStatus = intent.status;
    intent.status = 'requires_payment_method';
    intent.payment_method = null;
    intent.next_action = null;
    intent.latest_charge = charge.id;
    intent.last_payment_error = {
      type: 'card_error',
      code: failure.code,
      decline_code: failure.declineCode,
      message: failure.message,
      charge: charge.id,
      doc_url: docUrl(failure.code),
      payment_method: clone(pm.object),
    };
    this.emit('charge.failed', charge, ctx);
    this.emit('payment_intent.payment_failed', intent, ctx, { status: previousStatus });
    throw new ApiError(402, 'card_error', failure.message, {
      code: failure.code,
      decline_code: failure.declineCode,
      charge: charge.id,
      payment_intent: clone(intent),
      payment_method: clone(pm.object),
    });
  }

  cancelIntent(id: string, params: Params, ctx: RequestContext): PaymentIntentObject {
    const intent = this.intent(id);
    rejectUnknown(params, ['cancellation_reason', 'expand']);
    const reason = optString(params, 'cancellation_reason');
    if (reason !== undefined && !CANCELLATION_REASONS.includes(reason)) {
      throw invalidRequest(`Invalid cancellation_reason: must be one of ${CANCELLATION_REASONS.join(', ')}`, {
        param: 'cancellation_reason',
      });
    }
    if (!CANCELABLE.includes(intent.status)) {
      throw invalidRequest(
        `You cannot cancel this PaymentIntent because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be canceled: ${CANCELABLE.join(', ')}.`,
        { code: 'payment_intent_unexpected_state', payment_intent: clone(intent) },
      );
    }
    const previousStatus = intent.status;
    intent.status = 'canceled';
    intent.canceled_at = this.now();
    intent.cancellation_reason = reason ?? null;
    intent.next_action = null;
    this.emit('payment_intent.canceled', intent, ctx, { status: previousStatus });
    return clone(intent);
  }

  // Charges

  retrieveCharge(id: string): ChargeObject {
    const charge = this.charges.get(id);
    if (!charge) throw noSuch('charge', id, 'charge');
    return clone(charge);
  }

  listCharges(params: Params): ListObject<ChargeObject> {
    const pi = optString(params, 'payment_intent');
    const customer = optString(params, 'customer');
    const all = [...this.charges.values()].filter(
      (c) => (pi === undefined || c.payment_intent === pi) && (customer === undefined || c.customer === customer),
    );
    return this.page(all, params, '/v1/charges', ['payment_intent', 'customer']);
  }

  // Refunds

  createRefund(params: Params, ctx: RequestContext): RefundObject {
    rejectUnknown(params, ['payment_intent', 'charge', 'amount', 'reason', 'metadata', 'instructions_email', 'expand']);
    const piId = optString(params, 'payment_intent');
    const chargeId = optString(params, 'charge');
    if (piId === undefined && chargeId === undefined) {
      throw invalidRequest('One of the following params should be provided for this request: payment_intent or charge.', {
        code: 'parameter_missing',
      });
    }
    let charge: ChargeObject | undefined;
    if (chargeId !== undefined) {
      charge = this.charges.get(chargeId);
      if (!charge) throw noSuch('charge', chargeId, 'charge', 400);
      if (piId !== undefined && charge.payment_intent !== piId) {
        throw invalidRequest(`Charge ${chargeId} does not belong to PaymentIntent ${piId}.`, { param: 'charge' });
      }
    } else if (piId !== undefined) {
      const intent = this.intent(piId, 'payment_intent', 400);
      charge = intent.latest_charge ? this.charges.get(intent.latest_charge) : undefined;
      if (!charge || intent.status !== 'succeeded') {
        throw invalidRequest(`This PaymentIntent (${piId}) does not have a successful charge to refund.`, {
          param: 'payment_intent',
        });
      }
    }
    if (!charge || charge.status !== 'succeeded') {
      throw invalidRequest(`Charge ${charge?.id ?? ''} has not succeeded and cannot be refunded.`, { param: 'charge' });
    }
    const remaining = charge.amount_captured - charge.amount_refunded;
    if (remaining <= 0) {
      throw invalidRequest(`Charge ${charge.id} has already been refunded.`, { code: 'charge_already_refunded' });
    }
    const amount = optInteger(params, 'amount') ?? remaining;
    if (amount < 1) {
      throw invalidRequest('Invalid positive integer', { code: 'parameter_invalid_integer', param: 'amount' });
    }
    if (amount > remaining) {
      throw invalidRequest(
        `Refund amount (${amount} ${charge.currency} minor units) is greater than unrefunded amount on charge (${remaining}).`,
        { code: 'amount_too_large', param: 'amount' },
      );
    }
    const reason = optString(params, 'reason');
    if (reason !== undefined && !REFUND_REASONS.includes(reason)) {
      throw invalidRequest(`Invalid reason: must be one of ${REFUND_REASONS.join(', ')}`, { param: 'reason' });
    }
    const refund: RefundObject = {
      id: newId('re'),
      object: 'refund',
      amount,
      balance_transaction: newId('txn'),
      charge: charge.id,
      created: this.now(),
      currency: charge.currency,
      destination_details: { card: { type: 'refund' }, type: 'card' },
      metadata: applyMetadata({}, params),
      payment_intent: charge.payment_intent,
      reason: reason ?? null,
      receipt_number: null,
      source_transfer_reversal: null,
      status: 'succeeded',
      transfer_reversal: null,
    };
    this.refunds.set(refund.id, refund);
    const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount_captured;
    this.emit('refund.created', refund, ctx);
    // The provider sends charge.refunded for partial refunds too; amount_refunded tells them apart.
    this.emit('charge.refunded', charge, ctx, previous);
    return clone(refund);
  }

  retrieveRefund(id: string): RefundObject {
    const refund = this.refunds.get(id);
    if (!refund) throw noSuch('refund', id, 'refund');
    return clone(refund);
  }

  listRefunds(params: Params): ListObject<RefundObject> {
    const pi = optString(params, 'payment_intent');
    const charge = optString(params, 'charge');
    const all = [...this.refunds.values()].filter(
      (r) => (pi === undefined || r.payment_intent === pi) && (charge === undefined || r.charge === charge),
    );
    return this.page(all, params, '/v1/refunds', ['payment_intent', 'charge']);
  }

  // Events

  retrieveEvent(id: string): EventObject {
    const event = this.eventLog.get(id);
    if (!event) throw noSuch('event', id, 'id');
    return clone(event);
  }

  listEvents(params: Params): ListObject<EventObject> {
    const type = optString(params, 'type');
    const all = [...this.eventLog.values()].filter((e) => type === undefined || e.type === type);
    return this.page(all, params, '/v1/events', ['type', 'delivery_success']);
  }

  // Expansion of ids into objects, for the few fields the storefront may ask for.

  expand<T extends object>(object: T, params: Params): T {
    const paths = optStringList(params, 'expand');
    if (!paths || paths.length === 0) return object;
    const record = object as Record<string, unknown>;
    const lookups: Record<string, (id: string) => unknown> = {
      customer: (id) => this.customers.get(id),
      latest_charge: (id) => this.charges.get(id),
      charge: (id) => this.charges.get(id),
      payment_intent: (id) => this.intents.get(id),
      payment_method: (id) => this.paymentMethods.get(id)?.object,
    };
    const out: Record<string, unknown> = { ...record };
    for (const path of paths) {
      const lookup = lookups[path];
      if (!lookup || !(path in record)) {
        throw invalidRequest(`This property cannot be expanded (${path}).`, { param: 'expand' });
      }
      const id = record[path];
      if (typeof id === 'string') out[path] = clone(lookup(id) ?? id);
    }
    return out as T;
  }

  private page<T extends { id: string; created: number }>(
    items: T[],
    params: Params,
    url: string,
    filters: readonly string[],
  ): ListObject<T> {
    rejectUnknown(params, [...filters, 'limit', 'starting_after', 'ending_before', 'created', 'expand']);
    const limit = optInteger(params, 'limit') ?? 10;
    if (limit < 1 || limit > 100) {
      throw invalidRequest('This value must be between 1 and 100.', { param: 'limit' });
    }
    // Newest first; insertion order breaks ties within the same second.
    const sorted = items.map((item, index) => ({ item, index })).sort((a, b) => b.item.created - a.item.created || b.index - a.index);
    let list = sorted.map((s) => s.item);
    const after = optString(params, 'starting_after');
    const before = optString(params, 'ending_before');
    if (after !== undefined) {
      const at = list.findIndex((item) => item.id === after);
      if (at < 0) throw noSuch('object', after, 'starting_after', 400);
      list = list.slice(at + 1);
    } else if (before !== undefined) {
      const at = list.findIndex((item) => item.id === before);
      if (at < 0) throw noSuch('object', before, 'ending_before', 400);
      list = list.slice(Math.max(0, at - limit), at);
      return { object: 'list', data: clone(list), has_more: at - limit > 0, url };
    }
    return { object: 'list', data: clone(list.slice(0, limit)), has_more: list.length > limit, url };
  }
}
