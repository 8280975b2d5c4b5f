import { useMemo } from 'preact/hooks';
import { useApp } from '../../app-context';
import { useStoreData } from '../../hooks';
import { Notice } from '../../forms';
import { routeHref } from '../../router';
import { analyzeSeriesRecords } from '../../../analysis';
import { DayHeader } from './DayOverview';
import { RiskWarnings } from '../../RiskWarnings';
import { describeError } from '../../errors';

/** The end of the day: every series' result, what is unresolved or flagged, and the way to the office. */
export function DaySummary({ dayId }: { dayId: string }) {
  const app = useApp();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  const rows = useMemo(() => {
    if (data.state !== 'ready') return [];
    const v = data.value;
    return v.series.map((s) => {
      const specimen = v.specimens.find((p) => p.id === s.specimen_id);
      const drops = v.drops.filter((d) => d.series_id === s.id);
      return { s, specimen, drops, outcome: analyzeSeriesRecords(v.site, v.readings, specimen, s, drops) };
    });
  }, [data]);
  if (data.state === 'loading') return <p>Loading…</p>;
  if (data.state === 'failed') return <Notice tone="bad">{describeError(data.error)}</Notice>;
  const flagged = rows.filter(
    (r) =>
      r.outcome.kind !== 'ready' ||
      r.outcome.result.drag_coefficient === null ||
      r.outcome.result.warnings.length > 0 ||
      r.outcome.result.drag_coefficient_standard_uncertainty / (r.outcome.result.drag_coefficient ?? 1) > r.s.target_relative_uncertainty,
  );
  return (
    <div>
      <a class="back" href={routeHref('day', dayId)}>
        ← Back to the day
      </a>
      <h2>End of the day</h2>
      <DayHeader view={data.value} />
      <p>
        {data.value.readings.length} air readings · {rows.length} series · {data.value.drops.length} drops
      </p>
      <div class="table-wrap">
        <table class="drops">
          <thead>
            <tr>
              <th scope="col">Specimen</th>
              <th scope="col">Height</th>
              <th scope="col">Drops</th>
              <th scope="col">C_d ± U (k = 2)</th>
              <th scope="col">Target</th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ s, specimen, drops, outcome }) => {
              const r = outcome.kind === 'ready' ? outcome.result : null;
              const rel = r?.drag_coefficient ? r.drag_coefficient_standard_uncertainty / r.drag_coefficient : null;
              return (
                <tr key={s.id}>
                  <th scope="row">
                    <a href={routeHref('day', dayId, 'series', s.id)}>{specimen?.name ?? 'unknown'}</a>
                  </th>
                  <td>{app.format(s.height_m, 'length', 1)}</td>
                  <td>{drops.filter((d) => !d.excluded).length}</td>
                  <td>
                    {r?.drag_coefficient != null
                      ? `${r.drag_coefficient.toFixed(3)} ± ${(2 * r.drag_coefficient_standard_uncertainty).toFixed(3)}`
                      : r
                        ? `< ${r.drag_coefficient_upper_bound_95?.toFixed(3)}`
                        : '—'}
                  </td>
                  <td>{rel === null ? 'not met' : rel <= s.target_relative_uncertainty ? 'met' : 'not met'}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {flagged.length ? (
        <Notice tone="warn" title="Look at these before you leave">
          <ul>
            {flagged.map(({ s, specimen, outcome }) => (
              <li key={s.id}>
                {specimen?.name ?? 'unknown'} from {app.format(s.height_m, 'length', 1)}:{' '}
                {outcome.kind !== 'ready'
                  ? outcome.message
                  : outcome.result.drag_coefficient === null
                    ? 'drag not resolved'
                    : [...outcome.result.warnings.map((w) => w.message), 'target uncertainty not met'].slice(0, 2).join(' ')}
              </li>
            ))}
          </ul>
        </Notice>
      ) : rows.length ? (
        <Notice tone="good">Every series met its target and nothing is flagged.</Notice>
      ) : null}
      <RiskWarnings />
      <a class="btn btn-block" href={routeHref('send')}>
        Send the log to the office
      </a>
    </div>
  );
}
