// Size budgets for the production build: `node scripts/budget.mjs [dist]` (run `npm run build` first).
//   first screen JavaScript: at most 45 KB, measured in Chromium (the system one, driven by playwright-core):
//     the build is served by the project's own server (gzip, as production) and loaded at phone size with an
//     empty cache and no service worker (a first visit; the worker's own downloads are the precache budget);
//     every script the page fetches until its network is idle counts, lazily loaded chunks included, as the
//     gzip bytes received (the compressed bodies; the total with HTTP headers is printed beside it).
//     What the app loads once the screen is shown and the browser idle (it sets the performance mark
//     "plummet:idle-loads" first: the day overview's C_d figures, for example) is listed apart, not counted.
//     Two first screens: an empty app (the form to start a day) and a day with a few series (the app's own
//     sample log, loaded through Settings, then the day opened afresh with its C_d figures filled in).
//   CSS: at most 10 KB gzip
//   the whole service-worker precache: at most 340 KB gzip, what a phone downloads to install the app (the
//   files as any compressing web server sends them; PNG icons barely compress). The raw size the phone keeps
//   in its cache is printed beside it. It was 300 KB until video timing came: its demuxer and decoder worker
//   (about 52 KB gzip) are precached so that a clip can be timed with no signal, and the 40 KB raised is that
//   worker's share, not room for anything else.
// Prints a table and exits 1 when any budget is exceeded or a screen cannot be measured. KB = 1000 bytes.
import { readFileSync, statSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { startStaticServer } from './static-server.mjs';
import { CHROMIUM_ARGS } from './chromium-args.mjs';

export const BUDGETS = { firstScreenJs: 45_000, cssGzip: 10_000, precache: 340_000 };

export { CHROMIUM_ARGS };

const gz = (file) => gzipSync(readFileSync(file), { level: 9 }).length;

/** The figures read from the files alone: CSS and the precache. */
export function measureFiles(dist, budgets = BUDGETS) {
  const html = readFileSync(join(dist, 'index.html'), 'utf8');
  const local = (href) => href.replace(/^\//, '').split('?')[0];
  const styles = [...html.matchAll(/<link[^>]+rel="stylesheet"[^>]+href="([^"]+)"/g)].map((m) => local(m[1]));
  const sw = readFileSync(join(dist, 'sw.js'), 'utf8');
  const precached = [...new Set([...sw.matchAll(/"url":"([^"]+)"/g)].map((m) => m[1]))];
  if (precached.length === 0) throw new Error('sw.js lists no precache entries: was the manifest injected?');
  for (const f of [...styles, ...precached]) {
    if (!existsSync(join(dist, f))) throw new Error(`${f} is referenced but missing from ${dist}`);
  }
  const figures = {
    cssGzip: styles.reduce((s, f) => s + gz(join(dist, f)), 0),
    precache: precached.reduce((s, f) => s + gz(join(dist, f)), 0) + gz(join(dist, 'sw.js')),
  };
  const precacheRaw = precached.reduce((s, f) => s + statSync(join(dist, f)).size, 0) + statSync(join(dist, 'sw.js')).size;
  const over = Object.keys(figures).filter((k) => budgets[k] !== undefined && figures[k] > budgets[k]);
  return { figures, over, precacheRaw, files: { styles, precached } };
}

/**
 * Loads `url` in a fresh phone-sized page with the cache disabled and sums every script transferred until the
 * network has been quiet for `quietMs` after the load event and `ready(page)` has resolved.
 * Returns the scripts in the order they were requested, with their gzip bytes. Scripts the app requested after
 * it set the performance mark `idleMark` (the first screen shown, the browser idle) are returned apart in
 * `afterIdle`; a page without the mark has every script in `scripts`.
 */
export async function measurePage(context, url, { ready = async () => undefined, quietMs = 1500, timeoutMs = 60_000, idleMark = 'plummet:idle-loads' } = {}) {
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  const requests = new Map();
  let inFlight = 0;
  let lastActivity = Date.now();
  cdp.on('Network.requestWillBeSent', (e) => {
    if (!requests.has(e.requestId)) inFlight++;
    requests.set(e.requestId, { url: e.request.url, type: e.type, mime: '', bytes: 0, wire: 0, done: false, at: e.wallTime * 1000, end: Infinity });
    lastActivity = Date.now();
  });
  cdp.on('Network.responseReceived', (e) => {
    const r = requests.get(e.requestId);
    if (r) r.mime = e.response.mimeType;
  });
  // The compressed body as it arrives (no headers): the "gzip" figure the budget is stated in.
  cdp.on('Network.dataReceived', (e) => {
    const r = requests.get(e.requestId);
    if (r) r.bytes += e.encodedDataLength;
  });
  const finish = (e, failed) => {
    const r = requests.get(e.requestId);
    if (!r || r.done) return;
    r.done = true;
    r.failed = failed;
    r.end = Date.now();
    if (!failed) r.wire = e.encodedDataLength;
    inFlight--;
    lastActivity = Date.now();
  };
  cdp.on('Network.loadingFinished', (e) => finish(e, false));
  cdp.on('Network.loadingFailed', (e) => finish(e, true));
  await cdp.send('Network.enable');
  await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
  const started = Date.now();
  await page.goto(url, { waitUntil: 'load', timeout: timeoutMs });
  await ready(page);
  while (inFlight > 0 || Date.now() - lastActivity < quietMs) {
    if (Date.now() - started > timeoutMs) throw new Error(`${url}: the network was not idle after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
  // Where the app marks the moment it starts loading what it held back until the first screen was shown
  // (src/ui/lazy.tsx, IDLE_LOADS_MARK), the scripts requested from then on are listed apart.
  const mark = await page.evaluate(
    (name) => {
      const m = performance.getEntriesByName(name)[0];
      return m ? performance.timeOrigin + m.startTime : null;
    },
    idleMark,
  );
  const isScript = (r) => r.type === 'Script' || /javascript|ecmascript/.test(r.mime) || /\.m?js(\?|$)/.test(new URL(r.url).pathname);
  const all = [...requests.values()].filter((r) => isScript(r) && !r.failed);
  const entry = (r) => ({ file: new URL(r.url).pathname.replace(/^\//, ''), bytes: r.bytes, wire: r.wire });
  const scripts = all.filter((r) => mark === null || r.at < mark).map(entry);
  const afterIdle = all.filter((r) => mark !== null && r.at >= mark).map(entry);
  await page.close();
  const sum = (list, key) => list.reduce((s, f) => s + f[key], 0);
  return { scripts, afterIdle, total: sum(scripts, 'bytes'), wire: sum(scripts, 'wire'), afterIdleTotal: sum(afterIdle, 'bytes'), idleMarked: mark !== null };
}

/** How long a screen may take to show what it must (PLUMMET_BUDGET_READY_MS overrides: the tests shorten it). */
const READY_MS = Number(process.env.PLUMMET_BUDGET_READY_MS ?? 30_000);

/** The two first screens of the real app. `seed` runs once before the screen is measured, in the same profile. */
export const APP_SCREENS = [
  {
    name: 'empty app',
    path: '/',
    async ready(page) {
      await page.getByRole('heading', { name: 'Start a test day' }).waitFor({ timeout: READY_MS });
    },
  },
  {
    name: 'day with 3 series',
    async seed(page, baseUrl) {
      await page.goto(`${baseUrl}/#/settings`);
      await page.getByRole('button', { name: 'Load the sample log' }).click({ timeout: READY_MS });
      await page.getByText('The sample log is loaded').waitFor({ timeout: READY_MS });
      await page.goto(`${baseUrl}/#/log`);
      const link = page.locator('a.row-link[href^="#/day/"]').first();
      await link.waitFor({ timeout: READY_MS });
      return `/${await link.getAttribute('href')}`;
    },
    async ready(page) {
      // The series list is shown at once and its C_d figures fill in when the analysis has run.
      const list = page.locator('section[aria-labelledby="serieslist-h"]');
      await list.locator('a.row-link').nth(2).waitFor({ timeout: READY_MS });
      await page.waitForFunction(
        () => {
          const sides = [...document.querySelectorAll('section[aria-labelledby="serieslist-h"] .row-side')];
          return sides.length === 3 && sides.every((s) => /C_d \d/.test(s.textContent ?? ''));
        },
        undefined,
        { timeout: READY_MS },
      );
    },
  },
];

/**
 * Serves `dist` with the project's server and measures each screen's first-screen JavaScript in Chromium.
 * Returns one entry per screen and the names of the screens over the budget.
 */
export async function measureFirstScreens(dist, { chromiumPath = process.env.CHROME_PATH ?? '/usr/bin/chromium', screens = APP_SCREENS, budget = BUDGETS.firstScreenJs } = {}) {
  if (!existsSync(chromiumPath)) throw new Error(`no Chromium at ${chromiumPath}: the first screen cannot be measured (set CHROME_PATH)`);
  const { chromium } = await import('playwright-core');
  const server = await startStaticServer({ root: dist });
  const browser = await chromium.launch({ executablePath: chromiumPath, args: CHROMIUM_ARGS });
  try {
    const results = [];
    for (const screen of screens) {
      // A first visit: an empty profile, and no service worker (its precache downloads are budgeted apart).
      const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true, serviceWorkers: 'block', locale: 'en-GB' });
      try {
        let path = screen.path ?? '/';
        if (screen.seed) {
          const seeding = await context.newPage();
          path = await screen.seed(seeding, server.url);
          await seeding.close();
        }
        const measured = await measurePage(context, `${server.url}${path}`, { ready: screen.ready });
        results.push({ name: screen.name, path, ...measured, over: measured.total > budget });
      } finally {
        await context.close();
      }
    }
    return { screens: results, over: results.filter((r) => r.over).map((r) => r.name) };
  } finally {
    await browser.close();
    await server.close();
  }
}

const isMain = process.argv[1] && import.meta.url === new URL(`file://${process.argv[1]}`).href;
if (isMain) {
  const dist = process.argv[2] ?? 'dist';
  const scale = process.env.PLUMMET_BUDGET_SCALE ? Number(process.env.PLUMMET_BUDGET_SCALE) : 1;
  const budgets = Object.fromEntries(Object.entries(BUDGETS).map(([k, v]) => [k, v * scale]));
  const kb = (n) => `${(n / 1000).toFixed(1)} KB`;
  const line = (bad, name, v, b, n) => console.log(`${bad ? 'OVER' : 'ok  '}  ${name.padEnd(34)} ${kb(v).padStart(9)} of ${kb(b).padStart(9)}  (${n} files)`);
  let failed = [];
  try {
    const first = await measureFirstScreens(dist, { budget: budgets.firstScreenJs });
    for (const s of first.screens) {
      line(s.over, `first screen JS: ${s.name}`, s.total, budgets.firstScreenJs, s.scripts.length);
      for (const f of s.scripts) console.log(`        ${kb(f.bytes).padStart(9)}  ${f.file}`);
      console.log(`        (${kb(s.wire)} on the wire with the HTTP headers)`);
      if (s.afterIdle.length) {
        console.log(`      then, once the screen was shown and the browser idle: ${kb(s.afterIdleTotal)} (settled total ${kb(s.total + s.afterIdleTotal)})`);
        for (const f of s.afterIdle) console.log(`        ${kb(f.bytes).padStart(9)}  ${f.file}`);
      }
    }
    failed.push(...first.over.map((n) => `first screen JS (${n})`));
  } catch (error) {
    console.error(`the first screen could not be measured: ${error instanceof Error ? error.message : error}`);
    failed.push('first screen JS (not measured)');
  }
  const { figures, over, files, precacheRaw } = measureFiles(dist, budgets);
  line(figures.cssGzip > budgets.cssGzip, 'CSS (gzip)', figures.cssGzip, budgets.cssGzip, files.styles.length);
  line(figures.precache > budgets.precache, 'precache incl. sw.js (gzip)', figures.precache, budgets.precache, files.precached.length + 1);
  console.log(`      (the precache takes ${kb(precacheRaw)} uncompressed in the phone's cache)`);
  failed.push(...over);
  if (failed.length) {
    console.error(`size budget exceeded: ${failed.join(', ')}`);
    process.exit(1);
  }
}
