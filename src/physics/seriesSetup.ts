/**
 * The first stage of a series' analysis: everything that does not depend on the drops. The request is
 * validated, then air (CIPM-2007), local gravity (WGS84) and the specimen's geometry give the body that falls,
 * with its drag-free fall parameters. The planner prepares this once and evaluates many drop sets on it.
 */
import { airProperties, type AirProperties } from './airProperties';
import type { AnalysisRequest, UncertaintyInput } from './analysisTypes';
import { DEFAULT_SEED } from './createRandom';
import { fallParameters, type FallBody, type FallParameters } from './fallModel';
import { localGravity, type SiteGravity } from './normalGravity';
import type { PhysicsWarning } from './physicsWarning';
import type { HumidityKind } from './seriesModel';
import { checkSpecimen, type CheckedSpecimen, type SpecimenGeometry } from './specimenGeometry';
import { TIMING_METHOD_DEFAULTS, type TimingMethod } from './timingMethodDefaults';
import { validateAnalysisRequest } from './validateAnalysisRequest';
import { fallBodyFor } from './fallBodyFor';
import { DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M, STANDARD_LAPSE_RATE_K_PER_M } from './airColumn';
import type { ColumnHumidity, ColumnSetup } from './columnCorrection';

export const DEFAULT_MONTE_CARLO_DRAWS = 20_000;

export interface SeriesSetup {
  /** The request as validated (its drops too; the later stages take drops as an argument). */
  request: AnalysisRequest;
  /** The air's warnings (outside the CIPM range and the like). */
  warnings: PhysicsWarning[];
  site: SiteGravity;
  gravity_m_s2: number;
  air: AirProperties;
  density_kg_m3: number;
  viscosity_Pa_s: number;
  specimen: CheckedSpecimen;
  geometry: SpecimenGeometry;
  buoyancy: boolean;
  added_mass_coefficient: number;
  fitOffset: boolean;
  /** Declared standard uncertainty of one drop's time, s. */
  timingU: number;
  /**
   * The declared constant delay (measured minus true) and its standard uncertainty, s; null when none was declared
   * (then the analysis is exactly the one without it). With a fitted offset it is only the prior the fit is checked against.
   */
  declaredOffset: { offset_s: number; standard_uncertainty_s: number; method: TimingMethod | null; source: string } | null;
  /** The delay subtracted from every time before the fit: the declared one, 0 when fitting or none declared. */
  subtractedOffset_s: number;
  /** Its standard uncertainty, shared by all drops (0 when fitting or none declared). */
  subtractedOffsetU_s: number;
  /** Declared standard uncertainty of a release height, m (0 when not given). */
  heightU: number;
  uncertainty: UncertaintyInput;
  draws: number;
  seed: number;
  /** The falling body without its drag coefficient. */
  body: Omit<FallBody, 'drag_coefficient'>;
  /** The body's fall without drag (throws on building when it is not heavier than air). */
  noDrag: FallParameters;
  effectiveGravity_m_s2: number;
  effectiveMass_kg: number;
  humidityKind: HumidityKind;
  /** The air along the fall and its motion: their inputs, uncertainties and defaults (airColumn.ts). */
  column: ColumnInputs;
}

export interface ColumnInputs {
  setup: ColumnSetup;
  /** One reading: the lapse rate and its standard uncertainty, K/m (with two readings: unused). */
  lapseRate_K_per_m: number;
  lapseRateU: number;
  /** At the reading: vertical wind (positive up) and horizontal wind speed, m/s, with standard uncertainties (0 when the motion is not considered). */
  verticalWind_m_s: number;
  verticalWindU: number;
  windSpeed_m_s: number;
  windSpeedU: number;
  /** True when the request says anything about the air's motion. */
  motion: boolean;
  aloft: { temperature_K: number; pressure_Pa: number; humidity: number; verticalWind_m_s: number; windSpeed_m_s: number } | null;
  /** Where defaults came from, in words. */
  notes: string[];
}

