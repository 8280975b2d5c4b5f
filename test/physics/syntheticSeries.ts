/**
 * Synthetic drop series for the analysis tests: a "true world" (true air, gravity, specimen and
 * drag coefficient) produces exact fall times through the closed-form model; the request then
 * carries what a crew would have measured — every input off by a draw of its declared standard
 * uncertainty, every time off by timing noise. Invented data, our own scenario.
 */
import { airProperties } from '../../src/physics/airProperties';
import type { AnalysisRequest, UncertaintyInput } from '../../src/physics/analysisTypes';
import { createRandom, type RandomSource } from '../../src/physics/createRandom';
import { fallParameters, fallTime } from '../../src/physics/fallModel';
import { localGravity } from '../../src/physics/normalGravity';
import { checkSpecimen, type SpecimenInput } from '../../src/physics/specimenGeometry';

export const BALL: SpecimenInput = { shape: 'sphere', mass_kg: 0.21, diameter_m: 0.095 };
export const SITE = { latitude_deg: 46.1, elevation_m: 430 };
export const AIR = { temperature_C: 17.5, pressure_Pa: 96120, pressure_reference: 'station' as const, relative_humidity_pct: 55 };
export const UNCERTAINTY: UncertaintyInput = {
  height_m: 0.01,
  mass_kg: 0.0005,
  diameter_m: 0.0003,
  temperature_C: 0.3,
  pressure_Pa: 30,
  relative_humidity_pct: 3,
};

/** Exact fall times of a specimen with drag coefficient cd (same model the analysis fits). */
export function exactTimes(
  request: Pick<AnalysisRequest, 'site' | 'air' | 'specimen' | 'options'>,
  cd: number,
  heights: number[],
): number[] {
  const air = airProperties(request.air, request.site.elevation_m);
  const g = localGravity(request.site).gravity_m_s2;
  const s = checkSpecimen(request.specimen);
  const p = fallParameters({
    mass_kg: s.mass_kg,
    area_m2: s.geometry.area_m2,
    volume_m3: s.geometry.volume_m3,
    drag_coefficient: cd,
    density_kg_m3: air.density_kg_m3,
    gravity_m_s2: g,
    buoyancy: request.options?.buoyancy ?? true,
    added_mass_coefficient: request.options?.added_mass_coefficient ?? s.geometry.default_added_mass_coefficient,
  });
  return heights.map((h) => fallTime(h, p));
}

export interface SyntheticOptions {
  cd: number;
  heights: number[];
  timingU: number;
  /** Actual timing noise; defaults to the declared one. */
  actualTimingSd?: number;
  offset_s?: number;
  fitOffset?: boolean;
  random: RandomSource;
  draws?: number;
}

/** One series as measured in a world whose true inputs differ from the measured ones by their uncertainties. */
export function measuredSeries(o: SyntheticOptions): AnalysisRequest {
  const r = o.random;
  const u = UNCERTAINTY;
  const ball = BALL as Extract<SpecimenInput, { shape: 'sphere' }>;
  // The truth, drawn around the nominal values by the declared uncertainties…
  const trueSpecimen = { ...ball, mass_kg: ball.mass_kg + u.mass_kg! * r.normal(), diameter_m: ball.diameter_m + u.diameter_m! * r.normal() };
  const trueAir = {
    ...AIR,
    temperature_C: AIR.temperature_C + u.temperature_C! * r.normal(),
    pressure_Pa: AIR.pressure_Pa + u.pressure_Pa! * r.normal(),
    relative_humidity_pct: AIR.relative_humidity_pct + u.relative_humidity_pct! * r.normal(),
  };
  const distinct = [...new Set(o.heights)];
  const trueHeight = new Map(distinct.map((h) => [h, h + u.height_m! * r.normal()]));
  const truth = exactTimes({ site: SITE, air: trueAir, specimen: trueSpecimen }, o.cd, o.heights.map((h) => trueHeight.get(h)!));
  const sd = o.actualTimingSd ?? o.timingU;
  // …and the crew records the nominal values and noisy times.
  return {
    site: SITE,
    air: AIR,
    specimen: BALL,
    drops: o.heights.map((h, i) => ({ height_m: h, time_s: truth[i]! + (o.offset_s ?? 0) + sd * r.normal() })),
    timing: { standard_uncertainty_s: o.timingU, offset: o.fitOffset ? 'fit' : 'none' },
    uncertainty: UNCERTAINTY,
    options: { monte_carlo_draws: o.draws ?? 2000 },
  };
}

export { createRandom };
