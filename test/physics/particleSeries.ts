/**
 * A 1 mm glass bead (2500 kg/m³; an invented scenario of our own) falling through still air whose drag follows
 * the standard sphere curve scaled by a known factor: the truth for the speed-dependent drag tests. Exact times
 * come from integrating the fall (fallWithVariableDrag.ts, itself checked against odex).
 */
import { airProperties } from '../../src/physics/airProperties';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import type { RandomSource } from '../../src/physics/createRandom';
import type { DragLawOption, SphereScaleBody } from '../../src/physics/dragLaw';
import { scaledSphereFallTime } from '../../src/physics/dragLaw';
import { localGravity } from '../../src/physics/normalGravity';

export const PARTICLE = { shape: 'sphere' as const, diameter_m: 0.001, mass_kg: (2500 * Math.PI * 0.001 ** 3) / 6 };
export const PARTICLE_SITE = { latitude_deg: 46.1, elevation_m: 430 };
export const PARTICLE_AIR = { temperature_C: 19, pressure_Pa: 96_120, pressure_reference: 'station' as const, relative_humidity_pct: 55 };

export function particleBody(air = PARTICLE_AIR, specimen = PARTICLE): SphereScaleBody {
  const a = airProperties(air, PARTICLE_SITE.elevation_m);
  const g = localGravity(PARTICLE_SITE).gravity_m_s2;
  const rho = a.density_kg_m3;
  const V = (Math.PI * specimen.diameter_m ** 3) / 6;
  const A = (Math.PI * specimen.diameter_m ** 2) / 4;
  const mEff = specimen.mass_kg + 0.5 * rho * V;
  return {
    effective_gravity_m_s2: (g * (specimen.mass_kg - rho * V)) / mEff,
    drag_constant_per_unit_cd_per_m: (rho * A) / (2 * mEff),
    reynolds_per_speed_s_m: (rho * specimen.diameter_m) / a.dynamic_viscosity_Pa_s,
  };
}

export interface ParticleOptions {
  scale: number;
  heights: number[];
  drag_law?: DragLawOption;
  /** Noise and true inputs drawn around the recorded ones; exact without it. */
  random?: RandomSource;
  timingU?: number;
  draws?: number;
}

export const PARTICLE_UNCERTAINTY = { height_m: 0.003, mass_kg: 1e-8, diameter_m: 5e-6, temperature_C: 0.3, pressure_Pa: 30, relative_humidity_pct: 3 };

export function particleRequest(o: ParticleOptions): AnalysisRequest {
  const r = o.random;
  const u = PARTICLE_UNCERTAINTY;
  const n = () => (r ? r.normal() : 0);
  const trueSpecimen = { ...PARTICLE, mass_kg: PARTICLE.mass_kg + u.mass_kg * n(), diameter_m: PARTICLE.diameter_m + u.diameter_m * n() };
  const trueAir = {
    ...PARTICLE_AIR,
    temperature_C: PARTICLE_AIR.temperature_C + u.temperature_C * n(),
    pressure_Pa: PARTICLE_AIR.pressure_Pa + u.pressure_Pa * n(),
    relative_humidity_pct: PARTICLE_AIR.relative_humidity_pct + u.relative_humidity_pct * n(),
  };
  const body = particleBody(trueAir, trueSpecimen);
  const distinct = [...new Set(o.heights)];
  const trueHeight = new Map(distinct.map((h) => [h, h + u.height_m * n()]));
  const timingU = o.timingU ?? 0.004;
  return {
    site: PARTICLE_SITE,
    air: PARTICLE_AIR,
    specimen: PARTICLE,
    drops: o.heights.map((h) => ({ height_m: h, time_s: scaledSphereFallTime(trueHeight.get(h)!, body, o.scale) + timingU * n() })),
    timing: { standard_uncertainty_s: timingU },
    uncertainty: u,
    options: { monte_carlo_draws: o.draws ?? 2000, ...(o.drag_law ? { drag_law: o.drag_law } : {}) },
  };
}
