import { describe, expect, it } from 'vitest';
import { analyzeSeriesRecords, dropOfResult, seriesDropRows, singleDropDragCoefficient } from '../../src/analysis';
import { analyzeSeries } from '../../src/physics';
import { createRandom } from '../../src/physics/createRandom';
import { particleRequest } from '../physics/particleSeries';
import { measuredSeries } from '../physics/syntheticSeries';
import { excludedCopy, revise, testDay, DEVICE } from './day-records';

const DRAWS = { monteCarloDraws: 200 };

function analysed(timingOffset: 'fit' | 'none') {
  const day = testDay({ timingOffset });
  const copy = excludedCopy(day.drops[2]!, 7, '00000000-0000-4000-8000-000000000007');
  const drops = [...day.drops, copy];
  const outcome = analyzeSeriesRecords(day.site, [day.reading], day.specimen, day.series, drops, DRAWS);
  if (outcome.kind !== 'ready') throw new Error(`not ready: ${JSON.stringify(outcome)}`);
  return { day, copy, drops, outcome };
}

describe('the drop table rows', () => {
  it('give an excluded drop the same own C_d as an included drop with the same height and time, with a fitted timing offset', () => {
    const { day, copy, drops, outcome } = analysed('fit');
    // The series is built with a 40 ms timer delay: the fit must see one, or this test proves nothing.
    expect(outcome.result.timing_offset_s).toBeGreaterThan(0.03);
    const rows = seriesDropRows(day.series, drops, outcome);
    const original = rows.find((r) => r.drop.id === day.drops[2]!.id)!;
    const excluded = rows.find((r) => r.drop.id === copy.id)!;
    expect(original.used).toBe(true);
    expect(excluded.used).toBe(false);
    expect(original.own_drag_coefficient).not.toBeNull();
    // One meaning per column: the excluded drop's time less the same fitted offset, through the same function.
    expect(excluded.own_drag_coefficient).toBe(original.own_drag_coefficient);
  });

  it('give an excluded drop the same own C_d as an included twin without an offset too', () => {
    const { day, copy, drops, outcome } = analysed('none');
    expect(outcome.result.timing_offset_s).toBeUndefined();
    const rows = seriesDropRows(day.series, drops, outcome);
    expect(rows.find((r) => r.drop.id === copy.id)!.own_drag_coefficient).toBe(rows.find((r) => r.drop.id === day.drops[2]!.id)!.own_drag_coefficient);
  });

  it('take the fitted offset off a single drop’s time', () => {
    const { day, outcome } = analysed('fit');
    const drop = day.drops[4]!;
    const offset = outcome.result.timing_offset_s!;
    const raw = singleDropDragCoefficient({ ...outcome.result, timing_offset_s: 0 }, drop.height_m!, drop.time_s).value!;
    const corrected = singleDropDragCoefficient(outcome.result, drop.height_m!, drop.time_s).value!;
    // A timer that stops late makes the raw time too long, so the raw C_d is larger than the corrected one.
    expect(offset).toBeGreaterThan(0);
    expect(raw).toBeGreaterThan(corrected);
    expect(corrected).toBeCloseTo(outcome.result.drops.find((d) => d.id === drop.id)!.drag_coefficient!, 12);
  });

  it('give a drop left out of a series under the scaled sphere curve the C_d the analysis gives a drop in it', () => {
    // A 1 mm bead (invented scenario, particleSeries.ts) from four heights with an offset fitted under the scaled law.
    const request = particleRequest({ scale: 1.1, heights: [0.3, 0.3, 1, 1, 2, 2, 3, 3], drag_law: 'scaled_sphere', random: createRandom(41) });
    const result = analyzeSeries({ ...request, timing: { ...request.timing, offset: 'fit' } });
    expect(result.drag_law).toBe('scaled_sphere');
    expect(result.timing_offset_s).toBeDefined();
    for (const drop of result.drops) {
      expect(singleDropDragCoefficient(result, drop.height_m, drop.time_s).value).toBe(drop.drag_coefficient);
    }
  });

  it('take a declared delay off a left-out drop’s time, as the analysis does for the drops in the fit', () => {
    // A ball timed with a declared 20 ± 3 ms delay, no offset fitted (syntheticSeries.ts, seeded).
    const series = measuredSeries({ cd: 0.47, heights: [8, 8, 8, 12, 12, 12], timingU: 0.004, random: createRandom(13), offset_s: 0.02 });
    const result = analyzeSeries({ ...series, timing: { standard_uncertainty_s: 0.004, offset_s: 0.02, offset_standard_uncertainty_s: 0.003 } });
    expect(result.timing_offset_s).toBeUndefined();
    for (const drop of result.drops) {
      expect(singleDropDragCoefficient(result, drop.height_m, drop.time_s).value).toBe(drop.drag_coefficient);
    }
  });

  it('join each drop to its own result by id, whatever the order and with deleted drops among them', () => {
    const { day, copy, outcome } = analysed('fit');
    const deleted = revise(day.drops[1]!, { deleted: true }, Date.UTC(2026, 6, 3, 12), DEVICE, 'deleted');
    // The same drops in another order, one of them now deleted: positions no longer match the fit's order.
    const shuffled = [copy, day.drops[5]!, day.drops[0]!, deleted, day.drops[3]!, day.drops[2]!, day.drops[4]!];
    const rows = seriesDropRows(day.series, shuffled, outcome);
    expect(rows.map((r) => r.drop.id)).toEqual(shuffled.filter((d) => !d.deleted).map((d) => d.id));
    for (const row of rows.filter((r) => r.used)) {
      const result = outcome.result.drops.find((d) => d.id === row.drop.id)!;
      expect(row.residual_s).toBe(result.residual_s);
      expect(row.own_drag_coefficient).toBe(result.drag_coefficient);
      expect(row.predicted_time_s).toBe(result.predicted_time_s);
      expect(row.height_m).toBe(result.height_m);
    }
  });

  it('carry the prediction’s own uncertainty for each drop in the fit, from its height’s entry of the result', () => {
    const { day, copy, drops, outcome } = analysed('none');
    const heights = outcome.result.prediction.heights!;
    expect(outcome.result.prediction.method).toBe('standard-sphere-drag-curve');
    const rows = seriesDropRows(day.series, drops, outcome);
    for (const row of rows.filter((r) => r.used)) {
      const entry = heights.find((h) => h.height_m === row.height_m)!;
      expect(entry.time_standard_uncertainty_s).toBeGreaterThan(0);
      expect(row.predicted_time_standard_uncertainty_s).toBe(entry.time_standard_uncertainty_s);
    }
    expect(rows.find((r) => r.drop.id === copy.id)!.predicted_time_standard_uncertainty_s).toBeNull();
    // With a reference C_d (0.47, a smooth sphere's usual value, common practice) the prediction carries no curve
    // uncertainty, and the rows say none.
    const withReference = { ...day.specimen, reference_drag_coefficient: 0.47 };
    const referenced = analyzeSeriesRecords(day.site, [day.reading], withReference, day.series, drops, DRAWS);
    if (referenced.kind !== 'ready') throw new Error('not ready');
    expect(referenced.result.prediction.method).toBe('reference-drag-coefficient');
    const plain = seriesDropRows(day.series, drops, referenced).filter((r) => r.used);
    expect(plain.every((r) => r.predicted_time_s !== null && r.predicted_time_standard_uncertainty_s === null)).toBe(true);
  });

  it('name the drop record behind a result index by its id', () => {
    const { day, outcome } = analysed('fit');
    expect(dropOfResult(outcome.result, 3, [...day.drops].reverse())).toBe(day.drops[3]);
    expect(dropOfResult(outcome.result, 99, day.drops)).toBeUndefined();
  });

  it('leave every number blank when the series cannot be computed', () => {
    const day = testDay();
    const outcome = analyzeSeriesRecords(day.site, [], day.specimen, day.series, day.drops, DRAWS);
    const rows = seriesDropRows(day.series, day.drops, outcome);
    expect(rows).toHaveLength(day.drops.length);
    expect(rows.every((r) => r.own_drag_coefficient === null && r.residual_s === null && !r.used)).toBe(true);
  });
});
