import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { FITMENT_LIMITS, FitmentRequestSchema } from '../../shared/schemas/fitment';

const valid = { displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' };
const fieldErrors = (body: unknown) => {
  const result = FitmentRequestSchema.safeParse(body);
  if (result.success) return {};
  return z.flattenError(result.error).fieldErrors as Record<string, string[] | undefined>;
};

describe('FitmentRequestSchema', () => {
  it('accepts the minimal body and every optional field', () => {
    expect(FitmentRequestSchema.safeParse(valid).success).toBe(true);
    const full = {
      ...valid,
      powerHp: undefined,
      powerKw: 220,
      altitudeM: 1200,
      ambientC: 30,
      intercooled: false,
      assumptions: { bsfc: 0.55, afr: 11.8, volumetricEfficiency: 0.95, manifoldTempC: 60, chargeLossPsi: 1, inletLossPsi: 0.3, compressorEfficiency: 0.74 },
    };
    expect(FitmentRequestSchema.safeParse(full).success).toBe(true);
  });

  it('says what is wrong in words a person understands', () => {
    expect(fieldErrors({ ...valid, displacementL: 0 }).displacementL).toEqual(['displacement must be between 0.1 and 20 L']);
    expect(fieldErrors({ ...valid, displacementL: 25 }).displacementL).toEqual(['displacement must be between 0.1 and 20 L']);
    expect(fieldErrors({ ...valid, displacementL: undefined }).displacementL).toEqual(['displacement is required']);
    expect(fieldErrors({ ...valid, rpm: 50_000 }).rpm).toEqual(['peak-power rpm must be between 1000 and 20000 rpm']);
    expect(fieldErrors({ ...valid, fuel: 'kerosene' }).fuel).toEqual(['fuel must be one of petrol, e85, methanol or diesel']);
    expect(fieldErrors({ ...valid, application: 'rally' }).application).toEqual([
      'application must be one of street, circuit, drag, offroad or marine',
    ]);
    expect(fieldErrors({ ...valid, powerHp: undefined }).powerHp).toEqual(['power is required, in hp or kW']);
    expect(fieldErrors({ ...valid, powerKw: 200 }).powerKw).toEqual(['give power in hp or in kW, not both']);
    expect(fieldErrors({ ...valid, assumptions: { volumetricEfficiency: 90 } })).toHaveProperty('assumptions');
    expect(fieldErrors({ ...valid, displacementL: '2.0' }).displacementL).toEqual(['displacement must be between 0.1 and 20 L']);
  });

  it('exports its limits', () => {
    expect(FITMENT_LIMITS.displacementL).toEqual({ min: 0.1, max: 20 });
    expect(FITMENT_LIMITS.powerHp.max).toBeGreaterThanOrEqual(2100);
  });
});
