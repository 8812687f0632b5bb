import type { Application, Fuel } from '../schemas/fitment';
import { APPLICATION_DEFAULTS, FUEL_DEFAULTS, PETROL_RATING_AIR_LB_PER_HP_H } from './defaults';

/** Wa [lb/min] = P [hp] · BSFC [lb/(hp·h)] · AFR / 60. */
export function airflowLbMinFromPower(powerHp: number, bsfcLbPerHpH: number, afr: number): number {
  return (powerHp * bsfcLbPerHpH * afr) / 60;
}

export function defaultBsfcLbPerHpH(fuel: Fuel, application: Application): number {
  return FUEL_DEFAULTS[fuel].bsfc * APPLICATION_DEFAULTS[application].bsfcFactor;
}

export function defaultAfr(fuel: Fuel, application: Application): number {
  return FUEL_DEFAULTS[fuel].afr * APPLICATION_DEFAULTS[application].afrFactor;
}

/** The petrol power this airflow corresponds to on the catalogue's rating basis. */
export function petrolEquivalentHp(airflowLbMin: number): number {
  return (airflowLbMin * 60) / PETROL_RATING_AIR_LB_PER_HP_H;
}
