import { existsSync } from 'node:fs';

/** Where the system Chromium is, or why there is none. */
export function findChromium(): { path: string | null; reason: string } {
  const candidates = [process.env.CHROME_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(
    (p): p is string => Boolean(p),
  );
  for (const path of candidates) if (existsSync(path)) return { path, reason: '' };
  return {
    path: null,
    reason: `no Chromium at ${candidates.join(' or ')} (on Debian: apt-get install chromium, or set CHROME_PATH)`,
  };
}

/** Flags for the system Chromium on a machine with no GPU and no outside network. */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];
