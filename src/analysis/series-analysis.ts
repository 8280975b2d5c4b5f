// A series' records analysed: what the screens show (the series, the day list, the summary, the log).
import { analyzeSeries, PhysicsInputError, type AnalysisRequest, type AnalysisResult } from '../physics';
import type { DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';
import { readingAloftForSeries, readingForSeries } from '../log';
import { buildRequest, seriesParts, type MissingPart } from './series-request';

export type SeriesOutcome =
  | { kind: 'missing'; code: MissingPart; message: string }
  | { kind: 'error'; message: string; field: string | null }
  | { kind: 'ready'; request: AnalysisRequest; result: AnalysisResult; reading: ReadingRecord };

export function analyzeSeriesRecords(
  site: SiteRecord | null,
  readings: readonly ReadingRecord[],
  specimen: SpecimenRecord | undefined,
  series: SeriesRecord,
  drops: readonly DropRecord[],
  options: { monteCarloDraws?: number } = {},
): SeriesOutcome {
  const parts = seriesParts({ series, site, specimen, reading: readingForSeries(series, readings), readingAloft: readingAloftForSeries(series, readings), drops });
  if (parts.kind === 'missing') return { kind: 'missing', code: parts.code, message: parts.message };
  const request = buildRequest(parts.site, parts.reading, parts.specimen, series, parts.drops, parts.readingAloft);
  if (options.monteCarloDraws !== undefined) request.options = { ...request.options, monte_carlo_draws: options.monteCarloDraws };
  try {
    return { kind: 'ready', request, result: analyzeSeries(request), reading: parts.reading };
  } catch (error) {
    if (error instanceof PhysicsInputError) return { kind: 'error', message: error.message, field: error.field };
    return { kind: 'error', message: error instanceof Error ? error.message : String(error), field: null };
  }
}

/** What a day view holds, as far as the analysis needs it (the store's DayView has it all). */
export interface DayRecords {
  site: SiteRecord | null;
  readings: ReadingRecord[];
  specimens: SpecimenRecord[];
  series: SeriesRecord[];
  drops: DropRecord[];
}

export interface SeriesOfDay {
  series: SeriesRecord;
  specimen: SpecimenRecord | undefined;
  /** The series' drops, excluded ones too, in the order they were made. */
  drops: DropRecord[];
  outcome: SeriesOutcome;
  /** u(C_d)/C_d, or null when there is no resolved C_d. */
  relativeUncertainty: number | null;
  /** Whether the series reached its target relative uncertainty. */
  targetMet: boolean;
}

/** u(C_d)/C_d of a result, or null when drag is not resolved. */
export function relativeUncertainty(result: AnalysisResult): number | null {
  return result.drag_coefficient ? result.drag_coefficient_standard_uncertainty / result.drag_coefficient : null;
}

/** A series' specimen and drops (in the order they were made) picked out of its day. */
export function seriesOfDay(day: DayRecords, series: SeriesRecord): { specimen: SpecimenRecord | undefined; drops: DropRecord[] } {
  return {
    specimen: day.specimens.find((p) => p.id === series.specimen_id),
    drops: day.drops.filter((d) => d.series_id === series.id).sort((a, b) => a.seq - b.seq),
  };
}

/** Every series of a day with its drops and its analysis. */
export function analyzeDay(day: DayRecords, options: { monteCarloDraws?: number } = {}): SeriesOfDay[] {
  return day.series.map((series) => {
    const { specimen, drops } = seriesOfDay(day, series);
    const outcome = analyzeSeriesRecords(day.site, day.readings, specimen, series, drops, options);
    const rel = outcome.kind === 'ready' ? relativeUncertainty(outcome.result) : null;
    return { series, specimen, drops, outcome, relativeUncertainty: rel, targetMet: rel !== null && rel <= series.target_relative_uncertainty };
  });
}
