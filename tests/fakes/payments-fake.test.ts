import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startPaymentsFake, type PaymentsFake } from '../../fakes/payments/payments-fake';
import { TEST_PAYMENT_METHODS } from '../../shared/payment-test-methods';
import { startWebhookReceiver, type WebhookReceiver } from './webhook-receiver';

/*
 * The reference here is the official SDK itself: every call goes through `stripe` as the app will make it,
 * so request encoding, error classes and webhook signatures are checked by the library that consumes them.
 */

const SECRET = 'whsec_test_fake_suite';
const KEY = 'sk_test_spoolyard_suite';

let fake: PaymentsFake;
let receiver: WebhookReceiver;
let stripe: Stripe;

beforeAll(async () => {
  fake = await startPaymentsFake({ port: 0, webhookUrl: null, webhookSecret: SECRET, retryDelaysMs: [20, 40] });
  stripe = new Stripe(KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
  receiver = await startWebhookReceiver(stripe, SECRET);
  fake.setWebhookUrl(receiver.url);
});

afterAll(async () => {
  await fake?.close();
  await receiver?.close();
});

beforeEach(() => {
  receiver.received.length = 0;
});

async function caught(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('expected the call to fail');
}

describe('customers', () => {
  it('creates and retrieves a customer; an unknown id is 404 resource_missing', async () => {
    const created = await stripe.customers.create({
      email: 'buyer@retail.test',
      name: 'Pat Retail',
      metadata: { userId: 'u1' },
    });
    expect(created.id).toMatch(/^cus_/);
    const fetched = await stripe.customers.retrieve(created.id);
    expect(fetched).toMatchObject({ id: created.id, object: 'customer', email: 'buyer@retail.test', metadata: { userId: 'u1' } });

    const error = await caught(stripe.customers.retrieve('cus_missing'));
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error).toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('refuses an unknown parameter like the provider', async () => {
    const error = await caught(stripe.customers.create({ emial: 'x@retail.test' } as Stripe.CustomerCreateParams));
    expect(error).toMatchObject({ statusCode: 400, code: 'parameter_unknown', param: 'emial' });
  });
});

describe('payment intents', () => {
  it('create then confirm with the success card succeeds and a signed payment_intent.succeeded arrives', async () => {
    const customer = await stripe.customers.create({ email: 'buyer@retail.test' });
    const created = await stripe.paymentIntents.create({
      amount: 48_250,
      currency: 'usd',
      customer: customer.id,
      metadata: { orderNumber: 'SY-1001' },
    });
    expect(created.status).toBe('requires_payment_method');
    expect(created.client_secret).toMatch(new RegExp(`^${created.id}_secret_`));

    const withMethod = await stripe.paymentIntents.update(created.id, { payment_method: TEST_PAYMENT_METHODS.success });
    expect(withMethod.status).toBe('requires_confirmation');

    const confirmed = await stripe.paymentIntents.confirm(created.id);
    expect(confirmed).toMatchObject({ status: 'succeeded', amount_received: 48_250 });
    expect(confirmed.latest_charge).toMatch(/^ch_/);

    const hit = await receiver.waitFor((r) => r.event?.type === 'payment_intent.succeeded');
    expect(hit.verifyError).toBeNull();
    expect(hit.event?.id).toMatch(/^evt_/);
    const object = hit.event?.data.object as Stripe.PaymentIntent;
    expect(object).toMatchObject({ id: created.id, status: 'succeeded', metadata: { orderNumber: 'SY-1001' } });

    // A forged signature must not verify: the header is bound to the secret and the exact body.
    expect(() => stripe.webhooks.constructEvent(hit.rawBody, hit.signature ?? '', 'whsec_wrong')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => stripe.webhooks.constructEvent(`${hit.rawBody} `, hit.signature ?? '', SECRET)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('a decline is a 402 StripeCardError and the intent is back at requires_payment_method', async () => {
    const intent = await stripe.paymentIntents.create({ amount: 9_900, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.declined });
    expect(intent.status).toBe('requires_confirmation');
    const error = await caught(stripe.paymentIntents.confirm(intent.id));
    expect(error).toBeInstanceOf(Stripe.errors.StripeCardError);
    const cardError = error as Stripe.errors.StripeCardError;
    expect(cardError).toMatchObject({ statusCode: 402, type: 'StripeCardError', code: 'card_declined', decline_code: 'generic_decline' });
    expect(cardError.payment_intent).toMatchObject({ id: intent.id, status: 'requires_payment_method' });

    const after = await stripe.paymentIntents.retrieve(intent.id);
    expect(after.status).toBe('requires_payment_method');
    expect(after.payment_method).toBeNull();
    expect(after.last_payment_error).toMatchObject({ type: 'card_error', code: 'card_declined', decline_code: 'generic_decline' });

    const failed = await receiver.waitFor((r) => r.event?.type === 'payment_intent.payment_failed');
    expect((failed.event?.data.object as Stripe.PaymentIntent).id).toBe(intent.id);

    // The buyer may try again with another card on the same intent.
    const retried = await stripe.paymentIntents.confirm(intent.id, { payment_method: TEST_PAYMENT_METHODS.success });
    expect(retried.status).toBe('succeeded');
  });

  it('insufficient funds carries its own decline code', async () => {
    const error = await caught(
      stripe.paymentIntents.create({ amount: 5_000, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.insufficientFunds, confirm: true }),
    );
    expect(error).toMatchObject({ statusCode: 402, code: 'card_declined', decline_code: 'insufficient_funds' });
  });

  it('authentication required goes to requires_action; the test hook completes or fails it', async () => {
    const intent = await stripe.paymentIntents.create({
      amount: 120_000,
      currency: 'usd',
      payment_method: TEST_PAYMENT_METHODS.authenticationRequired,
      confirm: true,
    });
    expect(intent.status).toBe('requires_action');
    expect(intent.next_action?.type).toBe('use_stripe_sdk');

    const hook = await fetch(`${fake.url}/_test/payment_intents/${intent.id}/authenticate`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ outcome: 'succeed' }),
    });
    expect(hook.status).toBe(200);
    const done = await stripe.paymentIntents.retrieve(intent.id);
    expect(done.status).toBe('succeeded');
    expect(done.next_action).toBeNull();

    const second = await stripe.paymentIntents.create({
      amount: 120_000,
      currency: 'usd',
      payment_method: TEST_PAYMENT_METHODS.authenticationRequired,
      confirm: true,
      return_url: 'http://127.0.0.1:3000/checkout/return',
    });
    expect(second.next_action?.redirect_to_url?.url).toBe(`${fake.url}/_test/authenticate/${second.id}`);
    fake.authenticate(second.id, 'fail');
    const failed = await stripe.paymentIntents.retrieve(second.id);
    expect(failed.status).toBe('requires_payment_method');
    expect(failed.last_payment_error?.code).toBe('payment_intent_authentication_failure');
  });

  it('the redirect flow: the authentication page sends the buyer back to return_url', async () => {
    const intent = await stripe.paymentIntents.create({
      amount: 30_000,
      currency: 'usd',
      payment_method: TEST_PAYMENT_METHODS.authenticationRequired,
      confirm: true,
      return_url: 'http://127.0.0.1:3000/checkout/return',
    });
    const pageUrl = intent.next_action?.redirect_to_url?.url ?? '';
    const page = await fetch(pageUrl);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Complete authentication');

    const submit = await fetch(pageUrl, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ outcome: 'succeed', return_url: 'http://127.0.0.1:3000/checkout/return' }),
      redirect: 'manual',
    });
    expect(submit.status).toBe(303);
    const location = new URL(submit.headers.get('location') ?? '');
    expect(location.pathname).toBe('/checkout/return');
    expect(location.searchParams.get('payment_intent')).toBe(intent.id);
    expect(location.searchParams.get('redirect_status')).toBe('succeeded');
    expect((await stripe.paymentIntents.retrieve(intent.id)).status).toBe('succeeded');
  });

  it('off-session, a card that needs authentication is declined with authentication_required', async () => {
    const error = await caught(
      stripe.paymentIntents.create({
        amount: 5_000,
        currency: 'usd',
        payment_method: TEST_PAYMENT_METHODS.authenticationRequired,
        confirm: true,
        off_session: true,
      }),
    );
    expect(error).toMatchObject({ statusCode: 402, code: 'authentication_required' });
  });

  it('cancels an open intent; a canceled one cannot be confirmed or canceled again', async () => {
    const intent = await stripe.paymentIntents.create({ amount: 7_700, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.success });
    const canceled = await stripe.paymentIntents.cancel(intent.id, { cancellation_reason: 'abandoned' });
    expect(canceled).toMatchObject({ status: 'canceled', cancellation_reason: 'abandoned' });
    expect(canceled.canceled_at).toEqual(expect.any(Number));

    const confirmError = await caught(stripe.paymentIntents.confirm(intent.id));
    expect(confirmError).toMatchObject({ statusCode: 400, code: 'payment_intent_unexpected_state' });
    const cancelError = await caught(stripe.paymentIntents.cancel(intent.id));
    expect(cancelError).toMatchObject({ statusCode: 400, code: 'payment_intent_unexpected_state' });
  });

  it('a succeeded intent cannot be canceled', async () => {
    const paid = await stripe.paymentIntents.create({ amount: 6_000, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.success, confirm: true });
    const error = await caught(stripe.paymentIntents.cancel(paid.id));
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });

  it('an unknown intent is 404 resource_missing', async () => {
    const error = await caught(stripe.paymentIntents.retrieve('pi_missing'));
    expect(error).toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('expands latest_charge on request', async () => {
    const paid = await stripe.paymentIntents.create({ amount: 6_000, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.success, confirm: true });
    const expanded = await stripe.paymentIntents.retrieve(paid.id, { expand: ['latest_charge'] });
    const charge = expanded.latest_charge as Stripe.Charge;
    expect(charge).toMatchObject({ object: 'charge', amount: 6_000, status: 'succeeded', payment_intent: paid.id });
  });
});

describe('refunds', () => {
  it('refunds part, refuses more than remains, lists by intent and sends charge.refunded', async () => {
    const paid = await stripe.paymentIntents.create({ amount: 50_000, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.success, confirm: true });
    const partial = await stripe.refunds.create({ payment_intent: paid.id, amount: 20_000, reason: 'requested_by_customer' });
    expect(partial).toMatchObject({ object: 'refund', amount: 20_000, status: 'succeeded', payment_intent: paid.id });
    expect(await stripe.refunds.retrieve(partial.id)).toMatchObject({ id: partial.id, amount: 20_000 });

    const hit = await receiver.waitFor((r) => r.event?.type === 'charge.refunded');
    expect(hit.event?.data.object).toMatchObject({ amount_refunded: 20_000, refunded: false });

    const over = await caught(stripe.refunds.create({ payment_intent: paid.id, amount: 30_001 }));
    expect(over).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(over).toMatchObject({ statusCode: 400, type: 'StripeInvalidRequestError', param: 'amount' });

    const rest = await stripe.refunds.create({ payment_intent: paid.id });
    expect(rest.amount).toBe(30_000);
    const again = await caught(stripe.refunds.create({ payment_intent: paid.id, amount: 1 }));
    expect(again).toMatchObject({ statusCode: 400, code: 'charge_already_refunded' });

    const list = await stripe.refunds.list({ payment_intent: paid.id });
    expect(list.data.map((r) => r.amount)).toEqual([30_000, 20_000]);
    const charge = await stripe.charges.retrieve(String(paid.latest_charge));
    expect(charge).toMatchObject({ amount_refunded: 50_000, refunded: true });
  });

  it('an intent that never succeeded cannot be refunded', async () => {
    const open = await stripe.paymentIntents.create({ amount: 5_000, currency: 'usd' });
    const error = await caught(stripe.refunds.create({ payment_intent: open.id }));
    expect(error).toMatchObject({ statusCode: 400 });
  });
});

describe('idempotency keys', () => {
  it('replays the saved response for the same key and parameters', async () => {
    const first = await stripe.customers.create({ email: 'dealer@trade.test' }, { idempotencyKey: 'cust-key-1' });
    const second = await stripe.customers.create({ email: 'dealer@trade.test' }, { idempotencyKey: 'cust-key-1' });
    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    const list = await stripe.customers.list({ email: 'dealer@trade.test' });
    expect(list.data).toHaveLength(1);
  });

  it('replays a decline instead of charging the card again', async () => {
    const params: Stripe.PaymentIntentCreateParams = {
      amount: 5_000,
      currency: 'usd',
      payment_method: TEST_PAYMENT_METHODS.declined,
      confirm: true,
    };
    const a = (await caught(stripe.paymentIntents.create(params, { idempotencyKey: 'decline-key' }))) as Stripe.errors.StripeCardError;
    const b = (await caught(stripe.paymentIntents.create(params, { idempotencyKey: 'decline-key' }))) as Stripe.errors.StripeCardError;
    expect(a.statusCode).toBe(402);
    expect(b.statusCode).toBe(402);
    expect((b.payment_intent as Stripe.PaymentIntent).id).toBe((a.payment_intent as Stripe.PaymentIntent).id);
    expect(b.charge).toBe(a.charge);
  });

  it('refuses the same key with different parameters as an idempotency error', async () => {
    await stripe.paymentIntents.create({ amount: 5_000, currency: 'usd' }, { idempotencyKey: 'pi-key-1' });
    const error = await caught(stripe.paymentIntents.create({ amount: 5_001, currency: 'usd' }, { idempotencyKey: 'pi-key-1' }));
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(error).toMatchObject({ statusCode: 400, rawType: 'idempotency_error' });

    const otherEndpoint = await caught(stripe.customers.create({}, { idempotencyKey: 'pi-key-1' }));
    expect(otherEndpoint).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });
});

describe('authentication', () => {
  it('rejects an unknown or live key with StripeAuthenticationError', async () => {
    for (const key of ['sk_live_not_here', 'not_a_key']) {
      const client = new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
      const error = await caught(client.customers.create({ email: 'buyer@retail.test' }));
      expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
      expect(error).toMatchObject({ statusCode: 401 });
    }
  });

  it('accepts only the configured key when one is set', async () => {
    const strict = await startPaymentsFake({ port: 0, webhookSecret: SECRET, apiKey: 'sk_test_only_this_one' });
    try {
      const wrong = new Stripe('sk_test_some_other', { host: '127.0.0.1', port: strict.port, protocol: 'http' });
      expect(await caught(wrong.customers.create({}))).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
      const right = new Stripe('sk_test_only_this_one', { host: '127.0.0.1', port: strict.port, protocol: 'http' });
      expect((await right.customers.create({})).id).toMatch(/^cus_/);
    } finally {
      await strict.close();
    }
  });
});
