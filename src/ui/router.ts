import { useEffect, useState } from 'preact/hooks';

/** The app's screens, addressed by the hash so every deep link works offline through the one index.html. */
export type ScreenName = 'day' | 'plan' | 'specimens' | 'log' | 'send' | 'settings';

export interface Route {
  screen: ScreenName;
  /** Further path parts, e.g. ['series', '<id>'] on the day screen. */
  params: string[];
  /**
   * Set when the address leads to no screen; the day is shown instead, with a notice. 'malformed': a part that
   * is not valid percent-encoded UTF-8 (a link cut in the middle of an escape); 'unknown': no such screen;
   * 'too-long': longer than any address the app writes.
   */
  notFound?: 'malformed' | 'unknown' | 'too-long';
}

/** Far above any address the app writes (a screen, two ids of 36 characters and a word), far below a megabyte. */
const MAX_ROUTE_LENGTH = 1000;

const SCREENS: readonly ScreenName[] = ['day', 'plan', 'specimens', 'log', 'send', 'settings'];

/** Never throws: whatever the address, the app opens (a link is outside input, and an exception here left it blank). */
export function parseRoute(hash: string): Route {
  const path = hash.replace(/^#\/?/, '');
  if (path.length > MAX_ROUTE_LENGTH) return { screen: 'day', params: [], notFound: 'too-long' };
  const parts: string[] = [];
  for (const part of path.split('/').filter(Boolean)) {
    try {
      parts.push(decodeURIComponent(part));
    } catch {
      // URIError: a cut or invalid escape ("%E0%A4%A", "100%", an encoded lone surrogate).
      return { screen: 'day', params: [], notFound: 'malformed' };
    }
  }
  const first = parts[0];
  if (first === undefined) return { screen: 'day', params: [] };
  if ((SCREENS as readonly string[]).includes(first)) return { screen: first as ScreenName, params: parts.slice(1) };
  return { screen: 'day', params: [], notFound: 'unknown' };
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
