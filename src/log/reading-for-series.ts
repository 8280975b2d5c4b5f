import type { ReadingRecord, SeriesRecord } from './types';

/**
 * The reading a series uses: its own when named and present, else the day's live reading nearest its start
 * (never the series' reading aloft, which describes the air at another height).
 */
export function readingForSeries(series: SeriesRecord, readings: readonly ReadingRecord[]): ReadingRecord | null {
  if (series.reading_id) {
    const own = readings.find((r) => r.id === series.reading_id && !r.deleted);
    if (own) return own;
  }
  const start = Date.parse(series.started_at);
  let best: ReadingRecord | null = null;
  let bestGap = Infinity;
  for (const r of readings) {
    if (r.day_id !== series.day_id || r.deleted || r.id === series.reading_aloft_id) continue;
    const gap = Math.abs(Date.parse(r.taken_at) - start);
    if (gap < bestGap || (gap === bestGap && best !== null && r.id < best.id)) {
      best = r;
      bestGap = gap;
    }
  }
  return best;
}

/** The series' second reading at another height (typically the release point), when named and live; else null. */
export function readingAloftForSeries(series: SeriesRecord, readings: readonly ReadingRecord[]): ReadingRecord | null {
  if (!series.reading_aloft_id) return null;
  return readings.find((r) => r.id === series.reading_aloft_id && !r.deleted) ?? null;
}

/** Which reading a series uses and why: the crew's choice, or the nearest in time (also when the chosen one is gone). */
export interface SeriesReadingChoice {
  reading: ReadingRecord | null;
  how: 'chosen' | 'nearest' | 'chosen-missing';
  /** Minutes between the reading's time and the series' start (positive: the reading is later). */
  gap_min: number | null;
}

export function seriesReadingChoice(series: SeriesRecord, readings: readonly ReadingRecord[]): SeriesReadingChoice {
  const reading = readingForSeries(series, readings);
  const gap_min = reading ? (Date.parse(reading.taken_at) - Date.parse(series.started_at)) / 60000 : null;
  if (series.reading_id === null) return { reading, how: 'nearest', gap_min };
  return { reading, how: reading?.id === series.reading_id ? 'chosen' : 'chosen-missing', gap_min };
}
