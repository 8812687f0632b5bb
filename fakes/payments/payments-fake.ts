import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type ErrorRequestHandler, type Request, type RequestHandler, type Response } from 'express';
import { ApiError, invalidRequest } from './api-error';
import { IdempotencyStore, stableStringify } from './idempotency-store';
import { asParams, type Params } from './params';
import { PaymentsLedger, newId, type PaymentIntentObject, type RequestContext } from './payments-ledger';
import { TEST_CARDS } from '../../shared/payment-test-methods';
import { FaultSwitches, type FaultInput } from './fault-switches';
import { WebhookDispatcher, type DeliveryAttempt, type EventRecord } from './webhook-dispatcher';

/** The event types the storefront subscribes to. */
export const DEFAULT_WEBHOOK_EVENTS = ['payment_intent.succeeded', 'payment_intent.payment_failed', 'charge.refunded'] as const;

/**
 * How long after a payment's event its webhook is first posted. The provider answers the API call and posts the events
 * it caused afterwards, on their own; a short wait keeps that order here even when the app is busy answering others.
 */
export const DEFAULT_WEBHOOK_DELAY_MS = 250;

/** Growing gaps between webhook attempts; short enough for development, bounded to five attempts. */
export const DEFAULT_RETRY_DELAYS_MS = [1_000, 5_000, 20_000, 60_000] as const;

export interface PaymentsFakeOptions {
  /** 0 picks a free port. */
  port?: number;
  host?: string;
  /** Where events are posted; null stores them without posting. */
  webhookUrl?: string | null;
  /** Must start with `whsec_`. */
  webhookSecret: string;
  /** When set, only this key is accepted; otherwise any `sk_test_...` key is. */
  apiKey?: string;
  retryDelaysMs?: readonly number[];
  /** Wait before an event's first post (DEFAULT_WEBHOOK_DELAY_MS); 0 posts it as soon as the call is answered. */
  webhookDelayMs?: number;
  webhookTimeoutMs?: number;
  /** Event types posted to the webhook URL; '*' posts all. Every event is still listed by the API. */
  enabledEvents?: readonly string[];
  /** Above 0, a confirmed card payment waits in `processing` this long before it succeeds. */
  processingDelayMs?: number;
  /** The `api_version` stamped on events; by default the version the last API request asked for. */
  apiVersion?: string;
}

export interface PaymentsFake {
  url: string;
  port: number;
  close(): Promise<void>;
  /** Every event with its delivery attempts, oldest first. */
  events(): EventRecord[];
  /** Posts one event again with the same id (a duplicate delivery). */
  resendEvent(eventId: string): Promise<DeliveryAttempt>;
  /** Finishes the 3-D Secure step of an intent in `requires_action`. */
  authenticate(paymentIntentId: string, outcome: 'succeed' | 'fail'): PaymentIntentObject;
  setWebhookUrl(url: string | null): void;
  /** Resolves once no webhook is being posted or waiting for a retry. */
  waitForWebhooks(timeoutMs?: number): Promise<void>;
  /** Test-only faults on API requests (drop the reply, delay it, answer 5xx); also at POST/DELETE /_test/faults. */
  addFault(fault: FaultInput): { id: number };
  clearFaults(): void;
  /** Forgets every object, event, idempotency key and fault. */
  reset(): void;
}

const API_VERSION_PATTERN = /^\d{4}-\d{2}-\d{2}(\.[a-z_]+)?$/;

function readApiKey(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value] = header.split(' ', 2);
  if (!value) return null;
  if (scheme?.toLowerCase() === 'bearer') return value.trim();
  if (scheme?.toLowerCase() === 'basic') {
    // curl -u sk_test_...: sends the key as the user name with an empty password.
    return Buffer.from(value, 'base64').toString('utf8').split(':')[0] ?? null;
  }
  return null;
}

function maskKey(key: string): string {
  return key.length <= 12 ? '*'.repeat(key.length) : `${key.slice(0, 8)}${'*'.repeat(key.length - 12)}${key.slice(-4)}`;
}

/** A JSON answer written at once (what Express's res.json ends with, without its content negotiation). */
function sendJson(res: Response, status: number, body: unknown): void {
  const json = JSON.stringify(body);
  res.statusCode = status;
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.setHeader('Content-Length', Buffer.byteLength(json));
  res.end(json);
}

