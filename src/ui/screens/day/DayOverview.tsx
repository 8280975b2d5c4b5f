import { useMemo, useState } from 'preact/hooks';
import type { DayView } from '../../../store';
import { useApp } from '../../app-context';
import { useStoreData } from '../../use-store-data';
import { Notice } from '../../Notice';
import { verdictLine } from './series/verdict-text';
import { routeHref } from '../../router';
import { DetailsOnDemand } from '../../details-on-demand';
import { describeError } from '../../errors';
import { lazyModule, lazyScreen } from '../../lazy';
import { inputRange, LIMITS, type ReadingRecord } from '../../../log';
import type { EditField } from '../../record-edit';

// Correcting and restoring load when a panel first needs them: the day's first screen stays small.
const RecordActions = lazyScreen(() => import('../../record-edit').then((m) => m.RecordActions), null);
const RestoreRow = lazyScreen(() => import('../../record-edit').then((m) => m.RestoreRow), null);

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
      <DayTools view={view} />
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
      <RemovedInDay view={view} />
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
          <li key={r.id}>
            <DetailsOnDemand
              class="row-details"
              summary={
                <summary class="row" aria-label={`Reading of ${clock(r.taken_at)}: correct, history or remove`}>
                  <span class="row-main">
                    {clock(r.taken_at)} · {format(r.temperature_C, 'temperature')} ·{' '}
                    {format(r.pressure_Pa, 'pressure')} {r.pressure_reference === 'station' ? 'on site' : 'reported, sea level'} ·{' '}
                    {r.humidity.kind === 'relative' ? `${r.humidity.relative_humidity_pct} % RH` : `dew point ${format(r.humidity.dew_point_C, 'temperature')}`}
                  </span>
                  <span class="row-side">ρ {density}</span>
                </summary>
              }
            >
              <RecordActions key={r.rev} record={r} label={`the reading of ${clock(r.taken_at)}`} fields={readingFields(r)} />
            </DetailsOnDemand>
          </li>
        );
      })}
    </ul>
  );
}

const clock = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

function readingFields(r: ReadingRecord): EditField[] {
  const humidity: EditField[] =
    r.humidity.kind === 'relative'
      ? [{ name: 'humidity.relative_humidity_pct', label: 'Relative humidity', type: 'quantity', kind: 'percent', ...inputRange(LIMITS.relative_humidity_pct) }]
      : [{ name: 'humidity.dew_point_C', label: 'Dew point', type: 'quantity', kind: 'temperature', ...inputRange(LIMITS.dew_point_C) }];
  return [
    { name: 'taken_at', label: 'Time of the reading', type: 'instant' },
    { name: 'temperature_C', label: 'Air temperature', type: 'quantity', kind: 'temperature', ...inputRange(LIMITS.temperature_C) },
    { name: 'pressure_Pa', label: 'Pressure', type: 'quantity', kind: 'pressure', ...inputRange(r.pressure_reference === 'sea_level' ? LIMITS.sea_level_pressure_Pa : LIMITS.station_pressure_Pa) },
    ...humidity,
    { name: 'wind_speed_m_s', label: 'Wind speed (optional)', type: 'quantity', kind: 'speed', optional: true, ...inputRange(LIMITS.wind_speed_m_s) },
    { name: 'instrument', label: 'Instrument', type: 'text' },
    { name: 'notes', label: 'Notes', type: 'text' },
  ];
}

