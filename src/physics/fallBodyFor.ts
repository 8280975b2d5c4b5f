/**
 * The falling body from a request's parts (before there is a result): the checked specimen, the air's density,
 * gravity, and the options for buoyancy and added mass. The analysis's setup and the planner both build their
 * body here; fallBodyOf rebuilds the same body from a result.
 */
import type { FallBody } from './fallModel';

export interface FallBodyParts {
  mass_kg: number;
  geometry: { area_m2: number; volume_m3: number };
  density_kg_m3: number;
  gravity_m_s2: number;
  buoyancy: boolean;
  added_mass_coefficient: number;
}

export function fallBodyFor(parts: FallBodyParts): Omit<FallBody, 'drag_coefficient'> {
  return {
    mass_kg: parts.mass_kg,
    area_m2: parts.geometry.area_m2,
    volume_m3: parts.geometry.volume_m3,
    density_kg_m3: parts.density_kg_m3,
    gravity_m_s2: parts.gravity_m_s2,
    buoyancy: parts.buoyancy,
    added_mass_coefficient: parts.added_mass_coefficient,
  };
}
