import { useEffect, useState } from 'preact/hooks';
import { Nav } from './Nav';
import { UpdateNotice } from './UpdateNotice';
import { routeHref, useRoute, type Route, type ScreenName } from './router';
import type { UpdateHandle } from './service-worker';
import { useApp } from './app-context';
import { lazyScreen } from './lazy';
import { Notice } from './Notice';
import { UndoProvider } from './undo';
// The day is the screen the app opens on: its router is small and comes with the shell; its parts load lazily.
import { DayScreen, preloadDayScreen } from './screens/DayScreen';

const PlanScreen = lazyScreen(() => import('./screens/PlanScreen').then((m) => m.PlanScreen));
const SpecimensScreen = lazyScreen(() => import('./screens/SpecimensScreen').then((m) => m.SpecimensScreen));
const LogScreen = lazyScreen(() => import('./screens/LogScreen').then((m) => m.LogScreen));
const SendScreen = lazyScreen(() => import('./screens/SendScreen').then((m) => m.SendScreen));
const SettingsScreen = lazyScreen(() => import('./screens/SettingsScreen').then((m) => m.SettingsScreen));

const SCREENS = { plan: PlanScreen, specimens: SpecimensScreen, log: LogScreen, send: SendScreen, settings: SettingsScreen };

/**
 * Starts loading a screen's code before the app renders it. The bare #/day needs the current day (from the
 * settings) to know whether it shows a day or the form to start one: until then it waits.
 */
export function preloadScreen(route: Route, currentDayId?: string | null): void {
  if (route.screen === 'day') preloadDayScreen(route.params, currentDayId);
  else SCREENS[route.screen].preload();
}

const TITLES: Record<ScreenName, string> = {
  day: 'Test day',
  plan: 'Planner',
  specimens: 'Specimens',
  log: 'Log',
  send: 'Send to the office',
  settings: 'Settings',
};

/** Why an address led nowhere; the address itself is not echoed (it may be huge or hostile). */
const NOT_FOUND: Record<NonNullable<Route['notFound']>, string> = {
  malformed: 'This link is damaged (it may have been cut short when it was copied).',
  unknown: 'This link does not lead to a screen of Plummet.',
  'too-long': 'This link is far longer than any Plummet writes.',
};

export function App({ updates }: { updates: { subscribe(fn: (u: UpdateHandle) => void): () => void } }) {
  const route = useRoute();
  const { status } = useApp();
  const [update, setUpdate] = useState<UpdateHandle | null>(null);
  useEffect(() => updates.subscribe(setUpdate), [updates]);
  useEffect(() => {
    document.title = `${TITLES[route.screen]} · Plummet`;
    window.scrollTo(0, 0);
  }, [route.screen, route.params.join('/')]);

  return (
    <UndoProvider>
    <div class="shell">
      <header class="topbar">
        <a class="brand" href={routeHref('day')}>
          <img src="/icons/icon.svg" alt="" width="28" height="28" />
          <span>Plummet</span>
        </a>
        <h1 class="screen-title">{TITLES[route.screen]}</h1>
        <a
          class={`settings-link ${route.screen === 'settings' ? 'tab-on' : ''}`}
          href={routeHref('settings')}
          aria-label="Settings"
          aria-current={route.screen === 'settings' ? 'page' : undefined}
        >
          <svg viewBox="0 0 24 24" width="26" height="26" aria-hidden="true">
            {/* Three set levels, each with its knob: our own mark for choices (not a sun, which reads as brightness). */}
            <path d="M4 6h10M18 6h2M14 4v4M4 12h3M11 12h9M7 10v4M4 18h12M16 16v4" />
          </svg>
        </a>
      </header>
      <main id="main" class="screen">
        {route.notFound ? (
          <Notice tone="warn" title="Page not found">
            {NOT_FOUND[route.notFound]} Here is the test day instead.
          </Notice>
        ) : null}
        {route.screen === 'day' && <DayScreen params={route.params} />}
        {route.screen === 'plan' && <PlanScreen />}
        {route.screen === 'specimens' && <SpecimensScreen params={route.params} />}
        {route.screen === 'log' && <LogScreen />}
        {route.screen === 'send' && <SendScreen />}
        {route.screen === 'settings' && <SettingsScreen />}
      </main>
      {update ? <UpdateNotice update={update} onDismiss={() => setUpdate(null)} /> : null}
      <Nav current={route.screen} unsent={status?.unsentChanges ?? 0} />
    </div>
    </UndoProvider>
  );
}