/**
 * Default standard uncertainties of the air's motion when the crew gives none, from the recorded horizontal wind U
 * (common practice, stated here so a crew can argue with them): the horizontal wind max(0.5 m/s, U/2) (gusts over a
 * few seconds commonly reach one and a half times the mean wind), the vertical wind max(0.05 m/s, U/10) (near the
 * ground the vertical gusts are about a tenth of the wind; a calm sunny day still has weak thermals).
 */
export function airMotionDefaults(windSpeed_m_s: number): { windSpeedU: number; verticalWindU: number } {
  return { windSpeedU: Math.max(0.5, windSpeed_m_s / 2), verticalWindU: Math.max(0.05, windSpeed_m_s / 10) };
}

function columnInputs(req: AnalysisRequest, u: UncertaintyInput, elevation_m: number): ColumnInputs {
  const notes: string[] = [];
  const air = req.air;
  const aloftInput = req.air_aloft;
  const motion =
    air.vertical_wind_m_s !== undefined ||
    air.wind_speed_m_s !== undefined ||
    aloftInput?.vertical_wind_m_s !== undefined ||
    aloftInput?.wind_speed_m_s !== undefined;
  const W = air.vertical_wind_m_s ?? 0;
  const U = air.wind_speed_m_s ?? 0;
  const defaults = airMotionDefaults(Math.max(U, aloftInput?.wind_speed_m_s ?? 0));
  let verticalWindU = 0;
  let windSpeedU = 0;
  if (motion) {
    verticalWindU = u.vertical_wind_m_s ?? defaults.verticalWindU;
    windSpeedU = u.wind_speed_m_s ?? defaults.windSpeedU;
    if (u.vertical_wind_m_s === undefined) notes.push(`vertical wind uncertainty ${verticalWindU.toPrecision(2)} m/s by default (a tenth of the wind, at least 0.05 m/s)`);
    if (u.wind_speed_m_s === undefined) notes.push(`wind speed uncertainty ${windSpeedU.toPrecision(2)} m/s by default (half the wind, at least 0.5 m/s)`);
  }
  const lapseRateU = u.lapse_rate_K_per_m ?? DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M;
  if (aloftInput === undefined && u.lapse_rate_K_per_m === undefined) {
    notes.push(`lapse rate ${STANDARD_LAPSE_RATE_K_PER_M * 1000} K/km (ISO 2533) with a default standard uncertainty of ${DEFAULT_LAPSE_RATE_STANDARD_UNCERTAINTY_K_PER_M * 1000} K/km`);
  }
  let aloft: ColumnInputs['aloft'] = null;
  let aloftSetup: ColumnSetup['aloft'] = null;
  if (aloftInput !== undefined) {
    const hasHumidity = aloftInput.relative_humidity_pct !== undefined || aloftInput.dew_point_C !== undefined;
    const props = airProperties(hasHumidity ? aloftInput : { ...aloftInput, relative_humidity_pct: 0 }, elevation_m + aloftInput.height_m, 'air_aloft');
    const humidity: ColumnHumidity = aloftInput.relative_humidity_pct !== undefined ? 'relative-humidity' : aloftInput.dew_point_C !== undefined ? 'dew-point' : 'none';
    if (humidity === 'none') notes.push('no humidity aloft: the vapour mole fraction of the ground reading is kept');
    aloft = {
      temperature_K: props.temperature_K,
      pressure_Pa: props.station_pressure_Pa!,
      humidity: humidity === 'relative-humidity' ? aloftInput.relative_humidity_pct! / 100 : humidity === 'dew-point' ? aloftInput.dew_point_C! + 273.15 : 0,
      verticalWind_m_s: aloftInput.vertical_wind_m_s ?? W,
      windSpeed_m_s: aloftInput.wind_speed_m_s ?? U,
    };
    aloftSetup = { height_m: aloftInput.height_m, humidity };
  }
  return {
    setup: { readingHeight_m: air.height_m ?? 0, aloft: aloftSetup },
    lapseRate_K_per_m: STANDARD_LAPSE_RATE_K_PER_M,
    lapseRateU,
    verticalWind_m_s: W,
    verticalWindU,
    windSpeed_m_s: U,
    windSpeedU,
    motion,
    aloft,
    notes,
  };
}

