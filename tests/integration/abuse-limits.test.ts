import http from 'node:http';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createApp } from '../../server/app';
import { openDatabase } from '../../server/db/client';
import { RESET_ANSWER, SIGN_UP_ANSWER } from '../../server/middleware/auth-guard';
import { createRecordingMailer } from '../../server/services/mailer';
import { CSV_MAX_ROWS } from '../../shared/schemas/orders';
import { offlineDeps, testConfig } from '../support/app-deps';
import { createAccount, createCustomer } from '../support/factories';
import { startServerProcess } from '../support/server-process';
import { startTestApp, type TestApp } from '../support/test-app';
import { envBesideTestApp } from '../support/process-env';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
});
afterAll(async () => {
  await t.close();
});

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};
/** Part numbers that exist nowhere, each one a suggestion search. */
const unknownLines = (seed: number, n = CSV_MAX_ROWS) => Array.from({ length: n }, (_, i) => ({ partNumber: `QZX-${seed}${i % 10}-${String(7000 + i).padStart(4, '0')}`, quantity: '2' }));
const userCount = () => (t.db.$client.prepare('SELECT COUNT(*) AS n FROM user').get() as { n: number }).n;

/** Posts a body of `bytes` bytes through node:http, so the test sees the server's answer even if it stops reading early. */
function postLarge(url: string, bytes: number, contentType: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const target = new URL(url);
    const req = http.request({ host: target.hostname, port: target.port, path: target.pathname, method: 'POST', headers: { 'content-type': contentType, 'content-length': bytes, origin: t.url } }, (res) => {
      res.resume();
      resolve(res.statusCode ?? 0);
    });
    req.on('error', (err) => (req.destroyed ? undefined : reject(err)));
    const chunk = Buffer.alloc(1 << 20, 'a');
    const prefix = Buffer.from('{"name":"');
    let sent = 0;
    const write = () => {
      while (sent < bytes && !req.destroyed) {
        const part = sent === 0 ? prefix : chunk.subarray(0, Math.min(chunk.length, bytes - sent));
        sent += part.length;
        if (!req.write(part)) return void req.once('drain', write);
      }
      req.end();
    };
    write();
  });
}

describe('body limits and input types on the auth routes', () => {
  it('answers a 50 MB sign-up with 413 and stores nothing', async () => {
    const before = userCount();
    expect(await postLarge(`${t.url}/api/auth/sign-up/email`, 50 * 1024 * 1024, 'application/json')).toBe(413);
    // A body of a type the auth routes do not read is refused unread, whatever its size.
    expect(await postLarge(`${t.url}/api/auth/sign-up/email`, 50 * 1024 * 1024, 'text/plain')).toBe(415);
    expect(userCount()).toBe(before);
    const health = await t.get('/api/health');
    expect(health.status).toBe(200);
  }, 30_000);

  it('refuses a sign-up name of the wrong type or length with 400, nothing stored', async () => {
    const before = userCount();
    for (const name of [null, true, [], {}, 'x'.repeat(81)]) {
      const reply = await t.send('POST', '/api/auth/sign-up/email', { name, email: 'typed@example.test', password: 'brackenford-anvil-7' }, { origin: t.url });
      expect(reply.status, JSON.stringify(name)).toBe(400);
    }
    // Fields the form does not have (a role) are refused, not passed on.
    const role = await t.send('POST', '/api/auth/sign-up/email', { name: 'Rae Tolland', email: 'role@example.test', password: 'brackenford-anvil-7', role: 'admin' }, { origin: t.url });
    expect(role.status).toBe(400);
    expect(userCount()).toBe(before);
  });

  it('answers update-user with name null, true, [] or {} with 400 and keeps the name', async () => {
    const buyer = await createCustomer(t);
    for (const name of [null, true, [], {}]) {
      const reply = await buyer.client.send('POST', '/api/auth/update-user', { name });
      expect(reply.status, JSON.stringify(name)).toBe(400);
      expect(reply.body).toMatchObject({ error: { fieldErrors: { name: expect.any(Array) } } });
    }
    const row = t.db.$client.prepare('SELECT name FROM user WHERE id = ?').get(buyer.id) as { name: string };
    expect(row.name).toBe(buyer.name);
    const ok = await buyer.client.send('POST', '/api/auth/update-user', { name: 'Rae Tolland' });
    expect(ok.status).toBe(200);
  });
});

