/**
 * Density of moist air by the CIPM-2007 equation (Picard, Davis, Gläser, Fujii, Metrologia 45
 * (2008) 149–155):
 *
 *   ρ = p·M_a / (Z·R·T) · [1 − x_v·(1 − M_v/M_a)]
 *
 * with the compressibility factor Z (equation A1.4), the molar mass of dry air M_a including its
 * CO2 term (equation 4 of the 2007 revision), and the mole fraction of water vapour x_v from
 * relative humidity or dew point (equations A1.2, A1.3). The equation is stated for
 * 600–1100 hPa and 15–27 °C; outside it still computes (the callers warn).
 */
import { enhancementFactor, saturationVapourPressure } from './saturationVapourPressure';

/** Molar gas constant used by CIPM-2007, J mol^-1 K^-1 (CODATA 2006). */
export const CIPM_GAS_CONSTANT = 8.314472;
/** Molar mass of water, kg/mol (CIPM-2007). */
export const WATER_MOLAR_MASS = 18.01528e-3;
/** The CO2 mole fraction CIPM-2007's reference composition assumes. */
export const REFERENCE_CO2_MOLE_FRACTION = 0.0004;

/**
 * M_a in kg/mol for a CO2 mole fraction x_CO2. CIPM-2007 assumes each extra CO2 molecule
 * replaces an O2 molecule, which adds the mass of one carbon atom (12.011 g/mol).
 */
export function dryAirMolarMass(co2MoleFraction: number = REFERENCE_CO2_MOLE_FRACTION): number {
  return (28.96546 + 12.011 * (co2MoleFraction - REFERENCE_CO2_MOLE_FRACTION)) * 1e-3;
}

const a0 = 1.58123e-6; // K Pa^-1
const a1 = -2.9331e-8; // Pa^-1
const a2 = 1.1043e-10; // K^-1 Pa^-1
const b0 = 5.707e-6; // K Pa^-1
const b1 = -2.051e-8; // Pa^-1
const c0 = 1.9898e-4; // K Pa^-1
const c1 = -2.376e-6; // Pa^-1
const d = 1.83e-11; // K^2 Pa^-2
const e = -0.765e-8; // K^2 Pa^-2

/** Compressibility factor Z of moist air (CIPM-2007 equation A1.4). */
export function compressibilityFactor(pressure_Pa: number, temperature_K: number, vapourMoleFraction: number): number {
  const p = pressure_Pa;
  const T = temperature_K;
  const t = T - 273.15;
  const xv = vapourMoleFraction;
  const pT = p / T;
  return (
    1 -
    pT * (a0 + a1 * t + a2 * t * t + (b0 + b1 * t) * xv + (c0 + c1 * t) * xv * xv) +
    pT * pT * (d + e * xv * xv)
  );
}

/** x_v from relative humidity h (0–1): x_v = h·f(p,t)·p_sv(t)/p. */
export function vapourMoleFractionFromRelativeHumidity(
  pressure_Pa: number,
  temperature_K: number,
  relativeHumidity: number,
): number {
  return (relativeHumidity * enhancementFactor(pressure_Pa, temperature_K) * saturationVapourPressure(temperature_K)) / pressure_Pa;
}

/** x_v from dew point: x_v = f(p,t_d)·p_sv(t_d)/p. */
export function vapourMoleFractionFromDewPoint(pressure_Pa: number, dewPoint_K: number): number {
  return (enhancementFactor(pressure_Pa, dewPoint_K) * saturationVapourPressure(dewPoint_K)) / pressure_Pa;
}

/** ρ in kg/m³ from station pressure, temperature and the vapour mole fraction. */
export function moistAirDensity(
  pressure_Pa: number,
  temperature_K: number,
  vapourMoleFraction: number,
  co2MoleFraction: number = REFERENCE_CO2_MOLE_FRACTION,
): number {
  const Ma = dryAirMolarMass(co2MoleFraction);
  const Z = compressibilityFactor(pressure_Pa, temperature_K, vapourMoleFraction);
  return ((pressure_Pa * Ma) / (Z * CIPM_GAS_CONSTANT * temperature_K)) * (1 - vapourMoleFraction * (1 - WATER_MOLAR_MASS / Ma));
}
