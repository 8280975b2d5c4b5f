/**
 * A reference for falls of a sphere through the day's air column with a drag coefficient that follows the Reynolds
 * number: odex (odexSolver.ts) driving m_e(z)·dv/dt = (m − ρ(z)V)·g(z) − ½ρ(z)·C_d(Re)·A·v², Re = ρ(z)·v·D/μ(z),
 * m_e = m + ½ρ(z)V (buoyancy and a sphere's added mass), z = h − d, and the time to fall h found by Newton's method
 * on the end time. Independent of fallThroughColumn.ts but for the column's air, checked in airColumn.test.ts.
 */
import type { AirColumn } from '../../src/physics/airColumn';
import { odexSolver } from './odexSolver';

export function sphereColumnFallTime(column: AirColumn, mass_kg: number, diameter_m: number, height_m: number, cd: (reynolds: number) => number): number {
  const V = (Math.PI * diameter_m ** 3) / 6;
  const A = (Math.PI * diameter_m ** 2) / 4;
  const rhs = (_t: number, [d, v]: number[]): number[] => {
    const z = height_m - d!;
    const rho = column.density(z);
    const me = mass_kg + 0.5 * rho * V;
    const re = Math.max((rho * Math.abs(v!) * diameter_m) / column.viscosity(z), 1e-12);
    return [v!, (column.gravity(z) * (mass_kg - rho * V)) / me - ((rho * cd(re) * A) / (2 * me)) * v! * Math.abs(v!)];
  };
  let t = Math.sqrt((2 * height_m) / 9.8);
  for (let i = 0; i < 30; i++) {
    const [d, v] = odexSolver(2, 1e-12).solve(rhs, 0, [0, 0], t).y;
    const step = (d! - height_m) / v!;
    t -= step;
    if (Math.abs(step) < 1e-12 * t) return t;
  }
  throw new Error('Newton on the end time did not settle');
}