describe('common passwords', () => {
  it('refuses password123 and 1234567890 at sign-up, reset and change, with the shared rule', async () => {
    for (const password of ['password123', '1234567890', 'qwertyuiop']) {
      const reply = await t.send('POST', '/api/auth/sign-up/email', { name: 'Ori Fenwick', email: 'weak@example.test', password }, { origin: t.url });
      expect(reply.status, password).toBe(400);
      expect(reply.body).toMatchObject({ error: { fieldErrors: { password: [expect.stringMatching(/too common/)] } } });
    }
    const reset = await t.send('POST', '/api/auth/reset-password', { newPassword: 'password123', token: 'any' }, { origin: t.url });
    expect(reset.status).toBe(400);
    const buyer = await createCustomer(t);
    const change = await buyer.client.send('POST', '/api/auth/change-password', { currentPassword: buyer.password, newPassword: '1234567890' });
    expect(change.status).toBe(400);
    expect(t.db.$client.prepare("SELECT COUNT(*) AS n FROM user WHERE email = 'weak@example.test'").get()).toEqual({ n: 0 });
  });
});

describe('sign-in and reset limits per account', () => {
  it('40 wrong passwords from 40 addresses, across two app instances on one database, do not end in a sign-in', async () => {
    const victim = await createAccount(t);
    // A second app on the same database file (its own connection), as a second process would be.
    const otherDb = openDatabase(path.join(t.dir, 'test.db'));
    const other = createApp({ ...offlineDeps(otherDb), mailer: createRecordingMailer(), config: testConfig({ publicUrl: t.url }) });
    const server = await new Promise<http.Server>((resolve) => {
      const s = other.app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const otherUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 40; i++) {
        const base = i % 2 === 0 ? t.url : otherUrl;
        const res = await fetch(`${base}/api/auth/sign-in/email`, {
          method: 'POST',
          // 'trust proxy' is loopback: the app takes the client address from the header, as behind our proxy.
          headers: { 'content-type': 'application/json', origin: t.url, 'x-forwarded-for': `198.51.100.${i + 1}` },
          body: JSON.stringify({ email: victim.email, password: `wrong-guess-${i}` }),
        });
        statuses.push(res.status);
      }
      const right = await fetch(`${otherUrl}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: t.url, 'x-forwarded-for': '198.51.100.99' },
        body: JSON.stringify({ email: victim.email, password: victim.password }),
      });
      const counts = { wrong: statuses.filter((s) => s === 401).length, refused: statuses.filter((s) => s === 429).length };
      console.log(`per-account limit: ${counts.wrong} wrong passwords answered, ${counts.refused} refused with 429, then the right password: ${right.status}`);
      expect(counts).toEqual({ wrong: 10, refused: 30 });
      expect(right.status).toBe(429);
      expect(right.headers.getSetCookie().some((c) => c.includes('session_token'))).toBe(false);
      expect(((await right.json()) as { error: { message: string } }).error.message).toMatch(/paused after 10 wrong passwords.*15 minutes/);
      // Another account is not affected.
      const bystander = await createAccount(t);
      const ok = await fetch(`${t.url}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: t.url, 'x-forwarded-for': '198.51.100.200' },
        body: JSON.stringify({ email: bystander.email, password: bystander.password }),
      });
      expect(ok.status).toBe(200);
    } finally {
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
      otherDb.$client.close();
    }
  }, 60_000);

  it('limits reset requests per address the same for known and unknown addresses', async () => {
    const known = await createAccount(t);
    for (const email of [known.email, 'nobody-limit@example.test']) {
      const statuses: number[] = [];
      for (let i = 0; i < 6; i++) {
        const reply = await t.send('POST', '/api/auth/request-password-reset', { email }, { origin: t.url, 'x-forwarded-for': `192.0.2.${i + 1}` });
        statuses.push(reply.status);
      }
      expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
    }
  }, 30_000);
});

