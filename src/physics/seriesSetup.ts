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
