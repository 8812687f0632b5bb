import type { CompressorMap } from '../schemas/compressor-map';

/** What the fitment check needs to know about a frame; rows from the frames table map onto it directly. */
export interface FitmentFrame {
  code: string;
  name: string;
  inducerMm: number;
  exducerMm: number;
  /** Rated on petrol at about 1 lb/min per 10 hp (corrected flow). */
  powerBandHp: readonly [number, number];
  maxFlowLbMin: number;
  maxPressureRatio: number;
  maxShaftRpm: number;
  bearingOptions: readonly string[];
  map: CompressorMap;
  /** Turbine wheel diameter and the turbine housing A/R options the catalogue sells for the frame. */
  turbineWheelMm: number;
  turbineArOptions: readonly number[];
}
