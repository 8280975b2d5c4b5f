// Size budgets, read from the build output: `node scripts/budget.mjs [dist]`.
//   initial JavaScript (what index.html loads before the first screen): at most 45 KB gzip
//   CSS: at most 10 KB gzip
//   the whole service-worker precache: at most 300 KB gzip, what a phone downloads to install the app (the
//   files as any compressing web server sends them; PNG icons barely compress). The raw size the phone keeps
//   in its cache is printed beside it.
// Prints a table and exits 1 when any budget is exceeded. KB = 1000 bytes.
import { readFileSync, statSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

export const BUDGETS = { initialJsGzip: 45_000, cssGzip: 10_000, precache: 300_000 };

const gz = (file) => gzipSync(readFileSync(file), { level: 9 }).length;

/** Measures a build folder; returns the figures and the list of budgets exceeded. */
export function measure(dist, budgets = BUDGETS) {
  const html = readFileSync(join(dist, 'index.html'), 'utf8');
  const local = (href) => href.replace(/^\//, '').split('?')[0];
  const scripts = [...html.matchAll(/<script[^>]+src="([^"]+)"/g)].map((m) => local(m[1]));
  const preloads = [...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+)"/g)].map((m) => local(m[1]));
  const styles = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => local(m[1]));
  const initialJs = [...new Set([...scripts, ...preloads])];
  const sw = readFileSync(join(dist, 'sw.js'), 'utf8');
  const precached = [...new Set([...sw.matchAll(/"url":"([^"]+)"/g)].map((m) => m[1]))];
  if (precached.length === 0) throw new Error('sw.js lists no precache entries: was the manifest injected?');
  for (const f of [...initialJs, ...styles, ...precached]) {
    if (!existsSync(join(dist, f))) throw new Error(`${f} is referenced but missing from ${dist}`);
  }
  const figures = {
    initialJsGzip: initialJs.reduce((s, f) => s + gz(join(dist, f)), 0),
    cssGzip: styles.reduce((s, f) => s + gz(join(dist, f)), 0),
    precache: precached.reduce((s, f) => s + gz(join(dist, f)), 0) + gz(join(dist, 'sw.js')),
  };
  const precacheRaw = precached.reduce((s, f) => s + statSync(join(dist, f)).size, 0) + statSync(join(dist, 'sw.js')).size;
  const over = Object.keys(budgets).filter((k) => figures[k] > budgets[k]);
  return { figures, over, precacheRaw, files: { initialJs, styles, precached } };
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const dist = process.argv[2] ?? 'dist';
  const scale = process.env.PLUMMET_BUDGET_SCALE ? Number(process.env.PLUMMET_BUDGET_SCALE) : 1;
  const budgets = Object.fromEntries(Object.entries(BUDGETS).map(([k, v]) => [k, v * scale]));
  const { figures, over, files, precacheRaw } = measure(dist, budgets);
  const kb = (n) => `${(n / 1000).toFixed(1)} KB`;
  const rows = [
    ['initial JavaScript (gzip)', figures.initialJsGzip, budgets.initialJsGzip, files.initialJs.length],
    ['CSS (gzip)', figures.cssGzip, budgets.cssGzip, files.styles.length],
    ['precache incl. sw.js (gzip)', figures.precache, budgets.precache, files.precached.length + 1],
  ];
  for (const [name, v, b, n] of rows) {
    console.log(`${v > b ? 'OVER' : 'ok  '}  ${name.padEnd(28)} ${kb(v).padStart(9)} of ${kb(b).padStart(9)}  (${n} files)`);
  }
  console.log(`      (the precache takes ${kb(precacheRaw)} uncompressed in the phone's cache)`);
  if (over.length) {
    console.error(`size budget exceeded: ${over.join(', ')}`);
    process.exit(1);
  }
}
