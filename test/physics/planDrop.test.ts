import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { planDrop, type DropPlanRequest } from '../../src/physics/planDrop';
import { AIR, BALL, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';
import { fallParameters, fallTime } from '../../src/physics/fallModel';
import { nominalAirColumn } from '../../src/physics/predictedFall';
import { prepareSetup } from '../../src/physics/seriesSetup';
import { odexSolver } from './odexSolver';
import { sphereColumnFallTime } from './sphereColumnFall';
import { standardSphereDragCoefficient, standardSphereDragRelativeUncertainty } from '../../src/physics/standardSphereDrag';

const plan: DropPlanRequest = {
  site: SITE,
  air: AIR,
  specimen: BALL,
  timing: { standard_uncertainty_s: 0.004 },
  uncertainty: UNCERTAINTY,
  drag_coefficient: 0.47,
  height_m: 12,
  target_relative_uncertainty: 0.05,
};

/** What the analysis reports for n noise-free drops from h at the plan's C_d. */
function analysedRelativeUncertainty(h: number, n: number): number {
  const times = exactTimes({ site: SITE, air: AIR, specimen: BALL }, 0.47, Array(n).fill(h));
  const result = analyzeSeries({
    site: SITE,
    air: AIR,
    specimen: BALL,
    drops: times.map((t) => ({ height_m: h, time_s: t })),
    timing: { standard_uncertainty_s: 0.004 },
    uncertainty: UNCERTAINTY,
    options: { monte_carlo_draws: 200 },
  });
  return result.drag_coefficient_standard_uncertainty / result.drag_coefficient_estimate;
}

describe('planDrop', () => {
  const result = planDrop(plan);

  it('describes the planned drop through the same air the analysis uses, within 3e-5 of uniform air over 12 m', () => {
    const at = result.at_height!;
    // exactTimes is the closed form in uniform air at the reading; the air along 12 m thins by about 0.1 %.
    expect(Math.abs(at.fall_time_s / exactTimes({ site: SITE, air: AIR, specimen: BALL }, 0.47, [12])[0]! - 1)).toBeLessThan(3e-5);
    expect(at.impact_energy_J).toBeCloseTo(0.5 * 0.21 * at.impact_speed_m_s ** 2, 12);
    expect(at.drag_delay_s).toBeGreaterThan(0);
    expect(at.vacuum_time_s).toBeLessThan(at.fall_time_s);
  });

  it('puts 99 % of terminal velocity farther than 95 %, in the ratio ln(1 − 0.99²)/ln(1 − 0.95²)', () => {
    const ratio = result.distance_to_99pct_terminal_velocity_m / result.distance_to_95pct_terminal_velocity_m;
    expect(ratio).toBeCloseTo(Math.log(1 - 0.99 ** 2) / Math.log(1 - 0.95 ** 2), 12);
  });

  it('finds a smallest height and number of drops whose analysis really reaches the target', () => {
    const target = result.target!;
    expect(target.reachable).toBe(true);
    const h = target.smallest_height_m!;
    const n = target.drops_at_smallest_height!;
    expect(analysedRelativeUncertainty(h, n)).toBeLessThanOrEqual(0.05);
    if (n > 1) expect(analysedRelativeUncertainty(h, n - 1)).toBeGreaterThan(0.05);
    // And a lower release point with the most drops does not reach it.
    expect(analysedRelativeUncertainty(h * 0.97, 20)).toBeGreaterThan(0.05);
  });

  it('needs fewer drops from higher up', () => {
    const heights = result.target!.heights_by_drops.map((r) => r.smallest_height_m!);
    for (let i = 1; i < heights.length; i++) expect(heights[i]).toBeLessThan(heights[i - 1]!);
  });

  it('states plainly that no height up to the limit reaches a target that timing cannot reach', () => {
    const hopeless = planDrop({ ...plan, timing: { standard_uncertainty_s: 0.1 }, target_relative_uncertainty: 0.01, max_height_m: 20 });
    expect(hopeless.target!.reachable).toBe(false);
    expect(hopeless.target!.smallest_height_m).toBeNull();
    expect(hopeless.target!.message).toMatch(/^No height up to 20 m reaches 1\.0 %/);
  });

  it('says when size, mass and air alone already exceed the target', () => {
    const floor = planDrop({ ...plan, uncertainty: { ...UNCERTAINTY, diameter_m: 0.002 }, target_relative_uncertainty: 0.02 });
    expect(floor.target!.systematic_relative_uncertainty_at_max_height).toBeGreaterThan(0.02);
    expect(floor.target!.message).toContain('alone');
  });

  it('plans a sphere without a C_d on the standard curve: the analysis\' predicted time, with its uncertainty', () => {
    const { drag_coefficient: _, ...withoutCd } = plan;
    const onCurve = planDrop(withoutCd);
    expect(onCurve.drag_coefficient_source).toBe('standard-sphere-drag-curve');
    const at = onCurve.at_height!;
    // Its C_d is the curve's at the impact Reynolds number, where the curve is stated to 5 % (below Re 1e5).
    expect(onCurve.drag_coefficient).toBe(standardSphereDragCoefficient(at.reynolds_number));
    expect(onCurve.drag_coefficient_relative_standard_uncertainty).toBe(0.05);
    // The analysis of drops from the same height predicts the same time with the same uncertainty.
    const times = exactTimes({ site: SITE, air: AIR, specimen: BALL }, 0.47, [12, 12]);
    const analysed = analyzeSeries({
      site: SITE,
      air: AIR,
      specimen: BALL,
      drops: times.map((t) => ({ height_m: 12, time_s: t })),
      timing: plan.timing,
      uncertainty: UNCERTAINTY,
      options: { monte_carlo_draws: 200 },
    });
    const predicted = analysed.prediction.heights![0]!;
    expect(analysed.prediction.method).toBe('standard-sphere-drag-curve');
    expect(Math.abs(predicted.time_s / at.fall_time_s - 1)).toBeLessThan(1e-9);
    expect(Math.abs(predicted.time_standard_uncertainty_s / at.fall_time_standard_uncertainty_s! - 1)).toBeLessThan(1e-9);
    // A 12 m ball drop: a few milliseconds, far above the planner's integration error.
    expect(at.fall_time_standard_uncertainty_s!).toBeGreaterThan(1e-3);
    // Terminal velocity is where the curve's drag balances the weight: ρ·C_d(ρvD/μ)·A·v²/(2m_e) = g_e.
    const s = prepareSetup({ site: SITE, air: AIR, specimen: BALL, drops: [{ height_m: 12, time_s: 1.6 }], timing: plan.timing });
    const vT = onCurve.terminal_velocity_m_s;
    const drag = (s.density_kg_m3 * standardSphereDragCoefficient((s.density_kg_m3 * vT * 0.095) / s.viscosity_Pa_s) * s.geometry.area_m2 * vT * vT) / (2 * s.effectiveMass_kg);
    expect(Math.abs(drag / s.effectiveGravity_m_s2 - 1)).toBeLessThan(1e-9);
    expect(vT).toBeGreaterThan(at.impact_speed_m_s);
  });

  it('gives no time uncertainty for a given or a reference C_d, which come without one', () => {
    expect(result.drag_coefficient_source).toBe('given');
    expect(result.at_height!.fall_time_standard_uncertainty_s).toBeNull();
    expect(result.drag_coefficient_relative_standard_uncertainty).toBeNull();
    const { drag_coefficient: _, ...withoutCd } = plan;
    const reference = planDrop({ ...withoutCd, specimen: { ...BALL, reference_drag_coefficient: 0.47 } });
    expect(reference.drag_coefficient_source).toBe('reference');
    expect(reference.at_height!.fall_time_standard_uncertainty_s).toBeNull();
  });

  it('carries the curve\'s uncertainty to the time as odex integrates the fall with the curve moved by ±u(Re)', () => {
    // Reference: odex through the same air column (sphereColumnFall.ts) with C_d(Re)·(1 ± u(Re)) (standardSphereDrag.ts).
    // The central difference of the two times is the uncertainty as the planner states it.
    const { drag_coefficient: _, ...withoutCd } = plan;
    const setup = prepareSetup({ site: SITE, air: AIR, specimen: BALL, drops: [{ height_m: 12, time_s: 1.6 }], timing: { standard_uncertainty_s: 0.004 } });
    const column = nominalAirColumn(setup);
    const moved = (sign: number) => (re: number) => standardSphereDragCoefficient(re) * (1 + sign * standardSphereDragRelativeUncertainty(re));
    const timeToFall = (h: number, sign: number) => sphereColumnFallTime(column, 0.21, 0.095, h, moved(sign));
    for (const h of [3, 12, 40]) {
      const planned = planDrop({ ...withoutCd, height_m: h, max_height_m: 50 }).at_height!;
      // The planner's falls on the curve take a 1e-8 step tolerance: a few 1e-7 of the time in all.
      expect(Math.abs(planned.fall_time_s / timeToFall(h, 0) - 1)).toBeLessThan(1e-6);
      const reference = Math.abs(timeToFall(h, 1) - timeToFall(h, -1)) / 2;
      expect(Math.abs(planned.fall_time_standard_uncertainty_s! / reference - 1)).toBeLessThan(2e-3);
    }
  });

  it('warns of the drag crisis for a sphere, not for a box or a custom shape at the same Reynolds number', () => {
    // A 250 mm, 2 kg ball from 30 m reaches about 22 m/s: Re ≈ 3.5e5 (as in the analysis tests).
    const big = { ...plan, specimen: { shape: 'sphere' as const, mass_kg: 2, diameter_m: 0.25 }, height_m: 30, target_relative_uncertainty: undefined };
    const { drag_coefficient: _, ...bigOnCurve } = big;
    const sphere = planDrop(bigOnCurve);
    expect(sphere.at_height!.reynolds_number).toBeGreaterThan(2e5);
    expect(sphere.warnings.map((w) => w.code)).toContain('near-drag-crisis');
    // On the curve there, its stated uncertainty is large, and so is the time's.
    expect(sphere.drag_coefficient_relative_standard_uncertainty!).toBeGreaterThan(0.3);
    expect(sphere.at_height!.fall_time_standard_uncertainty_s!).toBeGreaterThan(0.02);
    // The same ball with a given C_d still meets the crisis: the warning follows the shape, not the C_d's source.
    expect(planDrop({ ...big, drag_coefficient: 0.3 }).warnings.map((w) => w.code)).toContain('near-drag-crisis');
    const shapeFree = { height_m: 0.01 };
    const box = planDrop({ ...big, specimen: { shape: 'box', mass_kg: 3, length_m: 0.25, width_m: 0.25, thickness_m: 0.05 }, drag_coefficient: 1.05, uncertainty: shapeFree });
    expect(box.at_height!.reynolds_number).toBeGreaterThan(2e5);
    expect(box.warnings.map((w) => w.code)).not.toContain('near-drag-crisis');
    const custom = planDrop({ ...big, specimen: { shape: 'custom', mass_kg: 2, area_m2: 0.049, volume_m3: 0.008 }, drag_coefficient: 0.3, uncertainty: shapeFree });
    expect(custom.at_height!.reynolds_number).toBeGreaterThan(2e5);
    expect(custom.warnings.map((w) => w.code)).not.toContain('near-drag-crisis');
  });

  it('asks for a drag coefficient for other shapes', () => {
    const { drag_coefficient: _, ...withoutCd } = plan;
    try {
      planDrop({ ...withoutCd, specimen: { shape: 'disc', mass_kg: 0.05, diameter_m: 0.12, thickness_m: 0.004 }, uncertainty: { height_m: 0.01 } });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      expect((error as PhysicsInputError).code).toBe('missing-drag-coefficient');
    }
  });
});

describe('a planned tall drop', () => {
  // A 0.5 kg, 100 mm ball with a handbook C_d of 0.5 from 3000 m (an invented scenario of our own), hand-timed.
  const SPECIMEN = { shape: 'sphere' as const, mass_kg: 0.5, diameter_m: 0.1, reference_drag_coefficient: 0.5 };
  const AIR_3000 = { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station' as const, relative_humidity_pct: 55 };
  const SITE_3000 = { latitude_deg: 46.1, elevation_m: 430 };
  const tall = planDrop({ site: SITE_3000, air: AIR_3000, specimen: SPECIMEN, timing: { standard_uncertainty_s: 0.05 }, height_m: 3000, max_height_m: 3000 });

  it('takes the time the analysis predicts for the same inputs, to 1e-6', () => {
    const planned = tall.at_height!.fall_time_s;
    const analysed = analyzeSeries({
      site: SITE_3000,
      air: AIR_3000,
      specimen: SPECIMEN,
      drops: [planned, planned + 0.03, planned - 0.03].map((t) => ({ height_m: 3000, time_s: t })),
      timing: { standard_uncertainty_s: 0.05 },
      options: { monte_carlo_draws: 1000 },
    });
    expect(analysed.prediction.method).toBe('reference-drag-coefficient');
    expect(Math.abs(analysed.drops[0]!.predicted_time_s! / planned - 1)).toBeLessThan(1e-6);
  });

  it('falls as odex integrates the stratified equations of motion, and not as in uniform air at the reading', () => {
    // Reference: odex driving m_e(z)·dv/dt = (m − ρ(z)V)·g(z) − ½ρ(z)·C_d·A·v², m_e = m + ½ρ(z)V, with the air of
    // the column (ISO 2533 lapse and hydrostatic pressure, checked in airColumn.test.ts) to the planned time: the
    // distance reached is the height.
    const setup = prepareSetup({ site: SITE_3000, air: AIR_3000, specimen: SPECIMEN, drops: [{ height_m: 3000, time_s: 80 }], timing: { standard_uncertainty_s: 0.05 } });
    const column = nominalAirColumn(setup);
    const V = (Math.PI * 0.1 ** 3) / 6;
    const A = (Math.PI * 0.1 ** 2) / 4;
    const rhs = (_t: number, [d, v]: number[]): number[] => {
      const z = 3000 - d!;
      const rho = column.density(z);
      const me = 0.5 + 0.5 * rho * V;
      return [v!, (column.gravity(z) * (0.5 - rho * V)) / me - ((rho * 0.5 * A) / (2 * me)) * v! * Math.abs(v!)];
    };
    const reached = odexSolver(2, 1e-12).solve(rhs, 0, [0, 0], tall.at_height!.fall_time_s).y[0]!;
    expect(Math.abs(reached / 3000 - 1)).toBeLessThan(1e-6);
    // Uniform air at the ground would make the fall several seconds longer (the air thins by about a quarter).
    const uniform = fallTime(3000, fallParameters({ mass_kg: 0.5, area_m2: A, volume_m3: V, drag_coefficient: 0.5, density_kg_m3: setup.density_kg_m3, gravity_m_s2: setup.gravity_m_s2, added_mass_coefficient: 0.5 }));
    expect(uniform - tall.at_height!.fall_time_s).toBeGreaterThan(1);
  });
});
