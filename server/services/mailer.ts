import addressparser from 'nodemailer/lib/addressparser';
import MailComposer from 'nodemailer/lib/mail-composer';
import SMTPConnection from 'nodemailer/lib/smtp-connection';
import type { RenderedMail } from './mail-templates/types';

export type OutgoingMail = RenderedMail & { to: string };

/** What request handlers need; tests pass a recording fake in its place. */
export interface MailerPort {
  send(message: OutgoingMail): Promise<void>;
}

export interface Mailer extends MailerPort {
  /** Connects and greets the server once; rejects when it cannot be reached. */
  verify(): Promise<void>;
  close(): Promise<void>;
}

export interface MailerOptions {
  host: string;
  port: number;
  /** e.g. `"Spoolyard Turbo Supply" <orders@spoolyard.test>` */
  from: string;
  /** Implicit TLS from the first byte (port 465 style). */
  secure?: boolean;
  /**
   * Skip STARTTLS even when offered. On by default because the local fake runs without TLS;
   * a production relay sets this to false.
   */
  ignoreTLS?: boolean;
  auth?: { user: string; pass: string };
  /** Upper bound for connecting, the greeting and each socket wait, so a dead relay fails fast. */
  timeoutMs?: number;
}

/** Connections kept open to the relay; the outbox worker keeps as many messages in hand. */
export const MAIL_POOL_CONNECTIONS = 2;

/** Errors of the connection rather than of the message: worth one more try over a fresh connection. */
const CONNECTION_ERRORS = new Set(['ECONNECTION', 'ESOCKET', 'ETIMEDOUT', 'ECONNRESET', 'EPIPE']);

/**
 * Sends composed messages over a few kept-open SMTP connections (nodemailer's SMTPConnection, the client its own
 * pooled transport runs on). The outbox worker hands over whole messages, already composed, with their envelope, so
 * the transport's per-message pipeline (plugins, a second MIME pass over the raw message, its queue) is not needed:
 * measured here, a message cost 1.24 ms of CPU through the pooled transport and 0.72 ms this way, of which composing
 * is 0.48 ms. A connection that fails or that the server closes is dropped. A message whose send failed with a
 * connection error on a reused connection (most often one the server closed while it was idle) goes once more over a
 * fresh one; should the server have taken it just before the connection broke, that is a duplicate, the outbox's
 * at-least-once edge (docs/decisions/0007-mail-outbox.md), never a lost message.
 */
class SmtpConnections {
  /** Connected and not failed: idle, or carrying a message. */
  private live = new Set<SMTPConnection>();
  private idle: SMTPConnection[] = [];
  private connecting = 0;
  private waiting: Array<{ resolve: (c: SMTPConnection) => void; reject: (e: Error) => void }> = [];
  private closed = false;

  constructor(
    private readonly options: SMTPConnection.Options,
    private readonly auth: { user: string; pass: string } | undefined,
    private readonly size: number,
  ) {}

  /** Opens one connection: connected, greeted, signed in when there are credentials. */
  private async openOne(): Promise<SMTPConnection> {
    this.connecting += 1;
    try {
      const connection = await new Promise<SMTPConnection>((resolve, reject) => {
        const connection = new SMTPConnection(this.options);
        let ready = false;
        connection.on('error', (error: Error) => {
          this.drop(connection);
          if (!ready) reject(error);
        });
        connection.once('end', () => this.drop(connection));
        connection.connect((error) => {
          if (error) return reject(error);
          if (!this.auth) {
            ready = true;
            return resolve(connection);
          }
          connection.login(this.auth, (loginError) => {
            if (loginError) {
              connection.close();
              return reject(loginError);
            }
            ready = true;
            resolve(connection);
          });
        });
      });
      this.live.add(connection);
      return connection;
    } finally {
      this.connecting -= 1;
    }
  }

  /** Forgets a connection that failed or ended: it is never handed out again, and a waiting message may open another. */
  private drop(connection: SMTPConnection) {
    if (!this.live.delete(connection)) return;
    const at = this.idle.indexOf(connection);
    if (at >= 0) this.idle.splice(at, 1);
    const waiter = this.waiting.length > 0 && !this.closed ? this.waiting.shift() : undefined;
    if (waiter) this.openOne().then(waiter.resolve, waiter.reject);
  }

