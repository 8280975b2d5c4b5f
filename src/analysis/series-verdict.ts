/**
 * A series' verdict, read the same way by the series screen, the day's list and the end-of-day summary: whether
 * its C_d is good enough yet, and every flag behind it, sorted into three kinds of message.
 *
 * No verdict before MIN_DROPS_FOR_VERDICT drops are in the fit. The uncertainty of a series rests on the scatter
 * of its drops, and a standard deviation from n readings is itself uncertain by about 1/√(2(n − 1)) (GUM,
 * JCGM 100:2008, Table E.1: 76 % from 2 readings, 52 % from 3, 36 % from 5): from two drops "the target is met"
 * says more about luck than about the specimen. From five drops the scatter is known to about a third, which is
 * the least a crew should act on (common practice).
 */
import { analyzeSeries, prepareSeries, type PhysicsWarning } from '../physics';
import type { DropRecord, SeriesRecord } from '../log';
import { relativeUncertainty, type SeriesOutcome, type SetAsideDrop } from './series-analysis';
import { dropOfResult } from './drop-rows';
import { usedDrops } from './series-request';

/** Drops in the fit before a series gets a verdict (see above). */
export const MIN_DROPS_FOR_VERDICT = 5;

/**
 * The three kinds of message, each with its own look everywhere: a problem blocks the result; a warning may change
 * whether the result can be trusted; an information note changes nothing about the verdict.
 */
export type MessageKind = 'problem' | 'warning' | 'info';

export type SeriesFlag =
  | { kind: MessageKind; code: 'set-aside'; setAside: SetAsideDrop }
  | { kind: MessageKind; code: 'possible-outlier'; seq: number | null; time_s: number | null; height_m: number; statistic: number; critical_value: number }
  | { kind: MessageKind; code: 'physics'; warning: PhysicsWarning };

export type VerdictState =
  /** Nothing to judge: a part is missing or the computation refused the series (the message says which). */
  | { state: 'blocked'; message: string }
  /** Fewer drops in the fit than MIN_DROPS_FOR_VERDICT. */
  | { state: 'too-few'; drops_used: number; drops_needed: number }
  | { state: 'met'; relative_uncertainty: number; target: number }
  | { state: 'not-met'; relative_uncertainty: number; target: number }
  /** Drag is hidden in the timing noise: only an upper bound of C_d. */
  | { state: 'unresolved'; upper_bound_95: number | null; target: number };

export interface SeriesVerdict {
  verdict: VerdictState;
  /** Drops in the fit (live, not excluded, not set aside). */
  drops_used: number;
  /** Every flag, none left out, in a fixed order: set-aside drops, outliers, then the physics' own warnings. */
  flags: SeriesFlag[];
}

/** The verdict and every flag of a series' outcome. `drops` are the series' drop records (any order). */
export function seriesVerdict(outcome: SeriesOutcome, series: SeriesRecord, drops: readonly DropRecord[]): SeriesVerdict {
  const flags: SeriesFlag[] = (outcome.setAside ?? []).map((setAside) => ({ kind: 'warning', code: 'set-aside', setAside }));
  if (outcome.kind === 'missing') {
    const verdict: VerdictState =
      outcome.code === 'series-without-drops' ? { state: 'too-few', drops_used: 0, drops_needed: MIN_DROPS_FOR_VERDICT } : { state: 'blocked', message: outcome.message };
    return { verdict, drops_used: 0, flags };
  }
  if (outcome.kind === 'error') return { verdict: { state: 'blocked', message: outcome.message }, drops_used: 0, flags };
  const r = outcome.result;
  const used = usedDrops(drops).filter((d) => !outcome.setAside.some((s) => s.drop.id === d.id));
  for (const h of r.heights) {
    if (!h.grubbs?.outlier) continue;
    // The core numbers drops by their place in the fit; the crew knows them by their own number (joined by id).
    const drop = dropOfResult(r, h.grubbs.suspect_drop_index, used);
    flags.push({
      kind: 'warning',
      code: 'possible-outlier',
      seq: drop?.seq ?? null,
      time_s: drop?.time_s ?? null,
      height_m: h.height_m,
      statistic: h.grubbs.statistic,
      critical_value: h.grubbs.critical_value,
    });
  }
  for (const warning of r.warnings) {
    if (warning.code === 'possible-outlier') continue;
    flags.push({ kind: warning.severity === 'info' ? 'info' : 'warning', code: 'physics', warning });
  }
  const target = series.target_relative_uncertainty;
  const dropsUsed = r.drops.length;
  let verdict: VerdictState;
  if (dropsUsed < MIN_DROPS_FOR_VERDICT) verdict = { state: 'too-few', drops_used: dropsUsed, drops_needed: MIN_DROPS_FOR_VERDICT };
  else if (r.drag_coefficient === null) verdict = { state: 'unresolved', upper_bound_95: r.drag_coefficient_upper_bound_95 ?? null, target };
  else {
    const rel = relativeUncertainty(r)!;
    verdict = rel <= target ? { state: 'met', relative_uncertainty: rel, target } : { state: 'not-met', relative_uncertainty: rel, target };
  }
  return { verdict, drops_used: dropsUsed, flags };
}

/** Whether a verdict says the series is done. */
export function verdictMet(v: SeriesVerdict): boolean {
  return v.verdict.state === 'met';
}

/**
 * The C_d the same drops give when the model leaves out the air's buoyancy and added mass, so the drag term takes
 * up both: what a crew comparing with a handbook's drag-only formula would compute by hand. Null when the
 * series is not computed, drag is not resolved, or the body is too light to fall without buoyancy's help (never).
 */
export function dragCoefficientWithoutBuoyancyAndAddedMass(outcome: SeriesOutcome): number | null {
  if (outcome.kind !== 'ready' || outcome.result.drag_coefficient === null) return null;
  const model = outcome.result.model;
  if (!model.buoyancy && model.added_mass_coefficient === 0) return outcome.result.drag_coefficient;
  const options = { ...outcome.request.options, buoyancy: false, added_mass_coefficient: 0 };
  try {
    // Under the scaled sphere curve the series gives C_d at its terminal Reynolds number: the same law, the same
    // reading (only the estimate is used; the fewest Monte Carlo draws allowed keep it quick).
    if (outcome.result.drag_law === 'scaled_sphere') {
      const lumped = analyzeSeries({ ...outcome.request, options: { ...options, drag_law: 'scaled_sphere', monte_carlo_draws: LUMPED_DRAWS } });
      return lumped.drag_law === 'scaled_sphere' && lumped.drag_coefficient_estimate > 0 ? lumped.drag_coefficient_estimate : null;
    }
    const prepared = prepareSeries({ ...outcome.request, options });
    return prepared.fit.estimate > 0 ? prepared.fit.estimate : null;
  } catch {
    return null;
  }
}

/** The Monte Carlo draws of the analysis above, whose uncertainty is not used: the fewest a request may ask for. */
const LUMPED_DRAWS = 200;
