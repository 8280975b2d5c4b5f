import { describe, expect, it } from 'vitest';
import { AirColumn, FREE_AIR_GRAVITY_GRADIENT_PER_S2 } from '../../src/physics/airColumn';
import { fallParameters, fallSpeedAtHeight, fallTime } from '../../src/physics/fallModel';
import { fallThroughColumn, type ColumnBody } from '../../src/physics/fallThroughColumn';
import { standardSphereDragCoefficient } from '../../src/physics/standardSphereDrag';
import { odexSolver } from './odexSolver';

const G_GROUND = 9.8061;
// A ground reading near the ISA: 15 °C, 101 325 Pa, 1.225 kg/m³ (invented scenario).
const reading = (over: Partial<ConstructorParameters<typeof AirColumn>[0]> = {}) => ({
  height_m: 0,
  temperature_K: 288.15,
  pressure_Pa: 101325,
  gasFactor: (1.225 * 288.15) / 101325,
  verticalWind_m_s: 0,
  windSpeed_m_s: 0,
  ...over,
});
const ball: ColumnBody = {
  mass_kg: 0.21,
  area_m2: (Math.PI * 0.095 ** 2) / 4,
  volume_m3: (Math.PI * 0.095 ** 3) / 6,
  characteristic_length_m: 0.095,
  buoyancy: true,
  added_mass_coefficient: 0.5,
  drag_coefficient: 0.5,
};

/**
 * The same equations written out again, independently of airColumn.ts (the polytropic pressure law
 * p = p₀·(T/T₀)^(G·g/Γ) in its textbook form, the sutherland-free constant viscosity is not needed for a constant
 * C_d), and handed to odex (Hairer & Wanner's extrapolation code, from npm) as the reference.
 */
function referenceRhs(H: number, lapse: number, W: number, U: number, body: ColumnBody, mu = 1.8e-5) {
  const r = reading();
  const G = r.gasFactor;
  const T0 = r.temperature_K;
  const p0 = r.pressure_Pa;
  const n = (G * G_GROUND) / lapse;
  return (_t: number, y: number[]): number[] => {
    const z = H - y[0]!;
    const T = T0 - lapse * z;
    const rho = (G * p0 * Math.pow(T / T0, n)) / T;
    const g = G_GROUND - FREE_AIR_GRAVITY_GRADIENT_PER_S2 * z;
    const me = body.mass_kg + body.added_mass_coefficient * rho * body.volume_m3;
    const vr = y[1]! + W;
    const ur = (y[3] ?? 0) - U;
    const q = Math.hypot(vr, ur);
    const cd = typeof body.drag_coefficient === 'number' ? body.drag_coefficient : body.drag_coefficient((rho * q * body.characteristic_length_m) / mu);
    const c = (rho * cd * body.area_m2) / (2 * me);
    const dv = (g * (body.mass_kg - rho * body.volume_m3)) / me - c * q * vr;
    return y.length === 4 ? [y[1]!, dv, y[3]!, -c * q * ur] : [y[1]!, dv];
  };
}