/** Correcting or removing the day itself and its site. */
function DayTools({ view }: { view: DayView }) {
  const app = useApp();
  const sites = useStoreData(() => app.store.list('site'), []);
  const siteOptions = (sites.state === 'ready' ? sites.value : view.site ? [view.site] : []).map((s) => ({ value: s.id, label: s.name }));
  return (
    <DetailsOnDemand class="card row-details" summary={<summary>Correct the day or the site</summary>}>
      <h3>The day</h3>
      <RecordActions
        key={view.day.rev}
        record={view.day}
        label="this day"
        consequence="Its readings, series and drops are removed with it. "
        fields={[
          { name: 'date', label: 'Date', type: 'date' },
          { name: 'site_id', label: 'Site', type: 'select', options: siteOptions },
          { name: 'crew', label: 'Crew (separated by commas)', type: 'list' },
          { name: 'notes', label: 'Notes', type: 'text' },
        ]}
        onRemoved={() => {
          void app.updateSettings({ currentDayId: null });
          location.hash = routeHref('log');
        }}
      />
      {view.site ? (
        <>
          <h3>The site: {view.site.name}</h3>
          <RecordActions
            key={view.site.rev}
            record={view.site}
            label="this site"
            removable={false}
            fields={[
              { name: 'name', label: 'Site name', type: 'text' },
              { name: 'latitude_deg', label: 'Latitude', type: 'quantity', kind: 'angle', ...inputRange(LIMITS.latitude_deg) },
              { name: 'longitude_deg', label: 'Longitude', type: 'quantity', kind: 'angle', ...inputRange(LIMITS.longitude_deg) },
              { name: 'elevation_m', label: 'Elevation', type: 'quantity', kind: 'length', ...inputRange(LIMITS.elevation_m) },
              { name: 'notes', label: 'Notes', type: 'text' },
            ]}
          />
        </>
      ) : null}
    </DetailsOnDemand>
  );
}

/** What was removed from this day, each with the way back. */
function RemovedInDay({ view }: { view: DayView }) {
  const app = useApp();
  const { format } = app;
  const removed = useStoreData(() => app.store.loadRemoved(view.day.id), [view.day.id]);
  const specimens = useStoreData(() => app.store.list('specimen', { includeDeleted: true }), []);
  if (removed.state !== 'ready') return null;
  const { readings, series, drops } = removed.value;
  const liveSeries = new Map(view.series.map((s) => [s.id, s]));
  const loose = drops.filter((d) => liveSeries.has(d.series_id));
  if (readings.length + series.length + loose.length === 0) return null;
  const nameOf = (id: string) => (specimens.state === 'ready' ? specimens.value.find((p) => p.id === id)?.name : undefined) ?? 'Unknown specimen';
  return (
    <section aria-labelledby="removed-h">
      <h2 id="removed-h">Removed</h2>
      <p class="hint">Kept with the reason; restore brings each back as it was.</p>
      <ul class="rows">
        {series.map((s) => (
          <RestoreRow key={s.id} record={s} label={`series ${nameOf(s.specimen_id)}`} detail={`from ${format(s.height_m, 'length', 2)}`} />
        ))}
        {readings.map((r) => (
          <RestoreRow key={r.id} record={r} label={`reading of ${clock(r.taken_at)}`} detail={format(r.temperature_C, 'temperature')} />
        ))}
        {loose.map((d) => (
          <RestoreRow key={d.id} record={d} label={`drop ${d.seq} of ${nameOf(liveSeries.get(d.series_id)!.specimen_id)}`} detail={`${d.time_s.toFixed(3)} s`} />
        ))}
      </ul>
    </section>
  );
}

function SeriesList({ view }: { view: DayView }) {
  const { format } = useApp();
  const figures = useDayFigures();
  // Only the C_d is shown here: the Monte Carlo interval needs no full draw count.
  const rows = useMemo(() => figures?.analyzeDay(view, { monteCarloDraws: 200 }) ?? null, [view, figures]);
  // The same verdict as the series screen and the summary.
  const verdicts = useMemo(
    () => (rows && figures ? new Map(rows.map((r) => [r.series.id, verdictLine(figures.seriesVerdict(r.outcome, r.series, r.drops))])) : null),
    [rows, figures],
  );
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
                {verdicts?.get(s.id) ? (
                  <span class="hint row-verdict" data-testid="row-verdict">
                    <br />
                    {verdicts.get(s.id)}
                  </span>
                ) : null}
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
