// The rows of a series' drop table: each drop record beside its result, joined by the drop's id.
import { fallBodyOf, ownDragCoefficient, ownScaledSphereDragCoefficient, sphereScaleBodyOf, type AnalysisResult } from '../physics';
import type { DropRecord, SeriesRecord } from '../log';
import type { SeriesOutcome } from './series-analysis';
import { dropHeight } from './series-request';

export interface DropRow {
  drop: DropRecord;
  height_m: number;
  /** Whether the drop is in the series fit (its result is the fit's). */
  used: boolean;
  /** The drop's own C_d, excluded drops too; null when not computable (see ownMessage). */
  own_drag_coefficient: number | null;
  /** Why there is no own C_d, when a computation refused the drop. */
  ownMessage: string | null;
  predicted_time_s: number | null;
  /** The predicted time's standard uncertainty from the standard sphere curve's own (null without one). */
  predicted_time_standard_uncertainty_s: number | null;
  residual_s: number | null;
}

/**
 * The standard uncertainty of the time predicted for a drop from `height_m`: the standard sphere curve's own
 * uncertainty of C_d carried to the time (result.prediction.heights); null when the prediction has none (a
 * reference C_d, or no prediction).
 */
export function predictedTimeUncertainty(result: AnalysisResult, height_m: number): number | null {
  return result.prediction.heights?.find((h) => h.height_m === height_m)?.time_standard_uncertainty_s ?? null;
}

/**
 * One drop's own C_d on the series' body and air, for drops the fit leaves out: the same function the analysis
 * uses for the drops in the fit, in the series' drag law, with the same delay taken off the time (the fitted
 * offset, or else the declared delay) and, under a constant C_d, the same correction for the air along the fall.
 */
export function singleDropDragCoefficient(result: AnalysisResult, height_m: number, time_s: number): { value: number | null; message: string | null } {
  const offset = result.timing_offset_s ?? result.declared_timing_offset?.offset_s ?? 0;
  try {
    if (result.drag_law === 'scaled_sphere' && result.drag_law_details.scale_factor !== null) {
      return { value: ownScaledSphereDragCoefficient(sphereScaleBodyOf(result), height_m, time_s, offset, result.drag_law_details.scale_factor), message: null };
    }
    const value = ownDragCoefficient(fallBodyOf(result), height_m, time_s, offset);
    return { value: value === null ? null : value * (result.air_column?.correction_ratio ?? 1), message: null };
  } catch (error) {
    return { value: null, message: error instanceof Error ? error.message : String(error) };
  }
}

/** Every live drop of the series (in the order given) with its numbers from the outcome. */
export function seriesDropRows(series: SeriesRecord, drops: readonly DropRecord[], outcome: SeriesOutcome): DropRow[] {
  const ready = outcome.kind === 'ready' ? outcome : null;
  const results = new Map((ready?.result.drops ?? []).map((r) => [r.id, r]));
  return drops
    .filter((d) => !d.deleted)
    .map((drop) => {
      const height_m = dropHeight(drop, series);
      const none = { drop, height_m, used: false, own_drag_coefficient: null, ownMessage: null, predicted_time_s: null, predicted_time_standard_uncertainty_s: null, residual_s: null };
      if (!ready) return none;
      const r = results.get(drop.id);
      if (r) {
        return {
          drop,
          height_m,
          used: true,
          own_drag_coefficient: r.drag_coefficient,
          ownMessage: null,
          predicted_time_s: r.predicted_time_s,
          predicted_time_standard_uncertainty_s: r.predicted_time_s === null ? null : predictedTimeUncertainty(ready.result, r.height_m),
          residual_s: r.residual_s,
        };
      }
      const own = singleDropDragCoefficient(ready.result, height_m, drop.time_s);
      return { ...none, own_drag_coefficient: own.value, ownMessage: own.message };
    });
}

/** The drop record behind a result drop index (e.g. Grubbs' suspect), by id. */
export function dropOfResult(result: AnalysisResult, index: number, drops: readonly DropRecord[]): DropRecord | undefined {
  const id = result.drops[index]?.id;
  return id === undefined ? undefined : drops.find((d) => d.id === id);
}
