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

// One list of flags for every Chromium the project starts.
export { CHROMIUM_ARGS } from '../../scripts/chromium-args.mjs';
