import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createCustomer, createDealer, createOrder } from '../support/factories';
import { signIn, type Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

/** A refused upload, whatever refuses it, leaves no file behind; an accepted one keeps its files. */
let t: TestApp;
let uploads: string;
beforeAll(async () => {
  t = await startTestApp({ accounts: true });
  uploads = path.join(t.dir, '.uploads');
}, 120_000);
afterAll(() => t?.close());

const filesUnder = (dir: string): string[] =>
  fs.existsSync(dir) ? fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name)) : [];
const png = (extraBytes = 0) => new Blob([Buffer.concat([Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex'), Buffer.alloc(extraBytes)])], { type: 'image/png' });
const form = (fields: Record<string, string>, files: Array<[string, Blob]>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  for (const [field, blob] of files) f.append(field, blob, 'photo.png');
  return f;
};

/** Sends the upload and returns its status, having checked that the uploads folder did not grow. */
async function refused(client: Client, url: string, body: FormData) {
  const before = filesUnder(uploads).length;
  const res = await client.upload(url, body);
  expect(filesUnder(uploads), `files left by a ${res.status} answer`).toHaveLength(before);
  return res.status;
}

describe('refused uploads leave nothing on disk', () => {
  it('return photos: bad fields, someone else’s order, too large, not an image, wrong role', async () => {
    const dealer = await createDealer(t);
    const stranger = await createCustomer(t);
    const order = await createOrder(dealer, [{ partNumber: 'FLG-50-0201', quantity: 1 }]);
    const fields = { orderNumber: order.order.number, lineId: '1', kind: 'faulty', quantity: '1', reason: 'Leaks at the flange' };

    expect(await refused(dealer.client, '/api/returns', form({ kind: 'faulty' }, [['photos', png()]]))).toBe(400);
    expect(await refused(stranger.client, '/api/returns', form(fields, [['photos', png()], ['photos', png()]]))).toBe(404);
    // The second file goes over the limit while multer is writing it; the first was already on disk.
    expect(await refused(dealer.client, '/api/returns', form(fields, [['photos', png()], ['photos', png(2_100_000)]]))).toBe(413);
    expect(await refused(dealer.client, '/api/returns', form(fields, [['photos', new Blob(['not an image'], { type: 'image/png' })]]))).toBe(415);
    const floor = await signIn(t, 'warehouse@spoolyard.test');
    expect(await refused(floor, '/api/returns', form(fields, [['photos', png()]]))).toBe(403);
  });

  it('part photos: an unknown part keeps nothing; a known one keeps its photo', async () => {
    const admin = await signIn(t, 'admin@spoolyard.test');
    expect(await refused(admin, '/api/admin/parts/ZZZ-99-9999/photos', form({}, [['photo', png()]]))).toBe(404);
    const before = filesUnder(uploads).length;
    const kept = await admin.upload('/api/admin/parts/CHS-30-0201/photos', form({}, [['photo', png()]]));
    expect(kept.status, JSON.stringify(kept.body)).toBe(201);
    expect(filesUnder(uploads)).toHaveLength(before + 1);
  });
});