describe('sign-up and reset do not tell whether an account exists', () => {
  it('answers the same words in about the same time, and mails the owner instead', async () => {
    const owner = await createAccount(t, { name: 'Mina Ashcombe' });
    const timed = async (p: string, body: unknown) => {
      const started = performance.now();
      const reply = await t.send('POST', p, body, { origin: t.url });
      return { ms: performance.now() - started, reply };
    };
    const signUps = { known: [] as number[], unknown: [] as number[] };
    const resets = { known: [] as number[], unknown: [] as number[] };
    const bodies = new Set<string>();
    for (let i = 0; i < 5; i++) {
      const known = await timed('/api/auth/sign-up/email', { name: 'Someone Else', email: owner.email, password: 'harrowgate-lantern-4' });
      const unknown = await timed('/api/auth/sign-up/email', { name: 'Someone Else', email: `new-${i}@example.test`, password: 'harrowgate-lantern-4' });
      for (const r of [known, unknown]) {
        expect(r.reply.status).toBe(200);
        expect(r.reply.body).toEqual({ status: true, message: SIGN_UP_ANSWER });
        expect(r.reply.headers.getSetCookie()).toEqual([]);
        bodies.add(JSON.stringify(r.reply.body));
      }
      signUps.known.push(known.ms);
      signUps.unknown.push(unknown.ms);
      const resetKnown = await timed('/api/auth/request-password-reset', { email: owner.email, redirectTo: '/reset-password' });
      const resetUnknown = await timed('/api/auth/request-password-reset', { email: `nobody-${i}@example.test`, redirectTo: '/reset-password' });
      expect(resetKnown.reply.body).toEqual({ status: true, message: RESET_ANSWER });
      expect(resetUnknown.reply.body).toEqual(resetKnown.reply.body);
      resets.known.push(resetKnown.ms);
      resets.unknown.push(resetUnknown.ms);
    }
    expect(bodies.size).toBe(1);
    const figures = {
      signUpKnown: median(signUps.known),
      signUpUnknown: median(signUps.unknown),
      resetKnown: median(resets.known),
      resetUnknown: median(resets.unknown),
    };
    console.log(
      `median answer times (ms): sign-up known ${figures.signUpKnown.toFixed(0)} / unknown ${figures.signUpUnknown.toFixed(0)}; reset known ${figures.resetKnown.toFixed(0)} / unknown ${figures.resetUnknown.toFixed(0)}`,
    );
    // Both paths wait for the same floor (600 ms), so neither answers sooner than it; what is left between them is
    // noise (quiet machine: within ~20 ms; without the floor reset differed by ~130 ms). Only the floor is asserted:
    // the difference of two timings depends on the machine's load and is printed above.
    for (const ms of [...signUps.known, ...signUps.unknown, ...resets.known, ...resets.unknown]) expect(ms).toBeGreaterThanOrEqual(595);

    await t.mailSettled();
    const inbox = await t.mail!.messages();
    const to = (address: string) => inbox.filter((m) => m.to.includes(address));
    expect(to(owner.email).filter((m) => /already have a Spoolyard account/.test(m.subject))).toHaveLength(5);
    expect(to(owner.email).filter((m) => /Reset your Spoolyard password/.test(m.subject))).toHaveLength(5);
    expect(to('new-0@example.test').map((m) => m.subject)).toEqual(['Confirm your Spoolyard account']);
    expect(to('nobody-0@example.test')).toEqual([]);
    // The owner's password is unchanged and the account is still one row.
    expect(t.db.$client.prepare('SELECT COUNT(*) AS n FROM user WHERE email = ?').get(owner.email)).toEqual({ n: 1 });
  }, 60_000);
});

