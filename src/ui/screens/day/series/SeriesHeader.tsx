// The series' heading: the way back to its day, the specimen, the height and the timing, the air reading it uses
// (and why that one), and correcting or removing the series.
import { inputRange, LIMITS, seriesReadingChoice, type SeriesRecord, type SpecimenRecord } from '../../../../log';
import type { DayView } from '../../../../store';
import { useApp } from '../../../app-context';
import { routeHref } from '../../../router';
import { RecordActions } from '../../../record-edit';
import { useStoreData } from '../../../use-store-data';
import { TIMING_DEFAULTS } from '../SeriesForm';

const clock = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

function ReadingLine({ view, series }: { view: DayView; series: SeriesRecord }) {
  const choice = seriesReadingChoice(series, view.readings);
  if (!choice.reading) return <div class="hint">Air: no reading of this day yet.</div>;
  const gap = Math.round(Math.abs(choice.gap_min ?? 0));
  const when = gap === 0 ? 'at the start' : `${gap} min ${(choice.gap_min ?? 0) < 0 ? 'before' : 'after'} the start`;
  const why =
    choice.how === 'chosen'
      ? 'chosen by the crew'
      : choice.how === 'chosen-missing'
        ? 'the chosen reading is gone: nearest in time instead'
        : 'nearest in time';
  return (
    <div class="hint" data-testid="series-reading">
      Air: reading of {clock(choice.reading.taken_at)} ({why}, {when})
    </div>
  );
}

export function SeriesHeader({ view, series, specimen }: { view: DayView; series: SeriesRecord; specimen: SpecimenRecord | undefined }) {
  const app = useApp();
  const specimens = useStoreData(() => app.store.list('specimen'), []);
  const specimenOptions = (specimens.state === 'ready' ? specimens.value : specimen ? [specimen] : []).map((s) => ({ value: s.id, label: s.name }));
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
        <ReadingLine view={view} series={series} />
        <RecordActions
          key={series.rev}
          record={series}
          label="this series"
          consequence="Its drops are removed with it. "
          fields={[
            { name: 'specimen_id', label: 'Specimen', type: 'select', options: specimenOptions },
            { name: 'height_m', label: 'Release height', type: 'quantity', kind: 'length', ...inputRange(LIMITS.height_m) },
            { name: 'u_height_m', label: 'Release height ± (std. unc.)', type: 'quantity', kind: 'length', ...inputRange(LIMITS.u_height_m) },
            {
              name: 'reading_id',
              label: 'Air reading',
              type: 'select',
              options: [{ value: '', label: 'The nearest in time to the start' }, ...view.readings.map((r) => ({ value: r.id, label: `Reading of ${clock(r.taken_at)}` }))],
            },
            { name: 'started_at', label: 'Started at', type: 'instant' },
            { name: 'notes', label: 'Notes', type: 'text' },
          ]}
          onRemoved={() => {
            location.hash = routeHref('day', view.day.id);
          }}
        />
      </header>
    </>
  );
}
