import { useEffect, useState } from 'preact/hooks';

/** The app's screens, addressed by the hash so every deep link works offline through the one index.html. */
export type ScreenName = 'day' | 'plan' | 'specimens' | 'log' | 'send' | 'settings';

export interface Route {
  screen: ScreenName;
  /** Further path parts, e.g. ['series', '<id>'] on the day screen. */
  params: string[];
}

const SCREENS: readonly ScreenName[] = ['day', 'plan', 'specimens', 'log', 'send', 'settings'];

export function parseRoute(hash: string): Route {
  const parts = hash.replace(/^#\/?/, '').split('/').filter(Boolean).map(decodeURIComponent);
  const first = parts[0] as ScreenName | undefined;
  if (first && SCREENS.includes(first)) return { screen: first, params: parts.slice(1) };
  return { screen: 'day', params: [] };
}

export function routeHref(screen: ScreenName, ...params: string[]): string {
  return `#/${[screen, ...params].map(encodeURIComponent).join('/')}`;
}

export function navigate(screen: ScreenName, ...params: string[]): void {
  location.hash = routeHref(screen, ...params);
}

export function useRoute(): Route {
  const [route, setRoute] = useState(() => parseRoute(location.hash));
  useEffect(() => {
    const onChange = () => setRoute(parseRoute(location.hash));
    window.addEventListener('hashchange', onChange);
    return () => window.removeEventListener('hashchange', onChange);
  }, []);
  return route;
}
