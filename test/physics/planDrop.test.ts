import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { planDrop, type DropPlanRequest } from '../../src/physics/planDrop';
import { AIR, BALL, exactTimes, SITE, UNCERTAINTY } from './syntheticSeries';

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

  it('describes the planned drop with the same closed form the analysis uses', () => {
    const at = result.at_height!;
    expect(at.fall_time_s).toBeCloseTo(exactTimes({ site: SITE, air: AIR, specimen: BALL }, 0.47, [12])[0]!, 12);
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

  it('uses the Morrison correlation for a sphere when no C_d is given', () => {
    const { drag_coefficient: _, ...withoutCd } = plan;
    const morrison = planDrop(withoutCd);
    expect(morrison.drag_coefficient_source).toBe('morrison-sphere-correlation');
    expect(morrison.drag_coefficient).toBeGreaterThan(0.38);
    expect(morrison.drag_coefficient).toBeLessThan(0.5);
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
