import { describe, expect, it } from 'vitest';
import { fallSpeedAtHeight, fallTime } from '../../src/physics/fallModel';
import { fallWithVariableDrag } from '../../src/physics/fallWithVariableDrag';
import { morrisonSphereDragCoefficient } from '../../src/physics/sphereDragCoefficient';
import { odexSolver } from './odexSolver';

describe('fallWithVariableDrag', () => {
  it('reproduces the closed form to 1e-9 when C_d does not depend on Re', () => {
    for (const [k, h] of [
      [1e-6, 2],
      [0.002, 12],
      [0.05, 40],
      [1, 30],
    ] as const) {
      const cd = 0.47;
      const fall = fallWithVariableDrag(h, {
        effective_gravity_m_s2: 9.8,
        drag_constant_per_unit_cd_per_m: k / cd,
        reynolds_per_speed_s_m: 6e3,
        dragCoefficient: () => cd,
      });
      const p = { effective_gravity_m_s2: 9.8, drag_constant_per_m: k, effective_mass_kg: 1 };
      expect(Math.abs(fall.time_s / fallTime(h, p) - 1)).toBeLessThan(1e-9);
      expect(Math.abs(fall.impact_speed_m_s / fallSpeedAtHeight(h, p) - 1)).toBeLessThan(1e-9);
    }
  });

  it('agrees with odex for a sphere whose C_d follows the Morrison correlation', () => {
    // A 20 mm ball of 4 g in air: Re passes from 0 through the Stokes and intermediate range to ~2e4.
    const g = 9.79;
    const c = (1.2 * Math.PI * 0.01 * 0.01) / (2 * 0.004); // ρA/(2m)
    const rps = (1.2 * 0.02) / 1.8e-5; // ρL/μ
    const h = 25;
    const ours = fallWithVariableDrag(h, {
      effective_gravity_m_s2: g,
      drag_constant_per_unit_cd_per_m: c,
      reynolds_per_speed_s_m: rps,
      dragCoefficient: morrisonSphereDragCoefficient,
    });
    const drag = (v: number): number => (v > 0 ? c * morrisonSphereDragCoefficient(rps * v) * v * v : 0);
    const reference = odexSolver(2, 1e-13).solve((_t, [, v]) => [v!, g - drag(v!)], 0, [0, 0], ours.time_s);
    expect(Math.abs(reference.y[0]! / h - 1)).toBeLessThan(1e-9);
    expect(Math.abs(reference.y[1]! / ours.impact_speed_m_s - 1)).toBeLessThan(1e-9);
    expect(ours.reynolds_number).toBeCloseTo(rps * ours.impact_speed_m_s, 9);
  });

  it('takes longer than a vacuum fall and reports C_d at the impact Reynolds number', () => {
    const body = {
      effective_gravity_m_s2: 9.8,
      drag_constant_per_unit_cd_per_m: (1.2 * Math.PI * 0.025 * 0.025) / (2 * 0.05),
      reynolds_per_speed_s_m: (1.2 * 0.05) / 1.8e-5,
      dragCoefficient: morrisonSphereDragCoefficient,
    };
    const fall = fallWithVariableDrag(10, body);
    expect(fall.time_s).toBeGreaterThan(Math.sqrt(20 / 9.8));
    expect(fall.drag_coefficient_at_impact).toBe(morrisonSphereDragCoefficient(fall.reynolds_number));
  });
});
