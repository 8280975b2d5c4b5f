import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { analyzeDay } from '../../analysis';
import { inputRange, LIMITS } from '../../log';
import { RecordActions, RestoreRow } from '../record-edit';
import { useApp } from '../app-context';
import { useStoreData } from '../hooks';
import { routeHref } from '../router';
import { RiskWarnings } from '../RiskWarnings';

/** Every day in the log, newest first, searchable by site and specimen, with each day's results at a glance. */
export function LogScreen() {
  const app = useApp();
  const [query, setQuery] = useState('');
  const data = useStoreData(async () => {
    const [days, series, specimens, everyDay] = await Promise.all([
      app.store.listDays(),
      app.store.list('series'),
      app.store.list('specimen'),
      app.store.list('day', { includeDeleted: true }),
    ]);
    return { days, series, specimens, removedDays: everyDay.length - days.length };
  }, []);
  const rows = useMemo(() => {
    if (data.state !== 'ready') return [];
    const { days, series, specimens } = data.value;
    const names = new Map(specimens.map((s) => [s.id, s.name]));
    const q = query.trim().toLowerCase();
    return days
      .map((d) => {
        const dayNames = [...new Set(series.filter((s) => s.day_id === d.id).map((s) => names.get(s.specimen_id) ?? 'unknown'))];
        return { d, dayNames };
      })
      .filter(({ d, dayNames }) => !q || (d.site_name ?? '').toLowerCase().includes(q) || dayNames.some((n) => n.toLowerCase().includes(q)) || d.date.includes(q));
  }, [data, query]);
  return (
    <div>
      <RiskWarnings />
      <div class="field">
        <label for="log-search">Search by site, specimen or date</label>
        <input id="log-search" type="search" value={query} onInput={(e) => setQuery((e.target as HTMLInputElement).value)} />
      </div>
      {data.state === 'ready' && data.value.days.length === 0 && data.value.removedDays > 0 ? (
        <p>
          No day is left in the log: {data.value.removedDays === 1 ? 'the one day was' : `all ${data.value.removedDays} days were`} removed, and can be
          restored under Removed days below. Or <a href={routeHref('day', 'new')}>start a test day</a>.
        </p>
      ) : null}
      {data.state === 'ready' && data.value.days.length === 0 && data.value.removedDays === 0 ? (
        <p>
          The log is empty. <a href={routeHref('day', 'new')}>Start a test day</a>, or load the sample log in <a href={routeHref('settings')}>Settings</a>.
        </p>
      ) : null}
      <ul class="rows">
        {rows.map(({ d, dayNames }) => (
          <li key={d.id}>
            <a class="row row-link" href={routeHref('day', d.id)}>
              <span class="row-main">
                <strong>{d.date}</strong> · {d.site_name ?? 'site missing'}
                <br />
                <span class="hint">{dayNames.length ? dayNames.join(', ') : 'no series yet'}</span>
                {d.series_count ? <DayGlance dayId={d.id} /> : null}
              </span>
              <span class="row-side">
                {d.series_count} series
                <br />
                {d.drop_count} drops
              </span>
            </a>
          </li>
        ))}
      </ul>
      {data.state === 'ready' && rows.length === 0 && data.value.days.length > 0 ? <p>No day matches “{query}”.</p> : null}
      <RemovedDays />
      <Sites />
    </div>
  );
}

/**
 * The sites of the log, each correctable and removable (a site that a live day still uses is refused by name:
 * remove or move those days first), and the removed ones with the way back.
 */
