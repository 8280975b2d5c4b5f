import { useMemo } from 'preact/hooks';
import { useApp } from '../../app-context';
import { useStoreData } from '../../hooks';
import { Notice } from '../../forms';
import { routeHref } from '../../router';
import { analyzeDay } from '../../../analysis';
import { DayHeader } from './DayOverview';
import { RiskWarnings } from '../../RiskWarnings';
import { describeError } from '../../errors';
import { inChosenUnits, warningText } from '../../unit-text';

/** The end of the day: every series' result, what is unresolved or flagged, and the way to the office. */
export function DaySummary({ dayId }: { dayId: string }) {
  const app = useApp();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  const rows = useMemo(() => (data.state === 'ready' ? analyzeDay(data.value) : []), [data]);
  if (data.state === 'loading') return <p>Loading…</p>;
  if (data.state === 'failed') return <Notice tone="bad">{describeError(data.error)}</Notice>;
  const flagged = rows.filter((r) => !r.targetMet || (r.outcome.kind === 'ready' && r.outcome.result.warnings.length > 0));
  return (
    <div>
      <a class="back" href={routeHref('day', dayId)}>
        ← Back to the day
      </a>
      <h2>End of the day</h2>
      <DayHeader view={data.value} />
      <p>
        {plural(data.value.readings.length, 'air reading')} · {rows.length} series · {plural(data.value.drops.length, 'drop')}
      </p>
      <ul class="rows">
        {rows.map(({ series: s, specimen, drops, outcome, targetMet: met }) => {
          const r = outcome.kind === 'ready' ? outcome.result : null;
          return (
            <li key={s.id}>
              <a class="row row-link" href={routeHref('day', dayId, 'series', s.id)}>
                <span class="row-main">
                  <strong>{specimen?.name ?? 'unknown specimen'}</strong>
                  <br />
                  <span class="hint">
                    {app.format(s.height_m, 'length', 1)} · {drops.filter((d) => !d.excluded).length} drops · target {(s.target_relative_uncertainty * 100).toFixed(0)} %{' '}
                    {met ? 'met' : 'not met'}
                  </span>
                </span>
                <span class="row-side">
                  {r?.drag_coefficient != null
                    ? `C_d ${r.drag_coefficient.toFixed(3)} ± ${(2 * r.drag_coefficient_standard_uncertainty).toFixed(3)}`
                    : r
                      ? `C_d < ${r.drag_coefficient_upper_bound_95?.toFixed(3)}`
                      : '—'}
                </span>
              </a>
            </li>
          );
        })}
      </ul>
      {flagged.length ? (
        <Notice tone="warn" title="Look at these before you leave">
          <ul>
            {flagged.map(({ series: s, specimen, outcome }) => (
              <li key={s.id}>
                {specimen?.name ?? 'unknown'} from {app.format(s.height_m, 'length', 1)}:{' '}
                {outcome.kind !== 'ready'
                  ? inChosenUnits(outcome.message, app.format)
                  : outcome.result.drag_coefficient === null
                    ? 'drag not resolved'
                    : [...outcome.result.warnings.map((w) => warningText(w, app.format, { temperature_C: outcome.reading.temperature_C, station_pressure_Pa: outcome.result.air.station_pressure_Pa })), 'target uncertainty not met'].slice(0, 2).join(' ')}
              </li>
            ))}
          </ul>
        </Notice>
      ) : rows.length ? (
        <Notice tone="good">Every series met its target and nothing is flagged.</Notice>
      ) : null}
      <RiskWarnings />
      <a class="btn btn-quiet btn-block" href={routeHref('day', dayId, 'report')}>
        Printable day report
      </a>
      <a class="btn btn-block" href={routeHref('send')}>
        Send the log to the office
      </a>
    </div>
  );
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}
