// One series of a day: its heading, the next drop's entry, the verdict, the charts, the drop table and the
// budget. Each part lives in ./series/; the analysis is computed once per change of the records it reads.
import '../../../widgets';
import type { DropRecord, SeriesRecord, SpecimenRecord } from '../../../log';
import type { DayView } from '../../../store';
import { seriesOfDay, seriesVerdict, siteGravity } from '../../../analysis';
import { useMemo } from 'preact/hooks';
import { useScreenWakeLock } from '../../use-wake-lock';
import { useKeyboardInset } from '../../use-keyboard-inset';
import { useApp } from '../../app-context';
import { useStoreData } from '../../hooks';
import { Notice } from '../../forms';
import { describeError } from '../../errors';
import { SeriesHeader } from './series/SeriesHeader';
import { DropEntry } from './series/DropEntry';
import { Verdict, VerdictBar } from './series/Verdict';
import { SeriesCharts } from './series/SeriesCharts';
import { DropTable } from './series/DropTable';
import { BudgetChart } from './series/BudgetChart';
import { useSeriesAnalysis } from './series/use-series-analysis';

export function SeriesScreen({ dayId, seriesId }: { dayId: string; seriesId: string }) {
  const app = useApp();
  const data = useStoreData(() => app.store.loadDay(dayId), [dayId]);
  if (data.state === 'loading') return <p>Loading the series…</p>;
  if (data.state === 'failed') return <Notice tone="bad">This day could not be opened: {describeError(data.error)}</Notice>;
  const view = data.value;
  const series = view.series.find((s) => s.id === seriesId);
  if (!series) return <Notice tone="bad">This series is not in the day (it may have been removed).</Notice>;
  const { specimen, drops } = seriesOfDay(view, series);
  return <SeriesBody view={view} series={series} specimen={specimen} drops={drops} />;
}

export function SeriesBody({ view, series, specimen, drops }: { view: DayView; series: SeriesRecord; specimen: SpecimenRecord | undefined; drops: DropRecord[] }) {
  const outcome = useSeriesAnalysis(view.site, view.readings, specimen, series, drops);
  const verdict = useMemo(() => seriesVerdict(outcome, series, drops), [outcome, series, drops]);
  // The screen stays awake and Add stays above the keyboard while the series is open.
  useScreenWakeLock();
  useKeyboardInset();
  return (
    <div>
      <VerdictBar outcome={outcome} verdict={verdict} />
      <SeriesHeader view={view} series={series} specimen={specimen} />
      <DropEntry
        gravity={siteGravity(view.site)}
        series={series}
        nextSeq={drops.reduce((m, d) => Math.max(m, d.seq), 0) + 1}
        airTemperature={outcome.kind === 'ready' ? outcome.reading.temperature_C : (view.readings[view.readings.length - 1]?.temperature_C ?? null)}
      />
      <Verdict outcome={outcome} series={series} verdict={verdict} />
      {outcome.kind === 'ready' ? <SeriesCharts outcome={outcome} drops={drops} series={series} /> : null}
      <DropTable drops={drops} series={series} outcome={outcome} />
      {outcome.kind === 'ready' ? <BudgetChart result={outcome.result} /> : null}
    </div>
  );
}
