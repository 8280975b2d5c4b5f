import { describe, expect, it } from 'vitest';
import type { AnalysisRequest } from '../../src/physics/analysisTypes';
import { analyzeSeries } from '../../src/physics/analyzeSeries';
import { createRandom } from '../../src/physics/createRandom';
import { fallDistance, fallTime } from '../../src/physics/fallModel';
import { PhysicsInputError } from '../../src/physics/physicsInputError';
import { AIR, BALL, BALL_CD, markSeriesRequest, SITE, trueFall } from './markSeries';

const p = trueFall(BALL, AIR, BALL_CD);

/** Three clips without any noise: marks every 10 ms from 5 cm down, each clip's zero 7 ms after its release. */
function exactVideo(): AnalysisRequest {
  const clip = () => {
    const marks = [];
    for (let t = 0.1; fallDistance(t, p) < 2; t += 0.01) marks.push({ distance_m: fallDistance(t, p), time_s: t - 0.007 });
    // The typed request carries the landing; here it is the last mark itself (the validation takes it as that mark).
    const last = marks[marks.length - 1]!;
    return { height_m: last.distance_m, time_s: last.time_s, marks, release_time_known: false };
  };
  return { site: SITE, air: AIR, specimen: BALL, drops: [clip(), clip(), clip()], timing: { standard_uncertainty_s: 0.001, method: 'video' }, options: { monte_carlo_draws: 2000 } };
}

