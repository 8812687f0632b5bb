import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { precompress } from '../../scripts/precompress';
import { startTestApp, type TestApp } from '../support/test-app';

/** Compressed answers and cache headers, read as raw bytes (fetch would decompress them out of sight). */
let t: TestApp;
let clientDir: string;
const script = `export const rows = ${JSON.stringify(Array.from({ length: 400 }, (_, i) => ({ i, text: `row ${i} of the built script` })))};\n`;
beforeAll(async () => {
  clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-client-'));
  fs.mkdirSync(path.join(clientDir, 'assets'));
  fs.writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><title>Spoolyard</title><div id="root"></div>');
  fs.writeFileSync(path.join(clientDir, 'assets', 'index-Abc123.js'), script);
  precompress(clientDir);
  t = await startTestApp({ deps: { clientDir } });
}, 120_000);
afterAll(async () => {
  await t?.close();
  fs.rmSync(clientDir, { recursive: true, force: true });
});

function raw(p: string, acceptEncoding?: string): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: Buffer }> {
  return new Promise((resolve, reject) => {
    const req = http.get(`${t.url}${p}`, { headers: acceptEncoding ? { 'accept-encoding': acceptEncoding } : {} }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    });
    req.on('error', reject);
  });
}
const decode = (r: { headers: http.IncomingHttpHeaders; body: Buffer }) =>
  r.headers['content-encoding'] === 'br' ? zlib.brotliDecompressSync(r.body) : r.headers['content-encoding'] === 'gzip' ? zlib.gunzipSync(r.body) : r.body;

describe('compression', () => {
  it('sends a catalogue list as brotli or gzip as accepted, the same answer either way, and plain otherwise', async () => {
    const plain = await raw('/api/parts');
    expect(plain.headers['content-encoding']).toBeUndefined();
    const list = JSON.parse(plain.body.toString()) as { items: unknown[] };
    expect(list.items.length).toBeGreaterThan(0);
    for (const [accept, encoding] of [['gzip, deflate, br', 'br'], ['gzip', 'gzip']] as const) {
      const r = await raw('/api/parts', accept);
      expect(r.headers['content-encoding']).toBe(encoding);
      expect(r.headers.vary).toMatch(/Accept-Encoding/i);
      expect(r.body.length).toBeLessThan(plain.body.length / 3);
      expect(JSON.parse(decode(r).toString())).toEqual(list);
    }
    // The cached answer's bytes are reused: a second request gives the identical compressed body and entity tag.
    const [a, b] = [await raw('/api/parts', 'br'), await raw('/api/parts', 'br')];
    expect(a.body.equals(b.body)).toBe(true);
    expect(a.headers.etag).toBe(plain.headers.etag);
  });

  it('compresses other JSON answers as they are made, and leaves small ones alone', async () => {
    const frames = await raw('/api/frames', 'gzip');
    expect(frames.headers['content-encoding']).toBe('gzip');
    expect(JSON.parse(decode(frames).toString())).toBeTruthy();
    const health = await raw('/api/health', 'gzip, br');
    expect(health.headers['content-encoding']).toBeUndefined();
  });

  it('serves built files precompressed and cached for a year, and the page revalidated on every visit', async () => {
    const js = await raw('/assets/index-Abc123.js', 'br, gzip');
    expect(js.status).toBe(200);
    expect(js.headers['content-encoding']).toBe('br');
    expect(js.headers['content-type']).toMatch(/javascript/);
    expect(js.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(decode(js).toString()).toBe(script);
    const gz = await raw('/assets/index-Abc123.js', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(decode(gz).toString()).toBe(script);
    const page = await raw('/catalogue/turbochargers');
    expect(page.status).toBe(200);
    expect(page.headers['cache-control']).toBe('no-cache');
    expect(page.body.toString()).toMatch(/<div id="root">/);
  });
});
