// The drop table: each drop beside its own C_d, prediction and residual (rows from src/analysis), and excluding or
// including a drop with a reason.
import { useState } from 'preact/hooks';
import type { DropRecord, SeriesRecord } from '../../../../log';
import { seriesDropRows, type SeriesOutcome } from '../../../../analysis';
import { useApp } from '../../../app-context';
import { Notice, TextField } from '../../../forms';
import { describeError } from '../../../errors';
import { formatNumber } from '../../../../widgets/units';
import { RecordActions } from '../../../record-edit';
import { useUndo } from '../../../undo';
import { inputRange, LIMITS } from '../../../../log';

export function DropTable({ drops, series, outcome }: { drops: readonly DropRecord[]; series: SeriesRecord; outcome: SeriesOutcome }) {
  const app = useApp();
  const { offerUndo } = useUndo();
  const [excluding, setExcluding] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [picked, setPicked] = useState<string | null>(null);
  const rows = seriesDropRows(series, drops, outcome).map((r) => ({
    d: r.drop,
    h: r.height_m,
    own: r.own_drag_coefficient,
    predicted: r.predicted_time_s,
    uPredicted: r.predicted_time_standard_uncertainty_s,
    residual: r.residual_s,
  }));
  if (rows.length === 0) return null;
  // The prediction's own uncertainty, once per height: the standard sphere curve is known to a few per cent only.
  const predictionSpread = new Map<number, number>();
  for (const r of rows) if (r.uPredicted !== null && !predictionSpread.has(r.h)) predictionSpread.set(r.h, r.uPredicted);
  const curvePercent = outcome.kind === 'ready' ? outcome.result.prediction.drag_coefficient_relative_standard_uncertainty : undefined;

  const toggle = async (d: DropRecord) => {
    setError(null);
    try {
      let written: DropRecord;
      if (d.excluded) {
        written = await app.store.revise('drop', d.id, { excluded: false, exclusion_reason: null }, reason.trim() || 'included again', { expectedRev: d.rev });
      } else {
        // The drop as this table showed it: refused ("changed elsewhere: reload") if another tab changed it since.
        written = await app.store.revise('drop', d.id, { excluded: true, exclusion_reason: reason.trim() }, reason.trim(), { expectedRev: d.rev });
      }
      offerUndo(d.excluded ? `Drop ${d.seq} included again` : `Drop ${d.seq} excluded`, [written]);
      setExcluding(null);
      setReason('');
      app.notifyChanged();
    } catch (e) {
      setError(describeError(e));
    }
  };

  const oneHeight = new Set(rows.map((r) => r.h)).size === 1;
  // The last column compares each drop with the prediction where there is one (a sphere), else with the series'
  // own fit; either way measured minus the other, so a drop slower than expected reads positive.
  const againstPrediction = rows.some((r) => r.predicted !== null);
  const difference = (r: (typeof rows)[number]): number | null =>
    againstPrediction ? (r.predicted !== null ? r.d.time_s - r.predicted : null) : r.residual;
  const ms = (seconds: number) => formatNumber(seconds * 1000, 1, app.settings.decimalComma);
  return (
    <section class="card" aria-labelledby="drops-h">
      <h3 id="drops-h">Predicted and measured</h3>
      {oneHeight ? <p class="hint">All drops from {app.format(rows[0]!.h, 'length', 2)}.</p> : null}
      <div class="table-wrap">
        <table class="drops">
          <thead>
            <tr>
              <th scope="col">#</th>
              {oneHeight ? null : <th scope="col">h ({app.unit('length')})</th>}
              <th scope="col">
                <abbr title="measured time">t</abbr> (s)
              </th>
              <th scope="col">
                <abbr title="predicted time">pred.</abbr> (s)
              </th>
              <th scope="col">C_d</th>
              <th scope="col">
                {againstPrediction ? (
                  <abbr title="measured minus predicted time, milliseconds">t − pred.</abbr>
                ) : (
                  <abbr title="measured minus fitted time, milliseconds">t − fit</abbr>
                )}{' '}
                (ms)
              </th>
              <th scope="col">
                <span class="sr-only">Action</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => {
              const { d, h, own, predicted } = row;
              const diff = difference(row);
              return (
              <tr key={d.id} class={d.excluded ? 'excluded' : ''}>
                <th scope="row">
                  <button
                    type="button"
                    class="btn btn-quiet btn-small drop-num"
                    aria-expanded={picked === d.id}
                    aria-label={`Correct or remove drop ${d.seq}`}
                    onClick={() => setPicked((p) => (p === d.id ? null : d.id))}
                  >
                    {d.seq}
                  </button>
                </th>
                {oneHeight ? null : <td>{app.format(h, 'length', 2).replace(/ \S+$/, '')}</td>}
                <td>{formatNumber(d.time_s, 3, app.settings.decimalComma)}</td>
                <td>{predicted !== null ? formatNumber(predicted, 3, app.settings.decimalComma) : '—'}</td>
                <td>{own !== null ? formatNumber(own, 3, app.settings.decimalComma) : '—'}</td>
                <td>{diff !== null ? ms(diff) : d.excluded ? 'excl.' : '—'}</td>
                <td class="act">
                  <button
                    type="button"
                    class="btn btn-small btn-quiet btn-icon"
                    title={d.excluded ? 'Include again' : 'Exclude'}
                    aria-label={d.excluded ? `Include drop ${d.seq} again` : `Exclude drop ${d.seq}`}
                    onClick={() => {
                      setExcluding(d.id);
                      setReason('');
                    }}
                  >
                    <span aria-hidden="true">{d.excluded ? '↺' : '✕'}</span>
                  </button>
                </td>
              </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {picked && drops.some((x) => x.id === picked)
        ? (() => {
            const d = drops.find((x) => x.id === picked)!;
            return (
              <div class="drop-tools" role="group" aria-label={`Drop ${d.seq}`}>
                <h4>
                  Drop {d.seq}: {d.time_s.toFixed(3)} s
                </h4>
                <RecordActions
                  key={d.id}
                  record={d}
                  label={`drop ${d.seq}`}
                  fields={[
                    { name: 'time_s', label: 'Fall time', type: 'quantity', kind: 'time', ...inputRange(LIMITS.time_s) },
                    { name: 'height_m', label: 'Height of this drop (empty: the series height)', type: 'quantity', kind: 'length', optional: true, ...inputRange(LIMITS.height_m) },
                    { name: 'note', label: 'Note', type: 'text' },
                  ]}
                  onRemoved={() => setPicked(null)}
                />
              </div>
            );
          })()
        : null}
      {predictionSpread.size > 0 ? (
        <p class="hint" data-testid="prediction-spread">
          The predicted time is uncertain by{' '}
          {[...predictionSpread]
            .sort((a, b) => a[0] - b[0])
            .map(([h, u]) => `±${ms(u)} ms${predictionSpread.size > 1 ? ` from ${app.format(h, 'length', 2)}` : ''}`)
            .join(', ')}{' '}
          (one standard uncertainty)
          {curvePercent !== undefined ? `, from the standard sphere curve’s own ±${formatNumber(curvePercent * 100, 0, app.settings.decimalComma)} % in C_d` : ''}: a
          difference up to about twice that is within what the curve can tell.
        </p>
      ) : null}
      {rows
        .filter((r) => r.d.excluded)
        .map((r) => (
          <p key={r.d.id} class="hint">
            Drop {r.d.seq} excluded: {r.d.exclusion_reason}
          </p>
        ))}
      {excluding
        ? (() => {
            const d = drops.find((x) => x.id === excluding)!;
            return (
              <div class="subform" role="group" aria-label={d.excluded ? `Include drop ${d.seq}` : `Exclude drop ${d.seq}`}>
                <TextField
                  id="exclude-reason"
                  label={d.excluded ? `Why include drop ${d.seq} again?` : `Why exclude drop ${d.seq}?`}
                  hint="The reason is kept in the drop’s history. Nothing is deleted."
                  value={reason}
                  onInput={setReason}
                />
                {error ? <Notice tone="bad">{error}</Notice> : null}
                <div class="btn-row">
                  <button type="button" class="btn" disabled={!d.excluded && reason.trim() === ''} onClick={() => void toggle(d)}>
                    {d.excluded ? 'Include it' : 'Exclude it'}
                  </button>
                  <button type="button" class="btn btn-quiet" onClick={() => setExcluding(null)}>
                    Cancel
                  </button>
                </div>
              </div>
            );
          })()
        : null}
    </section>
  );
}
