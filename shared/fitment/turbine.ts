import type { Fuel } from '../schemas/fitment';

/**
 * The turbine side, from the compressor–turbine power balance (Watson & Janota, "Turbocharging the Internal
 * Combustion Engine", ch. 4 and 7; the method is standard, the figures below are from memory unless marked):
 *   compressor power  P_c = ṁ_air · c_p,air · T₁ · (PR^((γ−1)/γ) − 1) / η_c
 *   turbine power     P_t = ṁ_t · c_p,exh · T₃ · η_t · (1 − ER^(−(γₑ−1)/γₑ)),  with P_t · η_mech = P_c
 *   swallowing        ṁ_t = A_eff · p₃ · ψ(ER) / √(Rₑ · T₃)  (the housing's throat as a nozzle)
 * where ER = p₃/p₄ is the turbine expansion ratio, ṁ_t the exhaust (air + fuel) through the wheel; the rest goes
 * through the wastegate.
 */

/** Exhaust gas: γ ≈ 1.33 and c_p ≈ 1150 J/(kg·K) near 700–950 °C (Watson & Janota, from memory). */
export const EXHAUST_GAMMA = 1.33;
export const EXHAUST_CP_J_PER_KG_K = 1150;
export const EXHAUST_R_J_PER_KG_K = (EXHAUST_CP_J_PER_KG_K * (EXHAUST_GAMMA - 1)) / EXHAUST_GAMMA;
const EXHAUST_EXPONENT = (EXHAUST_GAMMA - 1) / EXHAUST_GAMMA;

/** Turbine total-to-static efficiency of a small radial turbine (common practice 0.65–0.72). */
export const DEFAULT_TURBINE_EFFICIENCY = 0.68;
/** Bearings and seals: the shaft passes about 95 % of the turbine's power to the compressor (common practice). */
export const MECHANICAL_EFFICIENCY = 0.95;
/** Exhaust system after the turbine at full flow: about 1 psi above ambient (common practice). */
export const EXHAUST_SYSTEM_LOSS_KPA = 7;

/** Turbine inlet temperature at full load, °C (common practice; alcohol fuels burn cooler, diesel runs lean). */
export const TURBINE_INLET_C: Record<Fuel, number> = { petrol: 950, e85: 880, methanol: 800, diesel: 700 };

/**
 * Effective throat area of a housing. A/R is quoted in inches (area in in² over the centroid radius in in); the
 * centroid radius is about 0.6 × the turbine wheel's diameter (a volute's centroid sits a little outside the wheel
 * tip; invented proportion in the usual range) and the throat discharges at about 0.9 of its area (nozzle
 * discharge coefficient, common practice).
 */
export const VOLUTE_CENTROID_RADIUS_SHARE = 0.6;
export const THROAT_DISCHARGE_COEFFICIENT = 0.9;
const M_PER_IN = 0.0254;

export function turbineThroatAreaM2(housingAr: number, turbineWheelMm: number): number {
  const radiusIn = (VOLUTE_CENTROID_RADIUS_SHARE * turbineWheelMm) / 1000 / M_PER_IN;
  return THROAT_DISCHARGE_COEFFICIENT * housingAr * radiusIn * M_PER_IN * M_PER_IN;
}

/** ψ(ER): the compressible nozzle flow function, choked (constant) above the critical expansion ratio. */
const CRITICAL_ER = ((EXHAUST_GAMMA + 1) / 2) ** (EXHAUST_GAMMA / (EXHAUST_GAMMA - 1));
function nozzleFlowFunction(er: number): number {
  const r = 1 / Math.min(Math.max(er, 1), CRITICAL_ER);
  const g = EXHAUST_GAMMA;
  return Math.sqrt(((2 * g) / (g - 1)) * (r ** (2 / g) - r ** ((g + 1) / g)));
}

// ER·ψ(ER) rises monotonically, so swallowing is inverted through a table (fast, and exact enough at 0.1 %); so does
// ER·ψ(ER)·(1 − ER^(−(γₑ−1)/γₑ)), the power of the flow a housing swallows, which the wastegate balance inverts.
const TABLE_MAX_ER = 8;
const TABLE_STEPS = 2000;
const erTable = Array.from({ length: TABLE_STEPS + 1 }, (_, i) => 1 + ((TABLE_MAX_ER - 1) * i) / TABLE_STEPS);
const capacityTable = erTable.map((er) => er * nozzleFlowFunction(er));
const swallowedPowerTable = erTable.map((er, i) => capacityTable[i]! * (1 - er ** -EXHAUST_EXPONENT));

