import { useApp } from '../app-context';
import { useStoreData } from '../use-store-data';
import { lazyScreen } from '../lazy';

// Each part of the day loads on its own, so the first screen (a day's overview, or the form to start one)
// carries neither the series screen's timer and charts nor the forms it does not show.
const StartDayForm = lazyScreen(() => import('./day/StartDayForm').then((m) => m.StartDayForm));
const DayOverview = lazyScreen(() => import('./day/DayOverview').then((m) => m.DayOverview), 'Loading the day…');
// The series screen renders its timer pad and charts at once: they are defined before it is shown.
const SeriesScreen = lazyScreen(() => Promise.all([import('./day/SeriesScreen'), import('../../widgets').then((w) => w.loadInstruments())]).then(([m]) => m.SeriesScreen));
const DaySummary = lazyScreen(() => import('./day/DaySummary').then((m) => m.DaySummary));
const DayReport = lazyScreen(() => import('./day/DayReport').then((m) => m.DayReport), 'Computing the report…');

/** Starts loading the part of the day that `params` (and, for the bare #/day, the current day) will show. */
export function preloadDayScreen(params: string[], currentDayId: string | null | undefined): void {
  const [dayId, sub, subId] = params;
  if (dayId === 'new') StartDayForm.preload();
  else if (dayId && sub === 'series' && subId) SeriesScreen.preload();
  else if (dayId && sub === 'summary') DaySummary.preload();
  else if (dayId && sub === 'report') DayReport.preload();
  else if (dayId) DayOverview.preload();
  else if (currentDayId !== undefined) (currentDayId ? DayOverview : StartDayForm).preload();
}

/**
 * The test day: #/day opens the current day (or the form to start one), #/day/new starts another,
 * #/day/<id> shows a day, #/day/<id>/series/<id> a series, #/day/<id>/summary the end-of-day summary, #/day/<id>/report the printable day report.
 */
export function DayScreen({ params }: { params: string[] }) {
  const [dayId, sub, subId] = params;
  if (dayId === 'new') return <StartDayForm />;
  if (dayId && sub === 'series' && subId) return <SeriesScreen dayId={dayId} seriesId={subId} />;
  if (dayId && sub === 'summary') return <DaySummary dayId={dayId} />;
  if (dayId && sub === 'report') return <DayReport dayId={dayId} />;
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
