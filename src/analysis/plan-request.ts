/**
 * The planner's requests, built from the log's records: from the Planner screen (a specimen, and the current
 * day's reading and site when there is one) and from a series' "what would it take" advice (the series' own
 * air, site, specimen, uncertainties and measured C_d). Every value the crew did not give is a named default
 * here, never a number hidden in a screen.
 */
import { planDrop, type AnalysisResult, type DropPlan, type DropPlanRequest } from '../physics';
import type { ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';
import type { SeriesOutcome } from './series-analysis';
import { airInput, siteInput, specimenInput } from './series-request';

/** What the planner assumes when the crew has not said otherwise. */
export const PLAN_DEFAULTS = {
  /**
   * Air without a reading: the ICAO standard atmosphere at sea level (ISO 2533:1975: 15 °C, 101 325 Pa), taken
   * as dry (0 % RH). No uncertainty is attached to it (the plan then warns that the air counts as exactly known).
   */
  air: { temperature_C: 15, pressure_Pa: 101_325, pressure_reference: 'station', relative_humidity_pct: 0 } as const satisfies DropPlanRequest['air'],
  /** Site without a record: 45° latitude at sea level, a middle value of normal gravity (9.806 m/s², WGS84). */
  site: { latitude_deg: 45, elevation_m: 0 } as const satisfies DropPlanRequest['site'],
  /** Standard uncertainty of a release height measured with a tape over a few metres, m (common practice). */
  u_height_m: 0.01,
  /** Most drops the crew will make at one height on the Planner screen. */
  max_drops: 30,
  /** The Planner form's starting values: release height (m), target u(C_d)/C_d (%), highest release point (m). */
  form: { height_m: 10, target_pct: 5, max_height_m: 50 },
} as const;

/** What a series' advice assumes beyond the series' own records. */
export const ADVICE_DEFAULTS = {
  /** The highest release point considered, m, unless the series is already higher. */
  max_height_m: 100,
  /** Most drops considered from one height. */
  max_drops: 50,
  /** A usual series from one height: the count the advice prefers when another height is needed (common practice). */
  usual_drops: 10,
} as const;

export interface PlanInputs {
  specimen: SpecimenRecord;
  /** The air reading to plan with; null for PLAN_DEFAULTS.air. */
  reading: ReadingRecord | null;
  /** The site to plan at; null for PLAN_DEFAULTS.site. */
  site: SiteRecord | null;
  /** A C_d measured for this specimen; null for the specimen's reference value or the standard sphere curve. */
  measuredDragCoefficient: number | null;
  u_time_s: number;
  height_m: number;
  target_relative_uncertainty: number;
  max_height_m: number;
  u_height_m?: number;
  max_drops?: number;
}

/** Where each part of a plan came from, for the screen to say. */
export interface PlanSources {
  air: 'reading' | 'default';
  site: 'site' | 'default';
  dragCoefficient: 'measured' | 'specimen';
}

export function planRequest(inputs: PlanInputs): { request: DropPlanRequest; sources: PlanSources } {
  const sp = specimenInput(inputs.specimen);
  const air = inputs.reading ? airInput(inputs.reading) : { air: { ...PLAN_DEFAULTS.air }, uncertainty: {} };
  const measured = inputs.measuredDragCoefficient !== null && inputs.measuredDragCoefficient > 0 ? inputs.measuredDragCoefficient : null;
  return {
    request: {
      site: inputs.site ? siteInput(inputs.site) : { ...PLAN_DEFAULTS.site },
      air: air.air,
      specimen: sp.input,
      timing: { standard_uncertainty_s: inputs.u_time_s },
      uncertainty: { ...sp.uncertainty, ...air.uncertainty, height_m: inputs.u_height_m ?? PLAN_DEFAULTS.u_height_m },
      ...(measured !== null ? { drag_coefficient: measured } : {}),
      height_m: Math.min(inputs.height_m, inputs.max_height_m),
      target_relative_uncertainty: inputs.target_relative_uncertainty,
      max_height_m: inputs.max_height_m,
      max_drops: inputs.max_drops ?? PLAN_DEFAULTS.max_drops,
    },
    sources: { air: inputs.reading ? 'reading' : 'default', site: inputs.site ? 'site' : 'default', dragCoefficient: measured !== null ? 'measured' : 'specimen' },
  };
}

/** The C_d a result measured, or when drag is not resolved its 95 % upper bound; null when neither is positive. */
export function measuredDragCoefficient(result: AnalysisResult): number | null {
  const cd = result.drag_coefficient ?? result.drag_coefficient_upper_bound_95 ?? null;
  return cd !== null && cd > 0 ? cd : null;
}

/** "What would it take": the plan request on the series' own air, site, specimen, uncertainties and measured C_d. */
export function seriesPlanRequest(outcome: Extract<SeriesOutcome, { kind: 'ready' }>, series: SeriesRecord): DropPlanRequest {
  const cd = measuredDragCoefficient(outcome.result);
  const request: DropPlanRequest = {
    site: outcome.request.site,
    air: outcome.request.air,
    specimen: outcome.request.specimen,
    timing: { standard_uncertainty_s: series.u_time_s },
    ...(cd !== null ? { drag_coefficient: cd } : {}),
    height_m: series.height_m,
    target_relative_uncertainty: series.target_relative_uncertainty,
    max_height_m: Math.max(ADVICE_DEFAULTS.max_height_m, series.height_m),
    max_drops: ADVICE_DEFAULTS.max_drops,
  };
  if (outcome.request.uncertainty !== undefined) request.uncertainty = outcome.request.uncertainty;
  return request;
}

/**
 * The C_d measured for a specimen on a day: the latest of its series (by start) whose drag is resolved; null when
 * none is.
 */
export function specimenDragCoefficientOfDay(
  rows: readonly { series: SeriesRecord; outcome: SeriesOutcome }[],
  specimenId: string,
): { value: number; series: SeriesRecord } | null {
  let best: { value: number; series: SeriesRecord } | null = null;
  for (const { series, outcome } of rows) {
    if (series.specimen_id !== specimenId || outcome.kind !== 'ready' || outcome.result.drag_coefficient === null) continue;
    if (!best || series.started_at > best.series.started_at) best = { value: outcome.result.drag_coefficient, series };
  }
  return best;
}

/** "What would it take" for a series that has not met its target: the planner's answer on the series' own data. */
export function seriesAdvice(outcome: Extract<SeriesOutcome, { kind: 'ready' }>, series: SeriesRecord): DropPlan['target'] {
  return planDrop(seriesPlanRequest(outcome, series)).target;
}

/** The Planner screen's plan: the request from the records and the form, planned. */
export function planFor(inputs: PlanInputs): { plan: DropPlan; sources: PlanSources } {
  const { request, sources } = planRequest(inputs);
  return { plan: planDrop(request), sources };
}

/**
 * What the crew should do next, as facts the screen words in its own units (never the planner's search limits):
 * - `more`: `more` further drops from this height reach the target (`total` in all);
 * - `scatter`: the planner says the drops made should already reach it, so the drops scatter more than the
 *   series' declared timing: the timing or an outlier needs a look, not more drops;
 * - `elsewhere`: this height and timing cannot within ADVICE_DEFAULTS.max_drops; `drops` drops from `height_m`
 *   (the fewest-drops height the planner found, rounded up to 0.1 m) can;
 * - `cannot`: no height the crew can reach does it with this timing; `floor` is what no number of drops removes
 *   (size, mass, air, height), or null when better timing would help.
 */
export type SeriesAdvice =
  | { kind: 'more'; more: number; total: number; height_m: number }
  | { kind: 'scatter'; total: number; height_m: number }
  | { kind: 'elsewhere'; drops: number; height_m: number }
  | { kind: 'cannot'; floor: number | null };

export function seriesAdviceFacts(outcome: Extract<SeriesOutcome, { kind: 'ready' }>, series: SeriesRecord, dropsUsed: number): SeriesAdvice {
  const target = seriesAdvice(outcome, series);
  if (!target) return { kind: 'cannot', floor: null };
  const here = target.drops_at_planned_height;
  if (here !== null) {
    return here > dropsUsed ? { kind: 'more', more: here - dropsUsed, total: here, height_m: series.height_m } : { kind: 'scatter', total: here, height_m: series.height_m };
  }
  // Of the counts the planner tried, the largest up to a usual series (ADVICE_DEFAULTS.usual_drops) that reaches
  // the target from some height, which asks for the lowest release among them; failing that, the fewest above it.
  // Never the search's own limit unless nothing less will do.
  const reaching = target.heights_by_drops.filter((h) => h.smallest_height_m !== null);
  const best = [...reaching].reverse().find((h) => h.drops <= ADVICE_DEFAULTS.usual_drops) ?? reaching[0];
  if (!best || best.smallest_height_m === null) {
    return { kind: 'cannot', floor: target.systematic_relative_uncertainty_at_max_height >= target.relative_uncertainty ? target.systematic_relative_uncertainty_at_max_height : null };
  }
  return { kind: 'elsewhere', drops: best.drops, height_m: Math.ceil(best.smallest_height_m * 10) / 10 };
}
