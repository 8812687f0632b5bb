import type { Application, Fuel } from '../schemas/fitment';

/**
 * Default assumptions, each overridable by the request. Values are common practice in turbo matching unless a
 * handbook is named; they describe a healthy engine at full load, not a best case.
 */

export interface FuelDefaults {
  /** Brake-specific fuel consumption at full load for a turbocharged engine, lb/(hp·h). */
  bsfc: number;
  /** Air-fuel ratio by mass at full load. */
  afr: number;
}

// Stoichiometric AFRs are petrol 14.7, E85 ≈ 9.8, methanol 6.4, diesel 14.5 (Heywood, appendix D, from memory).
// Spark-ignition fuels run rich at full load for knock and exhaust-temperature margin (λ ≈ 0.8, common practice);
// the BSFC values then all land on about 6.0 lb of air per hp·h, the basis of the catalogue's 10 hp per lb/min.
// Diesel runs lean at full load (λ ≈ 1.5, the smoke limit; common practice) with a lower BSFC.
export const FUEL_DEFAULTS: Record<Fuel, FuelDefaults> = {
  petrol: { bsfc: 0.5, afr: 12.0 }, // common practice: 0.50–0.60 turbo petrol, AFR 11.5–12.5
  e85: { bsfc: 0.7, afr: 8.5 }, // common practice: about 1.4 × petrol BSFC for the lower heating value
  methanol: { bsfc: 1.2, afr: 5.0 }, // common practice: about 2.4 × petrol BSFC, AFR 4.5–5.5
  diesel: { bsfc: 0.38, afr: 22.0 }, // common practice: 0.36–0.42 turbo diesel, AFR 20–25
};

export interface ApplicationDefaults {
  /**
   * Multiplies the fuel's BSFC and divides its AFR by the same enrichment: sustained full load runs richer and
   * with less ignition advance, so it burns more fuel and a little more air per hp (common practice).
   */
  bsfcFactor: number;
  afrFactor: number;
  /** Air-to-air intercooler effectiveness (marine: sea-water aftercooler). Common practice 0.65–0.85. */
  intercoolerEffectiveness: number;
  /** Where full boost arrives, as a fraction of peak-power rpm (common practice for each use). */
  fullBoostFraction: number;
  /** Shaft speed kept in hand below the frame's maximum (continuous duty keeps more; common practice). */
  minShaftSpeedMargin: number;
  /** Least flow margin from the surge line at the same pressure ratio. */
  minSurgeMargin: number;
  /** Least flow margin from choke or the top speed line at the same pressure ratio. */
  minChokeMargin: number;
  /**
   * Most exhaust-manifold pressure a housing may need, as a multiple of boost pressure at peak power: racing wants the
   * engine to breathe out freely, the road and the water accept more for earlier boost (common practice).
   */
  maxBackPressureRatio: number;
  /** Specific output this kind of use usually survives, hp per litre on petrol (common practice; from memory). */
  typicalHpPerLitre: number;
  /** Weights in the ranking score (see verdict.ts). */
  weights: { efficiency: number; surge: number; choke: number; shaftSpeed: number; response: number };
  label: string;
}