function Sites() {
  const app = useApp();
  const sites = useStoreData(async () => {
    const [all, days] = await Promise.all([app.store.list('site', { includeDeleted: true }), app.store.list('day')]);
    return all.map((site) => ({ site, days: days.filter((d) => d.site_id === site.id).length }));
  }, []);
  if (sites.state !== 'ready' || sites.value.length === 0) return null;
  const live = sites.value.filter(({ site }) => !site.deleted);
  const removed = sites.value.filter(({ site }) => site.deleted);
  return (
    <section aria-labelledby="sites-h">
      <h2 id="sites-h">Sites</h2>
      <ul class="rows">
        {live.map(({ site, days }) => (
          <li key={site.id}>
            <details class="row-details">
              <summary class="row" aria-label={`Site ${site.name}: correct, history or remove`}>
                <span class="row-main">{site.name}</span>
                <span class="row-side">{days === 1 ? '1 day' : `${days} days`}</span>
              </summary>
              <RecordActions
                key={site.rev}
                record={site}
                label={`the site ${site.name}`}
                consequence={days > 0 ? 'It is still the site of some days: remove or move them first. ' : undefined}
                fields={[
                  { name: 'name', label: 'Site name', type: 'text' },
                  { name: 'latitude_deg', label: 'Latitude', type: 'quantity', kind: 'angle', ...inputRange(LIMITS.latitude_deg) },
                  { name: 'longitude_deg', label: 'Longitude', type: 'quantity', kind: 'angle', ...inputRange(LIMITS.longitude_deg) },
                  { name: 'elevation_m', label: 'Elevation', type: 'quantity', kind: 'length', ...inputRange(LIMITS.elevation_m) },
                  { name: 'notes', label: 'Notes', type: 'text' },
                ]}
              />
            </details>
          </li>
        ))}
        {removed.map(({ site }) => (
          <RestoreRow key={site.id} record={site} label={`site ${site.name}`} detail="removed" />
        ))}
      </ul>
    </section>
  );
}

/** Days removed from the log, each with the way back (its readings, series and drops come back with it). */
function RemovedDays() {
  const app = useApp();
  const removed = useStoreData(async () => {
    const [days, sites] = await Promise.all([app.store.list('day', { includeDeleted: true }), app.store.list('site', { includeDeleted: true })]);
    return days.filter((d) => d.deleted).map((d) => ({ d, site: sites.find((s) => s.id === d.site_id)?.name ?? 'site missing' }));
  }, []);
  if (removed.state !== 'ready' || removed.value.length === 0) return null;
  return (
    <section aria-labelledby="removed-days-h">
      <h2 id="removed-days-h">Removed days</h2>
      <ul class="rows">
        {removed.value.map(({ d, site }) => (
          <RestoreRow key={d.id} record={d} label={`day ${d.date}`} detail={site} />
        ))}
      </ul>
    </section>
  );
}

/**
 * One day's drag coefficients, computed when the row scrolls into view (a log of thousands of days opens at
 * once; the few rows on screen are worked out as they appear). The fit is exact; the Monte Carlo interval,
 * not shown here, uses few draws.
 */
function DayGlance({ dayId }: { dayId: string }) {
  const app = useApp();
  const ref = useRef<HTMLSpanElement>(null);
  const [text, setText] = useState<string | null>(null);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    let live = true;
    const run = async () => {
      const v = await app.store.loadDay(dayId);
      const parts = analyzeDay(v, { monteCarloDraws: 200 }).map(({ specimen, outcome: out, targetMet }) => {
        const name = specimen?.name.replace(/\s*\(sample\)$/, '') ?? 'unknown';
        const target = targetMet ? 'target met' : 'target not met';
        return out.kind === 'ready' && out.result.drag_coefficient !== null ? `${name}: C_d ${out.result.drag_coefficient.toFixed(3)}, ${target}` : `${name}: —, ${target}`;
      });
      if (live) setText(parts.join(' · '));
    };
    const io = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) {
        io.disconnect();
        void run().catch(() => live && setText(null));
      }
    });
    io.observe(el);
    return () => {
      live = false;
      io.disconnect();
    };
  }, [dayId, app.changes]);
  return (
    <span ref={ref} class="glance">
      {text ? (
        <>
          <br />
          {text}
        </>
      ) : null}
    </span>
  );
}
