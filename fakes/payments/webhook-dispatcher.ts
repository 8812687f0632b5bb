import { createHmac } from 'node:crypto';
import http from 'node:http';
import https from 'node:https';
import type { EventObject } from './payments-ledger';

/**
 * The `Stripe-Signature` header value: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>">`, keyed with
 * the whole webhook secret string. This is what the SDK's `webhooks.constructEvent` recomputes.
 */
export function signWebhookPayload(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

export interface DeliveryAttempt {
  attempt: number;
  /** 'retry' attempts follow a failure; 'resend' ones were asked for through the test hook. */
  kind: 'first' | 'retry' | 'resend';
  at: string;
  url: string;
  status: number | null;
  error: string | null;
  ok: boolean;
}

export interface EventRecord {
  event: EventObject;
  /** `skipped` when the type is not subscribed or no endpoint is set. */
  state: 'pending' | 'delivered' | 'failed' | 'skipped';
  attempts: DeliveryAttempt[];
}

export interface DispatcherOptions {
  secret: string;
  url: string | null;
  /** Delay before each retry; attempts = 1 + retryDelaysMs.length. */
  retryDelaysMs: readonly number[];
  /**
   * How long after the event the first attempt is made. Whatever it is, the first attempt waits until the API call
   * that caused the event has been answered: the provider answers the call, then posts its events.
   */
  firstAttemptDelayMs?: number;
  timeoutMs: number;
  /** Event types posted to the endpoint; '*' posts all. */
  enabledEvents: readonly string[];
  maxRecords: number;
}

export class WebhookDispatcher {
  private records = new Map<string, EventRecord>();
  private inFlight = 0;
  private idleWaiters: Array<() => void> = [];
  private closing = new AbortController();
  private httpAgent = new http.Agent({ keepAlive: true });
  private httpsAgent = new https.Agent({ keepAlive: true });
  private url: string | null;

  constructor(private readonly options: DispatcherOptions) {
    this.url = options.url;
  }

  setUrl(url: string | null): void {
    this.url = url;
  }

  getUrl(): string | null {
    return this.url;
  }

  list(): EventRecord[] {
    return [...this.records.values()].map((r) => structuredClone(r));
  }

  get(id: string): EventRecord | undefined {
    const record = this.records.get(id);
    return record ? structuredClone(record) : undefined;
  }

  clear(): void {
    this.records.clear();
  }

  private subscribed(type: string): boolean {
    return this.options.enabledEvents.includes('*') || this.options.enabledEvents.includes(type);
  }

  enqueue(event: EventObject): void {
    const url = this.url;
    const record: EventRecord = { event, state: 'skipped', attempts: [] };
    this.records.set(event.id, record);
    while (this.records.size > this.options.maxRecords) {
      const oldest = this.records.keys().next().value;
      if (oldest === undefined) break;
      this.records.delete(oldest);
    }
    if (!url || !this.subscribed(event.type) || this.closing.signal.aborted) return;
    record.state = 'pending';
    void this.track(this.deliverWithRetries(record, url));
  }

  /** Posts the event once more with the same id, as a duplicate delivery would. */
  async resend(id: string, url = this.url): Promise<DeliveryAttempt> {
    const record = this.records.get(id);
    if (!record) throw new Error(`No such event: '${id}'`);
    if (!url) throw new Error('No webhook endpoint is configured');
    return this.track(this.attempt(record, url, 'resend'));
  }

  /** Resolves once no delivery is running or waiting for a retry. */
  async idle(timeoutMs = 5_000): Promise<void> {
    if (this.inFlight === 0) return;
    await new Promise<void>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`Webhook deliveries still pending after ${timeoutMs} ms`)), timeoutMs);
      this.idleWaiters.push(() => {
        clearTimeout(timer);
        resolve();
      });
    });
  }

  close(): void {
    this.closing.abort();
    this.httpAgent.destroy();
    this.httpsAgent.destroy();
  }

  private async track<T>(work: Promise<T>): Promise<T> {
    this.inFlight += 1;
    try {
      return await work;
    } finally {
      this.inFlight -= 1;
      if (this.inFlight === 0) for (const wake of this.idleWaiters.splice(0)) wake();
    }
  }

  private async deliverWithRetries(record: EventRecord, url: string): Promise<void> {
    const delays = this.options.retryDelaysMs;
    for (let i = 0; i <= delays.length; i += 1) {
      const delay = i === 0 ? (this.options.firstAttemptDelayMs ?? 0) : (delays[i - 1] ?? 0);
      if (!(await this.sleep(delay))) break;
      const result = await this.attempt(record, url, i === 0 ? 'first' : 'retry');
      if (result.ok) return;
      if (this.closing.signal.aborted) break;
    }
    if (record.state !== 'delivered') record.state = 'failed';
  }

  /** Resolves true after `ms` (0: once the current turn of the event loop is over), false if the dispatcher closes first. */
  private sleep(ms: number): Promise<boolean> {
    const signal = this.closing.signal;
    if (signal.aborted) return Promise.resolve(false);
    return new Promise((resolve) => {
      const onAbort = () => {
        clearTimeout(timer);
        resolve(false);
      };
      const timer = setTimeout(() => {
        signal.removeEventListener('abort', onAbort);
        resolve(true);
      }, ms);
      signal.addEventListener('abort', onAbort, { once: true });
    });
  }

  private async attempt(record: EventRecord, url: string, kind: DeliveryAttempt['kind']): Promise<DeliveryAttempt> {
    // The provider posts pretty-printed JSON and signs every attempt afresh.
    const payload = JSON.stringify(record.event, null, 2);
    const attempt: DeliveryAttempt = {
      attempt: record.attempts.length + 1,
      kind,
      at: new Date().toISOString(),
      url,
      status: null,
      error: null,
      ok: false,
    };
    try {
      attempt.status = await this.post(url, payload);
      attempt.ok = attempt.status >= 200 && attempt.status < 300;
    } catch (error) {
      attempt.error = error instanceof Error ? `${error.name}: ${error.message}` : String(error);
    }
    record.attempts.push(attempt);
    if (attempt.ok) record.state = 'delivered';
    return structuredClone(attempt);
  }

  /**
   * One POST on a kept-alive connection (node:http rather than fetch: a busy shop gets a webhook per payment, and the
   * fake should cost little beside the app it serves). Answers the status; throws on a network error or timeout.
   */
  private post(url: string, payload: string): Promise<number> {
    const target = new URL(url);
    const secure = target.protocol === 'https:';
    return new Promise((resolve, reject) => {
      const req = (secure ? https : http).request(
        target,
        {
          method: 'POST',
          agent: secure ? this.httpsAgent : this.httpAgent,
          headers: {
            'Content-Type': 'application/json; charset=utf-8',
            'Content-Length': Buffer.byteLength(payload),
            'Stripe-Signature': signWebhookPayload(payload, this.options.secret),
            'User-Agent': 'Spoolyard-Payments-Fake/1.0 (webhooks)',
          },
          signal: this.closing.signal,
          timeout: this.options.timeoutMs,
        },
        (res) => {
          res.resume();
          res.once('end', () => resolve(res.statusCode ?? 0));
          res.once('error', reject);
        },
      );
      req.once('timeout', () => req.destroy(Object.assign(new Error(`no answer within ${this.options.timeoutMs} ms`), { name: 'TimeoutError' })));
      req.once('error', reject);
      req.end(payload);
    });
  }
}
