// Benchmark of the log store on Chromium's real IndexedDB (a persistent profile on disk; an incognito
// context would keep IndexedDB in memory). Run: npx tsx bench/store.bench.ts [days] [series per day] [drops per series]
//
// Measures, for a log of 2 000 days × 5 series × 10 drops (100 000 drops) by default:
//   bulk write (putRecords in batches of 50 days), opening the store to the list of days (target ≤ 300 ms),
//   opening one day with its series and drops (target ≤ 50 ms), saving one drop (target p95 ≤ 16 ms).
import { chromium } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { CHROMIUM_ARGS, findChromium } from '../test/support/chromium';
import { serveStorePage } from '../test/browser/fixtures/store-page/build';
import type { Outcome } from '../test/browser/fixtures/store-page/main';

const [days = 2000, seriesPerDay = 5, dropsPerSeries = 10] = process.argv.slice(2).map(Number);
const DB = 'plummet-bench';

function value<T>(outcome: Outcome<T>): T {
  if (!outcome.ok) throw new Error(`${outcome.code ?? outcome.name}: ${outcome.message}`);
  return outcome.value;
}

function quantile(sorted: number[], q: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i]!;
}

function summary(times: number[]) {
  const s = [...times].sort((a, b) => a - b);
  return { n: s.length, p50: quantile(s, 0.5), p95: quantile(s, 0.95), max: s[s.length - 1]! };
}

const ms = (x: number) => `${x.toFixed(1)} ms`;
const verdict = (x: number, target: number) => (x <= target ? `meets ≤ ${target} ms` : `MISSES ≤ ${target} ms`);

const chromiumPath = findChromium().path;
if (!chromiumPath) {
  console.error(`no Chromium: ${findChromium().reason}`);
  process.exit(1);
}

const server = await serveStorePage();
const profile = await mkdtemp(join(tmpdir(), 'plummet-bench-profile-'));
const launch = () =>
  chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath,
    args: CHROMIUM_ARGS,
    viewport: { width: 390, height: 844 },
    isMobile: true,
    hasTouch: true,
  });

try {
  let context = await launch();
  let page = await context.newPage();
  const load = async () => {
    await page.goto(server.url);
    await page.waitForSelector('body[data-ready="true"]');
  };
  await load();
  value(await page.evaluate((db) => window.store.open(db), DB));

  console.log(`machine load average ${loadavg()[0]!.toFixed(1)} on ${cpus().length} cores (every figure is slower under load)`);
  console.log(`Chromium ${context.browser()?.version() ?? '(persistent context)'}; log of ${days} days × ${seriesPerDay} series × ${dropsPerSeries} drops`);
  const bulk = value(await page.evaluate(([d, s, q]) => window.store.bulkLog(d, s, q, 50), [days, seriesPerDay, dropsPerSeries] as const));
  const estimate = await page.evaluate(() => navigator.storage.estimate());
  console.log(`bulk write: ${bulk.records} records in ${(bulk.writeMs / 1000).toFixed(2)} s (${((bulk.records / bulk.writeMs) * 1000).toFixed(0)} records/s); IndexedDB usage ${(estimate.usage! / 1e6).toFixed(1)} MB`);

  // Cold: the browser closed and started again, as when the crew opens the app in the morning.
  const colds: { ms: number; openMs: number; listMs: number; days: number; first: { drop_count: number } | null }[] = [];
  for (let i = 0; i < 5; i++) {
    await context.close();
    context = await launch();
    page = await context.newPage();
    await load();
    colds.push(value(await page.evaluate((db) => window.store.openAndListDays(db), DB)));
  }
  const cold = colds.reduce((a, b) => (b.ms > a.ms ? b : a));
  const later = summary(colds.slice(1).map((c) => c.ms));
  const warm: number[] = [];
  for (let i = 0; i < 7; i++) {
    await page.reload();
    await page.waitForSelector('body[data-ready="true"]');
    warm.push(value(await page.evaluate((db) => window.store.openAndListDays(db), DB)).ms);
  }
  const w = summary(warm);
  console.log(
    `open store → list of ${cold.days} days after a browser restart, ${colds.length} restarts: ` +
      colds.map((c) => `${ms(c.ms)} (open ${ms(c.openMs)} + list ${ms(c.listMs)})`).join(', '),
  );
  console.log(
    `  first start after the bulk write ${ms(colds[0]!.ms)} (${verdict(colds[0]!.ms, 300)}); later starts p50 ${ms(later.p50)}, worst ${ms(later.max)} (${verdict(later.max, 300)})`,
  );
  console.log(`open store → list of days after a reload, ${w.n} reloads: p50 ${ms(w.p50)}, max ${ms(w.max)} (${verdict(w.max, 300)})`);
  if (cold.first?.drop_count !== seriesPerDay * dropsPerSeries) throw new Error(`the newest day lists ${cold.first?.drop_count} drops`);

  const sample = Array.from({ length: 200 }, (_, i) => bulk.dayIds[(i * 7919) % bulk.dayIds.length]!);
  const day = value(await page.evaluate((ids) => window.store.timeLoadDay(ids), sample));
  if (day.drops !== sample.length * seriesPerDay * dropsPerSeries) throw new Error(`loadDay returned ${day.drops} drops`);
  const d = summary(day.times);
  console.log(`open one day (${seriesPerDay} series, ${seriesPerDay * dropsPerSeries} drops), ${d.n} days: p50 ${ms(d.p50)}, p95 ${ms(d.p95)}, max ${ms(d.max)} (${verdict(d.p95, 50)} at p95)`);

  for (const durability of ['strict', 'relaxed'] as const) {
    value(await page.evaluate(([db, dur]) => window.store.open(db, dur), [DB, durability] as const));
    const series = bulk.seriesIds[(durability === 'strict' ? 1 : 2) * 1237 % bulk.seriesIds.length]!;
    const saves = summary(value(await page.evaluate(([id, n]) => window.store.timeSaveDrop(id, n), [series, 200] as const)));
    console.log(
      `save one drop (${durability} durability${durability === 'strict' ? ', the default' : ''}), ${saves.n} saves: p50 ${ms(saves.p50)}, p95 ${ms(saves.p95)}, max ${ms(saves.max)} (${verdict(saves.p95, 16)} at p95)`,
    );
  }
  await context.close();
} finally {
  await server.close();
  await rm(profile, { recursive: true, force: true });
}
