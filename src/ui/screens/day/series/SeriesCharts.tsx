// The series' charts: distance fallen against time with the fitted, predicted and drag-free curves; residuals.
// What they plot comes from src/charts (seriesPlots), the same as the printed day report's.
import { useMemo } from 'preact/hooks';
import type { DropRecord, SeriesRecord } from '../../../../log';
import type { SeriesOutcome } from '../../../../analysis';
import { marksPlots, seriesPlots } from '../../../../charts';
import { useApp } from '../../../app-context';
import type { PlotLine } from '../../../../widgets';
import { fromSI, unitFor } from '../../../../widgets/units';

export function SeriesCharts({ outcome, drops, series }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; drops: DropRecord[]; series: SeriesRecord }) {
  const app = useApp();
  const lu = unitFor('length', app.unit('length'));
  const plots = useMemo(() => seriesPlots(outcome, drops, series, { symbol: lu.symbol, fromMetres: (m) => fromSI(m, lu) }), [outcome, drops, series, lu]);
  const { heightTime, residuals } = plots;
  const marks = useMemo(() => marksPlots(drops, outcome.result.drops, { symbol: lu.symbol, fromMetres: (m) => fromSI(m, lu) }), [outcome, drops, lu]);
  return (
    <section class="card" aria-labelledby="chart-h">
      <h3 id="chart-h">Height against time</h3>
      <pl-plot lines={[...heightTime.lines]} marks={[...heightTime.marks]} xLabel={heightTime.xLabel} yLabel={heightTime.yLabel} summary={heightTime.summary} />
      {marks ? (
        <>
          <h3>Marks along the fall</h3>
          <pl-plot lines={[...marks.distanceTime.lines]} marks={[...marks.distanceTime.marks]} xLabel={marks.distanceTime.xLabel} yLabel={marks.distanceTime.yLabel} summary={marks.distanceTime.summary} />
          {marks.residuals ? (
            <pl-plot lines={[]} zeroLine marks={[...marks.residuals.marks]} xLabel={marks.residuals.xLabel} yLabel={marks.residuals.yLabel} summary={marks.residuals.summary} />
          ) : null}
        </>
      ) : null}
      {new Set(outcome.request.drops.map((d) => d.height_m)).size === 1 ? <DropByDrop outcome={outcome} drops={drops} /> : null}
      {residuals ? (
        <>
          <h3>Residuals against height</h3>
          <p class="hint">Measured minus fitted time (a drop slower than the fit is above the line). A steady trend with height points to a timing offset.</p>
          <pl-plot lines={[]} zeroLine marks={[...residuals.marks]} xLabel={residuals.xLabel} yLabel={residuals.yLabel} summary={residuals.summary} />
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