export function prepareSetup(request: AnalysisRequest): SeriesSetup {
  const req = validateAnalysisRequest(request);
  const warnings: PhysicsWarning[] = [];
  const site = localGravity(req.site);
  const g = site.gravity_m_s2;
  const air = airProperties(req.air, req.site.elevation_m);
  warnings.push(...air.warnings);
  const rho = air.density_kg_m3;
  const specimen = checkSpecimen(req.specimen);
  const geometry = specimen.geometry;
  const options = req.options ?? {};
  const buoyancy = options.buoyancy ?? true;
  const addedMass = options.added_mass_coefficient ?? geometry.default_added_mass_coefficient;
  const u = req.uncertainty ?? {};
  const body = fallBodyFor({ mass_kg: specimen.mass_kg, geometry, density_kg_m3: rho, gravity_m_s2: g, buoyancy, added_mass_coefficient: addedMass });
  const noDrag = fallParameters({ ...body, drag_coefficient: 0 }); // throws when not heavier than air
  const timing = req.timing;
  const methodDefaults = timing.method !== undefined ? TIMING_METHOD_DEFAULTS[timing.method] : null;
  const declared = timing.offset_s !== undefined || timing.offset_standard_uncertainty_s !== undefined || methodDefaults !== null;
  const declaredOffset = declared
    ? {
        offset_s: timing.offset_s ?? methodDefaults?.offset_s ?? 0,
        standard_uncertainty_s: timing.offset_standard_uncertainty_s ?? methodDefaults?.offset_standard_uncertainty_s ?? 0,
        method: timing.method ?? null,
        source:
          timing.offset_s !== undefined && timing.offset_standard_uncertainty_s !== undefined
            ? 'given'
            : `${timing.offset_s !== undefined || timing.offset_standard_uncertainty_s !== undefined ? 'partly given; ' : ''}${methodDefaults?.source ?? 'nothing declared counts as 0'}`,
      }
    : null;
  const fitOffset = timing.offset === 'fit';
  const humidityKind: HumidityKind =
    air.density_source === 'override' ? 'none' : req.air.relative_humidity_pct !== undefined ? 'relative-humidity' : 'dew-point';
  return {
    request: req,
    warnings,
    site,
    gravity_m_s2: g,
    air,
    density_kg_m3: rho,
    viscosity_Pa_s: air.dynamic_viscosity_Pa_s,
    specimen,
    geometry,
    buoyancy,
    added_mass_coefficient: addedMass,
    fitOffset,
    timingU: req.timing.standard_uncertainty_s,
    declaredOffset,
    subtractedOffset_s: fitOffset || declaredOffset === null ? 0 : declaredOffset.offset_s,
    subtractedOffsetU_s: fitOffset || declaredOffset === null ? 0 : declaredOffset.standard_uncertainty_s,
    heightU: u.height_m ?? 0,
    uncertainty: u,
    draws: options.monte_carlo_draws ?? DEFAULT_MONTE_CARLO_DRAWS,
    seed: options.seed ?? DEFAULT_SEED,
    body,
    noDrag,
    effectiveGravity_m_s2: noDrag.effective_gravity_m_s2,
    effectiveMass_kg: noDrag.effective_mass_kg,
    humidityKind,
    column: columnInputs(req, u, req.site.elevation_m ?? 0),
  };
}

/** C_d from the drag constant k = ρ·C_d·A/(2·m_eff) (see fallModel.ts). */
export function cdFromDragConstant(setup: SeriesSetup, k: number): number {
  return (2 * setup.effectiveMass_kg * k) / (setup.density_kg_m3 * setup.geometry.area_m2);
}

/** The drag constant k = ρ·C_d·A/(2·m_eff) of a C_d (see fallModel.ts). */
export function dragConstantFromCd(setup: SeriesSetup, cd: number): number {
  return (setup.density_kg_m3 * cd * setup.geometry.area_m2) / (2 * setup.effectiveMass_kg);
}
