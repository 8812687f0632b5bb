import fs from 'node:fs';
import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startMailFake, type MailFake } from '../../fakes/mail/mail-fake';
import { createMailer, type Mailer } from '../../server/services/mailer';
import { createMailOutbox, enqueueMail } from '../../server/services/mail-outbox';
import { createTestDb } from '../support/test-app';
import { renderDispatchNotice } from '../../server/services/mail-templates/dispatch-notice';
import { renderOrderConfirmation } from '../../server/services/mail-templates/order-confirmation';

const FROM = '"Spoolyard Turbo Supply" <orders@spoolyard.test>';

let fake: MailFake;
let mailer: Mailer;

beforeAll(async () => {
  fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
  mailer = createMailer({ host: '127.0.0.1', port: fake.smtpPort, from: FROM });
});

afterAll(async () => {
  await mailer.close();
  await fake.close();
});

beforeEach(() => fake.clear());

/** A port nothing listens on: bind one, then let it go. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

function orderMail() {
  return renderOrderConfirmation({
    orderNumber: 'SY-2001',
    customerName: 'Robin <Vale>',
    placedAt: new Date('2025-03-04T10:00:00Z'),
    lines: [
      {
        partNumber: 'GIM-20-0203',
        title: 'Vanecraft Gimlet (GIM) cartridge, ball bearing',
        category: 'cartridges',
        quantity: 1,
        unitPriceCents: 61900,
        lineTotalCents: 61900,
      },
    ],
    totals: { goodsCents: 61900, dealerDiscountCents: 0, coreDepositsCents: 0, freightCents: 2200, taxCents: 5128, totalCents: 69228 },
    deliveryAddress: { name: 'Robin Vale', lines: ['14 Kiln Lane'], city: 'Ashcombe', postalCode: '00042' },
    payment: { method: 'card', status: 'paid', cardLast4: '4242' },
    orderUrl: 'http://127.0.0.1:5173/orders/SY-2001',
  });
}

describe('mailer over SMTP', () => {
  it('verifies the connection to the mail server', async () => {
    await expect(mailer.verify()).resolves.toBeUndefined();
  });

  it('delivers a rendered message with its text and HTML parts intact', async () => {
    const rendered = orderMail();
    await mailer.send({ to: 'Buyer@Retail.test', ...rendered });

    const message = await fake.waitForMessage((m) => m.subject === rendered.subject);
    expect(message).toMatchObject({
      from: 'orders@spoolyard.test',
      fromName: 'Spoolyard Turbo Supply',
      to: ['buyer@retail.test'],
      subject: 'Order SY-2001 confirmed',
    });
    // mailparser decodes the transfer encoding; what arrives must be what was rendered.
    expect(message.text?.trim()).toBe(rendered.text.trim());
    expect(message.text).toContain('$692.28');
    expect(message.html).toContain('$692.28');
    expect(message.html).toContain('Robin &lt;Vale&gt;');
    expect(message.html).toContain('Prime the oil supply');
  });

  it('delivers the dispatch notice with the tracking number', async () => {
    const rendered = renderDispatchNotice({
      orderNumber: 'SY-2002',
      customerName: 'Sam Ferrow',
      dispatchedAt: new Date('2025-06-12T15:00:00Z'),
      carrier: 'Cobbleline Freight',
      trackingNumber: 'MF987654321',
      cartons: 1,
      lines: [{ partNumber: 'FLG-50-0203', title: 'Turbine inlet flange gasket', category: 'gaskets-fittings', quantity: 2 }],
      deliveryAddress: { name: 'Sam Ferrow', lines: ['2 Mill Yard'], city: 'Ashcombe', postalCode: '00043' },
      orderUrl: 'http://127.0.0.1:5173/orders/SY-2002',
    });
    await mailer.send({ to: 'sam@dealer.test', ...rendered });
    const message = await fake.waitForMessage((m) => m.to.includes('sam@dealer.test'));
    expect(message.text).toContain('MF987654321');
    expect(message.html).toContain('MF987654321');
  });
});

describe('a mail server that is down', () => {
  it('sends a whole outbox over the pool: every message arrives, over at most two connections', async () => {
    const { db, dir } = createTestDb();
    const pooled = createMailer({ host: '127.0.0.1', port: fake.smtpPort, from: FROM });
    try {
      const rendered = orderMail();
      for (let i = 0; i < 40; i++) enqueueMail(db, 'order-confirmation', () => ({ ...rendered, to: `buyer-${i}@spoolyard.test`, subject: `Order ${i} confirmed` }));
      const opened = fake.connections();
      const outbox = createMailOutbox({ db, mailer: pooled });
      const result = await outbox.drain();
      expect(result).toMatchObject({ claimed: 40, sent: 40, retrying: 0, failed: 0 });
      expect((await fake.messages())).toHaveLength(40);
      expect(new Set((await fake.messages()).map((m) => m.to[0])).size).toBe(40);
      expect(fake.connections() - opened).toBeLessThanOrEqual(2);
    } finally {
      await pooled.close();
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('keeps a connection the server refused one message on, and sends the next over it', async () => {
    const strict = await startMailFake({ smtpPort: 0, httpPort: 0, maxMessageBytes: 40_000 });
    const sender = createMailer({ host: '127.0.0.1', port: strict.smtpPort, from: FROM });
    try {
      const small = orderMail();
      await sender.send({ to: 'first@retail.test', ...small });
      await expect(sender.send({ to: 'too-big@retail.test', ...small, html: small.html + '<p>filler</p>'.repeat(6_000) })).rejects.toThrow();
      await sender.send({ to: 'after@retail.test', ...small });
      expect((await strict.messages()).map((m) => m.to[0]).sort()).toEqual(['after@retail.test', 'first@retail.test']);
      expect(strict.connections()).toBe(1);
    } finally {
      await sender.close();
      await strict.close();
    }
  });

  it('opens a fresh connection when the server has closed the one kept open', async () => {
    const first = await startMailFake({ smtpPort: 0, httpPort: 0 });
    const port = first.smtpPort;
    const sender = createMailer({ host: '127.0.0.1', port, from: FROM });
    try {
      await sender.send({ to: 'before@retail.test', ...orderMail() });
      await first.close();
      // The server comes back on the same port; the pooled connection it cut is not used again.
      const second = await startMailFake({ smtpPort: port, httpPort: 0 });
      try {
        await sender.send({ to: 'after@retail.test', ...orderMail() });
        expect((await second.messages()).map((m) => m.to[0])).toEqual(['after@retail.test']);
      } finally {
        await second.close();
      }
    } finally {
      await sender.close();
    }
  });

  it('makes a send fail fast with the connection error (the outbox keeps the message and tries again)', async () => {
    const down = createMailer({ host: '127.0.0.1', port: await closedPort(), from: FROM, timeoutMs: 2_000 });
    try {
      await expect(down.verify()).rejects.toThrow();
      await expect(down.send({ to: 'buyer@retail.test', ...orderMail() })).rejects.toThrow(/ECONNREFUSED/);
    } finally {
      await down.close();
    }
  });
});
