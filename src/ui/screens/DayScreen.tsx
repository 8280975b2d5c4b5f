import { useApp } from '../app-context';
import { useStoreData } from '../hooks';
import { DayOverview } from './day/DayOverview';
import { StartDayForm } from './day/StartDayForm';
import { SeriesScreen } from './day/SeriesScreen';
import { DaySummary } from './day/DaySummary';

/**
 * The test day: #/day opens the current day (or the form to start one), #/day/new starts another,
 * #/day/<id> shows a day, #/day/<id>/series/<id> a series, #/day/<id>/summary the end-of-day summary.
 */
export function DayScreen({ params }: { params: string[] }) {
  const [dayId, sub, subId] = params;
  if (dayId === 'new') return <StartDayForm />;
  if (dayId && sub === 'series' && subId) return <SeriesScreen dayId={dayId} seriesId={subId} />;
  if (dayId && sub === 'summary') return <DaySummary dayId={dayId} />;
  if (dayId) return <DayOverview dayId={dayId} />;
  return <CurrentDay />;
}

function CurrentDay() {
  const app = useApp();
  const current = app.settings.currentDayId;
  const exists = useStoreData(async () => (current ? (await app.store.get('day', current)) ?? null : null), [current]);
  if (exists.state === 'loading') return <p>Loading…</p>;
  if (exists.state === 'ready' && exists.value && !exists.value.deleted) return <DayOverview dayId={exists.value.id} />;
  return <StartDayForm />;
}
