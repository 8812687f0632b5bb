import { randomUUID } from 'node:crypto';
import { and, count, desc, eq, inArray, lt, lte, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { preparedOn } from '../db/prepared';
import { mailBodies, mailOutbox } from '../db/schema';
import type { MailKind, MailState } from '../../shared/allowed-values';
import type { MailOutboxList, MailOutboxQuery } from '../../shared/schemas/mail-outbox';
import { ConflictError, NotFoundError } from './errors';
import { MAIL_POOL_CONNECTIONS, type MailerPort, type OutgoingMail } from './mailer';
import type { Query } from './orders/order-reads';

/**
 * The durable outbox (docs/decisions/0007-mail-outbox.md). A message is a row written in the transaction of the change
 * that causes it, so an order and its confirmation commit or roll back together, and no request waits for the mail
 * server. A worker in each app process claims due rows in one UPDATE (so two processes never send the same row), hands
 * them to the mail server, and marks each sent once or schedules its next attempt with exponential backoff.
 */

export interface OutboxPolicy {
  /** First retry delay; each later one doubles. */
  baseDelayMs: number;
  /** The longest wait between attempts. */
  maxDelayMs: number;
  /** After this many attempts a message is given up on (state `failed`) and shows in the Office. */
  maxAttempts: number;
  /** How long a claim lasts: a process that died mid-send gives its rows back after this. */
  claimMs: number;
  /** Rows claimed per pass. */
  batchSize: number;
  /** Messages handed to the mail server at once: as many as the pooled transport keeps connections (mailer.ts). */
  concurrency: number;
}

/** Messages whose link signs someone in or sets a password; their bodies are cleared once sent. */
const CARRIES_A_CREDENTIAL: ReadonlySet<MailKind> = new Set(['password-reset', 'account-confirm']);

export const DEFAULT_OUTBOX_POLICY: OutboxPolicy = { baseDelayMs: 5_000, maxDelayMs: 15 * 60_000, maxAttempts: 12, claimMs: 2 * 60_000, batchSize: 20, concurrency: MAIL_POOL_CONNECTIONS };

/**
 * The wait before attempt `attempts + 1`: base × 2^(attempts − 1), capped, with ±20 % jitter so messages that failed
 * together do not all come back at the same moment (common practice for retry schedules).
 */
export function retryDelayMs(attempts: number, policy: Pick<OutboxPolicy, 'baseDelayMs' | 'maxDelayMs'>, random = Math.random): number {
  const plain = Math.min(policy.maxDelayMs, policy.baseDelayMs * 2 ** Math.max(0, attempts - 1));
  return Math.round(plain * (0.8 + 0.4 * random()));
}

function reason(error: unknown): string {
  if (error instanceof Error) {
    const code = 'code' in error ? error.code : undefined;
    const text = typeof code === 'string' && !error.message.includes(code) ? `${code} ${error.message}` : error.message;
    return text.slice(0, 500);
  }
  return String(error).slice(0, 500);
}

/**
 * Writes one message in the caller's transaction (or on its own when called with the database). `build` renders the
 * message now; a rendering failure is kept as a failed row for staff to see rather than undoing the change that caused it.
 */
export function enqueueMail(q: Query, kind: MailKind, build: () => OutgoingMail, now = Date.now()): void {
  let message: OutgoingMail;
  try {
    message = build();
  } catch (error) {
    console.warn(`${kind} not written: ${reason(error)}`);
    const { id } = q
      .insert(mailOutbox)
      .values({ kind, recipient: '', subject: `(${kind} could not be written)`, state: 'failed', nextAttemptAt: now, lastError: `Could not be written: ${reason(error)}` })
      .returning({ id: mailOutbox.id })
      .get();
    q.insert(mailBodies).values({ outboxId: id, text: '', html: '' }).run();
    return;
  }
  const $ = sql.placeholder;
  const { lastInsertRowid } = preparedOn(q, 'outbox:enqueue', (h) =>
    h.insert(mailOutbox).values({ kind: $('kind'), recipient: $('recipient'), subject: $('subject'), nextAttemptAt: $('nextAttemptAt') }).prepare(),
  ).run({ kind, recipient: message.to, subject: message.subject, nextAttemptAt: now });
  preparedOn(q, 'outbox:enqueue-body', (h) => h.insert(mailBodies).values({ outboxId: $('outboxId'), text: $('text'), html: $('html') }).prepare()).run({
    outboxId: Number(lastInsertRowid),
    text: message.text,
    html: message.html,
  });
}

/** A claimed message: its row and the text and HTML to send. */
type ClaimedMail = typeof mailOutbox.$inferSelect & { text: string; html: string };

export interface OutboxRunResult {
  claimed: number;
  sent: number;
  retrying: number;
  failed: number;
}

export function createMailOutbox(deps: { db: Db; mailer: MailerPort; policy?: Partial<OutboxPolicy>; now?: () => number; holder?: string }) {
  const { db, mailer } = deps;
  const policy: OutboxPolicy = { ...DEFAULT_OUTBOX_POLICY, ...deps.policy };
  const now = deps.now ?? (() => Date.now());
  const holder = deps.holder ?? `${process.pid}-${randomUUID().slice(0, 8)}`;

  /** Rows whose claim ran out (their process stopped mid-send) go back in the queue. */
  function releaseStaleClaims(at: number) {
    return db
      .update(mailOutbox)
      .set({ state: 'queued', claimedBy: null, claimExpiresAt: null })
      .where(and(eq(mailOutbox.state, 'sending'), lt(mailOutbox.claimExpiresAt, at)))
      .run().changes;
  }

  /**
   * One UPDATE … RETURNING takes the due rows: SQLite runs it under the write lock, so a row goes to one process only.
   * Only rows due when the pass began are taken, so a message that failed in this pass waits for its backoff.
   */
  function claim(at: number, dueBy: number) {
    const due = db
      .select({ id: mailOutbox.id })
      .from(mailOutbox)
      .where(and(eq(mailOutbox.state, 'queued'), lte(mailOutbox.nextAttemptAt, dueBy)))
      .orderBy(mailOutbox.nextAttemptAt, mailOutbox.id)
      .limit(policy.batchSize);
    const rows = db
      .update(mailOutbox)
      .set({ state: 'sending', claimedBy: holder, claimExpiresAt: at + policy.claimMs, attempts: sql`${mailOutbox.attempts} + 1`, lastAttemptAt: new Date(at).toISOString() })
      .where(and(inArray(mailOutbox.id, due), eq(mailOutbox.state, 'queued')))
      .returning()
      .all();
    if (rows.length === 0) return [];
    const bodies = new Map(
      db
        .select()
        .from(mailBodies)
        .where(inArray(mailBodies.outboxId, rows.map((r) => r.id)))
        .all()
        .map((b) => [b.outboxId, b]),
    );
    return rows.map((r): ClaimedMail => ({ ...r, text: bodies.get(r.id)?.text ?? '', html: bodies.get(r.id)?.html ?? '' }));
  }

  const mine = (id: number) => and(eq(mailOutbox.id, id), eq(mailOutbox.state, 'sending'), eq(mailOutbox.claimedBy, holder));

  /** Rows claimed but not tried when the worker stops go straight back, as if never claimed. */
  function unclaim(ids: number[]) {
    if (ids.length === 0) return;
    db.update(mailOutbox)
      .set({ state: 'queued', claimedBy: null, claimExpiresAt: null, attempts: sql`${mailOutbox.attempts} - 1` })
      .where(and(inArray(mailOutbox.id, ids), eq(mailOutbox.state, 'sending'), eq(mailOutbox.claimedBy, holder)))
      .run();
  }

  let stopped = false;

  /** Hands one claimed row to the mail server and records what happened, if the claim is still this worker's. */
  async function sendOne(row: ClaimedMail, result: OutboxRunResult, sent: ClaimedMail[]) {
    try {
      await mailer.send({ to: row.recipient, subject: row.subject, text: row.text, html: row.html });
    } catch (error) {
      const giveUp = row.attempts >= policy.maxAttempts;
      db.update(mailOutbox)
        .set({
          state: giveUp ? 'failed' : 'queued',
          claimedBy: null,
          claimExpiresAt: null,
          lastError: reason(error),
          nextAttemptAt: now() + retryDelayMs(row.attempts, policy),
        })
        .where(mine(row.id))
        .run();
      if (giveUp) {
        result.failed += 1;
        console.warn(`${row.kind} to ${row.recipient} given up after ${row.attempts} attempts: ${reason(error)}`);
      } else result.retrying += 1;
      return;
    }
    sent.push(row);
  }

  /**
   * Marks a batch's delivered rows sent in one write (one commit for the batch, not one per message), if their claims
   * are still this worker's. A reset or confirmation link is a credential: once it has gone it is not kept.
   */
  function markSent(rows: ClaimedMail[], result: OutboxRunResult) {
    if (rows.length === 0) return;
    const at = new Date(now()).toISOString();
    const credentials = rows.filter((r) => CARRIES_A_CREDENTIAL.has(r.kind)).map((r) => r.id);
    const marked = db.transaction(() => {
      const done = db
        .update(mailOutbox)
        .set({ state: 'sent', sentAt: at, claimedBy: null, claimExpiresAt: null, lastError: null })
        .where(and(inArray(mailOutbox.id, rows.map((r) => r.id)), eq(mailOutbox.state, 'sending'), eq(mailOutbox.claimedBy, holder)))
        .returning({ id: mailOutbox.id })
        .all();
      const cleared = credentials.filter((id) => done.some((d) => d.id === id));
      if (cleared.length > 0) db.update(mailBodies).set({ text: '', html: '' }).where(inArray(mailBodies.outboxId, cleared)).run();
      return done.length;
    });
    result.sent += marked;
  }

  /** Sends every message due now (one batch at a time) and returns what happened. */
  async function runOnce(): Promise<OutboxRunResult> {
    const result: OutboxRunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
    const began = now();
    releaseStaleClaims(began);
    while (!stopped) {
      const rows = claim(now(), began);
      if (rows.length === 0) break;
      result.claimed += rows.length;
      // A few messages in hand at once, one per pooled connection; a stop leaves the rest untried and gives them back.
      let next = 0;
      const untried: number[] = [];
      const sent: ClaimedMail[] = [];
      const worker = async () => {
        while (next < rows.length) {
          const row = rows[next++]!;
          if (stopped) untried.push(row.id);
          else await sendOne(row, result, sent);
        }
      };
      await Promise.all(Array.from({ length: Math.min(policy.concurrency, rows.length) }, worker));
      markSent(sent, result);
      unclaim(untried);
    }
    return result;
  }

  let timer: NodeJS.Timeout | null = null;
  let running: Promise<unknown> | null = null;

  /** Passes that overlap are joined, not doubled: a caller waiting for the queue gets the pass in progress and then its own. */
  function pass(): Promise<OutboxRunResult> {
    const next = (running ?? Promise.resolve()).then(() => runOnce());
    const settled = next.catch((error: unknown) => {
      console.warn(`mail outbox pass failed: ${reason(error)}`);
    });
    running = settled;
    void settled.then(() => {
      if (running === settled) running = null;
    });
    return next;
  }

  return {
    holder,
    policy,
    runOnce: pass,
    /** Passes until nothing is due now (retries scheduled for later are left for later). Tests and shutdown use it. */
    async drain(maxPasses = 50): Promise<OutboxRunResult> {
      const total: OutboxRunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
      for (let i = 0; i < maxPasses; i += 1) {
        const r = await pass();
        total.claimed += r.claimed;
        total.sent += r.sent;
        total.retrying += r.retrying;
        total.failed += r.failed;
        if (r.claimed === 0) break;
      }
      return total;
    },
    /** Starts the worker: a pass every `everyMs`, never two at once in this process. */
    start(everyMs: number) {
      if (timer || stopped) return;
      const tick = () => {
        void pass()
          .catch(() => {})
          .finally(() => {
            if (!stopped) {
              timer = setTimeout(tick, everyMs);
              timer.unref();
            }
          });
      };
      timer = setTimeout(tick, everyMs);
      timer.unref();
    },
    /** Stops the worker and waits for a pass in progress, so no claimed row is left half done. */
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running;
    },
    list(query: MailOutboxQuery): MailOutboxList {
      const where = query.state ? eq(mailOutbox.state, query.state) : undefined;
      const rows = db
        .select({
          id: mailOutbox.id,
          kind: mailOutbox.kind,
          recipient: mailOutbox.recipient,
          subject: mailOutbox.subject,
          state: mailOutbox.state,
          attempts: mailOutbox.attempts,
          nextAttemptAt: mailOutbox.nextAttemptAt,
          lastError: mailOutbox.lastError,
          lastAttemptAt: mailOutbox.lastAttemptAt,
          sentAt: mailOutbox.sentAt,
          createdAt: mailOutbox.createdAt,
          hasBody: sql<number>`(select length(${mailBodies.text}) from ${mailBodies} where ${mailBodies.outboxId} = ${mailOutbox.id}) > 0`,
        })
        .from(mailOutbox)
        .where(where)
        .orderBy(desc(mailOutbox.id))
        .limit(query.limit)
        .offset(query.offset)
        .all();
      const counts = db.select({ state: mailOutbox.state, n: count() }).from(mailOutbox).groupBy(mailOutbox.state).all();
      const byState = { queued: 0, sending: 0, sent: 0, failed: 0 } satisfies Record<MailState, number>;
      for (const c of counts) byState[c.state] = c.n;
      return {
        messages: rows.map(({ hasBody, nextAttemptAt, ...r }) => ({
          ...r,
          nextAttemptAt: r.state === 'queued' ? new Date(nextAttemptAt).toISOString() : null,
          resendable: Boolean(hasBody) && r.state !== 'sending',
        })),
        counts: byState,
        total: query.state ? byState[query.state] : Object.values(byState).reduce((a, b) => a + b, 0),
      };
    },
    /** Queues a message again for the next pass; a sent one goes once more. */
    resend(id: number) {
      const row = db
        .select({ state: mailOutbox.state, text: mailBodies.text, kind: mailOutbox.kind })
        .from(mailOutbox)
        .leftJoin(mailBodies, eq(mailBodies.outboxId, mailOutbox.id))
        .where(eq(mailOutbox.id, id))
        .get();
      if (!row) throw new NotFoundError('No such message');
      if (!row.text) {
        throw new ConflictError(
          row.kind === 'password-reset'
            ? 'A reset link is not kept once it has gone. The customer can ask for a new one from the sign-in page.'
            : row.kind === 'account-confirm'
              ? 'A confirmation link is not kept once it has gone. Signing in with the new account sends a fresh one.'
              : 'This message was never written, so there is nothing to send again.',
        );
      }
      const changed = db
        .update(mailOutbox)
        .set({ state: 'queued', attempts: 0, nextAttemptAt: now(), lastError: null, claimedBy: null, claimExpiresAt: null })
        .where(and(eq(mailOutbox.id, id), inArray(mailOutbox.state, ['queued', 'sent', 'failed'])))
        .run().changes;
      if (changed === 0) throw new ConflictError('This message is being sent right now');
    },
  };
}

export type MailOutbox = ReturnType<typeof createMailOutbox>;