function sendError(res: Response, error: ApiError): void {
  sendJson(res, error.status, error.toBody());
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function authenticationPage(intent: PaymentIntentObject, returnUrl: string | undefined): string {
  const hidden = returnUrl ? `<input type="hidden" name="return_url" value="${escapeHtml(returnUrl)}">` : '';
  const amount = `${(intent.amount / 100).toFixed(2)} ${intent.currency.toUpperCase()}`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Test card authentication</title></head>
<body style="font-family: sans-serif; max-width: 32rem; margin: 3rem auto">
<h1>Test card authentication</h1>
<p>This page stands in for the card issuer's 3-D Secure check. Payment ${escapeHtml(intent.id)} for ${escapeHtml(amount)}.</p>
<form method="post"><input type="hidden" name="outcome" value="succeed">${hidden}<button type="submit">Complete authentication</button></form>
<form method="post"><input type="hidden" name="outcome" value="fail">${hidden}<button type="submit">Fail authentication</button></form>
</body></html>`;
}

export async function startPaymentsFake(options: PaymentsFakeOptions): Promise<PaymentsFake> {
  if (!options.webhookSecret.startsWith('whsec_')) {
    throw new Error('webhookSecret must start with whsec_');
  }
  if (options.apiKey !== undefined && !options.apiKey.startsWith('sk_test_')) {
    throw new Error('apiKey must start with sk_test_');
  }
  const host = options.host ?? '127.0.0.1';
  let baseUrl = '';
  let lastApiVersion: string | null = null;

  const dispatcher = new WebhookDispatcher({
    secret: options.webhookSecret,
    url: options.webhookUrl ?? null,
    retryDelaysMs: options.retryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
    firstAttemptDelayMs: options.webhookDelayMs ?? DEFAULT_WEBHOOK_DELAY_MS,
    timeoutMs: options.webhookTimeoutMs ?? 10_000,
    enabledEvents: options.enabledEvents ?? DEFAULT_WEBHOOK_EVENTS,
    maxRecords: 5_000,
  });
  const ledger = new PaymentsLedger({
    baseUrl: () => baseUrl,
    apiVersion: () => options.apiVersion ?? lastApiVersion,
    onEvent: (event) => dispatcher.enqueue(event),
    processingDelayMs: options.processingDelayMs ?? 0,
  });
  const idempotency = new IdempotencyStore();
  const faults = new FaultSwitches();
  const testContext = (): RequestContext => ({ requestId: null, idempotencyKey: null });

  type Handler = (params: Params, req: Request, ctx: RequestContext) => unknown;

  /** Runs one API call; POSTs with an idempotency key are saved and replayed as the provider does. */
  const handle =
    (fn: Handler): RequestHandler =>
    (req, res) => {
      const isPost = req.method === 'POST';
      const params = asParams(isPost ? req.body : req.query);
      const ctx: RequestContext = { requestId: String(res.locals.requestId), idempotencyKey: null };
      const apiKey = String(res.locals.apiKey);
      const key = isPost ? req.get('Idempotency-Key') : undefined;
      const fingerprint = stableStringify(params);
      if (key) {
        ctx.idempotencyKey = key;
        res.set('Idempotency-Key', key);
        const saved = idempotency.get(apiKey, key);
        if (saved) {
          if (saved.path !== req.path) {
            sendError(
              res,
              new ApiError(
                400,
                'idempotency_error',
                `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${saved.path}' vs '${req.path}'). Try using a key other than '${key}' if you meant to execute a different request.`,
              ),
            );
            return;
          }
          if (saved.fingerprint !== fingerprint) {
            sendError(
              res,
              new ApiError(
                400,
                'idempotency_error',
                `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
              ),
            );
            return;
          }
          res.set('Idempotent-Replayed', 'true');
          sendJson(res, saved.status, saved.body);
          return;
        }
      }
      let status = 200;
      let body: unknown;
      try {
        body = fn(params, req, ctx);
      } catch (error) {
        const apiError =
          error instanceof ApiError
            ? error
            : new ApiError(500, 'api_error', `The payments fake failed: ${error instanceof Error ? error.message : String(error)}`);
        if (!(error instanceof ApiError)) console.error('payments fake:', error);
        status = apiError.status;
        body = apiError.toBody();
      }
      // Requests refused while validating are not saved (the provider's rule); results of executing are.
      if (key && (status < 400 || status === 402 || status >= 500)) {
        idempotency.set(apiKey, key, { path: req.path, fingerprint, status, body });
      }
      sendJson(res, status, body);
    };

  const id = (req: Request): string => String(req.params.id);

  const app = express();
  app.disable('x-powered-by');
  app.disable('etag');
  // Bracketed query keys (expand[0]=...) decode to arrays and objects, as in request bodies.
  app.set('query parser', 'extended');

  app.use('/v1', (req, res, next) => {
    const requestId = newId('req', 14);
    res.locals.requestId = requestId;
    res.set('Request-Id', requestId);
    const version = req.get('Stripe-Version');
    if (version !== undefined) {
      if (!API_VERSION_PATTERN.test(version)) {
        sendError(res, invalidRequest(`Invalid API version: ${version}`));
        return;
      }
      lastApiVersion = version;
      res.set('Stripe-Version', version);
    } else if (options.apiVersion ?? lastApiVersion) {
      res.set('Stripe-Version', options.apiVersion ?? lastApiVersion ?? '');
    }
    const apiKey = readApiKey(req.get('Authorization'));
    if (!apiKey) {
      sendError(
        res,
        new ApiError(
          401,
          'invalid_request_error',
          "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
        ),
      );
      return;
    }
    const accepted = options.apiKey !== undefined ? apiKey === options.apiKey : /^sk_test_\w+$/.test(apiKey);
    if (!accepted) {
      const why = apiKey.startsWith('sk_live_') ? ' The payments fake accepts test-mode keys only.' : '';
      sendError(res, new ApiError(401, 'invalid_request_error', `Invalid API Key provided: ${maskKey(apiKey)}${why}`));
      return;
    }
    res.locals.apiKey = apiKey;
    next();
  });
  app.use('/v1', faults.middleware());
  app.use('/v1', express.urlencoded({ extended: true, limit: '1mb', parameterLimit: 2_000 }));

  app.post('/v1/customers', handle((p, _req, ctx) => ledger.createCustomer(p, ctx)));
  app.get('/v1/customers', handle((p) => ledger.listCustomers(p)));
  app.get('/v1/customers/:id', handle((p, req) => ledger.expand(ledger.retrieveCustomer(id(req)), p)));
  app.post('/v1/customers/:id', handle((p, req, ctx) => ledger.updateCustomer(id(req), p, ctx)));

  app.post('/v1/payment_intents', handle((p, _req, ctx) => ledger.expand(ledger.createIntent(p, ctx), p)));
  app.get('/v1/payment_intents', handle((p) => ledger.listIntents(p)));
  app.get('/v1/payment_intents/:id', handle((p, req) => ledger.expand(ledger.retrieveIntent(id(req)), p)));
  app.post('/v1/payment_intents/:id', handle((p, req, ctx) => ledger.expand(ledger.updateIntent(id(req), p, ctx), p)));
  app.post('/v1/payment_intents/:id/confirm', handle((p, req, ctx) => ledger.expand(ledger.confirmIntent(id(req), p, ctx), p)));
  app.post('/v1/payment_intents/:id/cancel', handle((p, req, ctx) => ledger.expand(ledger.cancelIntent(id(req), p, ctx), p)));

  app.get('/v1/payment_methods/:id', handle((_p, req) => ledger.retrievePaymentMethod(id(req))));
  app.get('/v1/charges', handle((p) => ledger.listCharges(p)));
  app.get('/v1/charges/:id', handle((p, req) => ledger.expand(ledger.retrieveCharge(id(req)), p)));

  app.post('/v1/refunds', handle((p, _req, ctx) => ledger.expand(ledger.createRefund(p, ctx), p)));
  app.get('/v1/refunds', handle((p) => ledger.listRefunds(p)));
  app.get('/v1/refunds/:id', handle((p, req) => ledger.expand(ledger.retrieveRefund(id(req)), p)));

  app.get('/v1/events', handle((p) => ledger.listEvents(p)));
  app.get('/v1/events/:id', handle((_p, req) => ledger.retrieveEvent(id(req))));

  // Test hooks: what the provider's dashboard and the issuer's pages would do. No API key needed.
  const testHooks = express.Router();
  testHooks.use(express.json(), express.urlencoded({ extended: false }));
  testHooks.get('/payment_methods', (_req, res) => {
    res.json({ data: Object.values(TEST_CARDS) });
  });
  testHooks.post('/payment_intents/:id/authenticate', (req, res) => {
    const outcome = asParams(req.body).outcome;
    if (outcome !== 'succeed' && outcome !== 'fail') {
      sendError(res, invalidRequest("outcome must be 'succeed' or 'fail'", { param: 'outcome' }));
      return;
    }
    try {
      res.json(ledger.authenticate(id(req), outcome, testContext()));
    } catch (error) {
      if (error instanceof ApiError) sendError(res, error);
      else throw error;
    }
  });
  testHooks.get('/authenticate/:id', (req, res) => {
    try {
      const intent = ledger.retrieveIntent(id(req));
      const returnUrl = intent.next_action?.redirect_to_url?.return_url;
      res.type('html').send(authenticationPage(intent, returnUrl));
    } catch (error) {
      if (error instanceof ApiError) sendError(res, error);
      else throw error;
    }
  });
  testHooks.post('/authenticate/:id', (req, res) => {
    const body = asParams(req.body);
    const outcome = body.outcome === 'succeed' ? 'succeed' : 'fail';
    const returnUrl = typeof body.return_url === 'string' ? body.return_url : undefined;
    let intent: PaymentIntentObject;
    try {
      intent = ledger.authenticate(id(req), outcome, testContext());
    } catch (error) {
      if (error instanceof ApiError) {
        sendError(res, error);
        return;
      }
      throw error;
    }
    if (!returnUrl) {
      res.type('html').send(`<!doctype html><p>Authentication ${outcome === 'succeed' ? 'completed' : 'failed'}.</p>`);
      return;
    }
    // The provider returns the customer to return_url with these query parameters.
    const target = new URL(returnUrl);
    target.searchParams.set('payment_intent', intent.id);
    target.searchParams.set('payment_intent_client_secret', intent.client_secret);
    target.searchParams.set('redirect_status', intent.status === 'succeeded' ? 'succeeded' : 'failed');
    res.redirect(303, target.toString());
  });
  testHooks.get('/events', (_req, res) => {
    res.json({ data: dispatcher.list() });
  });
  testHooks.post('/events/:id/resend', async (req, res) => {
    if (!dispatcher.get(id(req))) {
      sendError(res, new ApiError(404, 'invalid_request_error', `No such event: '${id(req)}'`, { code: 'resource_missing' }));
      return;
    }
    try {
      res.json({ attempt: await dispatcher.resend(id(req)) });
    } catch (error) {
      sendError(res, invalidRequest(error instanceof Error ? error.message : String(error)));
    }
  });
  testHooks.get('/webhook_endpoint', (_req, res) => {
    res.json({ url: dispatcher.getUrl() });
  });
  testHooks.post('/webhook_endpoint', (req, res) => {
    const url = asParams(req.body).url;
    if (url !== null && (typeof url !== 'string' || !URL.canParse(url))) {
      sendError(res, invalidRequest('url must be an absolute URL or null', { param: 'url' }));
      return;
    }
    dispatcher.setUrl(url);
    res.json({ url });
  });
  testHooks.get('/faults', (_req, res) => {
    res.json({ data: faults.list() });
  });
  testHooks.post('/faults', (req, res) => {
    try {
      res.status(201).json(faults.add(req.body as FaultInput));
    } catch (error) {
      sendError(res, invalidRequest(error instanceof Error ? error.message : 'Invalid fault'));
    }
  });
  testHooks.delete('/faults', (_req, res) => {
    faults.clear();
    res.status(204).end();
  });
  testHooks.post('/reset', (_req, res) => {
    reset();
    res.status(204).end();
  });
  app.use('/_test', testHooks);

  app.use((req, res) => {
    sendError(res, new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.path}).`));
  });
  const onError: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
    const status = typeof error === 'object' && error && 'status' in error ? Number(error.status) : 500;
    if (status >= 400 && status < 500) {
      sendError(res, invalidRequest(error instanceof Error ? error.message : 'Invalid request'));
      return;
    }
    console.error('payments fake:', error);
    sendError(res, new ApiError(500, 'api_error', 'The payments fake failed.'));
  };
  app.use(onError);

  function reset(): void {
    ledger.reset();
    dispatcher.clear();
    idempotency.clear();
    faults.clear();
  }

  const server: Server = createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const port = (server.address() as AddressInfo).port;
  const urlHost = host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host.includes(':') ? `[${host}]` : host;
  baseUrl = `http://${urlHost}:${port}`;

  return {
    url: baseUrl,
    port,
    async close() {
      faults.dispose();
      dispatcher.close();
      ledger.dispose();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
    events: () => dispatcher.list(),
    resendEvent: (eventId) => dispatcher.resend(eventId),
    authenticate: (paymentIntentId, outcome) => ledger.authenticate(paymentIntentId, outcome, testContext()),
    setWebhookUrl: (url) => dispatcher.setUrl(url),
    addFault: (fault) => faults.add(fault),
    clearFaults: () => faults.clear(),
    waitForWebhooks: (timeoutMs) => dispatcher.idle(timeoutMs),
    reset,
  };
}
