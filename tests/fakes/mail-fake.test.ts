import nodemailer from 'nodemailer';
import { afterEach, describe, expect, it } from 'vitest';
import { startMailFake, type MailFake, type StoredMessage } from '../../fakes/mail/mail-fake';

// Messages go in through nodemailer, the reference SMTP client the app uses, and come out of the JSON API.

const started: MailFake[] = [];
afterEach(async () => {
  for (const fake of started.splice(0)) await fake.close();
});

async function start(options: Parameters<typeof startMailFake>[0] = {}): Promise<MailFake> {
  const fake = await startMailFake({ smtpPort: 0, httpPort: 0, ...options });
  started.push(fake);
  return fake;
}

function transport(fake: MailFake, extra: Record<string, unknown> = {}) {
  return nodemailer.createTransport({ host: '127.0.0.1', port: fake.smtpPort, secure: false, ...extra });
}

describe('mail fake', () => {
  it('stores a message sent by nodemailer and lists it with its text and HTML parts', async () => {
    const fake = await start();
    const info = await transport(fake).sendMail({
      from: '"Spoolyard Turbo Supply" <orders@spoolyard.test>',
      to: 'Pat Retail <Buyer@Retail.test>',
      cc: 'records@spoolyard.test',
      subject: 'Order SY-1001 confirmed',
      text: 'Thank you for your order SY-1001.\nTotal: $482.50',
      html: '<p>Thank you for your order <strong>SY-1001</strong>.</p><p>Total: $482.50</p>',
    });
    expect(info.accepted).toHaveLength(2);

    const response = await fetch(`${fake.httpUrl}/messages`);
    expect(response.status).toBe(200);
    const { messages } = (await response.json()) as { messages: StoredMessage[] };
    expect(messages).toHaveLength(1);
    const message = messages[0];
    expect(message).toMatchObject({
      from: 'orders@spoolyard.test',
      fromName: 'Spoolyard Turbo Supply',
      to: ['buyer@retail.test'],
      cc: ['records@spoolyard.test'],
      subject: 'Order SY-1001 confirmed',
      text: 'Thank you for your order SY-1001.\nTotal: $482.50',
    });
    expect(message?.html).toContain('<strong>SY-1001</strong>');
    expect(message?.envelope.to).toEqual(['buyer@retail.test', 'records@spoolyard.test']);
    expect(Number.isNaN(Date.parse(message?.date ?? ''))).toBe(false);

    const one = await fetch(`${fake.httpUrl}/messages/${message?.id}`);
    expect(((await one.json()) as StoredMessage).subject).toBe('Order SY-1001 confirmed');
    expect((await fetch(`${fake.httpUrl}/messages/nope`)).status).toBe(404);

    const filtered = (await (await fetch(`${fake.httpUrl}/messages?to=nobody@retail.test`)).json()) as { messages: unknown[] };
    expect(filtered.messages).toHaveLength(0);

    expect((await fetch(`${fake.httpUrl}/messages`, { method: 'DELETE' })).status).toBe(204);
    expect((await fake.messages())).toHaveLength(0);
  });

  it('does not offer STARTTLS, so a client that insists on TLS is refused', async () => {
    const fake = await start();
    await expect(transport(fake, { requireTLS: true }).verify()).rejects.toThrow(/STARTTLS/i);
    await expect(transport(fake).verify()).resolves.toBe(true);
  });

  it('accepts any SMTP credentials in plain text', async () => {
    const fake = await start();
    await transport(fake, { auth: { user: 'app', pass: 'dev-only' } }).sendMail({
      from: 'orders@spoolyard.test',
      to: 'dealer@trade.test',
      subject: 'Application received',
      text: 'We have your dealer application.',
    });
    const message = await fake.waitForMessage((m) => m.to.includes('dealer@trade.test'));
    expect(message.subject).toBe('Application received');
    expect(message.html).toBeNull();
  });

  it('wakes a waiter with a message that arrives after it began to wait, and keeps each message read once', async () => {
    const fake = await start();
    const waiting = fake.waitForMessage((m) => m.subject === 'Order SY-1002 on its way');
    await transport(fake).sendMail({ from: 'orders@spoolyard.test', to: 'buyer@retail.test', subject: 'Order SY-1002 on its way', text: 'Tracking: QF123', html: '<p>Tracking: QF123</p>' });
    const message = await waiting;
    expect(message).toMatchObject({ to: ['buyer@retail.test'], text: 'Tracking: QF123' });
    const [listed] = await fake.messages();
    expect(listed).toEqual(message);
  });

  it('keeps only the newest messages past the cap', async () => {
    const fake = await start({ maxMessages: 3 });
    const mailer = transport(fake);
    for (let i = 1; i <= 5; i += 1) {
      await mailer.sendMail({ from: 'orders@spoolyard.test', to: 'buyer@retail.test', subject: `Notice ${i}`, text: `n${i}` });
    }
    expect((await fake.messages()).map((m) => m.subject)).toEqual(['Notice 5', 'Notice 4', 'Notice 3']);
    fake.clear();
    expect((await fake.messages())).toEqual([]);
  });
});
