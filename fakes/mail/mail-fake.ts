import { randomUUID } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type ErrorRequestHandler } from 'express';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export interface StoredMessage {
  id: string;
  /** The Message-ID header, when the sender set one. */
  messageId: string | null;
  /** Addresses from the headers; `envelope` holds what the SMTP session said. */
  from: string | null;
  fromName: string | null;
  to: string[];
  cc: string[];
  envelope: { from: string | null; to: string[] };
  subject: string;
  text: string | null;
  html: string | null;
  /** ISO time from the Date header, or of receipt when there is none. */
  date: string;
  receivedAt: string;
  attachments: Array<{ filename: string | null; contentType: string; size: number }>;
}

export interface MailFakeOptions {
  /** 0 picks a free port. */
  smtpPort?: number;
  httpPort?: number;
  host?: string;
  /** Oldest messages are dropped past this many. */
  maxMessages?: number;
  /** Largest message accepted, in bytes. */
  maxMessageBytes?: number;
}

export interface MailFake {
  smtpPort: number;
  httpPort: number;
  httpUrl: string;
  /** Newest first. */
  messages(): Promise<StoredMessage[]>;
  /** SMTP connections opened so far, to see that a pooled sender reuses them. */
  connections(): number;
  clear(): void;
  /** Resolves with the first stored or arriving message that matches. */
  waitForMessage(match: (message: StoredMessage) => boolean, timeoutMs?: number): Promise<StoredMessage>;
  close(): Promise<void>;
}

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const list = field === undefined ? [] : Array.isArray(field) ? field : [field];
  const out: string[] = [];
  for (const object of list) {
    for (const entry of object.value) {
      if (entry.address) out.push(entry.address.toLowerCase());
      for (const member of entry.group ?? []) if (member.address) out.push(member.address.toLowerCase());
    }
  }
  return out;
}

function listen(server: Server | SMTPServer, port: number, host: string): Promise<number> {
  const net = server instanceof SMTPServer ? server.server : server;
  return new Promise((resolve, reject) => {
    net.once('error', reject);
    server.listen(port, host, () => {
      net.off('error', reject);
      resolve((net.address() as AddressInfo).port);
    });
  });
}

/** A message as it came in: read (parsed) only when someone asks for it, then kept read. */
interface Received {
  id: string;
  raw: Buffer;
  envelope: { from: string | null; to: string[] };
  receivedAt: Date;
  read?: Promise<StoredMessage>;
}

/** The inbox shows the text and HTML parts as sent: no HTML made from the text, no links found in it. */
const PARSE_OPTIONS = { skipTextToHtml: true, skipTextLinks: true, skipImageLinks: true } as const;

async function readMessage(r: Received): Promise<StoredMessage> {
  const parsed = await simpleParser(r.raw, PARSE_OPTIONS);
  const from = parsed.from?.value[0];
  const message: StoredMessage = {
    id: r.id,
    messageId: parsed.messageId ?? null,
    from: from?.address?.toLowerCase() ?? r.envelope.from,
    fromName: from?.name || null,
    to: addresses(parsed.to),
    cc: addresses(parsed.cc),
    envelope: r.envelope,
    subject: parsed.subject ?? '',
    text: parsed.text ?? null,
    html: typeof parsed.html === 'string' ? parsed.html : null,
    date: (parsed.date ?? r.receivedAt).toISOString(),
    receivedAt: r.receivedAt.toISOString(),
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
    })),
  };
  if (message.to.length === 0) message.to = message.envelope.to;
  return message;
}