  /** An idle connection, a new one while there are fewer than `size`, or the next one given back. */
  private take(): Promise<{ connection: SMTPConnection; reused: boolean }> {
    if (this.closed) return Promise.reject(new Error('the mailer is closed'));
    const idle = this.idle.pop();
    if (idle) return Promise.resolve({ connection: idle, reused: true });
    if (this.live.size + this.connecting < this.size) return this.openOne().then((connection) => ({ connection, reused: false }));
    return new Promise((resolve, reject) => this.waiting.push({ resolve: (connection) => resolve({ connection, reused: true }), reject }));
  }

  private giveBack(connection: SMTPConnection) {
    if (!this.live.has(connection)) return;
    if (this.closed) {
      this.live.delete(connection);
      connection.quit();
      return;
    }
    const waiter = this.waiting.shift();
    if (waiter) waiter.resolve(connection);
    else this.idle.push(connection);
  }

  async send(envelope: SMTPConnection.Envelope, raw: Buffer): Promise<void> {
    for (let attempt = 0; ; attempt++) {
      const { connection, reused } = await this.take();
      try {
        await new Promise<void>((resolve, reject) => connection.send(envelope, raw, (error) => (error ? reject(error) : resolve())));
        this.giveBack(connection);
        return;
      } catch (error) {
        const { code, responseCode } = error as { code?: string; responseCode?: number };
        const byConnection = CONNECTION_ERRORS.has(code ?? '') || responseCode === 421;
        if (byConnection) {
          this.drop(connection);
          connection.close();
        } else {
          // The server refused this message; the connection itself is fine once its session is reset.
          connection.reset((resetError) => {
            if (!resetError) return this.giveBack(connection);
            this.drop(connection);
            connection.close();
          });
        }
        if (!(byConnection && reused && attempt === 0)) throw error;
      }
    }
  }

  async verify(): Promise<void> {
    this.giveBack(await this.openOne());
  }

  close() {
    this.closed = true;
    for (const waiter of this.waiting.splice(0)) waiter.reject(new Error('the mailer is closed'));
    for (const connection of this.idle.splice(0)) {
      this.live.delete(connection);
      connection.quit();
    }
  }
}

export function createMailer(options: MailerOptions): Mailer {
  const timeout = options.timeoutMs ?? 10_000;
  const connections = new SmtpConnections(
    {
      host: options.host,
      port: options.port,
      secure: options.secure ?? false,
      ignoreTLS: options.ignoreTLS ?? true,
      connectionTimeout: timeout,
      greetingTimeout: timeout,
      socketTimeout: timeout * 3,
    },
    options.auth,
    MAIL_POOL_CONNECTIONS,
  );
  const sender = envelopeAddress(options.from);
  return {
    async send(message) {
      // Composed whole before it goes: handed over as one buffer it leaves in a few socket writes.
      const raw = await new MailComposer({ from: options.from, to: message.to, subject: message.subject, text: message.text, html: message.html }).compile().build();
      await connections.send({ from: sender, to: [envelopeAddress(message.to)] }, raw);
    },
    async verify() {
      await connections.verify();
    },
    async close() {
      connections.close();
    },
  };
}

/** The bare address of `"Name" <address>` (or of a bare address), for the SMTP envelope. */
function envelopeAddress(value: string): string {
  const [first] = addressparser(value, { flatten: true });
  if (!first?.address) throw new Error(`not an e-mail address: ${value}`);
  return first.address;
}

export interface RecordingMailer extends MailerPort {
  sent: OutgoingMail[];
  /** Makes every later send reject with this error, to exercise failure paths. */
  failWith(error: Error | null): void;
}

/** An in-memory mailer for tests of code that sends mail. */
export function createRecordingMailer(): RecordingMailer {
  let failure: Error | null = null;
  const sent: OutgoingMail[] = [];
  return {
    sent,
    failWith(error) {
      failure = error;
    },
    async send(message) {
      if (failure) throw failure;
      sent.push(structuredClone(message));
    },
  };
}
