import { useMemo } from 'preact/hooks';
import { useApp } from '../../app-context';
import { useStoreData } from '../../hooks';
import { Notice } from '../../forms';
import { routeHref } from '../../router';
import { analyzeDay, seriesVerdict } from '../../../analysis';
import { flagText, TONE_OF, verdictLine } from './series/verdict-text';
import { DayHeader } from './DayOverview';
import { RiskWarnings } from '../../RiskWarnings';
import { describeError } from '../../errors';
import { inChosenUnits, warningText } from '../../unit-text';

/** The end of the day: every series' result, what is unresolved or flagged, and the way to the office. */
export function DaySummary({ dayId }: { dayId: string }) {
  const app = useApp();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  const rows = useMemo(() => (data.state === 'ready' ? analyzeDay(data.value).map((row) => ({ ...row, verdict: seriesVerdict(row.outcome, row.series, row.drops) })) : []), [data]);
  if (data.state === 'loading') return <p>Loading…</p>;
  if (data.state === 'failed') return <Notice tone="bad">{describeError(data.error)}</Notice>;
  // The same verdict as the series screen; a series is listed below when it is not met or carries any warning or problem.
  const flagged = rows.filter((r) => r.verdict.verdict.state !== 'met' || r.verdict.flags.some((f) => f.kind !== 'info'));
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
        {rows.map(({ series: s, specimen, outcome, verdict }) => {
          const r = outcome.kind === 'ready' ? outcome.result : null;
          return (
            <li key={s.id}>
              <a class="row row-link" href={routeHref('day', dayId, 'series', s.id)}>
                <span class="row-main">
                  <strong>{specimen?.name ?? 'unknown specimen'}</strong>
                  <br />
                  <span class="hint">
                    {app.format(s.height_m, 'length', 1)} · {plural(verdict.drops_used, 'drop')} used · <span data-testid="summary-verdict">{verdictLine(verdict)}</span>
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
            {flagged.map(({ series: s, specimen, verdict }) => (
              <li key={s.id}>
                <strong>
                  {specimen?.name ?? 'unknown'} from {app.format(s.height_m, 'length', 1)}:
                </strong>{' '}
                {verdict.verdict.state === 'blocked' ? inChosenUnits(verdict.verdict.message, app.format) : verdictLine(verdict)}
                {verdict.flags.length ? (
                  <ul class="flag-list">
                    {verdict.flags.map((f, i) => (
                      <li key={i} class={`flag-${TONE_OF[f.kind]}`}>
                        {f.kind === 'info' ? 'Note: ' : f.kind === 'problem' ? 'Problem: ' : 'Warning: '}
                        {flagText(f, app.format)}
                      </li>
                    ))}
                  </ul>
                ) : null}
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