export async function startMailFake(options: MailFakeOptions = {}): Promise<MailFake> {
  const host = options.host ?? '127.0.0.1';
  const maxMessages = options.maxMessages ?? 500;
  let stored: Received[] = [];
  let connectionCount = 0;
  const waiters = new Set<(message: StoredMessage) => void>();
  const read = (r: Received) => (r.read ??= readMessage(r));
  const readAll = () => Promise.all(stored.map(read));

  const smtp = new SMTPServer({
    // The certificate bundled with smtp-server has expired, so the fake talks plain SMTP only.
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    // Accept any credentials, so an app configured with SMTP auth still works against the fake.
    allowInsecureAuth: true,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anonymous' });
    },
    size: options.maxMessageBytes ?? 10 * 1024 * 1024,
    banner: 'Spoolyard mail fake',
    onConnect(_session, callback) {
      connectionCount += 1;
      callback();
    },
    closeTimeout: 1_000,
    logger: false,
    onData(stream, session, callback) {
      // Kept as it came: a message is read (parsed) when someone lists it or waits for it, not for every one sent.
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.once('error', (error: Error) => callback(error));
      stream.once('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error('Message exceeds the size limit'), { responseCode: 552 }));
          return;
        }
        const received: Received = {
          id: randomUUID(),
          raw: Buffer.concat(chunks),
          envelope: {
            from: session.envelope.mailFrom === false ? null : session.envelope.mailFrom.address,
            to: session.envelope.rcptTo.map((r) => r.address.toLowerCase()),
          },
          receivedAt: new Date(),
        };
        stored.unshift(received);
        if (stored.length > maxMessages) stored.length = maxMessages;
        if (waiters.size > 0) {
          void read(received).then(
            (message) => {
              for (const wake of [...waiters]) wake(message);
            },
            () => undefined,
          );
        }
        callback();
      });
    },
  });
  // A client dropping its connection is no reason to stop the fake.
  smtp.on('error', () => undefined);

  const app = express();
  app.disable('x-powered-by');
  app.get('/messages', async (req, res) => {
    const to = typeof req.query.to === 'string' ? req.query.to.toLowerCase() : undefined;
    const all = await readAll();
    const list = to ? all.filter((m) => m.to.includes(to) || m.cc.includes(to) || m.envelope.to.includes(to)) : all;
    res.json({ messages: list });
  });
  app.get('/messages/:id', async (req, res) => {
    const received = stored.find((m) => m.id === req.params.id);
    if (!received) {
      res.status(404).json({ error: { message: `No message with id ${req.params.id}` } });
      return;
    }
    res.json(await read(received));
  });
  app.delete('/messages', (_req, res) => {
    stored = [];
    res.status(204).end();
  });
  app.delete('/messages/:id', (req, res) => {
    const before = stored.length;
    stored = stored.filter((m) => m.id !== req.params.id);
    if (stored.length === before) {
      res.status(404).json({ error: { message: `No message with id ${req.params.id}` } });
      return;
    }
    res.status(204).end();
  });
  app.get('/health', (_req, res) => {
    res.json({ ok: true, messages: stored.length });
  });
  app.use((req, res) => {
    res.status(404).json({ error: { message: `No route ${req.method} ${req.path}` } });
  });
  const onError: ErrorRequestHandler = (error: unknown, _req, res, _next) => {
    res.status(500).json({ error: { message: error instanceof Error ? error.message : 'Mail fake failed' } });
  };
  app.use(onError);
  const http = createServer(app);

  const smtpPort = await listen(smtp, options.smtpPort ?? 0, host);
  let httpPort: number;
  try {
    httpPort = await listen(http, options.httpPort ?? 0, host);
  } catch (error) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw error;
  }
  const urlHost = host === '0.0.0.0' || host === '::' ? '127.0.0.1' : host.includes(':') ? `[${host}]` : host;

  return {
    smtpPort,
    httpPort,
    httpUrl: `http://${urlHost}:${httpPort}`,
    messages: async () => structuredClone(await readAll()),
    connections: () => connectionCount,
    clear: () => {
      stored = [];
    },
    waitForMessage(match, timeoutMs = 5_000) {
      return new Promise((resolve, reject) => {
        let settled = false;
        const finish = (message: StoredMessage) => {
          if (settled) return;
          settled = true;
          waiters.delete(wake);
          clearTimeout(timer);
          resolve(structuredClone(message));
        };
        const wake = (message: StoredMessage) => {
          if (match(message)) finish(message);
        };
        const timer = setTimeout(() => {
          if (settled) return;
          settled = true;
          waiters.delete(wake);
          reject(new Error(`No matching message within ${timeoutMs} ms`));
        }, timeoutMs);
        // Waiting first, then looking through what is already here: a message arriving while those are read is not missed.
        waiters.add(wake);
        void readAll().then((all) => {
          const found = all.find(match);
          if (found) finish(found);
        }, reject);
      });
    },
    async close() {
      http.closeAllConnections();
      await Promise.all([
        new Promise<void>((resolve) => http.close(() => resolve())),
        new Promise<void>((resolve) => smtp.close(() => resolve())),
      ]);
    },
  };
}
