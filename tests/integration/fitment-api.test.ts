import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FITMENT_CAUTIONS } from '../../shared/fitment/check';
import { FitmentResponseSchema } from '../../shared/schemas/fitment';
import { FitmentFrameMapsResponseSchema, SavedFitmentSchema, SavedFitmentsResponseSchema } from '../../shared/schemas/saved-fitments';
import { createCustomer, createDealer } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const STREET_2L = { displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' } as const;

const savedCount = () => t.db.$client.prepare('SELECT count(*) FROM saved_fitments').pluck().get() as number;

describe('POST /api/fitment', () => {
  it('answers the required airflow, the operating line and every frame ranked, with the cautions', async () => {
    const res = await t.send('POST', '/api/fitment', STREET_2L);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const body = FitmentResponseSchema.parse(res.body);
    // Wa [lb/min] = hp · BSFC · AFR / 60 with the petrol defaults 0.50 lb/(hp·h) and 12:1 (common practice): 300 · 0.5 · 12 / 60 = 30.
    expect(body.required.airflowLbMin).toBeCloseTo(30, 6);
    expect(body.assumptions).toMatchObject({ bsfc: 0.5, afr: 12, displacementL: 2, powerHp: 300 });
    expect(body.assumptions.defaulted).toContain('bsfc');
    expect(body.required.manifoldPressureKpa).toBeGreaterThan(body.required.ambientPressureKpa);
    expect(body.operatingLine.length).toBeGreaterThanOrEqual(6);
    expect(body.operatingLine.at(-1)?.rpm).toBe(6500);
    const frameCount = t.db.$client.prepare('SELECT count(*) FROM frames').pluck().get() as number;
    expect(body.candidates).toHaveLength(frameCount);
    expect(body.candidates.map((c) => c.rank)).toEqual(body.candidates.map((_, i) => i + 1));
    expect(body.candidates[0]?.verdict).toBe('fits');
    expect(body.cautions).toEqual([...FITMENT_CAUTIONS]);
  });

  it('ranks the smallest frame, AWL, first for about 100 hp from a 0.5 L petrol engine (common practice)', async () => {
    const res = await t.send('POST', '/api/fitment', { displacementL: 0.5, powerHp: 100, rpm: 9000, fuel: 'petrol', application: 'street' });
    expect(res.status).toBe(200);
    const body = FitmentResponseSchema.parse(res.body);
    expect(body.candidates[0]).toMatchObject({ frameCode: 'AWL', layout: 'single' });
    expect(['fits', 'marginal']).toContain(body.candidates[0]?.verdict);
    // The recommended turbine housing is one the catalogue sells for that frame.
    const sold = t.db.$client
      .prepare("SELECT s.turbine_ar FROM parts p JOIN part_specs s ON s.part_id = p.id WHERE p.category = 'turbine-housings' AND p.frame_code = 'AWL' AND p.status = 'active'")
      .pluck()
      .all() as number[];
    expect(sold).toContain(body.candidates[0]?.turbine?.housingAr);
    expect(body.candidates[0]?.housings.map((h) => h.housingAr).sort()).toEqual([...new Set(sold)].sort());
  });

  it('refuses an engine beyond any engine (over 1,000 hp per litre) with a 400 naming the value and its unit', async () => {
    const res = await t.send('POST', '/api/fitment', { displacementL: 0.1147, displacementUnit: 'in3', powerHp: 260, rpm: 6500, fuel: 'petrol', application: 'street' });
    expect(res.status).toBe(400);
    const body = res.body as { error: { fieldErrors?: Record<string, string[]> } };
    expect(body.error.fieldErrors?.displacementL?.[0]).toMatch(/7 cubic inches .* hp per litre/);
  });

  it('takes power in kW as well as hp and answers the same check', async () => {
    const hp = FitmentResponseSchema.parse((await t.send('POST', '/api/fitment', STREET_2L)).body);
    // 300 hp = 223.71 kW (NIST SP 811: 1 hp = 745.699 872 W).
    const { powerHp: _, ...rest } = STREET_2L;
    const kw = FitmentResponseSchema.parse((await t.send('POST', '/api/fitment', { ...rest, powerKw: 223.7099616 })).body);
    expect(kw.required.airflowLbMin).toBeCloseTo(hp.required.airflowLbMin, 4);
    expect(kw.candidates.map((c) => c.frameCode)).toEqual(hp.candidates.map((c) => c.frameCode));
  });

  it('refuses missing and out-of-range input with field errors a person understands', async () => {
    const missing = await t.send('POST', '/api/fitment', { fuel: 'petrol' });
    expect(missing.status).toBe(400);
    const fe = (missing.body as { error: { message: string; fieldErrors: Record<string, string[]> } }).error.fieldErrors;
    expect(fe.displacementL).toEqual(['displacement is required']);
    expect(fe.rpm).toEqual(['peak-power rpm is required']);
    expect(fe.powerHp).toEqual(['power is required, in hp or kW']);
    expect(fe.application?.[0]).toMatch(/^application must be one of street, circuit, drag, offroad or marine/);

    const range = await t.send('POST', '/api/fitment', { ...STREET_2L, displacementL: 40, assumptions: { volumetricEfficiency: 3 } });
    expect(range.status).toBe(400);
    expect(range.body).toMatchObject({
      error: {
        message: 'Some engine details need fixing',
        fieldErrors: {
          displacementL: ['displacement must be between 0.1 and 20 L'],
          'assumptions.volumetricEfficiency': [expect.stringMatching(/^volumetric efficiency must be between 0.5 and 1.3/)],
        },
      },
    });
  });

  it('refuses a body that is not JSON in the one error shape', async () => {
    const res = await t.get('/api/fitment', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"displacementL":' });
    expect(res.status).toBe(400);
    expect(res.body).toMatchObject({ error: { message: expect.any(String) } });
  });
});

describe('GET /api/fitment/frames', () => {
  it('gives every frame its compressor map for the chart', async () => {
    const res = await t.get('/api/fitment/frames');
    expect(res.status).toBe(200);
    const { items } = FitmentFrameMapsResponseSchema.parse(res.body);
    expect(items.map((f) => f.code)).toContain('AWL');
    for (const f of items) {
      expect(f.map.surgeLine.length).toBeGreaterThanOrEqual(2);
      expect(f.map.maxShaftRpm).toBe(f.maxShaftRpm);
    }
  });
});

describe('/api/fitments (saved checks)', () => {
  let retail = '';
  let dealer = '';
  beforeAll(async () => {
    [retail, dealer] = (await Promise.all([createCustomer(t), createDealer(t)])).map((u) => u.client.cookie()) as [string, string];
  });

  it('answers 401 when signed out, for every route', async () => {
    expect((await t.get('/api/fitments')).status).toBe(401);
    expect((await t.get('/api/fitments/1')).status).toBe(401);
    expect((await t.send('POST', '/api/fitments', { name: 'x', input: STREET_2L }, { origin: t.url })).status).toBe(401);
    expect((await t.send('DELETE', '/api/fitments/1', undefined, { origin: t.url })).status).toBe(401);
  });

  it('saves a check recomputed on the server, lists it, and deletes it', async () => {
    const before = savedCount();
    const created = await t.send('POST', '/api/fitments', { name: "customer's 2.0 L street car", input: STREET_2L }, { cookie: retail, origin: t.url });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const saved = SavedFitmentSchema.parse(created.body);
    expect(saved).toMatchObject({ name: "customer's 2.0 L street car", input: STREET_2L });
    const best = FitmentResponseSchema.parse((await t.send('POST', '/api/fitment', STREET_2L)).body).candidates[0]!;
    expect(saved.bestFrameCode).toBe(best.frameCode);
    expect(saved.summary).toBe(`2.0 L petrol, 300 hp at 6500 rpm, street — best fit ${best.frameCode} ${best.frameName} (fits)`);
    expect(savedCount()).toBe(before + 1);

    const list = SavedFitmentsResponseSchema.parse((await t.get('/api/fitments', { headers: { cookie: retail } })).body);
    expect(list.items.map((s) => s.id)).toContain(saved.id);
    const one = await t.get(`/api/fitments/${saved.id}`, { headers: { cookie: retail } });
    expect(one.status).toBe(200);
    expect(SavedFitmentSchema.parse(one.body).input).toEqual(STREET_2L);

    const removed = await t.send('DELETE', `/api/fitments/${saved.id}`, undefined, { cookie: retail, origin: t.url });
    expect(removed.status).toBe(204);
    expect(savedCount()).toBe(before);
    expect((await t.get(`/api/fitments/${saved.id}`, { headers: { cookie: retail } })).status).toBe(404);
    expect((await t.send('DELETE', `/api/fitments/${saved.id}`, undefined, { cookie: retail, origin: t.url })).status).toBe(404);
  });

  it('refuses a bad name or engine with field errors and saves nothing', async () => {
    const before = savedCount();
    const res = await t.send('POST', '/api/fitments', { name: '  ', input: { ...STREET_2L, rpm: 50 } }, { cookie: retail, origin: t.url });
    expect(res.status).toBe(400);
    const fe = (res.body as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors;
    expect(fe.name?.[0]).toMatch(/^give the check a name/);
    expect(fe['input.rpm']).toEqual(['peak-power rpm must be between 1000 and 20000 rpm']);
    expect(savedCount()).toBe(before);
  });

  it("keeps each user's checks to themselves: another user's id answers 404 and stays in place", async () => {
    const mine = SavedFitmentSchema.parse((await t.send('POST', '/api/fitments', { name: 'marine quote', input: { ...STREET_2L, application: 'marine' } }, { cookie: retail, origin: t.url })).body);
    expect(mine.summary).toMatch(/, marine — /);
    expect((await t.get(`/api/fitments/${mine.id}`, { headers: { cookie: dealer } })).status).toBe(404);
    expect((await t.send('DELETE', `/api/fitments/${mine.id}`, undefined, { cookie: dealer, origin: t.url })).status).toBe(404);
    const theirs = SavedFitmentsResponseSchema.parse((await t.get('/api/fitments', { headers: { cookie: dealer } })).body);
    expect(theirs.items.map((s) => s.id)).not.toContain(mine.id);
    expect((await t.get(`/api/fitments/${mine.id}`, { headers: { cookie: retail } })).status).toBe(200);
    expect((await t.get('/api/fitments/not-a-number', { headers: { cookie: retail } })).status).toBe(404);
  });

  it('lets a cart line carry the saved check, and only its owner attach it', async () => {
    const saved = SavedFitmentSchema.parse((await t.send('POST', '/api/fitments', { name: 'cart check', input: STREET_2L }, { cookie: retail, origin: t.url })).body);
    const partNumber = t.db.$client
      .prepare("SELECT part_number FROM parts WHERE frame_code = ? AND category = 'turbochargers' AND status = 'active' ORDER BY id LIMIT 1")
      .pluck()
      .get(saved.bestFrameCode) as string;
    const added = await t.send('POST', '/api/cart/lines', { partNumber, quantity: 1, fitmentId: saved.id }, { cookie: retail, origin: t.url });
    expect(added.status, JSON.stringify(added.body)).toBe(201);
    const line = (added.body as { lines: Array<{ partNumber: string; fitment: { id: number; summary: string } | null }> }).lines.find((l) => l.partNumber === partNumber);
    expect(line?.fitment).toMatchObject({ id: saved.id, summary: saved.summary });
    const stolen = await t.send('POST', '/api/cart/lines', { partNumber, quantity: 1, fitmentId: saved.id }, { cookie: dealer, origin: t.url });
    expect(stolen.status).toBe(404);
  });
});
