import type { RequestHandler } from 'express';
import { z } from 'zod';

/**
 * Test-only faults between the storefront and the fake provider: a reply that never comes (the request IS carried
 * out), a slow reply, or a 5xx answered instead of carrying the request out. Each is scoped to a method and a path
 * pattern, for a number of requests or until cleared.
 */
export const FaultSchema = z.object({
  method: z.enum(['GET', 'POST', '*']).default('*'),
  /** A regular expression matched against the whole API path, e.g. `^/v1/payment_intents/[^/]+/confirm$`. */
  path: z.string().min(1).max(200),
  action: z.enum(['drop', 'delay', 'error']),
  /** How many requests (for `drop`: how many distinct operations; a retry with the same idempotency key counts once). */
  count: z.number().int().min(1).max(1000).optional(),
  delayMs: z.number().int().min(0).max(120_000).default(0),
  status: z.number().int().min(500).max(599).default(500),
});
export type FaultInput = z.input<typeof FaultSchema>;

interface Fault {
  id: number;
  method: string;
  pattern: RegExp;
  action: 'drop' | 'delay' | 'error';
  remaining: number | null;
  delayMs: number;
  status: number;
  /** Idempotency keys whose reply this fault dropped: every retry of them is dropped too, as a lossy path would. */
  droppedKeys: Set<string>;
  hits: number;
}

export class FaultSwitches {
  private faults: Fault[] = [];
  private nextId = 1;
  /** Requests held by a delay; clearing the faults lets them through at once (the host is back). */
  private held = new Map<NodeJS.Timeout, () => void>();

  add(input: FaultInput): { id: number } {
    const f = FaultSchema.parse(input);
    const fault: Fault = {
      id: this.nextId++,
      method: f.method,
      pattern: new RegExp(f.path),
      action: f.action,
      remaining: f.count ?? null,
      delayMs: f.delayMs,
      status: f.status,
      droppedKeys: new Set(),
      hits: 0,
    };
    this.faults.push(fault);
    return { id: fault.id };
  }

  clear(): void {
    this.faults = [];
    for (const [timer, release] of this.held) {
      clearTimeout(timer);
      release();
    }
    this.held.clear();
  }

  /** On shutdown: held requests are dropped, not carried out. */
  dispose(): void {
    for (const timer of this.held.keys()) clearTimeout(timer);
    this.held.clear();
    this.faults = [];
  }

  list() {
    return this.faults.map((f) => ({ id: f.id, method: f.method, path: f.pattern.source, action: f.action, remaining: f.remaining, hits: f.hits }));
  }

  /** The fault a request meets, if any; uses up one of its count. */
  private take(method: string, path: string, key: string | undefined): Fault | undefined {
    for (const f of this.faults) {
      if (f.method !== '*' && f.method !== method) continue;
      if (!f.pattern.test(path)) continue;
      if (f.action === 'drop' && key && f.droppedKeys.has(key)) {
        f.hits++;
        return f;
      }
      if (f.remaining === 0) continue;
      if (f.remaining !== null) f.remaining--;
      if (f.action === 'drop' && key) f.droppedKeys.add(key);
      f.hits++;
      return f;
    }
    return undefined;
  }

  middleware(): RequestHandler {
    return (req, res, next) => {
      const fault = this.take(req.method, req.baseUrl + req.path, req.get('Idempotency-Key'));
      if (!fault) return next();
      if (fault.action === 'error') {
        res.status(fault.status).json({ error: { type: 'api_error', message: 'The payments fake was told to fail this request.' } });
        return;
      }
      if (fault.action === 'drop') {
        // The request is carried out; the connection is cut instead of answering.
        res.end = (() => {
          res.socket?.destroy();
          return res;
        }) as typeof res.end;
        return next();
      }
      // A caller that gives up meanwhile does not stop it: the request is carried out late, as a slow provider's would be.
      const release = () => next();
      const timer = setTimeout(() => {
        this.held.delete(timer);
        release();
      }, fault.delayMs);
      this.held.set(timer, release);
    };
  }
}
