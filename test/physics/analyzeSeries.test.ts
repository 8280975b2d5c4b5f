import { describe, expect, it } from 'vitest';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { fallParameters, fallTime } from '../../src/physics/fallModel';
import { fallWithVariableDrag } from '../../src/physics/fallWithVariableDrag';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { standardSphereDragCoefficient } from '../../src/physics/standardSphereDrag';
import { AIR, BALL, createRandom, exactTimes, measuredSeries, SITE, UNCERTAINTY } from './syntheticSeries';

const exactRequest = (cd: number, heights: number[], extra: Partial<AnalysisRequest> = {}): AnalysisRequest => {
  const base = { site: SITE, air: AIR, specimen: BALL, ...extra };
  const times = exactTimes(base, cd, heights);
  return {
    ...base,
    drops: heights.map((h, i) => ({ height_m: h, time_s: times[i]! })),
    timing: { standard_uncertainty_s: 0.004 },
    uncertainty: UNCERTAINTY,
    options: { monte_carlo_draws: 2000 },
    ...extra,
  } as AnalysisRequest;
};

function coverage(series: number, make: (i: number) => AnalysisRequest, truth: number): { covered: number; resolved: number } {
  let covered = 0;
  let resolved = 0;
  for (let i = 0; i < series; i++) {
    const result = analyzeSeries(make(i));
    if (result.drag_resolved) resolved++;
    const [low, high] = result.drag_coefficient_interval_95;
    if (low <= truth && truth <= high) covered++;
  }
  return { covered: covered / series, resolved: resolved / series };
}