describe('expensive anonymous routes', () => {

  it('caps the rows of a check and says so', async () => {
    const reply = await t.send('POST', '/api/cart/check', { lines: unknownLines(1, CSV_MAX_ROWS + 1) });
    expect(reply.status).toBe(400);
    expect(JSON.stringify(reply.body)).toContain(`at most ${CSV_MAX_ROWS} lines per check`);
    const ok = await t.send('POST', '/api/cart/check', { lines: unknownLines(1, 3) });
    expect(ok.body).toMatchObject({ maxRows: CSV_MAX_ROWS, errorCount: 3 });
  });

  it('still suggests a near number for a typo', async () => {
    // A digit typed twice: one edit away from a catalogue number.
    const reply = await t.send('POST', '/api/cart/check', { lines: [{ partNumber: 'FLG-50-02011', quantity: '1' }] });
    const rows = (reply.body as { rows: Array<{ status: string; suggestions: Array<{ partNumber: string }> }> }).rows;
    expect(rows[0]!.status).toBe('error');
    expect(rows[0]!.suggestions.map((s) => s.partNumber)).toContain('FLG-50-0201');
  });

  it('rate-limits the order pad per client address, in the database', async () => {
    const limited = await startTestApp({ config: { orderPadLimitPerMinute: 3 } });
    try {
      const statuses: number[] = [];
      for (let i = 0; i < 5; i++) statuses.push((await limited.send('POST', '/api/cart/check', { lines: unknownLines(2, 1) }, { 'x-forwarded-for': '203.0.113.50' })).status);
      const bulk = await limited.send('POST', '/api/cart/bulk', { lines: [{ partNumber: 'FLG-50-0201', quantity: 1 }] }, { 'x-forwarded-for': '203.0.113.50' });
      const elsewhere = await limited.send('POST', '/api/cart/check', { lines: unknownLines(2, 1) }, { 'x-forwarded-for': '203.0.113.51' });
      expect(statuses).toEqual([200, 200, 200, 429, 429]);
      expect(bulk.status).toBe(429);
      expect(elsewhere.status).toBe(200);
    } finally {
      await limited.close();
    }
  });

  it('8 parallel maximal checks never hold /api/health long, and run no catalogue search per row', async () => {
    const fullSearch = vi.spyOn(t.app.search, 'search');
    const burst = Array.from({ length: 8 }, (_, k) =>
      fetch(`${t.url}/api/cart/check`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-forwarded-for': `203.0.113.${100 + k}` }, body: JSON.stringify({ lines: unknownLines(k + 3) }) }),
    );
    let done = false;
    const started = performance.now();
    const all = Promise.all(burst).then(async (replies) => {
      done = true;
      return Promise.all(replies.map(async (r) => ({ status: r.status, body: (await r.json()) as { errorCount: number } })));
    });
    const latencies: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const res = await fetch(`${t.url}/api/health`);
      await res.text();
      latencies.push(performance.now() - t0);
      await new Promise((resolve) => setTimeout(resolve, 5));
    }
    const replies = await all;
    const burstMs = performance.now() - started;
    expect(replies.every((r) => r.status === 200 && r.body.errorCount === CSV_MAX_ROWS)).toBe(true);
    const figures = { samples: latencies.length, median: median(latencies), max: Math.max(...latencies) };
    console.log(`/api/health during 8 parallel checks of ${CSV_MAX_ROWS} unknown numbers (${burstMs.toFixed(0)} ms): ${figures.samples} samples, median ${figures.median.toFixed(1)} ms, max ${figures.max.toFixed(1)} ms`);
    // Turns, not milliseconds: /api/health was answered again and again while the checks were still running, which
    // cannot happen if one check held the event loop to its end. (Quiet machine: median ~5 ms, max ~25 ms; without
    // turns median ~186 ms. Timings are printed above, not asserted: they depend on the machine's load.)
    expect(figures.samples).toBeGreaterThan(3);
    // Suggestions come from bounded index look-ups: the full search (word search, fuzzy ranking) is never run.
    expect(fullSearch).not.toHaveBeenCalled();
    fullSearch.mockRestore();
  }, 60_000);
});

