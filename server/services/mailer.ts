import nodemailer from 'nodemailer';
import addressparser from 'nodemailer/lib/addressparser';
import MailComposer from 'nodemailer/lib/mail-composer';
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

/** Connections the pooled transport keeps open; the outbox worker keeps as many messages in hand. */
export const MAIL_POOL_CONNECTIONS = 2;

export function createMailer(options: MailerOptions): Mailer {
  const timeout = options.timeoutMs ?? 10_000;
  // Pooled: the outbox worker sends batches over a few kept-open connections rather than one handshake per message.
  const transport = nodemailer.createTransport({
    pool: true,
    maxConnections: MAIL_POOL_CONNECTIONS,
    host: options.host,
    port: options.port,
    secure: options.secure ?? false,
    ignoreTLS: options.ignoreTLS ?? true,
    ...(options.auth ? { auth: options.auth } : {}),
    connectionTimeout: timeout,
    greetingTimeout: timeout,
    socketTimeout: timeout * 3,
  });
  const sender = envelopeAddress(options.from);
  return {
    async send(message) {
      // The message is composed whole before it goes: handed over as one buffer it leaves in a few socket writes,
      // where the composer's stream would leave it line by line (a dozen writes per message).
      const raw = await new MailComposer({ from: options.from, to: message.to, subject: message.subject, text: message.text, html: message.html }).compile().build();
      await transport.sendMail({ envelope: { from: sender, to: [envelopeAddress(message.to)] }, raw });
    },
    async verify() {
      await transport.verify();
    },
    async close() {
      transport.close();
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
