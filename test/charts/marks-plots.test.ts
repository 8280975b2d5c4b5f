// The marks' chart geometry from given numbers (demo values, not measurements): every mark a point, each fitted
// drop a curve through its fitted times, residuals in milliseconds; the marks alone until a fit is given.
import { describe, expect, it } from 'vitest';
import { marksPlots } from '../../src/charts';
import type { DropRecord } from '../../src/log';
import { logWithMarks } from '../log/marks-demo';

const drops = logWithMarks().filter((r): r is DropRecord => r.kind === 'drop');

describe("a series' marks as charts", () => {
  it('is nothing for drops without marks', () => {
    expect(marksPlots(drops.map(({ marks: _m, ...d }) => d as DropRecord), [])).toBeNull();
  });

  it('draws every mark alone while the result has no fit of them', () => {
    const plots = marksPlots(drops, [])!;
    expect(plots.distanceTime.marks).toHaveLength(30);
    expect(plots.distanceTime.lines).toEqual([]);
    expect(plots.residuals).toBeNull();
    const first = drops.find((d) => d.marks)!;
    expect(plots.distanceTime.marks[0]).toEqual({ label: `drop ${first.seq}, mark 1: ${first.marks![0]!.time_s.toFixed(4)} s at 0.500 m`, x: first.marks![0]!.time_s, y: 0.5, hollow: false });
  });

  it('draws each fitted drop through its fitted times and the residuals in ms, in the chosen length unit', () => {
    const drop = drops.find((d) => d.marks)!;
    const fit = [
      { distance_m: 0.5, time_s: 0.32, fitted_time_s: 0.3195, residual_s: 0.0005 },
      { distance_m: 1, time_s: 0.453, fitted_time_s: 0.4538, residual_s: -0.0008 },
      { distance_m: 1.5, time_s: 0.556, fitted_time_s: 0.556, residual_s: 0 },
    ];
    const feet = { symbol: 'ft', fromMetres: (m: number) => m / 0.3048 };
    const plots = marksPlots(drops, [{ id: drop.id, marks: fit }], feet)!;
    expect(plots.distanceTime.lines).toEqual([{ label: `drop ${drop.seq} fitted`, points: fit.map((f) => [f.fitted_time_s, f.distance_m / 0.3048]), tone: 'brand', style: 'solid' }]);
    expect(plots.residuals!.marks.map((m) => [m.x, m.y])).toEqual(fit.map((f) => [f.distance_m / 0.3048, f.residual_s * 1000]));
    expect(plots.residuals!.marks[1]!.label).toBe(`drop ${drop.seq}, mark 2: -0.80 ms at 3.281 ft`);
    expect(plots.distanceTime.yLabel).toBe('distance fallen (ft)');
  });
});
