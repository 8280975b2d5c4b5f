// The series' heading: the way back to its day, the specimen, the height and the timing.
import type { SeriesRecord, SpecimenRecord } from '../../../../log';
import type { DayView } from '../../../../store';
import { useApp } from '../../../app-context';
import { routeHref } from '../../../router';
import { TIMING_DEFAULTS } from '../SeriesForm';

export function SeriesHeader({ view, series, specimen }: { view: DayView; series: SeriesRecord; specimen: SpecimenRecord | undefined }) {
  const app = useApp();
  return (
    <>
      <a class="back" href={routeHref('day', view.day.id)}>
        ← {view.site?.name ?? 'Day'} · {view.day.date}
      </a>
      <header class="card">
        <h2 class="series-title">{specimen?.name ?? 'Unknown specimen'}</h2>
        <div class="hint">
          from {app.format(series.height_m, 'length', 2)} ± {app.format(series.u_height_m, 'length', 3)} · {TIMING_DEFAULTS[series.timing_method].label}, ±{' '}
          {(series.u_time_s * 1000).toFixed(1)} ms per drop · target {(series.target_relative_uncertainty * 100).toFixed(1)} %
        </div>
      </header>
    </>
  );
}
