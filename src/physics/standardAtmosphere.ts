/**
 * Station pressure from sea-level pressure and back, by the ICAO standard atmosphere
 * (ICAO Doc 7488; ISO 2533; U.S. Standard Atmosphere 1976) in its troposphere layer:
 *
 *   p = p0 · (1 − L·H/T0)^(g0·M/(R*·L))
 *
 * This is the QNH convention: a reported sea-level pressure is the station pressure reduced
 * with the standard atmosphere, not with the day's temperature, so the reverse is exact.
 * H is the geopotential height, H = r0·z/(r0 + z) with r0 = 6 356 766 m (US Standard
 * Atmosphere 1976); at 1000 m it differs from the elevation by 0.16 m (about 2 Pa).
 */

const ISA_SEA_LEVEL_TEMPERATURE_K = 288.15;
const ISA_SEA_LEVEL_PRESSURE_PA = 101325;
const LAPSE_RATE_K_PER_M = 0.0065;
const G0 = 9.80665; // m/s², standard gravity
const M_ISA = 0.0289644; // kg/mol, ISA molar mass of dry air
const R_ISA = 8.31432; // J/(mol K), gas constant used by the 1976 standard
const EARTH_RADIUS_FOR_GEOPOTENTIAL_M = 6356766;
const EXPONENT = (G0 * M_ISA) / (R_ISA * LAPSE_RATE_K_PER_M); // 5.255 88

/** Geopotential height (m') of a geometric elevation (m). */
export function geopotentialHeight(elevation_m: number): number {
  return (EARTH_RADIUS_FOR_GEOPOTENTIAL_M * elevation_m) / (EARTH_RADIUS_FOR_GEOPOTENTIAL_M + elevation_m);
}

/** Ratio p(z)/p(0) of the standard atmosphere (troposphere, z below 11 km). */
function standardPressureRatio(elevation_m: number): number {
  const H = geopotentialHeight(elevation_m);
  return Math.pow(1 - (LAPSE_RATE_K_PER_M * H) / ISA_SEA_LEVEL_TEMPERATURE_K, EXPONENT);
}

export function stationPressureFromSeaLevel(seaLevelPressure_Pa: number, elevation_m: number): number {
  return seaLevelPressure_Pa * standardPressureRatio(elevation_m);
}

export function seaLevelPressureFromStation(stationPressure_Pa: number, elevation_m: number): number {
  return stationPressure_Pa / standardPressureRatio(elevation_m);
}

/** Dry-air density of the standard atmosphere at elevation z (ideal gas, ISA constants). */
export function standardAtmosphereDensity(elevation_m: number): number {
  const H = geopotentialHeight(elevation_m);
  const T = ISA_SEA_LEVEL_TEMPERATURE_K - LAPSE_RATE_K_PER_M * H;
  const p = ISA_SEA_LEVEL_PRESSURE_PA * standardPressureRatio(elevation_m);
  return (p * M_ISA) / (R_ISA * T);
}

/** The ISA's own gas constant and molar mass, so a test can explain CIPM's difference from ISA. */
export const ISA_CONSTANTS = { gasConstant: R_ISA, molarMass_kg_mol: M_ISA } as const;
