// A series' records analysed: what the screens show (the series, the day list, the summary, the log).
import { analyzeSeries, PhysicsInputError, type AnalysisRequest, type AnalysisResult } from '../physics';
import type { DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';
import { readingAloftForSeries, readingForSeries } from '../log';
import { buildRequest, seriesParts, type MissingPart } from './series-request';
import { siteGravity, tooFastDrop } from './vacuum-check';

/**
 * A stored drop the analysis left out because no finite drag explains its time: shorter than the vacuum fall
 * (`vacuum_time_s`), or shorter than the drag-free fall of this body by far more than the timing noise (the
 * physics' own check, `message`). Named by the crew's drop number, never by a place in a request.
 */
export interface SetAsideDrop {
  drop: DropRecord;
  /** The vacuum fall time from the drop's height, s, when that is what it beats; null for the physics' check. */
  vacuum_time_s: number | null;
  /** The physics' words when it refused the drop (drop number in place of the request's index). */
  message: string | null;
}

export type SeriesOutcome =
  | { kind: 'missing'; code: MissingPart; message: string; setAside?: SetAsideDrop[] }
  | { kind: 'error'; message: string; field: string | null; setAside?: SetAsideDrop[] }
  | { kind: 'ready'; request: AnalysisRequest; result: AnalysisResult; reading: ReadingRecord; setAside: SetAsideDrop[] };

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
  // Times no body can make are set aside first (a bad time from an import or an older record), so one bad
  // time never blocks the series: it computes from its good drops and names the bad ones.
  const g = siteGravity(parts.site);
  const setAside: SetAsideDrop[] = [];
  let good = parts.drops;
  if (g !== null) {
    good = [];
    for (const drop of parts.drops) {
      const bad = tooFastDrop(drop, series, g);
      if (bad) setAside.push({ drop, vacuum_time_s: bad.vacuum_time_s, message: null });
      else good.push(drop);
    }
  }
  // The physics also refuses a drop faster than this body's drag-free fall by far more than its noise; such a
  // drop is set aside in turn (each round fails before the Monte Carlo, so a retry costs little).
  for (;;) {
    if (good.length === 0) {
      return { kind: 'error', message: `No drop can be used: ${setAside.map((s) => `drop ${s.drop.seq}`).join(', ')} ${setAside.length === 1 ? 'is' : 'are'} faster than a free fall.`, field: null, setAside };
    }
    const request = buildRequest(parts.site, parts.reading, parts.specimen, series, good, parts.readingAloft);
    if (options.monteCarloDraws !== undefined) request.options = { ...request.options, monte_carlo_draws: options.monteCarloDraws };
    try {
      return { kind: 'ready', request, result: analyzeSeries(request), reading: parts.reading, setAside };
    } catch (error) {
      if (!(error instanceof PhysicsInputError)) return { kind: 'error', message: error instanceof Error ? error.message : String(error), field: null, setAside };
      const index = /^drops\[(\d+)\]/.exec(error.field ?? '');
      const drop = index ? good[Number(index[1])] : undefined;
      if (drop && error.code === 'faster-than-free-fall') {
        setAside.push({ drop, vacuum_time_s: null, message: crewNumbered(error.message, good) });
        good = good.filter((d) => d !== drop);
        continue;
      }
      return { kind: 'error', message: crewNumbered(error.message, good), field: error.field, setAside };
    }
  }
}

/** A physics message with each request index ("drops[2].time_s") replaced by the crew's drop number. */
function crewNumbered(message: string, drops: readonly DropRecord[]): string {
  return message.replace(/drops\[(\d+)\](\.time_s)?/g, (whole, i: string, time: string | undefined) => {
    const drop = drops[Number(i)];
    return drop ? `drop ${drop.seq}${time ? '’s time' : ''}` : whole;
  });
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
