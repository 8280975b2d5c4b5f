// The import benchmark: a log of 100 000 drops imported into a store that already holds half, in the real
// Chromium with the IndexedDB store, exactly as the Send screen runs it (previewImport, then applyImport), timed
// as a whole and by phase (through the progress callback). Run: npx tsx bench/import.bench.ts [drops] [runs]
// Target: ≤ 3 s for the whole import. The median of the runs is the figure; the load average is printed beside it.
import { mkdtemp, rm } from 'node:fs/promises';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { startStaticServer } from '../scripts/static-server.mjs';
import { buildSyncPage } from '../test/browser/fixtures/sync-page/build';
import type { Harness } from '../test/browser/fixtures/sync-page/main';
import { CHROMIUM_ARGS, findChromium } from '../test/support/chromium';

const DROPS = Number(process.argv[2] ?? 100_000);
const RUNS = Number(process.argv[3] ?? 3);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
const load = () => loadavg()[0]!.toFixed(2);

const found = findChromium();
if (!found.path) {
  console.error(`no Chromium: ${found.reason}`);
  process.exit(1);
}
const dir = await mkdtemp(join(tmpdir(), 'plummet-bench-import-'));
await buildSyncPage(dir);
const server = await startStaticServer({ root: dir });
const profile = await mkdtemp(join(tmpdir(), 'plummet-bench-import-profile-'));
// A profile on disk: an incognito context keeps IndexedDB in memory, which no phone does.
const context = await chromium.launchPersistentContext(profile, { executablePath: found.path, args: CHROMIUM_ARGS, viewport: { width: 390, height: 844 }, isMobile: true });
try {
  const page = await context.newPage();
  await page.goto(`${server.url}/`);
  await page.waitForFunction(() => (window as unknown as { harness?: unknown }).harness !== undefined);
  console.log(`Chromium ${context.browser()?.version() ?? ''}, ${cpus().length} cores; ${DROPS} drops into a store holding half; ${RUNS} runs`);
  const totals: number[] = [];
  const previews: number[] = [];
  const phases = new Map<string, number[]>();
  for (let run = 0; run < RUNS; run++) {
    const before = load();
    const f = await page.evaluate((n) => (window as unknown as { harness: Harness }).harness.benchImport(n), DROPS);
    if (f.stored !== f.records) throw new Error(`the store holds ${f.stored} records after the import, not ${f.records}`);
    totals.push(f.total_ms);
    previews.push(f.preview_ms);
    for (const [k, v] of Object.entries(f.phases)) phases.set(k, [...(phases.get(k) ?? []), v]);
    console.log(
      `  run ${run + 1} (load ${before} → ${load()}): ${s(f.total_ms)} in all, preview ${s(f.preview_ms)}; ${f.added} added; ` +
        Object.entries(f.phases).map(([k, v]) => `${k} ${s(v)}`).join(', '),
    );
  }
  const m = median(totals);
  console.log(`import of ${DROPS} drops, median of ${RUNS}: ${s(m)} (target ≤ 3.00 s: ${m <= 3000 ? 'met' : 'MISSED'}); preview alone ${s(median(previews))}; load ${load()}`);
  console.log(`  by phase (medians): ${[...phases].map(([k, v]) => `${k} ${s(median(v))}`).join(', ')}`);
} finally {
  await context.close();
  await server.close();
  await rm(dir, { recursive: true, force: true });
  await rm(profile, { recursive: true, force: true });
}
