// The series' charts: distance fallen against time with the fitted, predicted and drag-free curves; residuals.
import { useMemo } from 'preact/hooks';
import type { DropRecord, SeriesRecord } from '../../../../log';
import { dropHeight, seriesCurves, type SeriesOutcome } from '../../../../analysis';
import { useApp } from '../../../app-context';
import type { PlotLine, PlotMark } from '../../../../widgets';
import { fromSI, unitFor } from '../../../../widgets/units';

export function SeriesCharts({ outcome, drops, series }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; drops: DropRecord[]; series: SeriesRecord }) {
  const app = useApp();
  const lu = unitFor('length', app.unit('length'));
  const L = (m: number) => fromSI(m, lu);
  const curves = useMemo(() => seriesCurves(outcome.request, outcome.result), [outcome]);
  const lines: PlotLine[] = [];
  const conv = (c: Array<[number, number]>) => c.map(([t, y]) => [t, L(y)] as const);
  if (curves.fitted) lines.push({ label: `measured C_d ${outcome.result.drag_coefficient?.toFixed(3)}`, points: conv(curves.fitted), tone: 'brand', style: 'solid' });
  if (curves.predicted) lines.push({ label: 'predicted', points: conv(curves.predicted), tone: 'accent', style: 'dash' });
  lines.push({ label: 'no air', points: conv(curves.vacuum), tone: 'ink', style: 'dot' });
  const marks: PlotMark[] = drops.map((d) => ({
    label: `drop ${d.seq}: ${d.time_s.toFixed(3)} s from ${L(dropHeight(d, series)).toFixed(2)} ${lu.symbol}${d.excluded ? ' (excluded)' : ''}`,
    x: d.time_s,
    y: L(dropHeight(d, series)),
    hollow: d.excluded,
  }));
  const heights = new Set(outcome.request.drops.map((d) => d.height_m));
  const r = outcome.result;
  return (
    <section class="card" aria-labelledby="chart-h">
      <h3 id="chart-h">Height against time</h3>
      <pl-plot
        lines={lines}
        marks={marks}
        xLabel="time (s)"
        yLabel={`distance fallen (${lu.symbol})`}
        summary={`Chart of distance fallen against time: ${drops.length} measured drops with the curve for the measured drag coefficient${curves.predicted ? ', the predicted curve' : ''} and the curve without air. The table below lists the same values.`}
      />
      {heights.size === 1 ? <DropByDrop outcome={outcome} drops={drops} /> : null}
      {heights.size > 1 ? (
        <>
          <h3>Residuals against height</h3>
          <p class="hint">Measured minus fitted time (a drop slower than the fit is above the line). A steady trend with height points to a timing offset.</p>
          <pl-plot
            lines={[]}
            zeroLine
            marks={r.drops.map((d, i) => ({ label: `${(d.residual_s * 1000).toFixed(1)} ms at ${L(d.height_m).toFixed(2)} ${lu.symbol}`, x: L(d.height_m), y: d.residual_s * 1000, yError: series.u_time_s * 1000, hollow: false, key: i }))}
            xLabel={`height (${lu.symbol})`}
            yLabel="residual (ms)"
            summary="Residuals of each drop against its height; the table lists the same values."
          />
        </>
      ) : null}
    </section>
  );
}

/**
 * Drops from one height all land at one point of the height-time chart; here they are spread out, drop by drop,
 * each time against the series' fitted time and the prediction.
 */
function DropByDrop({ outcome, drops }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; drops: DropRecord[] }) {
  const r = outcome.result;
  const first = r.drops[0];
  if (!first || drops.length === 0) return null;
  const seqs = drops.map((d) => d.seq);
  const span: [number, number] = [Math.min(...seqs) - 0.5, Math.max(...seqs) + 0.5];
  const flat = (y: number) => [
    [span[0], y],
    [span[1], y],
  ] as const;
  const lines: PlotLine[] = [{ label: `fitted ${first.fitted_time_s.toFixed(3)} s`, points: flat(first.fitted_time_s), tone: 'brand', style: 'solid' }];
  if (first.predicted_time_s !== null) lines.push({ label: `predicted ${first.predicted_time_s.toFixed(3)} s`, points: flat(first.predicted_time_s), tone: 'accent', style: 'dash' });
  return (
    <>
      <h3>Fall time, drop by drop</h3>
      <pl-plot
        lines={lines}
        marks={drops.map((d) => ({ label: `drop ${d.seq}: ${d.time_s.toFixed(3)} s${d.excluded ? ' (excluded)' : ''}`, x: d.seq, y: d.time_s, hollow: d.excluded, key: d.id }))}
        xLabel="drop number"
        yLabel="fall time (s)"
        summary={`Chart of each drop's fall time in the order they were made, with the fitted time${first.predicted_time_s !== null ? ' and the predicted time' : ''}; the table below lists the same values.`}
      />
    </>
  );
}
