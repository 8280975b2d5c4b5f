/**
 * Every series of a log computed once, for the office: the figures the CSV tables carry (the same computation as
 * the phone's tables, analysis/series-computer.ts) and a summary line per series: its C_d with the 95 % interval,
 * the verdict and the flags.
 *
 * The verdict, in the office's words:
 *   enough      C_d resolved, its relative standard uncertainty within the series' own target
 *   short       C_d resolved, but not yet as precise as the series' target (more drops, or a longer fall)
 *   unresolved  the drag delay is below what the timing can see: only an upper bound on C_d
 *   incomplete  a part the analysis needs is missing (no site, specimen, reading or included drop)
 *   refused     the physics refused a value (the flag names the field)
 * The flags are the physics' warnings by code ("info:" in front of a routine note).
 */
import { PlummetError } from '../errors';
import { relativeUncertainty, seriesRequest, seriesResultOf, SeriesIncomplete } from '../analysis';
import type { ComputeSeries, LogRecord, SeriesInput, SeriesResult } from '../log';
import { seriesInputs } from '../log';
import { analyzeSeries, validateAnalysisRequest } from '../physics';

export type Verdict = 'enough' | 'short' | 'unresolved' | 'incomplete' | 'refused';

export interface SeriesSummary {
  series_id: string;
  day_date: string | null;
  site_name: string | null;
  specimen_name: string | null;
  started_at: string;
  drops_total: number;
  drops_used: number;
  drag_coefficient: number | null;
  u_drag_coefficient: number | null;
  drag_coefficient_95_low: number | null;
  drag_coefficient_95_high: number | null;
  /** When C_d is not resolved: the 95 % upper bound. */
  drag_coefficient_upper_bound_95: number | null;
  relative_uncertainty: number | null;
  target_relative_uncertainty: number;
  verdict: Verdict;
  flags: string[];
  /** Why the series has no figures (verdict incomplete or refused). */
  problem: { code: string; field: string | null; value: unknown; allowed: string | null; message: string } | null;
}

export interface SummarizedSeries {
  summary: SeriesSummary;
  result: SeriesResult;
}

export interface ComputedSeries {
  summaries: SeriesSummary[];
  /** The CSV tables' computation, answering from what was computed here (each series computed once). */
  compute: ComputeSeries;
}

/** Computes every live series of the records in this thread; `onStep` is called after each (for a progress line). */
export function computeSeries(records: readonly LogRecord[], onStep?: (done: number, total: number) => void): ComputedSeries {
  const inputs = seriesInputs(records);
  return computedFrom(
    inputs,
    inputs.map((input, i) => {
      const done = summarize(input);
      onStep?.(i + 1, inputs.length);
      return done;
    }),
  );
}

/** The summaries in the inputs' order, and the tables' computation answering from them. */
export function computedFrom(inputs: readonly SeriesInput[], done: readonly SummarizedSeries[]): ComputedSeries {
  const results = new Map<string, SeriesResult>();
  inputs.forEach((input, i) => results.set(input.series.id, done[i]!.result));
  const compute: ComputeSeries = (input) => results.get(input.series.id) ?? summarize(input).result;
  return { summaries: done.map((d) => d.summary), compute };
}

/** One series computed: its summary and the CSV tables' values. Pure function of the input (the worker pool's unit). */
export function summarize(input: SeriesInput & { allDrops?: readonly unknown[] }): SummarizedSeries {
  const base = {
    series_id: input.series.id,
    day_date: input.day?.date ?? null,
    site_name: input.site?.name ?? null,
    specimen_name: input.specimen?.name ?? null,
    started_at: input.series.started_at,
    drops_total: input.allDrops?.length ?? input.drops.length,
    drops_used: input.drops.length,
    target_relative_uncertainty: input.series.target_relative_uncertainty,
  };
  const none = { drag_coefficient: null, u_drag_coefficient: null, drag_coefficient_95_low: null, drag_coefficient_95_high: null, drag_coefficient_upper_bound_95: null, relative_uncertainty: null };
  try {
    const analysis = analyzeSeries(validateAnalysisRequest(seriesRequest(input)));
    const cd = analysis.drag_coefficient;
    const rel = relativeUncertainty(analysis);
    const verdict: Verdict = cd === null ? 'unresolved' : rel !== null && rel <= input.series.target_relative_uncertainty ? 'enough' : 'short';
    const summary: SeriesSummary = {
      ...base,
      drag_coefficient: cd,
      u_drag_coefficient: cd === null ? null : analysis.drag_coefficient_standard_uncertainty,
      drag_coefficient_95_low: analysis.drag_coefficient_interval_95[0],
      drag_coefficient_95_high: analysis.drag_coefficient_interval_95[1],
      drag_coefficient_upper_bound_95: cd === null ? (analysis.drag_coefficient_upper_bound_95 ?? null) : null,
      relative_uncertainty: rel,
      verdict,
      flags: analysis.warnings.map((w) => (w.severity === 'info' ? `info:${w.code}` : w.code)),
      problem: null,
    };
    return { summary, result: seriesResultOf(analysis) };
  } catch (error) {
    // As the phone's CSV tables do (src/cli/log-to-csv.ts): one series that cannot be computed never stops the rest.
    const problem =
      error instanceof PlummetError
        ? { code: error.code, field: error.field, value: error.value, allowed: error.allowed, message: error.message }
        : { code: 'compute-failed', field: null, value: null, allowed: null, message: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
    const verdict: Verdict = error instanceof SeriesIncomplete ? 'incomplete' : 'refused';
    return {
      summary: { ...base, ...none, verdict, flags: [problem.code], problem },
      result: { error: { code: problem.code, message: problem.message } },
    };
  }
}

const fixed = (x: number | null, digits = 3) => (x === null ? '-' : x.toFixed(digits));

/** The summary for people: one block per series, in day and start order. */
export function summaryText(summaries: readonly SeriesSummary[]): string {
  if (summaries.length === 0) return 'no series in these logs\n';
  const lines: string[] = [];
  for (const s of summaries) {
    const where = [s.day_date ?? 'no day', s.site_name ?? 'no site', s.specimen_name ?? 'no specimen'].join(' · ');
    lines.push(`${where} · series ${s.series_id.slice(0, 8)} (started ${s.started_at})`);
    let figure: string;
    if (s.drag_coefficient !== null) {
      const pct = s.relative_uncertainty === null ? '' : `, u ${(100 * s.relative_uncertainty).toFixed(1)} % of target ${(100 * s.target_relative_uncertainty).toFixed(1)} %`;
      figure = `C_d ${fixed(s.drag_coefficient)} ± ${fixed(s.u_drag_coefficient)} (95 %: ${fixed(s.drag_coefficient_95_low)} to ${fixed(s.drag_coefficient_95_high)}${pct})`;
    } else if (s.drag_coefficient_upper_bound_95 !== null) figure = `C_d not resolved: below ${fixed(s.drag_coefficient_upper_bound_95)} (95 %)`;
    else figure = `no figures: ${s.problem?.message ?? 'not computed'}`;
    lines.push(`  ${s.verdict.padEnd(10)} drops ${s.drops_used}/${s.drops_total} used  ${figure}`);
    if (s.flags.length > 0) lines.push(`  flags: ${s.flags.join(', ')}`);
  }
  const count = (v: Verdict) => summaries.filter((s) => s.verdict === v).length;
  const tally = (['enough', 'short', 'unresolved', 'incomplete', 'refused'] as const).map((v) => `${count(v)} ${v}`).join(', ');
  lines.push(`${summaries.length} series: ${tally}`);
  return `${lines.join('\n')}\n`;
}
