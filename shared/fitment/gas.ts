/** Dry-air properties used throughout the fitment check. */

/** Specific gas constant of dry air, J/(kg·K), as the issue and ICAO Doc 7488 round it. */
export const R_AIR_J_PER_KG_K = 287.05;
/** Ratio of specific heats for air near room temperature. */
export const GAMMA_AIR = 1.4;
/** cp = γR/(γ−1), J/(kg·K); about 1005 as gas-turbine texts use. */
export const CP_AIR_J_PER_KG_K = (GAMMA_AIR * R_AIR_J_PER_KG_K) / (GAMMA_AIR - 1);
/** (γ−1)/γ, the isentropic exponent on pressure ratio. */
export const ISENTROPIC_EXPONENT = (GAMMA_AIR - 1) / GAMMA_AIR;

/** Reference conditions for corrected flow and compressor maps. */
export const REFERENCE_TEMPERATURE_K = 288.15;
export const REFERENCE_PRESSURE_KPA = 101.325;
