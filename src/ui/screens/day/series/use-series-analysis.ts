import { useMemo } from 'preact/hooks';
import type { DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../../../../log';
import { analyzeSeriesRecords, seriesAnalysisKey, type SeriesOutcome } from '../../../../analysis';

/**
 * A series' analysis (20 000 Monte Carlo draws), computed once per change of what it reads: the memo is keyed on
 * the records' ids and revision stamps, not on arrays a render rebuilds.
 */
export function useSeriesAnalysis(
  site: SiteRecord | null,
  readings: readonly ReadingRecord[],
  specimen: SpecimenRecord | undefined,
  series: SeriesRecord,
  drops: readonly DropRecord[],
): SeriesOutcome {
  const key = seriesAnalysisKey(site, readings, specimen, series, drops);
  // The records behind an unchanged key are the same versions, so the first render's closure stays right.
  return useMemo(() => analyzeSeriesRecords(site, readings, specimen, series, drops), [key]);
}
