import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { databaseMigratedBefore } from '../support/old-migrations';

/**
 * Messages queued before a message's text and HTML moved to a table of their own keep them: a database migrated up to
 * the move, holding queued and sent messages, is opened as the server opens it.
 */
describe('moving message bodies out of the outbox rows', () => {
  it('keeps every queued and sent message’s text and HTML, and the rows keep their state', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-mail-bodies-'));
    try {
      const { sqlite, file } = databaseMigratedBefore(dir, (tag) => tag.endsWith('_mail_bodies_apart'));
      const insert = sqlite.prepare('INSERT INTO mail_outbox (kind, recipient, subject, text, html, state, next_attempt_at, sent_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)');
      insert.run('order-confirmation', 'a@spoolyard.test', 'Order SY-1 confirmed', 'Thanks for your order', '<p>Thanks for your order</p>'.repeat(300), 'queued', 1, null);
      insert.run('dispatch', 'b@spoolyard.test', 'Order SY-2 is on its way', 'On its way', '<p>On its way</p>', 'sent', 1, '2026-12-01T10:00:00.000Z');
      sqlite.close();

      const db = openDatabase(file);
      try {
        const rows = db.$client
          .prepare('SELECT o.subject, o.state, b.text, b.html FROM mail_outbox o JOIN mail_bodies b ON b.outbox_id = o.id ORDER BY o.id')
          .all() as Array<{ subject: string; state: string; text: string; html: string }>;
        expect(rows).toEqual([
          { subject: 'Order SY-1 confirmed', state: 'queued', text: 'Thanks for your order', html: '<p>Thanks for your order</p>'.repeat(300) },
          { subject: 'Order SY-2 is on its way', state: 'sent', text: 'On its way', html: '<p>On its way</p>' },
        ]);
        const columns = (db.$client.pragma('table_info(mail_outbox)') as Array<{ name: string }>).map((c) => c.name);
        expect(columns).not.toContain('text');
        expect(columns).not.toContain('html');
      } finally {
        db.$client.close();
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
