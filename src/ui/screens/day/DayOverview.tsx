import { useMemo, useState } from 'preact/hooks';
import type { DayView } from '../../../store';
import { useApp } from '../../app-context';
import { useStoreData } from '../../use-store-data';
import { Notice } from '../../Notice';
import { routeHref } from '../../router';
import { describeError } from '../../errors';
import { lazyModule, lazyScreen } from '../../lazy';

// The overview shows the day at once; the physics behind its figures, and the forms it opens on a tap, load apart.
const useDayFigures = lazyModule(() => import('./day-figures'));
const ReadingForm = lazyScreen(() => import('./ReadingForm').then((m) => m.ReadingForm));
const SeriesForm = lazyScreen(() => import('./SeriesForm').then((m) => m.SeriesForm));
const SafetyCaution = lazyScreen(() => import('../../SafetyCaution').then((m) => m.SafetyCaution));

export function DayOverview({ dayId }: { dayId: string }) {
  const app = useApp();
  const data = useStoreData(async () => ({ view: await app.store.loadDay(dayId), specimens: await app.store.list('specimen') }), [dayId]);
  const [adding, setAdding] = useState<'reading' | 'series' | null>(null);
  if (data.state === 'loading') return <p>Loading the day…</p>;
  if (data.state === 'failed') return <Notice tone="bad">This day could not be opened: {describeError(data.error)}</Notice>;
  const { view, specimens } = data.value;
  const cautionDone = app.settings.cautionSeenForDay === dayId || view.series.length > 0;
  return (
    <div>
      <DayHeader view={view} />
      <section aria-labelledby="readings-h">
        <h2 id="readings-h">Air readings</h2>
        {view.readings.length === 0 ? <p>No reading yet. The air density needs one.</p> : <ReadingList view={view} />}
        {adding === 'reading' ? (
          <ReadingForm dayId={dayId} site={view.site} onDone={() => setAdding(null)} />
        ) : (
          <button type="button" class="btn btn-block" onClick={() => setAdding('reading')}>
            Add an air reading
          </button>
        )}
      </section>
      <section aria-labelledby="serieslist-h">
        <h2 id="serieslist-h">Series</h2>
        {view.series.length === 0 ? <p>No series yet.</p> : <SeriesList view={view} />}
        {adding === 'series' ? (
          cautionDone ? (
            <SeriesForm dayId={dayId} specimens={specimens} readings={view.readings} onDone={() => setAdding(null)} />
          ) : (
            <SafetyCaution onAcknowledge={() => void app.updateSettings({ cautionSeenForDay: dayId })} />
          )
        ) : (
          <button type="button" class="btn btn-block" onClick={() => setAdding('series')}>
            Start a series
          </button>
        )}
      </section>
      <div class="btn-row">
        <a class="btn btn-quiet" href={routeHref('day', dayId, 'summary')}>
          End of the day
        </a>
        <a class="btn btn-quiet" href={routeHref('day', 'new')}>
          Another day
        </a>
      </div>
    </div>
  );
}

export function DayHeader({ view }: { view: DayView }) {
  const { format } = useApp();
  return (
    <header class="card day-head">
      <div class="day-date">{new Date(`${view.day.date}T12:00:00`).toLocaleDateString(undefined, { weekday: 'short', year: 'numeric', month: 'short', day: 'numeric' })}</div>
      <div class="day-site">{view.site?.name ?? 'Site record missing'}</div>
      {view.site ? (
        <div class="hint">
          {coordinate(view.site.latitude_deg, 'NS')}, {coordinate(view.site.longitude_deg, 'EW')} · elevation {format(view.site.elevation_m, 'length', 0)} ({view.site.elevation_source})
        </div>
      ) : null}
      {view.day.crew.length ? <div class="hint">Crew: {view.day.crew.join(', ')}</div> : null}
    </header>
  );
}

function ReadingList({ view }: { view: DayView }) {
  const { format } = useApp();
  const figures = useDayFigures();
  return (
    <ul class="rows">
      {view.readings.map((r) => {
        let density = '…';
        if (figures) {
          const rho = figures.readingAirDensity(r, view.site);
          density = rho === null ? 'not computable' : format(rho, 'density');
        }
        return (
          <li key={r.id} class="row">
            <span class="row-main">
              {new Date(r.taken_at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })} · {format(r.temperature_C, 'temperature')} ·{' '}
              {format(r.pressure_Pa, 'pressure')} {r.pressure_reference === 'station' ? 'on site' : 'reported, sea level'} ·{' '}
              {r.humidity.kind === 'relative' ? `${r.humidity.relative_humidity_pct} % RH` : `dew point ${format(r.humidity.dew_point_C, 'temperature')}`}
            </span>
            <span class="row-side">ρ {density}</span>
          </li>
        );
      })}
    </ul>
  );
}

function SeriesList({ view }: { view: DayView }) {
  const { format } = useApp();
  const figures = useDayFigures();
  // Only the C_d is shown here: the Monte Carlo interval needs no full draw count.
  const rows = useMemo(() => figures?.analyzeDay(view, { monteCarloDraws: 200 }) ?? null, [view, figures]);
  // The list shows at once from the day's records; each C_d fills in when the analysis has arrived.
  return (
    <ul class="rows" aria-busy={rows ? undefined : 'true'}>
      {view.series.map((s) => {
        const specimen = view.specimens.find((p) => p.id === s.specimen_id);
        const drops = view.drops.filter((d) => d.series_id === s.id);
        const row = rows?.find((r) => r.series.id === s.id);
        const outcome = row?.outcome;
        return (
          <li key={s.id}>
            <a class="row row-link" href={routeHref('day', view.day.id, 'series', s.id)}>
              <span class="row-main">
                <strong>{specimen?.name ?? 'Unknown specimen'}</strong> from {format(s.height_m, 'length', 2)} · {drops.filter((d) => !d.excluded).length} drops
                {row ? (row.targetMet ? ' · target met' : ' · target not met yet') : ''}
              </span>
              <span class="row-side">
                {!outcome
                  ? '…'
                  : outcome.kind === 'ready'
                    ? outcome.result.drag_coefficient !== null
                      ? `C_d ${outcome.result.drag_coefficient.toFixed(3)}`
                      : 'drag not resolved'
                    : '—'}
              </span>
            </a>
          </li>
        );
      })}
    </ul>
  );
}

/** A coordinate with its hemisphere letter: 46.1083° N, 8.2500° W. */
function coordinate(degrees: number, letters: 'NS' | 'EW'): string {
  return `${Math.abs(degrees).toFixed(4)}° ${degrees < 0 ? letters[1] : letters[0]}`;
}
