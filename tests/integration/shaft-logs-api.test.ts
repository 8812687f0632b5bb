import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_LOG_NAMES, DEMO_LOGGED_CHECK, seedDemoShaftLogs } from '../../catalog-seed/seed-shaft-logs';
import { shaftLogs } from '../../server/db/schema';
import { analyseShaftLog } from '../../shared/fitment/shaft-log';
import { FitmentResponseSchema } from '../../shared/schemas/fitment';
import { FitmentFrameMapsResponseSchema, SavedFitmentSchema, SavedFitmentsResponseSchema, type SavedFitment } from '../../shared/schemas/saved-fitments';
import {
  SHAFT_LOG_MAX_BYTES,
  SHAFT_LOG_MAX_ROWS,
  SHAFT_LOGS_PER_CHECK_MAX,
  ShaftLogDetailSchema,
  ShaftLogSchema,
  ShaftLogsResponseSchema,
} from '../../shared/schemas/shaft-logs';
import { formatShaftLogCsv, parseShaftLogCsv } from '../../shared/shaft-log-csv';
import { createCustomer, createDealer } from '../support/factories';
import { signIn, type Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let retail: Client;
let otherDealer: Client;
let check: SavedFitment;
let sampleCsv: string;

const INPUT = { displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' } as const;
const base = () => `/api/fitments/${check.id}/shaft-logs`;
const logsHeld = () => t.db.select({ n: count() }).from(shaftLogs).get()?.n ?? 0;

function csvForm(csv: string, fields: Record<string, string>, fileName = 'pull.csv', type = 'text/csv'): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([csv], { type }), fileName);
  return form;
}

beforeAll(async () => {
  // Seeded for the test of the demo dealer's logged check; the other tests use users of their own.
  t = await startTestApp({ accounts: true });
  [retail, otherDealer] = (await Promise.all([createCustomer(t), createDealer(t)])).map((u) => u.client) as [Client, Client];
  const saved = await retail.send('POST', '/api/fitments', { name: 'logged street car', input: INPUT });
  expect(saved.status, JSON.stringify(saved.body)).toBe(201);
  check = SavedFitmentSchema.parse(saved.body);
});
afterAll(async () => {
  await t.close();
});