describe('fallThroughColumn (still air: the quadrature; moving air: the integrator) against odex driving the full equations (1e-6 relative)', () => {
  const cases: [string, number, number, number, ColumnBody][] = [
    ['a ball from 300 m through a standard lapse', 300, 0.0065, 0, ball],
    ['a ball from 3000 m with a 0.5 m/s updraft', 3000, 0.0065, 0.5, ball],
    ['a light parachute-like body from 1000 m in a downdraft', 1000, 0.008, -0.3, { ...ball, mass_kg: 0.05, area_m2: 0.3, volume_m3: 0.002, added_mass_coefficient: 0.8, drag_coefficient: 1.3 }],
    ['a dense ball from 10 000 m', 10000, 0.0065, 0, { ...ball, mass_kg: 5 }],
    ['a light, bulky ball from 3000 m in still air (terminal most of the way)', 3000, 0.0065, 0, { ...ball, mass_kg: 0.03, area_m2: Math.PI * 0.125 ** 2, volume_m3: (Math.PI * 0.25 ** 3) / 6, drag_coefficient: 0.47 }],
    ['a ball from 14 m in still air', 14, 0.0065, 0, ball],
  ];
  it.each(cases)('%s', (_name, H, lapse, W, body) => {
    const column = new AirColumn(reading({ verticalWind_m_s: W }), G_GROUND, lapse);
    const ours = fallThroughColumn(H, body, column);
    const ref = odexSolver(2, 1e-13).solve(referenceRhs(H, lapse, W, 0, body), 0, [0, 0], ours.time_s);
    // At our time odex has fallen H within 1e-6 of the time scale: the distance error over the speed.
    expect(Math.abs(ref.y[0]! - H) / ref.y[1]! / ours.time_s).toBeLessThan(1e-6);
    expect(Math.abs(ref.y[1]! / ours.impact_speed_m_s - 1)).toBeLessThan(1e-6);
  });

  it('a tennis-ball-like body from 10 m in a 5 m/s crosswind (2-D relative velocity)', () => {
    const tennis: ColumnBody = { ...ball, mass_kg: 0.058, area_m2: (Math.PI * 0.067 ** 2) / 4, volume_m3: (Math.PI * 0.067 ** 3) / 6, characteristic_length_m: 0.067, drag_coefficient: 0.55 };
    const column = new AirColumn(reading({ windSpeed_m_s: 5 }), G_GROUND, 0.0065);
    const ours = fallThroughColumn(10, tennis, column);
    const ref = odexSolver(4, 1e-13).solve(referenceRhs(10, 0.0065, 0, 5, tennis), 0, [0, 0, 0, 0], ours.time_s);
    expect(Math.abs(ref.y[0]! - 10) / ref.y[1]! / ours.time_s).toBeLessThan(1e-6);
    expect(Math.abs(ref.y[2]! / ours.drift_m - 1)).toBeLessThan(1e-6);
    // The crosswind slows the fall: more relative speed, more drag along the vertical too.
    const still = fallThroughColumn(10, tennis, new AirColumn(reading(), G_GROUND, 0.0065));
    expect(ours.time_s).toBeGreaterThan(still.time_s);
  });

  it('a sphere whose C_d follows the standard curve, from 300 m in a crosswind', () => {
    const sphere: ColumnBody = { ...ball, drag_coefficient: standardSphereDragCoefficient };
    const column = new AirColumn(reading({ windSpeed_m_s: 3 }), G_GROUND, 0.0065);
    // A constant viscosity for this case, in ours as in the reference: the column's viscosity follows T.
    const ours = fallThroughColumn(300, sphere, column);
    const mu = column.viscosity(150);
    const ref = odexSolver(4, 1e-12).solve(referenceRhs(300, 0.0065, 0, 3, sphere, mu), 0, [0, 0, 0, 0], ours.time_s);
    // The viscosity's change over 300 m (about 0.3 %) moves C_d by far less than 1e-4 here: a looser check.
    expect(Math.abs(ref.y[0]! - 300) / ref.y[1]! / ours.time_s).toBeLessThan(1e-4);
  });
});

describe('fallThroughColumn in still, uniform air', () => {
  it('is close to the closed form at the mean density along a short fall in still air', () => {
    // An isothermal column: over a 14 m drop the density changes by 1.7e-3; the closed form at the mean density
    // and gravity along the fall is right to first order in that change (the rest is below 1e-5 here).
    const column = new AirColumn(reading(), G_GROUND, 0);
    const ours = fallThroughColumn(14, ball, column);
    const mean = fallParameters({ ...ball, drag_coefficient: 0.5, density_kg_m3: column.density(7), gravity_m_s2: column.gravity(7) });
    expect(Math.abs(ours.time_s / fallTime(14, mean) - 1)).toBeLessThan(1e-5);
    // The impact speed weighs the air near the ground more: 5e-5.
    expect(Math.abs(ours.impact_speed_m_s / fallSpeedAtHeight(14, mean) - 1)).toBeLessThan(5e-5);
  });

  it('says so when an updraft holds the body up', () => {
    const feather: ColumnBody = { ...ball, mass_kg: 0.001, area_m2: 0.01, volume_m3: 1e-6, drag_coefficient: 1 };
    expect(() => fallThroughColumn(5, feather, new AirColumn(reading({ verticalWind_m_s: 5 }), G_GROUND, 0.0065))).toThrow(/updraft/);
  });
});
