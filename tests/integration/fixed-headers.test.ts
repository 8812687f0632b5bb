import type { AddressInfo } from 'node:net';
import express from 'express';
import helmet from 'helmet';
import { describe, expect, it } from 'vitest';
import { fixedHeaders } from '../../server/middleware/fixed-headers';

describe('security headers worked out once', () => {
  it('sets exactly the headers helmet sets on each request', async () => {
    const options = { contentSecurityPolicy: { directives: { defaultSrc: ["'self'"], frameAncestors: ["'none'"] } }, crossOriginEmbedderPolicy: false, hsts: true } as const;
    const app = express();
    app.get('/each', helmet(options), (_req, res) => void res.json({ ok: true }));
    app.get('/once', fixedHeaders(helmet(options)), (_req, res) => void res.json({ ok: true }));
    const server = app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const headersOf = async (p: string) => {
        const res = await fetch(`${base}${p}`);
        return Object.fromEntries([...res.headers].filter(([k]) => k !== 'date' && k !== 'etag'));
      };
      const each = await headersOf('/each');
      expect(each['content-security-policy']).toContain("frame-ancestors 'none'");
      expect(each['x-powered-by']).toBeUndefined();
      expect(await headersOf('/once')).toEqual(each);
    } finally {
      server.close();
    }
  });

  it('refuses a middleware that reads the request', () => {
    expect(() => fixedHeaders((req, _res, next) => (req.secure ? next() : next()))).toThrow(/read the request/);
  });
});
