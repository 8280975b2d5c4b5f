// A stable key of everything a series' analysis reads, so a screen recomputes it only when one of those records
// changes (a new array of the same records is not a change).
import type { DropRecord, ReadingRecord, SeriesRecord, SiteRecord, SpecimenRecord } from '../log';

type Stamped = Pick<SiteRecord | SpecimenRecord | ReadingRecord | SeriesRecord | DropRecord, 'id' | 'rev'>;

function stamp(record: Stamped | null | undefined): string {
  return record ? `${record.id}@${record.rev}` : '-';
}

/** Record ids with their revision stamps (a revision changes the stamp), in a fixed order. */
export function seriesAnalysisKey(
  site: SiteRecord | null | undefined,
  readings: readonly ReadingRecord[],
  specimen: SpecimenRecord | null | undefined,
  series: SeriesRecord,
  drops: readonly DropRecord[],
  options: { monteCarloDraws?: number } = {},
): string {
  return [
    stamp(site),
    stamp(specimen),
    stamp(series),
    readings.map(stamp).join(','),
    drops.map(stamp).join(','),
    options.monteCarloDraws ?? '',
  ].join('|');
}