describe('analyzeSeries', () => {
  it('recovers the drag coefficient that produced noise-free times', () => {
    const result = analyzeSeries(exactRequest(0.47, [12, 12, 12, 12, 12]));
    expect(result.drag_coefficient).toBeCloseTo(0.47, 10);
    for (const drop of result.drops) {
      expect(drop.drag_coefficient).toBeCloseTo(0.47, 10);
      expect(Math.abs(drop.residual_s)).toBeLessThan(1e-12);
    }
  });

  it('gives 95 % intervals that contain the true C_d about 95 % of the time when the timing noise is as declared', () => {
    // 1000 synthetic series of five drops from 12 m: every input drawn around its measured value by
    // its declared uncertainty, timing noise 4 ms as declared. With the scatter counted only beyond
    // the declared noise (max of the two), the expected coverage is about 96 % (not less than 95 %);
    // the binomial standard deviation over 1000 series is 0.7 %.
    const random = createRandom(2024);
    const result = coverage(1000, () => measuredSeries({ cd: 0.47, heights: [12, 12, 12, 12, 12], timingU: 0.004, random }), 0.47);
    expect(result.resolved).toBe(1);
    expect(result.covered).toBeGreaterThan(0.93);
    expect(result.covered).toBeLessThan(0.98);
  }, 120_000);

  it('keeps covering about 95 % when the real scatter is twice the declared timing uncertainty (Type A takes over)', () => {
    // Without the Type A term this would fall to about 70 %; with it drawn as a t-distribution
    // (ν = 4) the coverage is restored. 400 series: binomial standard deviation 1.1 %.
    const random = createRandom(77);
    const result = coverage(
      400,
      () => measuredSeries({ cd: 0.47, heights: [12, 12, 12, 12, 12], timingU: 0.004, actualTimingSd: 0.008, random }),
      0.47,
    );
    expect(result.covered).toBeGreaterThan(0.915);
    expect(result.covered).toBeLessThan(0.985);
  }, 120_000);

  it('covers about 95 % with a fitted timing offset over five heights', () => {
    // Ten drops, two from each of 4–20 m, with a true 15 ms start/stop delay fitted together with C_d.
    const random = createRandom(5);
    const heights = [4, 4, 8, 8, 12, 12, 16, 16, 20, 20];
    const result = coverage(
      300,
      () => measuredSeries({ cd: 0.47, heights, timingU: 0.002, offset_s: 0.015, fitOffset: true, random }),
      0.47,
    );
    expect(result.covered).toBeGreaterThan(0.91);
    expect(result.covered).toBeLessThan(0.99);
  }, 120_000);

  it('fits a known timing offset out of noise-free drops from several heights', () => {
    const heights = [4, 8, 12, 16, 20];
    const request = exactRequest(0.47, heights);
    request.drops = request.drops.map((d) => ({ ...d, time_s: d.time_s + 0.021 }));
    request.timing = { standard_uncertainty_s: 0.002, offset: 'fit' };
    const result = analyzeSeries(request);
    expect(result.timing_offset_s).toBeCloseTo(0.021, 10);
    expect(result.drag_coefficient).toBeCloseTo(0.47, 8);
    expect(result.timing_offset_standard_uncertainty_s).toBeGreaterThan(0);
    // Each drop's own C_d is taken from its time less the fitted offset.
    for (const drop of result.drops) expect(drop.drag_coefficient).toBeCloseTo(0.47, 8);
  });

  it('gives the same interval for the same seed, and a different one for another seed', () => {
    const request = measuredSeries({ cd: 0.47, heights: [12, 12, 12], timingU: 0.004, random: createRandom(1) });
    const a = analyzeSeries(request);
    const b = analyzeSeries(structuredClone(request));
    const c = analyzeSeries({ ...request, options: { ...request.options, seed: 99 } });
    expect(b.drag_coefficient_interval_95).toEqual(a.drag_coefficient_interval_95);
    expect(c.drag_coefficient_interval_95).not.toEqual(a.drag_coefficient_interval_95);
  });

  it('says plainly when drag is not resolved and gives an upper bound instead of a value', () => {
    // A dense 40 mm steel ball (263 g) dropped 1.5 m and timed by hand (50 ms): the drag delay is
    // a fraction of a millisecond.
    const steel = { shape: 'sphere' as const, mass_kg: 0.263, diameter_m: 0.04 };
    const times = exactTimes({ site: SITE, air: AIR, specimen: steel }, 0.47, [1.5, 1.5, 1.5]);
    const result = analyzeSeries({
      site: SITE,
      air: AIR,
      specimen: steel,
      drops: times.map((t, i) => ({ height_m: 1.5, time_s: t + [0.03, -0.02, 0.01][i]! })),
      timing: { standard_uncertainty_s: 0.05 },
      options: { monte_carlo_draws: 2000 },
    });
    expect(result.drag_resolved).toBe(false);
    expect(result.drag_coefficient).toBeNull();
    expect(result.drag_coefficient_upper_bound_95).toBeGreaterThan(0.47);
    expect(result.drag_coefficient_interval_95[0]).toBe(0);
    expect(result.terminal_velocity_m_s).toBeNull();
    expect(result.terminal_velocity_lower_bound_m_s).toBeGreaterThan(0);
    expect(result.warnings.map((w) => w.code)).toContain('drag-not-resolved');
  });

  it('refuses a series clearly faster than free fall, naming the drops and the limit', () => {
    const request = exactRequest(0.47, [12, 12, 12]);
    const vacuum = Math.sqrt((2 * 12) / 9.8058);
    request.drops = request.drops.map((d) => ({ ...d, time_s: vacuum - 0.03 }));
    try {
      analyzeSeries(request);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      expect((error as PhysicsInputError).code).toBe('faster-than-free-fall');
      expect((error as PhysicsInputError).message).toContain('faster than free fall: check the height and the timing');
    }
  });

  it('gives a drop inside the noise but short of a drag-free fall no C_d of its own, and keeps it in the fit', () => {
    const request = exactRequest(0.47, [12, 12, 12, 12]);
    const params = fallParameters({
      mass_kg: 0.21,
      area_m2: (Math.PI * 0.095 ** 2) / 4,
      volume_m3: (Math.PI * 0.095 ** 3) / 6,
      drag_coefficient: 0,
      density_kg_m3: analyzeSeries(request).air.density_kg_m3,
      gravity_m_s2: analyzeSeries(request).gravity_m_s2,
      added_mass_coefficient: 0.5,
    });
    request.drops[2] = { height_m: 12, time_s: fallTime(12, params) - 0.002 };
    const result = analyzeSeries(request);
    expect(result.drops[2]!.drag_coefficient).toBeNull();
    expect(result.drops[2]!.residual_s).toBeLessThan(0);
    expect(result.warnings.find((w) => w.code === 'drop-not-slower-than-free-fall')!.message).toContain('drop 3 of the series');
  });

  it('flags a Grubbs outlier but keeps the drop in the analysis', () => {
    const request = exactRequest(0.47, [12, 12, 12, 12, 12, 12]);
    const noise = [0.001, -0.002, 0.0015, -0.001, 0.0005, 0.03];
    request.drops = request.drops.map((d, i) => ({ ...d, time_s: d.time_s + noise[i]! }));
    const result = analyzeSeries(request);
    expect(result.heights[0]!.grubbs!.outlier).toBe(true);
    expect(result.heights[0]!.grubbs!.suspect_drop_index).toBe(5);
    expect(result.drops).toHaveLength(6);
    // Messages count drops from 1 for people; the index fields stay 0-based like JSON paths.
    expect(result.warnings.find((w) => w.code === 'possible-outlier')!.message).toContain('Drop 6 of the series');
  });

  it('counts scatter beyond the declared timing uncertainty as a Type A budget entry', () => {
    const request = exactRequest(0.47, [12, 12, 12, 12, 12]);
    const noise = [0.012, -0.01, 0.008, -0.011, 0.001];
    request.drops = request.drops.map((d, i) => ({ ...d, time_s: d.time_s + noise[i]! }));
    const result = analyzeSeries(request);
    const typeA = result.budget.find((b) => b.input === 'scatter_s')!;
    expect(typeA.evaluation).toBe('A');
    expect(typeA.degrees_of_freedom).toBe(4);
    expect(result.warnings.map((w) => w.code)).toContain('scatter-exceeds-timing-uncertainty');
  });

  it('combines the budget contributions into the reported standard uncertainty, and Monte Carlo agrees with it', () => {
    const result = analyzeSeries({ ...measuredSeries({ cd: 0.47, heights: [12, 12, 12, 12, 12], timingU: 0.004, random: createRandom(3) }), options: { monte_carlo_draws: 20000 } });
    const rss = Math.sqrt(result.budget.reduce((s, b) => s + b.contribution ** 2, 0));
    expect(result.drag_coefficient_standard_uncertainty).toBeCloseTo(rss, 14);
    // Nearly linear here (u/C_d ≈ 6 %), so JCGM 101 and the GUM should agree within a few per cent.
    expect(result.monte_carlo.standard_deviation / result.drag_coefficient_standard_uncertainty).toBeGreaterThan(0.95);
    expect(result.monte_carlo.standard_deviation / result.drag_coefficient_standard_uncertainty).toBeLessThan(1.1);
  });

  it('predicts from the reference C_d when the specimen has one, otherwise from the standard drag curve for a sphere', () => {
    const withReference = analyzeSeries(exactRequest(0.47, [12], { specimen: { ...BALL, reference_drag_coefficient: 0.5 } }));
    expect(withReference.prediction.method).toBe('reference-drag-coefficient');
    const m = withReference.model;
    const ref = fallParameters({
      mass_kg: 0.21,
      area_m2: m.area_m2,
      volume_m3: m.volume_m3,
      drag_coefficient: 0.5,
      density_kg_m3: withReference.air.density_kg_m3,
      gravity_m_s2: withReference.gravity_m_s2,
      added_mass_coefficient: 0.5,
    });
    // Predictions go through the air along the fall (predictedFall.ts): over 12 m the thinning air shortens the
    // fall by about 1e-5 of its time against uniform air at the reading (checked exactly against odex in
    // planDrop.test.ts, at 3000 m).
    expect(Math.abs(withReference.drops[0]!.predicted_time_s! / fallTime(12, ref) - 1)).toBeLessThan(3e-5);

    const sphere = analyzeSeries(exactRequest(0.47, [12]));
    expect(sphere.prediction.method).toBe('standard-sphere-drag-curve');
    const fall = fallWithVariableDrag(12, {
      effective_gravity_m_s2: sphere.model.effective_gravity_m_s2,
      drag_constant_per_unit_cd_per_m: (sphere.air.density_kg_m3 * m.area_m2) / (2 * sphere.model.effective_mass_kg),
      reynolds_per_speed_s_m: (sphere.air.density_kg_m3 * 0.095) / sphere.air.dynamic_viscosity_Pa_s,
      dragCoefficient: standardSphereDragCoefficient,
    });
    expect(Math.abs(sphere.drops[0]!.predicted_time_s! / fall.time_s - 1)).toBeLessThan(3e-5);
  });

  it('warns near the drag crisis', () => {
    // A 250 mm, 2 kg ball from 30 m reaches about 22 m/s: Re ≈ 3.5e5.
    const big = { shape: 'sphere' as const, mass_kg: 2, diameter_m: 0.25 };
    const result = analyzeSeries(exactRequest(0.3, [30, 30, 30], { specimen: big }));
    expect(result.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(result.warnings.map((w) => w.code)).toContain('near-drag-crisis');
  });

  it('warns of creeping flow for a dust-sized particle', () => {
    // A 0.1 mm particle of 0.14 µg with C_d = 30 settles at about 0.1 m/s: Re ≈ 0.7.
    const grain = { shape: 'custom' as const, mass_kg: 1.44e-10, area_m2: 7.85e-9, volume_m3: 5e-13, characteristic_length_m: 1e-4 };
    const result = analyzeSeries(
      exactRequest(30, [0.5, 0.5, 0.5], { specimen: grain, timing: { standard_uncertainty_s: 0.01 }, uncertainty: { height_m: 0.001 } }),
    );
    expect(result.drops[0]!.reynolds_number).toBeLessThan(1);
    expect(result.warnings.map((w) => w.code)).toContain('creeping-flow');
  });

  it('analyses every shape the log supports', () => {
    const shapes = [
      { shape: 'cylinder' as const, mass_kg: 0.3, diameter_m: 0.05, length_m: 0.15 },
      { shape: 'disc' as const, mass_kg: 0.05, diameter_m: 0.12, thickness_m: 0.004 },
      { shape: 'box' as const, mass_kg: 0.45, length_m: 0.3, width_m: 0.2, thickness_m: 0.12 },
      { shape: 'custom' as const, mass_kg: 0.0002, area_m2: 0.0006, volume_m3: 1.2e-6 },
    ];
    for (const specimen of shapes) {
      const result = analyzeSeries({ ...exactRequest(1.1, [3, 3, 3], { specimen }), uncertainty: { height_m: 0.01 } });
      // The estimate itself: whether 3 m resolves the drag of each shape is not the point here.
      expect(result.drag_coefficient_estimate).toBeCloseTo(1.1, 9);
      expect(result.budget.map((b) => b.input)).toContain('height_m');
    }
  });

  it('lets gravity and density overrides win', () => {
    const request = exactRequest(0.47, [12, 12]);
    const overridden = analyzeSeries({ ...request, site: { ...SITE, gravity_m_s2: 9.81 }, air: { ...AIR, density_kg_m3: 1.1 }, uncertainty: { height_m: 0.01 } });
    expect(overridden.gravity_m_s2).toBe(9.81);
    expect(overridden.gravity_source).toBe('override');
    expect(overridden.air.density_kg_m3).toBe(1.1);
    expect(overridden.budget.map((b) => b.input)).toContain('density_kg_m3');
    expect(overridden.budget.map((b) => b.input)).not.toContain('temperature_C');
  });

  it('warns about inputs given without a standard uncertainty', () => {
    const { uncertainty: _, ...request } = exactRequest(0.47, [12, 12]);
    const result = analyzeSeries(request);
    expect(result.warnings.find((w) => w.code === 'uncertainty-not-given')!.message).toContain('mass_kg');
  });

  it('uses SI with the unit in every field name of a drop', () => {
    const result = analyzeSeries(exactRequest(0.47, [12]));
    expect(Object.keys(result.drops[0]!).sort()).toEqual(
      [
        'drag_coefficient',
        'fitted_time_s',
        'height_m',
        'impact_energy_J',
        'impact_speed_m_s',
        'predicted_time_s',
        'residual_s',
        'reynolds_number',
        'time_s',
        'vacuum_time_s',
      ].sort(),
    );
  });
});
