/**
 * Everything the fall model needs to know about the air, from what a crew reads off its
 * instruments: density (CIPM-2007), station pressure, viscosity and speed of sound, plus
 * warnings when the density equation is used outside the range it was validated for.
 */
import { airViscosity } from './airViscosity';
import { checkNumber, checkOptionalNumber } from './checkNumber';
import {
  compressibilityFactor,
  moistAirDensity,
  REFERENCE_CO2_MOLE_FRACTION,
  vapourMoleFractionFromDewPoint,
  vapourMoleFractionFromRelativeHumidity,
} from './moistAirDensity';
import { PhysicsInputError } from './physicsInputError';
import type { PhysicsWarning } from './physicsWarning';
import { saturationVapourPressure } from './saturationVapourPressure';
import { speedOfSound } from './speedOfSound';
import { seaLevelPressureFromStation, stationPressureFromSeaLevel } from './standardAtmosphere';

export type PressureReference = 'station' | 'sea_level';

/** The air readings, with the unit in every name (the same shape as a request's "air"). */
export interface AirInput {
  temperature_C: number;
  /** Barometer reading; says in `pressure_reference` whether it is station or sea-level (QNH). */
  pressure_Pa?: number;
  pressure_reference?: PressureReference;
  /** Give relative humidity or dew point, not both. */
  relative_humidity_pct?: number;
  dew_point_C?: number;
  /** Defaults to 0.0004 (400 µmol/mol). */
  co2_mole_fraction?: number;
  /** A measured or trusted density; wins over the CIPM-2007 value. */
  density_kg_m3?: number;
  /** Height of the reading above the landing surface, m; default 0 (read at the landing surface). See airColumn.ts. */
  height_m?: number;
  /** Vertical air motion, positive up (an updraft), m/s; default 0. */
  vertical_wind_m_s?: number;
  /** Horizontal wind speed, m/s; absent: the air's motion is not considered at all. */
  wind_speed_m_s?: number;
}

export interface AirProperties {
  density_kg_m3: number;
  /** The CIPM-2007 value, also when an override wins (null when there was nothing to compute it from). */
  cipm_density_kg_m3: number | null;
  density_source: 'cipm-2007' | 'override';
  /** Null only when a density override stands in for a missing pressure. */
  station_pressure_Pa: number | null;
  sea_level_pressure_Pa: number | null;
  dynamic_viscosity_Pa_s: number;
  speed_of_sound_m_s: number;
  temperature_K: number;
  vapour_mole_fraction: number | null;
  saturation_vapour_pressure_Pa: number;
  compressibility_factor: number | null;
  /**
   * The extra relative standard uncertainty of the CIPM-2007 density outside the range it was validated for
   * (cipmExtrapolationRelativeUncertainty); 0 inside it, or when the density was given.
   */
  cipm_extrapolation_relative_uncertainty: number;
  warnings: PhysicsWarning[];
}

export const AIR_LIMITS = {
  temperature_C: { min: -100, max: 100, text: '-100 to 100 °C' },
  // 20 kPa is the standard atmosphere near 11.8 km, above any release point or reading this analysis accepts
  // (ISO 2533): a lower reading is a typing or unit error (hPa or kPa typed as Pa), never air we can use.
  pressure_Pa: { min: 20_000, max: 200_000, text: '20 000 Pa to 200 000 Pa' },
  relative_humidity_pct: { min: 0, max: 100, text: '0 to 100 %' },
  co2_mole_fraction: { min: 0, max: 0.01, text: '0 to 0.01 (0 to 10 000 µmol/mol)' },
  density_kg_m3: { min: 0.1, max: 2, text: '0.1 to 2 kg/m³' },
  elevation_m: { min: -500, max: 9000, text: '-500 to 9000 m' },
} as const;

/** The range CIPM-2007 was validated for (Picard et al. 2008, section 2). */
export const CIPM_VALID_RANGE = {
  pressure_Pa: [60_000, 110_000],
  temperature_C: [15, 27],
} as const;

/**
 * The sea-level pressures a day's weather makes likely. Outside tropical cyclones and the strongest winter highs
 * nearly all sea-level readings fall within 940–1060 hPa (common practice); the world records are 870 hPa and
 * 1083.8 hPa (WMO Archive of Weather and Climate Extremes, from memory). A station reading whose sea-level
 * equivalent at the site's elevation falls outside this range is more likely a sea-level (QNH) value typed as the
 * station pressure, or the reverse: at 400 m a QNH of 1013 hPa typed as station pressure reads as 1062 hPa.
 */
export const LIKELY_SEA_LEVEL_PRESSURE_PA: readonly [number, number] = [94_000, 106_000];

/**
 * Above this a reading in °C is more likely a Fahrenheit value (common practice: air above 45 °C is rare in the
 * shade where crews read thermometers; the hottest reliably measured air, 54.4 °C, is from memory).
 */
export const LIKELY_MAX_TEMPERATURE_C = 45;