describe('analyzeSeries with marks', () => {
  it('recovers C_d, each release shift and zero residuals from exact marks', () => {
    const result = analyzeSeries(exactVideo());
    expect(result.drag_coefficient_estimate / BALL_CD - 1).toBeCloseTo(0, 6);
    for (const drop of result.drops) {
      expect(drop.release_shift_s).toBeCloseTo(-0.007, 9);
      for (const mark of drop.marks!) expect(Math.abs(mark.residual_s)).toBeLessThan(1e-9);
    }
    // The rolling shutter (video) is a systematic row of its own.
    expect(result.budget.map((b) => b.input)).toContain('rolling_shutter_s');
  });

  it('carries a rolling shutter\'s delay growing with the distance into C_d as its budget row says (linear check)', () => {
    // The same exact clips read 4 ms late at the bottom of each fall, in proportion to the distance fallen.
    const request = exactVideo();
    const late = 0.004;
    for (const drop of request.drops) {
      const reach = drop.marks![drop.marks!.length - 1]!.distance_m;
      for (const mark of drop.marks!) mark.time_s += (late * mark.distance_m) / reach;
      drop.time_s = drop.marks![drop.marks!.length - 1]!.time_s;
    }
    const result = analyzeSeries(request);
    const row = result.budget.find((b) => b.input === 'rolling_shutter_s')!;
    const bias = result.drag_coefficient_estimate - BALL_CD;
    // Read late lower down looks like a slower fall: more drag. The model takes x·d/d_max off, so C_d moves by −c·x.
    expect(bias).toBeGreaterThan(0);
    expect(Math.abs(bias + row.sensitivity * late) / bias).toBeLessThan(0.05);
  });

  it('gives the landing fitted time of a single drop in the series from the same fall', () => {
    const request = exactVideo();
    request.drops.push({ height_m: 1.5, time_s: fallTime(1.5, p) });
    const result = analyzeSeries(request);
    expect(result.drops[3]!.residual_s).toBeCloseTo(0, 9);
    expect(result.drops[3]!.marks).toBeUndefined();
    expect(result.drag_coefficient_estimate / BALL_CD - 1).toBeCloseTo(0, 6);
  });

  it('has a Monte Carlo interval close to the GUM interval on gates (the model is nearly linear there)', () => {
    const result = analyzeSeries(markSeriesRequest({ kind: 'gates', random: createRandom(7) }));
    const u = result.gum.combined_standard_uncertainty;
    expect(result.budget.map((b) => b.input)).toEqual(expect.arrayContaining(['time_s', 'release_s', 'timing_offset_s', 'height_m']));
    expect(Math.abs(result.monte_carlo.standard_deviation / u - 1)).toBeLessThan(0.05);
    expect(Math.abs(result.monte_carlo.interval_95[0] - result.gum.interval_95[0])).toBeLessThan(0.1 * u);
    expect(Math.abs(result.monte_carlo.interval_95[1] - result.gum.interval_95[1])).toBeLessThan(0.1 * u);
  });

  it('fits the series\' offset from gates with a known release and reports it', () => {
    const request = markSeriesRequest({ kind: 'gates', random: createRandom(8), gates: 3 });
    request.timing.offset = 'fit';
    const result = analyzeSeries(request);
    expect(result.timing_offset_s).toBeDefined();
    expect(Math.abs(result.timing_offset_s!)).toBeLessThan(4 * result.timing_offset_standard_uncertainty_s!);
  });

  it('refuses the scaled sphere law for marks, naming the option', () => {
    const request = exactVideo();
    request.options = { drag_law: 'scaled_sphere', monte_carlo_draws: 200 };
    try {
      analyzeSeries(request);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsInputError);
      expect((error as PhysicsInputError).field).toBe('options.drag_law');
    }
  });

  it('leaves a series without marks exactly as it was, release flag or not', () => {
    const plain: AnalysisRequest = { site: SITE, air: AIR, specimen: BALL, drops: [1, 1.5, 2].map((h) => ({ height_m: h, time_s: fallTime(h, p) + 0.001 })), timing: { standard_uncertainty_s: 0.002 }, options: { monte_carlo_draws: 1000 } };
    const flagged = { ...plain, drops: plain.drops.map((d) => ({ ...d, release_time_known: true })) };
    expect(analyzeSeries(flagged)).toEqual(analyzeSeries(plain));
  });

  it('warns of the drag crisis for a sphere, not for a box or a custom shape at the same Reynolds number', () => {
    // Exact marks every 0.1 s of a 30 m fall, release known, for bodies reaching Re ≈ 3.5e5 (as in the analysis tests).
    const marksOf = (specimen: AnalysisRequest['specimen'], cd: number): AnalysisRequest => {
      const fall = trueFall(specimen as typeof BALL, AIR, cd);
      const marks: { distance_m: number; time_s: number }[] = [];
      for (let t = 0.1; fallDistance(t, fall) < 30; t += 0.1) marks.push({ distance_m: fallDistance(t, fall), time_s: t });
      const last = marks[marks.length - 1]!;
      const drop = () => ({ height_m: last.distance_m, time_s: last.time_s, marks: marks.map((m) => ({ ...m })), release_time_known: true });
      return { site: SITE, air: AIR, specimen, drops: [drop(), drop(), drop()], timing: { standard_uncertainty_s: 0.001, method: 'video' }, uncertainty: { height_m: 0.01 }, options: { monte_carlo_draws: 200 } };
    };
    const codes = (r: ReturnType<typeof analyzeSeries>) => r.warnings.map((w) => w.code);
    const sphere = analyzeSeries(marksOf({ shape: 'sphere', mass_kg: 2, diameter_m: 0.25 }, 0.3));
    expect(sphere.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(codes(sphere)).toContain('near-drag-crisis');
    const box = analyzeSeries(marksOf({ shape: 'box', mass_kg: 3, length_m: 0.25, width_m: 0.25, thickness_m: 0.05 }, 1.05));
    expect(box.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(codes(box)).not.toContain('near-drag-crisis');
    const custom = analyzeSeries(marksOf({ shape: 'custom', mass_kg: 2, area_m2: 0.049, volume_m3: 0.008 }, 0.3));
    expect(custom.drops[0]!.reynolds_number).toBeGreaterThan(2e5);
    expect(codes(custom)).not.toContain('near-drag-crisis');
  });
});
