import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import type Stripe from 'stripe';

export interface ReceivedWebhook {
  rawBody: string;
  signature: string | undefined;
  /** The event as the SDK's constructEvent verified and parsed it; null when verification failed. */
  event: Stripe.Event | null;
  verifyError: string | null;
  answeredWith: number;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  /** Status codes to answer with, in order, before answering 200. */
  failNext(...statuses: number[]): void;
  waitFor(match: (r: ReceivedWebhook) => boolean, timeoutMs?: number): Promise<ReceivedWebhook>;
  close(): Promise<void>;
}

/** A stand-in for the app's webhook route: verifies each delivery on its raw body as the app must. */
export async function startWebhookReceiver(stripe: Stripe, secret: string): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  const queued: number[] = [];
  const waiters = new Set<() => void>();
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const rawBody = Buffer.concat(chunks).toString('utf8');
      const signature = req.headers['stripe-signature'];
      const header = Array.isArray(signature) ? signature[0] : signature;
      let event: Stripe.Event | null = null;
      let verifyError: string | null = null;
      try {
        event = stripe.webhooks.constructEvent(rawBody, header ?? '', secret);
      } catch (error) {
        verifyError = error instanceof Error ? error.message : String(error);
      }
      const answeredWith = verifyError ? 400 : (queued.shift() ?? 200);
      received.push({ rawBody, signature: header, event, verifyError, answeredWith });
      res.statusCode = answeredWith;
      res.end();
      for (const wake of [...waiters]) wake();
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}/api/webhooks/payments`,
    received,
    failNext: (...statuses) => queued.push(...statuses),
    waitFor(match, timeoutMs = 3_000) {
      return new Promise((resolve, reject) => {
        const check = () => {
          const hit = received.find(match);
          if (!hit) return;
          waiters.delete(check);
          clearTimeout(timer);
          resolve(hit);
        };
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`No matching webhook within ${timeoutMs} ms; got ${received.map((r) => r.event?.type).join(', ')}`));
        }, timeoutMs);
        waiters.add(check);
        check();
      });
    },
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