export const APPLICATION_DEFAULTS: Record<Application, ApplicationDefaults> = {
  street: {
    bsfcFactor: 1.0,
    afrFactor: 1.0,
    intercoolerEffectiveness: 0.75,
    fullBoostFraction: 0.55, // full boost a little past half of peak-power rpm for daily response
    minShaftSpeedMargin: 0.05,
    minSurgeMargin: 0.1,
    minChokeMargin: 0.03,
    maxBackPressureRatio: 1.9,
    typicalHpPerLitre: 160,
    weights: { efficiency: 1, surge: 0.6, choke: 0.2, shaftSpeed: 0.3, response: 1 },
    label: 'street',
  },
  circuit: {
    bsfcFactor: 1.1,
    afrFactor: 1 / 1.05,
    intercoolerEffectiveness: 0.75,
    fullBoostFraction: 0.6, // lives in the upper half of the rev range
    minShaftSpeedMargin: 0.08,
    minSurgeMargin: 0.1,
    minChokeMargin: 0.05,
    maxBackPressureRatio: 1.6,
    typicalHpPerLitre: 220,
    weights: { efficiency: 1, surge: 0.3, choke: 0.4, shaftSpeed: 0.5, response: 0.4 },
    label: 'circuit',
  },
  drag: {
    bsfcFactor: 1.0,
    afrFactor: 1.0,
    intercoolerEffectiveness: 0.8, // short runs, often an iced air-to-water cooler
    fullBoostFraction: 0.65, // launched on a two-step; the top of the range matters
    minShaftSpeedMargin: 0.02,
    minSurgeMargin: 0.05,
    minChokeMargin: 0,
    maxBackPressureRatio: 1.5,
    typicalHpPerLitre: 350,
    weights: { efficiency: 1.2, surge: 0.2, choke: 0.2, shaftSpeed: 0.2, response: 0.1 },
    label: 'drag racing',
  },
  offroad: {
    bsfcFactor: 1.04,
    afrFactor: 1 / 1.02,
    intercoolerEffectiveness: 0.7, // low road speed, dusty cores
    fullBoostFraction: 0.55, // torque low in the range for climbing
    minShaftSpeedMargin: 0.06,
    minSurgeMargin: 0.12,
    minChokeMargin: 0.05,
    maxBackPressureRatio: 1.9,
    typicalHpPerLitre: 140,
    weights: { efficiency: 1, surge: 0.5, choke: 0.3, shaftSpeed: 0.4, response: 0.7 },
    label: 'off-road',
  },
  marine: {
    bsfcFactor: 1.1,
    afrFactor: 1 / 1.05,
    intercoolerEffectiveness: 0.85, // sea-water aftercooler
    fullBoostFraction: 0.6, // propeller load rises steeply with rpm
    minShaftSpeedMargin: 0.1,
    minSurgeMargin: 0.1,
    minChokeMargin: 0.08,
    maxBackPressureRatio: 1.6,
    typicalHpPerLitre: 120,
    weights: { efficiency: 1, surge: 0.3, choke: 0.5, shaftSpeed: 0.6, response: 0.2 },
    label: 'marine',
  },
};

/** Heywood §2.10 gives 80–90 % for good engines at full load (from memory); a modern four-valve head sits high. */
export const DEFAULT_VOLUMETRIC_EFFICIENCY = 0.9;
/** Intercooler core and piping at full flow; common practice 1–3 psi. */
export const DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED = 2.0;
/** Piping only, no core; common practice. */
export const DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER = 1.0;
/** Filter and intake tract at full flow; common practice 0.3–1 psi. */
export const DEFAULT_INLET_LOSS_PSI = 0.5;
/** A compressor run in its good region; common practice 0.70–0.78. */
export const DEFAULT_COMPRESSOR_EFFICIENCY = 0.72;
/** A warm day at the compressor inlet: ISA's 15 °C plus about 10 K of intake heating (common practice). */
export const DEFAULT_AMBIENT_C = 25;
export const DEFAULT_ALTITUDE_M = 0;
/** Most turbocharged installations carry a charge cooler (common practice). */
export const DEFAULT_INTERCOOLED = true;

/**
 * Air a petrol engine burns per hp at full load, lb/(hp·h): BSFC 0.50 × AFR 12. The catalogue's power bands are
 * quoted on this basis (1 lb/min per 10 hp), so other fuels are compared through their airflow.
 */
export const PETROL_RATING_AIR_LB_PER_HP_H = 6.0;

/** Diesels make less per litre for the same survival (common practice): the petrol figures above times this. */
export const DIESEL_SPECIFIC_OUTPUT_SHARE = 0.6;

/**
 * Charge temperature in the manifold above which each fuel loses knock or smoke margin and the tune must pull
 * timing or fuel (common practice; from memory).
 */
export const CHARGE_TEMP_LIMIT_C: Record<Fuel, number> = { petrol: 60, e85: 75, methanol: 90, diesel: 80 };
/** Above this pressure ratio without a charge cooler the charge gets hot enough to matter (common practice). */
export const NO_INTERCOOLER_PR_LIMIT = 1.6;
/** Injectors are sized to run at most at about 80 % duty cycle at peak power (common practice). */
export const INJECTOR_DUTY_CYCLE = 0.8;
/** Beyond this per injector the fuel system needs more than common street injectors (common practice). */
export const LARGE_INJECTOR_CC_MIN = 550;
/** A compressor outlet hotter than this strains hoses and couplers before the charge cooler (common practice). */
export const HOT_OUTLET_C = 180;
/** Fuel densities, kg/L, for injector flow (handbook values from memory: petrol 0.74, E85 0.78, methanol 0.79, diesel 0.83). */
export const FUEL_DENSITY_KG_L: Record<Fuel, number> = { petrol: 0.74, e85: 0.78, methanol: 0.79, diesel: 0.83 };