/** The expansion ratio at which a rising table reaches a value (linear between entries); null past its end. */
function invertErTable(table: readonly number[], needed: number): number | null {
  if (needed <= 0) return 1;
  if (needed > table[TABLE_STEPS]!) return null;
  let lo = 0;
  let hi = TABLE_STEPS;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (table[mid]! < needed) lo = mid;
    else hi = mid;
  }
  const a = table[lo]!;
  const b = table[hi]!;
  return erTable[lo]! + ((erTable[hi]! - erTable[lo]!) * (needed - a)) / (b - a || 1);
}

/** Expansion ratio at which a housing swallows a flow: solves ṁ = A·p₄·ER·ψ(ER)/√(R·T₃); null past the table. */
export function expansionRatioFor(massKgS: number, areaM2: number, p4Kpa: number, t3K: number): number | null {
  return invertErTable(capacityTable, (massKgS * Math.sqrt(EXHAUST_R_J_PER_KG_K * t3K)) / (areaM2 * p4Kpa * 1000));
}

/** Mass flow a housing passes at an expansion ratio. */
export function swallowedKgS(er: number, areaM2: number, p4Kpa: number, t3K: number): number {
  return (areaM2 * p4Kpa * 1000 * er * nozzleFlowFunction(er)) / Math.sqrt(EXHAUST_R_J_PER_KG_K * t3K);
}

/**
 * The least exhaust flow through a housing, wastegate shut, at which the turbine gives each kilogram of it a specific
 * work (J/kg at the shaft, before mechanical losses): the work sets the expansion ratio,
 * ER* = (1 − w/(c_p·T₃·η))^(−γₑ/(γₑ−1)), and the housing reaches ER* once it swallows this much. Null when no
 * expansion ratio the table spans gives that work.
 */
export function exhaustToDriveKgS(specificWorkJPerKg: number, setting: TurbineSetting): number | null {
  const share = specificWorkJPerKg / (EXHAUST_CP_J_PER_KG_K * setting.t3K * setting.efficiency);
  if (share <= 0) return 0;
  if (share >= 1) return null;
  const er = (1 - share) ** (-1 / EXHAUST_EXPONENT);
  return er > TABLE_MAX_ER ? null : swallowedKgS(er, setting.areaM2, setting.p4Kpa, setting.t3K);
}

/** Turbine shaft power, W. */
export function turbinePowerW(massKgS: number, t3K: number, er: number, efficiency: number): number {
  return massKgS * EXHAUST_CP_J_PER_KG_K * t3K * efficiency * (1 - er ** -EXHAUST_EXPONENT);
}

export interface TurbineSetting {
  areaM2: number;
  p4Kpa: number;
  t3K: number;
  efficiency: number;
}

export interface TurbineBalance {
  /** Whether the housing can drive the compressor at all at this flow (wastegate shut). */
  reaches: boolean;
  expansionRatio: number;
  exhaustManifoldKpa: number;
  /** Share of the exhaust that bypasses the wheel through the wastegate, 0–1. */
  wastegateShare: number;
  /** Surplus power with the wastegate shut, W (negative: the turbine cannot drive the compressor). */
  surplusW: number;
}

/**
 * Where turbine and compressor balance for an exhaust flow and a compressor power. With the wastegate shut the
 * housing's swallowing sets the expansion ratio; surplus power is bled off by opening the wastegate until the
 * wheel's share of the flow, at its lower expansion ratio, gives exactly the power needed.
 */
export function balanceTurbine(exhaustKgS: number, compressorPowerW: number, setting: TurbineSetting): TurbineBalance {
  const { areaM2, p4Kpa, t3K, efficiency } = setting;
  const needW = compressorPowerW / MECHANICAL_EFFICIENCY;
  const shutEr = expansionRatioFor(exhaustKgS, areaM2, p4Kpa, t3K) ?? TABLE_MAX_ER;
  const shutPower = turbinePowerW(exhaustKgS, t3K, shutEr, efficiency);
  if (shutPower <= needW) {
    return { reaches: false, expansionRatio: shutEr, exhaustManifoldKpa: shutEr * p4Kpa, wastegateShare: 0, surplusW: shutPower - needW };
  }
  // Open the wastegate: the expansion ratio whose swallowed flow makes just the power needed,
  // P(ER) = A·p₄·ER·ψ(ER)/√(R·T₃) · c_p·T₃·η·(1 − ER^(−(γₑ−1)/γₑ)), read off its table.
  const scale = (areaM2 * p4Kpa * 1000 * EXHAUST_CP_J_PER_KG_K * t3K * efficiency) / Math.sqrt(EXHAUST_R_J_PER_KG_K * t3K);
  const er = Math.min(invertErTable(swallowedPowerTable, needW / scale) ?? shutEr, shutEr);
  const through = swallowedKgS(er, areaM2, p4Kpa, t3K);
  return {
    reaches: true,
    expansionRatio: er,
    exhaustManifoldKpa: er * p4Kpa,
    wastegateShare: Math.min(1, Math.max(0, 1 - through / exhaustKgS)),
    surplusW: shutPower - needW,
  };
}
