import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { startPaymentsFake, type PaymentsFake, type PaymentsFakeOptions } from '../../fakes/payments/payments-fake';
import { TEST_PAYMENT_METHODS } from '../../shared/payment-test-methods';
import { startWebhookReceiver, type WebhookReceiver } from './webhook-receiver';

// Signatures are checked with the SDK's own webhooks.constructEvent, the reference the app will use.

const SECRET = 'whsec_test_webhook_suite';
const KEY = 'sk_test_webhook_suite';

const cleanup: Array<() => Promise<void>> = [];
afterEach(async () => {
  for (const close of cleanup.splice(0).reverse()) await close();
});

async function setup(options: Partial<PaymentsFakeOptions> = {}): Promise<{ fake: PaymentsFake; stripe: Stripe; receiver: WebhookReceiver }> {
  const fake = await startPaymentsFake({ port: 0, webhookSecret: SECRET, retryDelaysMs: [30, 60], webhookDelayMs: 0, ...options });
  cleanup.push(() => fake.close());
  const stripe = new Stripe(KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
  const receiver = await startWebhookReceiver(stripe, SECRET);
  cleanup.push(() => receiver.close());
  if (options.webhookUrl === undefined) fake.setWebhookUrl(receiver.url);
  return { fake, stripe, receiver };
}

async function pay(stripe: Stripe, amount = 25_000): Promise<Stripe.PaymentIntent> {
  return stripe.paymentIntents.create({ amount, currency: 'usd', payment_method: TEST_PAYMENT_METHODS.success, confirm: true });
}

describe('webhook delivery', () => {
  it('posts a payment\'s event after answering the call that caused it, the set wait later', async () => {
    const { fake, stripe, receiver } = await setup({ webhookDelayMs: 300 });
    const intent = await pay(stripe);
    // The answer is here and the event is not yet: the provider posts events on their own, after the call.
    expect(receiver.received).toHaveLength(0);
    expect(fake.events().find((e) => e.event.type === 'payment_intent.succeeded')?.state).toBe('pending');
    await fake.waitForWebhooks();
    const delivered = receiver.received.filter((r) => r.event?.type === 'payment_intent.succeeded');
    expect(delivered.map((d) => (d.event?.data.object as Stripe.PaymentIntent).id)).toEqual([intent.id]);
  });

  it('retries after the app answers 500 and then records the event as delivered', async () => {
    const { fake, stripe, receiver } = await setup();
    receiver.failNext(500);
    const intent = await pay(stripe);
    await fake.waitForWebhooks();

    const deliveries = receiver.received.filter((r) => r.event?.type === 'payment_intent.succeeded');
    expect(deliveries.map((d) => d.answeredWith)).toEqual([500, 200]);
    expect(new Set(deliveries.map((d) => d.event?.id)).size).toBe(1);
    expect(deliveries.every((d) => d.verifyError === null)).toBe(true);
    expect((deliveries[1]?.event?.data.object as Stripe.PaymentIntent).id).toBe(intent.id);

    const record = fake.events().find((e) => e.event.type === 'payment_intent.succeeded');
    expect(record?.state).toBe('delivered');
    expect(record?.attempts.map((a) => a.status)).toEqual([500, 200]);
  });

  it('gives up after the bounded attempts when the app keeps failing', async () => {
    const { fake, stripe, receiver } = await setup();
    receiver.failNext(500, 503, 500);
    await pay(stripe);
    await fake.waitForWebhooks();
    const record = fake.events().find((e) => e.event.type === 'payment_intent.succeeded');
    expect(record?.state).toBe('failed');
    expect(record?.attempts).toHaveLength(3); // 1 + retryDelaysMs.length
  });

  it('retries when the app is unreachable', async () => {
    // A port that was free a moment ago: nothing listens there.
    const probe = createServer();
    await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
    const deadPort = (probe.address() as AddressInfo).port;
    await new Promise<void>((resolve) => probe.close(() => resolve()));

    const { fake, stripe } = await setup({ webhookUrl: `http://127.0.0.1:${deadPort}/hook` });
    await pay(stripe);
    await fake.waitForWebhooks();
    const record = fake.events().find((e) => e.event.type === 'payment_intent.succeeded');
    expect(record?.state).toBe('failed');
    expect(record?.attempts).toHaveLength(3);
    expect(record?.attempts.every((a) => a.status === null && a.error !== null)).toBe(true);
  });

  it('re-sends an event with the same id through the test hook, signed afresh', async () => {
    const { fake, stripe, receiver } = await setup();
    await pay(stripe);
    const first = await receiver.waitFor((r) => r.event?.type === 'payment_intent.succeeded');
    const eventId = first.event?.id ?? '';

    const response = await fetch(`${fake.url}/_test/events/${eventId}/resend`, { method: 'POST' });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { attempt: { status: number; kind: string } };
    expect(body.attempt).toMatchObject({ status: 200, kind: 'resend' });

    const copies = receiver.received.filter((r) => r.event?.id === eventId);
    expect(copies).toHaveLength(2);
    expect(copies.every((c) => c.verifyError === null)).toBe(true);
  });

  it('posts only the subscribed event types, while the API lists them all', async () => {
    const { fake, stripe, receiver } = await setup();
    await pay(stripe);
    await fake.waitForWebhooks();
    expect(receiver.received.map((r) => r.event?.type)).toEqual(['payment_intent.succeeded']);

    const events = await stripe.events.list({ limit: 100 });
    const types = events.data.map((e) => e.type);
    expect(types).toEqual(expect.arrayContaining(['payment_intent.created', 'charge.succeeded', 'payment_intent.succeeded']));
    const posted = receiver.received[0]?.event;
    expect((await stripe.events.retrieve(posted?.id ?? '')).id).toBe(posted?.id);
  });

  it('stamps events with the API version the SDK asked for', async () => {
    const { stripe, receiver } = await setup();
    await pay(stripe);
    const hit = await receiver.waitFor((r) => r.event?.type === 'payment_intent.succeeded');
    expect(hit.event?.api_version).toBe(Stripe.API_VERSION);
  });

  it('with a processing delay, confirm answers processing and the payment succeeds later', async () => {
    const { stripe, receiver } = await setup({ processingDelayMs: 50 });
    const intent = await pay(stripe);
    expect(intent.status).toBe('processing');
    await receiver.waitFor((r) => r.event?.type === 'payment_intent.succeeded');
    expect((await stripe.paymentIntents.retrieve(intent.id)).status).toBe('succeeded');
  });
});