describe('/api/fitments/:id/shaft-logs', () => {
  it('answers 401 to a signed-out visitor', async () => {
    expect((await t.get(base())).status).toBe(401);
    expect((await t.get(`${base()}/1`)).status).toBe(401);
    expect((await t.get(`${base()}/sample.csv?frameCode=CHS`)).status).toBe(401);
    expect((await t.send('POST', base(), undefined, { origin: t.url, 'content-type': 'text/csv' })).status).toBe(401);
    expect((await t.send('DELETE', `${base()}/1`, undefined, { origin: t.url })).status).toBe(401);
  });

  it('gives a sample log for the check on a frame, as a CSV download that reads back cleanly', async () => {
    expect(check.bestFrameCode).not.toBeNull();
    const res = await fetch(`${t.url}${base()}/sample.csv?frameCode=${check.bestFrameCode}`, { headers: { cookie: retail.cookie() } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="sample-shaft-log-${check.bestFrameCode}.csv"`);
    sampleCsv = await res.text();
    expect(sampleCsv).toMatch(/^# Spoolyard shaft-speed log: a sample with invented data\./);
    expect(parseShaftLogCsv(sampleCsv).ok).toBe(true);
    expect((await retail.get(`${base()}/sample.csv?frameCode=ZZZ`)).status).toBe(400);
  });

  it('stores an uploaded log on the check and lays it on the frame’s map, worked out from the saved check', async () => {
    expect(ShaftLogsResponseSchema.parse((await retail.get(base())).body).items).toEqual([]);
    const up = await retail.upload(base(), csvForm(sampleCsv, { frameCode: check.bestFrameCode ?? '', name: 'Sunday pull' }));
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const log = ShaftLogSchema.parse(up.body);
    const rows = parseShaftLogCsv(sampleCsv);
    if (!rows.ok) throw new Error('sample did not parse');
    expect(log).toMatchObject({ savedFitmentId: check.id, name: 'Sunday pull', frameCode: check.bestFrameCode, boostUnit: 'kpa', rowCount: rows.rows.length });
    expect(log.durationS).toBeCloseTo((rows.rows.at(-1)?.t ?? 0) - (rows.rows[0]?.t ?? 0), 6);

    const list = ShaftLogsResponseSchema.parse((await retail.get(base())).body);
    expect(list.items).toEqual([log]);

    const detail = ShaftLogDetailSchema.parse((await retail.get(`${base()}/${log.id}`)).body);
    expect(detail.log).toEqual(log);
    expect(detail.frame.code).toBe(check.bestFrameCode);
    expect(detail.candidate?.frameCode).toBe(check.bestFrameCode);
    expect(detail.points).toHaveLength(log.rowCount);

    // The same answer from the public pieces: the check re-run, the frame's map, the shared computation.
    const result = FitmentResponseSchema.parse((await retail.send('POST', '/api/fitment', INPUT)).body);
    const frame = FitmentFrameMapsResponseSchema.parse((await retail.get('/api/fitment/frames')).body).items.find((f) => f.code === check.bestFrameCode);
    if (!frame) throw new Error('no frame');
    const expected = analyseShaftLog(rows.rows, result.assumptions, frame);
    expect(detail.operatingLine).toEqual(result.operatingLine);
    expect(detail.summary.points).toBe(expected.summary.points);
    expect(detail.summary.peakShaftRpm).toBe(expected.summary.peakShaftRpm);
    expect(detail.summary.timeNearOrInSurgeS).toBeCloseTo(expected.summary.timeNearOrInSurgeS, 3);
    expect(detail.summary.excursions.map((e) => e.kind)).toEqual(expected.summary.excursions.map((e) => e.kind));
    detail.points.forEach((p, i) => {
      const e = expected.points[i]!;
      expect(p.correctedFlowLbMin).toBeCloseTo(e.correctedFlowLbMin, 3);
      expect(p.pressureRatio).toBeCloseTo(e.pressureRatio, 4);
      expect([p.speed, p.surge]).toEqual([e.speed, e.surge]);
    });
    // The sample is made to show a lift-off near the surge line.
    expect(detail.summary.excursions.some((e) => e.kind === 'near-surge')).toBe(true);
  });

  it('takes the file as a text/csv body too, named in the query, boost in psi', async () => {
    const parsed = parseShaftLogCsv(sampleCsv);
    if (!parsed.ok) throw new Error('sample did not parse');
    const post = (body: string | undefined) =>
      fetch(`${t.url}${base()}?frameCode=${check.bestFrameCode?.toLowerCase()}&name=from%20a%20script`, {
        method: 'POST',
        headers: { cookie: retail.cookie(), origin: t.url, 'content-type': 'text/csv; charset=utf-8' },
        body,
      });
    const sent = await post(formatShaftLogCsv(parsed.rows, 'psi'));
    expect(sent.status).toBe(201);
    expect(ShaftLogSchema.parse(await sent.json())).toMatchObject({ name: 'from a script', boostUnit: 'psi', frameCode: check.bestFrameCode });
    expect((await post(undefined)).status).toBe(400);
  });

  it('refuses a file with bad rows, naming each line and column, and stores nothing', async () => {
    const before = logsHeld();
    const bad = 'time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c\n0.0,2300,-45,24800,33\n0.1,23OO,-45,24800,33\n0.2,2300,-45,900000,33\n0.0,2300,-45,24800,33\n';
    const res = await retail.upload(base(), csvForm(bad, { frameCode: check.bestFrameCode ?? '' }, 'bad.csv'));
    expect(res.status).toBe(400);
    expect(res.body).toEqual({
      error: {
        message: 'The log has 3 problems. Fix the file and upload it again.',
        fieldErrors: {
          'line.3.engine_rpm': ['“23OO” is not a number'],
          'line.4.shaft_rpm': ['900,000 rpm is outside the plausible 0 to 400,000 rpm'],
          'line.5.time_s': ['0 s is not after the row before (0.2 s): times must rise from row to row'],
        },
      },
    });
    expect(logsHeld()).toBe(before);
  });

  it('refuses a frame not in the catalogue, a missing file, the wrong kind of file, and files over the limits', async () => {
    const noFrame = await retail.upload(base(), csvForm(sampleCsv, { frameCode: 'ZZZ' }));
    expect(noFrame.status).toBe(400);
    expect(noFrame.body).toMatchObject({ error: { fieldErrors: { frameCode: ['there is no frame ZZZ; choose one from the list'] } } });

    const form = new FormData();
    form.append('frameCode', check.bestFrameCode ?? '');
    expect((await retail.upload(base(), form)).status).toBe(400);

    expect((await retail.upload(base(), csvForm(sampleCsv, { frameCode: check.bestFrameCode ?? '' }, 'pull.png', 'image/png'))).status).toBe(415);

    const huge = `${'#'.repeat(SHAFT_LOG_MAX_BYTES + 10)}\n`;
    const big = await retail.upload(base(), csvForm(huge, { frameCode: check.bestFrameCode ?? '' }));
    expect(big.status).toBe(413);
    expect(big.body).toEqual({ error: { message: 'The log is larger than 1 MB; split the session into shorter logs' } });

    const rows = Array.from({ length: SHAFT_LOG_MAX_ROWS + 1 }, (_, i) => `${i / 10},2300,-45,24800,33`).join('\n');
    const long = await retail.upload(base(), csvForm(`time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c\n${rows}\n`, { frameCode: check.bestFrameCode ?? '' }));
    expect(long.status).toBe(413);
    expect((long.body as { error: { message: string } }).error.message).toMatch(/more than 10,000 rows/);
  });

  it('shows a check’s logs to its owner only: anyone else is told there is no such check', async () => {
    const [log] = ShaftLogsResponseSchema.parse((await retail.get(base())).body).items;
    if (!log) throw new Error('no log');
    expect((await otherDealer.get(base())).status).toBe(404);
    expect((await otherDealer.get(`${base()}/${log.id}`)).status).toBe(404);
    expect((await otherDealer.get(`${base()}/sample.csv?frameCode=${check.bestFrameCode}`)).status).toBe(404);
    expect((await otherDealer.upload(base(), csvForm(sampleCsv, { frameCode: check.bestFrameCode ?? '' }))).status).toBe(404);
    expect((await otherDealer.send('DELETE', `${base()}/${log.id}`)).status).toBe(404);
    // A log id under another of the owner's checks is not found either.
    const other = SavedFitmentSchema.parse((await retail.send('POST', '/api/fitments', { name: 'second car', input: { ...INPUT, powerHp: 200 } })).body);
    expect((await retail.get(`/api/fitments/${other.id}/shaft-logs/${log.id}`)).status).toBe(404);
    expect((await retail.get(`${base()}/${log.id}`)).status).toBe(200);
  });

  it('deletes a log, and a deleted check takes its logs with it', async () => {
    const { items } = ShaftLogsResponseSchema.parse((await retail.get(base())).body);
    const [first] = items;
    if (!first) throw new Error('no log');
    expect((await retail.send('DELETE', `${base()}/${first.id}`)).status).toBe(204);
    expect((await retail.get(`${base()}/${first.id}`)).status).toBe(404);
    expect((await retail.send('DELETE', `${base()}/${first.id}`)).status).toBe(404);
    expect(ShaftLogsResponseSchema.parse((await retail.get(base())).body).items).toHaveLength(items.length - 1);

    expect((await retail.send('DELETE', `/api/fitments/${check.id}`)).status).toBe(204);
    expect(t.db.select({ n: count() }).from(shaftLogs).where(eq(shaftLogs.savedFitmentId, check.id)).get()?.n).toBe(0);
    expect((await retail.get(base())).status).toBe(404);
  });

  it('holds at most SHAFT_LOGS_PER_CHECK_MAX logs on one check', async () => {
    const saved = SavedFitmentSchema.parse((await retail.send('POST', '/api/fitments', { name: 'busy car', input: INPUT })).body);
    const row = { t: 0, engineRpm: 2300, boostKpa: -45, shaftRpm: 24_800, intakeC: 33 };
    t.db
      .insert(shaftLogs)
      .values(Array.from({ length: SHAFT_LOGS_PER_CHECK_MAX }, (_, i) => ({ savedFitmentId: saved.id, frameCode: saved.bestFrameCode ?? '', name: `log ${i}`, boostUnit: 'kpa' as const, rowCount: 1, durationS: 0, rows: [row] })))
      .run();
    const res = await retail.upload(`/api/fitments/${saved.id}/shaft-logs`, csvForm(sampleCsv, { frameCode: saved.bestFrameCode ?? '' }));
    expect(res.status).toBe(409);
  });
});

describe('the demo dealer’s logged check', () => {
  it('is seeded once, with a clean pull and one that touches past the shaft-speed limit', async () => {
    expect(seedDemoShaftLogs(t.db)).toBe(true);
    expect(seedDemoShaftLogs(t.db)).toBe(false);
    const dealer = await signIn(t, 'dealer@spoolyard.test');
    const saved = SavedFitmentsResponseSchema.parse((await dealer.get('/api/fitments')).body).items.find((s) => s.name === DEMO_LOGGED_CHECK.name);
    if (!saved) throw new Error('the demo check was not seeded');
    const { items } = ShaftLogsResponseSchema.parse((await dealer.get(`/api/fitments/${saved.id}/shaft-logs`)).body);
    expect(items.map((l) => l.name).sort()).toEqual([...DEMO_LOG_NAMES].sort());
    const byName = Object.fromEntries(items.map((l) => [l.name, l]));
    const clean = ShaftLogDetailSchema.parse((await dealer.get(`/api/fitments/${saved.id}/shaft-logs/${byName[DEMO_LOG_NAMES[0]]?.id}`)).body);
    const spike = ShaftLogDetailSchema.parse((await dealer.get(`/api/fitments/${saved.id}/shaft-logs/${byName[DEMO_LOG_NAMES[1]]?.id}`)).body);
    expect(clean.log.boostUnit).toBe('kpa');
    expect(spike.log.boostUnit).toBe('psi');
    expect(clean.summary.excursions.some((e) => e.kind === 'near-surge')).toBe(true);
    expect(clean.summary.timeInSurgeS).toBe(0);
    expect(spike.summary.timeOverSpeedS).toBeGreaterThan(0);
    expect(spike.summary.peakShaftSpeedPct).toBeGreaterThan(100);
  });
});