describe('/api/health beside a burst of expensive checks, server in its own process', () => {
  it('answers within a few milliseconds while eight maximal order-pad checks run', async () => {
    // The server as `npm start` runs it, so the figures are the server's alone (in the test app above, this test
    // process's own client work shares the event loop).
    const root = path.resolve(import.meta.dirname, '../..');
    const server = await startServerProcess(root, envBesideTestApp(t, { UPLOADS_DIR: path.join(t.dir, 'uploads-process'), ORDER_PAD_LIMIT_PER_MINUTE: '1000' }));
    try {
      const burst = async (round: number) => {
        let done = false;
        const started = performance.now();
        const checks = Promise.all(
          Array.from({ length: 8 }, (_, k) =>
            fetch(`${server.url}/api/cart/check`, {
              method: 'POST',
              headers: { 'content-type': 'application/json', 'x-forwarded-for': `198.51.100.${10 * round + k}` },
              body: JSON.stringify({ lines: unknownLines(k + 3) }),
            }).then(async (r) => ({ status: r.status, text: await r.text() })),
          ),
        ).finally(() => (done = true));
        const latencies: number[] = [];
        while (!done) {
          const t0 = performance.now();
          await (await fetch(`${server.url}/api/health`)).text();
          latencies.push(performance.now() - t0);
          await new Promise((resolve) => setTimeout(resolve, 5));
        }
        const replies = await checks;
        expect(replies.every((r) => r.status === 200)).toBe(true);
        latencies.sort((a, b) => a - b);
        return { burstMs: performance.now() - started, samples: latencies.length, median: median(latencies), p95: latencies[Math.floor(latencies.length * 0.95)]!, max: latencies.at(-1)! };
      };
      await burst(0); // warm-up: the first run compiles the code paths
      const figures = await burst(1);
      console.log(
        `/api/health during 8 parallel checks of ${CSV_MAX_ROWS} unknown numbers, server in its own process (${figures.burstMs.toFixed(0)} ms): ` +
          `${figures.samples} samples, median ${figures.median.toFixed(1)} ms, p95 ${figures.p95.toFixed(1)} ms, max ${figures.max.toFixed(1)} ms`,
      );
      // Answered many times while the burst ran: the checks take turns with other requests. Target 50 ms at worst;
      // measured on a quiet machine: median ~4 ms, p95 ~8 ms, max ~15 ms (printed above, not asserted: timings depend
      // on the machine's load; `npm run bench` is where figures are compared).
      expect(figures.samples).toBeGreaterThan(10);
    } finally {
      await server.stop();
    }
  }, 120_000);
});

describe('Cache-Control on personal answers', () => {
  it('is no-store on signed-in, cart, account and order answers; the public catalogue keeps its caching', async () => {
    const buyer = await createCustomer(t);
    const personal = ['/api/account/me', '/api/cart', '/api/orders', '/api/fitments', '/api/auth/get-session', '/api/parts', '/api/frames'];
    for (const p of personal) {
      const reply = await buyer.client.get(p);
      expect(reply.status, p).toBeLessThan(400);
      expect(reply.headers.get('cache-control'), p).toBe('no-store');
    }
    const guestCart = await t.send('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1 });
    expect(guestCart.headers.get('cache-control')).toBe('no-store');
    for (const p of ['/api/account/me', '/api/cart', '/api/auth/get-session']) expect((await t.get(p)).headers.get('cache-control'), p).toBe('no-store');
    for (const p of ['/api/parts', '/api/frames', '/api/parts/FLG-50-0201']) expect((await t.get(p)).headers.get('cache-control'), p).toBeNull();
    expect((await t.get('/api/fitment/frames')).headers.get('cache-control')).toBe('public, max-age=600');
  });
});
