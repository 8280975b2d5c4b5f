/**
 * The falling body of an analysed series, from its result alone: the specimen's mass, area and volume, the air's
 * density, gravity, buoyancy and added mass exactly as the analysis used them. Curves, single drops and the
 * planner build on this one body instead of rebuilding it from pieces.
 */
import type { AnalysisResult } from './analysisTypes';
import type { SphereScaleBody } from './dragLaw';
import type { FallBody } from './fallModel';

export function fallBodyOf(result: AnalysisResult): Omit<FallBody, 'drag_coefficient'>;
export function fallBodyOf(result: AnalysisResult, drag_coefficient: number): FallBody;
export function fallBodyOf(result: AnalysisResult, drag_coefficient?: number): FallBody | Omit<FallBody, 'drag_coefficient'> {
  const body = {
    mass_kg: result.model.mass_kg,
    area_m2: result.model.area_m2,
    volume_m3: result.model.volume_m3,
    density_kg_m3: result.air.density_kg_m3,
    gravity_m_s2: result.gravity_m_s2,
    buoyancy: result.model.buoyancy,
    added_mass_coefficient: result.model.added_mass_coefficient,
  };
  return drag_coefficient === undefined ? body : { ...body, drag_coefficient };
}

/**
 * The same body as the speed-dependent laws take it (g_e, ρA/(2m_e), ρL/μ), from a result alone: the very numbers
 * the analysis fitted the scaled sphere curve with.
 */
export function sphereScaleBodyOf(result: AnalysisResult): SphereScaleBody {
  const rho = result.air.density_kg_m3;
  return {
    effective_gravity_m_s2: result.model.effective_gravity_m_s2,
    drag_constant_per_unit_cd_per_m: (rho * result.model.area_m2) / (2 * result.model.effective_mass_kg),
    reynolds_per_speed_s_m: (rho * result.model.characteristic_length_m) / result.air.dynamic_viscosity_Pa_s,
  };
}
