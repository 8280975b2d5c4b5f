// The series' charts: distance fallen against time with the fitted, predicted and drag-free curves; residuals.
// What they plot comes from src/charts (seriesPlots), the same as the printed day report's.
import { useMemo } from 'preact/hooks';
import type { DropRecord, SeriesRecord } from '../../../../log';
import type { SeriesOutcome } from '../../../../analysis';
import { seriesPlots } from '../../../../charts';
import { useApp } from '../../../app-context';
import { fromSI, unitFor } from '../../../../widgets/units';

export function SeriesCharts({ outcome, drops, series }: { outcome: Extract<SeriesOutcome, { kind: 'ready' }>; drops: DropRecord[]; series: SeriesRecord }) {
  const app = useApp();
  const lu = unitFor('length', app.unit('length'));
  const plots = useMemo(() => seriesPlots(outcome, drops, series, { symbol: lu.symbol, fromMetres: (m) => fromSI(m, lu) }), [outcome, drops, series, lu]);
  const { heightTime, residuals } = plots;
  return (
    <section class="card" aria-labelledby="chart-h">
      <h3 id="chart-h">Height against time</h3>
      <pl-plot lines={[...heightTime.lines]} marks={[...heightTime.marks]} xLabel={heightTime.xLabel} yLabel={heightTime.yLabel} summary={heightTime.summary} />
      {residuals ? (
        <>
          <h3>Residuals against height</h3>
          <p class="hint">Measured minus fitted time. A steady trend with height points to a timing offset.</p>
          <pl-plot lines={[]} zeroLine marks={[...residuals.marks]} xLabel={residuals.xLabel} yLabel={residuals.yLabel} summary={residuals.summary} />
        </>
      ) : null}
    </section>
  );
}