/**
 * CIPM-2007 inside its validated range: relative standard uncertainty 22 × 10⁻⁶ of the formula itself (Picard et
 * al., Metrologia 45 (2008) 149, section 5, from memory). Outside it, the parts of the formula that are fits to
 * measurements (the compressibility factor Z and the enhancement factor) are extrapolated. We bound the extra error
 * by the whole compressibility correction |1 − Z| (about 4 × 10⁻⁴ near the ground) and take it as a rectangular
 * distribution (GUM 4.3.7): u_rel = |1 − Z|/√3, at least 1 × 10⁻⁴/√3 (our assessment).
 */
export function cipmExtrapolationRelativeUncertainty(compressibility: number): number {
  return Math.max(Math.abs(1 - compressibility), 1e-4) / Math.sqrt(3);
}

/**
 * Air properties from readings. Errors (PhysicsInputError) for impossible input; warnings for
 * input outside the CIPM-2007 validation range. `field` prefixes every error's path.
 */
export function airProperties(air: AirInput, elevation_m?: number, field = 'air'): AirProperties {
  const warnings: PhysicsWarning[] = [];
  const temperature_C = checkNumber(`${field}.temperature_C`, air.temperature_C, AIR_LIMITS.temperature_C);
  const T = temperature_C + 273.15;
  if (temperature_C > LIKELY_MAX_TEMPERATURE_C) {
    const asCelsius = ((temperature_C - 32) * 5) / 9;
    warnings.push({
      code: 'temperature-maybe-fahrenheit',
      message: `Air temperature ${temperature_C} °C is above ${LIKELY_MAX_TEMPERATURE_C} °C, which shaded air rarely reaches: was it read in °F? (${temperature_C} °F would be ${asCelsius.toFixed(1)} °C.)`,
    });
  }
  const co2 =
    checkOptionalNumber(`${field}.co2_mole_fraction`, air.co2_mole_fraction, AIR_LIMITS.co2_mole_fraction) ??
    REFERENCE_CO2_MOLE_FRACTION;
  const densityOverride = checkOptionalNumber(`${field}.density_kg_m3`, air.density_kg_m3, AIR_LIMITS.density_kg_m3);

  let stationPressure: number | null = null;
  let seaLevelPressure: number | null = null;
  if (air.pressure_Pa !== undefined || densityOverride === undefined) {
    const p = checkNumber(`${field}.pressure_Pa`, air.pressure_Pa, AIR_LIMITS.pressure_Pa);
    const reference = air.pressure_reference;
    if (reference !== 'station' && reference !== 'sea_level') {
      throw new PhysicsInputError({
        code: reference === undefined ? 'missing-field' : 'out-of-range',
        field: `${field}.pressure_reference`,
        value: reference,
        allowed: '"station" or "sea_level"',
        reason: 'every pressure must say whether it is the station pressure or the sea-level (QNH) pressure',
      });
    }
    if (reference === 'sea_level') {
      const z = checkNumber('site.elevation_m', elevation_m, {
        ...AIR_LIMITS.elevation_m,
        text: `${AIR_LIMITS.elevation_m.text} (needed to turn a sea-level pressure into station pressure)`,
      });
      seaLevelPressure = p;
      stationPressure = stationPressureFromSeaLevel(p, z);
    } else {
      stationPressure = p;
      seaLevelPressure =
        elevation_m !== undefined && Number.isFinite(elevation_m) ? seaLevelPressureFromStation(p, elevation_m) : null;
    }
    if (stationPressure < AIR_LIMITS.pressure_Pa.min) {
      throw new PhysicsInputError({
        code: 'out-of-range',
        field: `${field}.pressure_Pa`,
        value: p,
        allowed: `a station pressure of at least ${AIR_LIMITS.pressure_Pa.min} Pa at elevation ${elevation_m} m`,
      });
    }
    const [likelyLow, likelyHigh] = LIKELY_SEA_LEVEL_PRESSURE_PA;
    if (seaLevelPressure !== null && (seaLevelPressure < likelyLow || seaLevelPressure > likelyHigh)) {
      const range = `${likelyLow / 100}–${likelyHigh / 100} hPa`;
      warnings.push({
        code: reference === 'station' ? 'station-pressure-unlikely' : 'sea-level-pressure-unlikely',
        message:
          reference === 'station'
            ? `Station pressure ${Math.round(p)} Pa at ${elevation_m} m corresponds to ${Math.round(seaLevelPressure / 100)} hPa at sea level, outside the ${range} a day's weather makes likely: was a sea-level (QNH) value typed as the station pressure? Then set pressure_reference to "sea_level".`
            : `Sea-level pressure ${Math.round(p)} Pa is outside the ${range} a day's weather makes likely: was the station pressure typed as a sea-level (QNH) value? Then set pressure_reference to "station".`,
      });
    }
  }

  const psv = saturationVapourPressure(T);
  let xv: number | null = null;
  const hasRh = air.relative_humidity_pct !== undefined;
  const hasDew = air.dew_point_C !== undefined;
  if (hasRh && hasDew) {
    throw new PhysicsInputError({
      code: 'conflicting-fields',
      field: `${field}.dew_point_C`,
      value: air.dew_point_C,
      allowed: 'either relative_humidity_pct or dew_point_C, not both',
    });
  }
  if (stationPressure !== null) {
    if (hasRh) {
      const rh = checkNumber(`${field}.relative_humidity_pct`, air.relative_humidity_pct, AIR_LIMITS.relative_humidity_pct);
      xv = vapourMoleFractionFromRelativeHumidity(stationPressure, T, rh / 100);
    } else if (hasDew) {
      const dew = checkNumber(`${field}.dew_point_C`, air.dew_point_C, {
        min: AIR_LIMITS.temperature_C.min,
        text: `-100 °C up to the air temperature (${temperature_C} °C)`,
      });
      if (dew > temperature_C) {
        throw new PhysicsInputError({
          code: 'dew-point-above-temperature',
          field: `${field}.dew_point_C`,
          value: dew,
          allowed: `at most the air temperature, ${temperature_C} °C`,
        });
      }
      xv = vapourMoleFractionFromDewPoint(stationPressure, dew + 273.15);
    } else if (densityOverride === undefined) {
      throw new PhysicsInputError({
        code: 'missing-field',
        field: `${field}.relative_humidity_pct`,
        value: undefined,
        allowed: 'relative_humidity_pct (0 to 100 %) or dew_point_C (at most the air temperature)',
      });
    }
    if (xv !== null && xv >= 1) {
      throw new PhysicsInputError({
        code: 'vapour-pressure-above-total',
        field: hasRh ? `${field}.relative_humidity_pct` : `${field}.dew_point_C`,
        value: hasRh ? air.relative_humidity_pct : air.dew_point_C,
        allowed: `a vapour pressure below the station pressure (${Math.round(stationPressure)} Pa)`,
      });
    }
  }

  let cipmDensity: number | null = null;
  let Z: number | null = null;
  if (stationPressure !== null && xv !== null) {
    Z = compressibilityFactor(stationPressure, T, xv);
    cipmDensity = moistAirDensity(stationPressure, T, xv, co2);
    // Routine outdoors (every cool morning): an information note, and the formula's extra uncertainty enters the
    // budget when the density is computed (cipm_extrapolation_relative_uncertainty).
    const extra = `its extra relative standard uncertainty ${cipmExtrapolationRelativeUncertainty(Z).toExponential(1)} is in the budget`;
    const [pLow, pHigh] = CIPM_VALID_RANGE.pressure_Pa;
    if (stationPressure < pLow || stationPressure > pHigh) {
      warnings.push({
        code: 'outside-cipm-pressure-range',
        severity: 'info',
        message: `Station pressure ${Math.round(stationPressure)} Pa is outside 60 000–110 000 Pa, the range CIPM-2007 was validated for; the density is extrapolated and ${extra}.`,
      });
    }
    const [tLow, tHigh] = CIPM_VALID_RANGE.temperature_C;
    if (temperature_C < tLow || temperature_C > tHigh) {
      warnings.push({
        code: 'outside-cipm-temperature-range',
        severity: 'info',
        message: `Air temperature ${temperature_C} °C is outside 15–27 °C, the range CIPM-2007 was validated for; the density is extrapolated and ${extra}.`,
      });
    }
  }
  const [pLow, pHigh] = CIPM_VALID_RANGE.pressure_Pa;
  const [tLow, tHigh] = CIPM_VALID_RANGE.temperature_C;
  const outsideCipm =
    Z !== null && stationPressure !== null && (stationPressure < pLow || stationPressure > pHigh || temperature_C < tLow || temperature_C > tHigh);

  let density: number;
  let source: AirProperties['density_source'];
  if (densityOverride !== undefined) {
    density = densityOverride;
    source = 'override';
    warnings.push({
      code: 'density-overridden',
      message:
        cipmDensity === null
          ? `Air density ${densityOverride} kg/m³ was given and is used as is.`
          : `Air density ${densityOverride} kg/m³ was given and is used; CIPM-2007 would give ${cipmDensity.toFixed(4)} kg/m³ from the readings.`,
    });
  } else {
    // Reached only with pressure and humidity present (checked above).
    density = cipmDensity as number;
    source = 'cipm-2007';
  }

  return {
    density_kg_m3: density,
    cipm_density_kg_m3: cipmDensity,
    density_source: source,
    station_pressure_Pa: stationPressure,
    sea_level_pressure_Pa: seaLevelPressure,
    dynamic_viscosity_Pa_s: airViscosity(T),
    speed_of_sound_m_s: speedOfSound(T),
    temperature_K: T,
    vapour_mole_fraction: xv,
    saturation_vapour_pressure_Pa: psv,
    compressibility_factor: Z,
    cipm_extrapolation_relative_uncertainty: outsideCipm && densityOverride === undefined ? cipmExtrapolationRelativeUncertainty(Z!) : 0,
    warnings,
  };
}
