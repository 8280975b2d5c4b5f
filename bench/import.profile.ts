// A CPU profile of the import benchmark (bench/import.bench.ts) in Chromium, through the DevTools protocol's
// sampling profiler: the page built without minifying, one import of [drops] drops into a store holding half,
// then the functions by self time and by total time. Run: npx tsx bench/import.profile.ts [drops] [top]
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'vite';
import { chromium } from 'playwright-core';
import { startStaticServer } from '../scripts/static-server.mjs';
import type { Harness } from '../test/browser/fixtures/sync-page/main';
import { CHROMIUM_ARGS, findChromium } from '../test/support/chromium';

const DROPS = Number(process.argv[2] ?? 20_000);
const TOP = Number(process.argv[3] ?? 30);
const OUT = process.env.PROFILE_OUT;

interface Node { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; children?: number[] }
interface Profile { nodes: Node[]; samples: number[]; timeDeltas: number[]; startTime: number; endTime: number }

const found = findChromium();
if (!found.path) {
  console.error(`no Chromium: ${found.reason}`);
  process.exit(1);
}
const dir = await mkdtemp(join(tmpdir(), 'plummet-profile-import-'));
await build({
  configFile: false,
  root: fileURLToPath(new URL('../test/browser/fixtures/sync-page/', import.meta.url)),
  logLevel: 'warn',
  define: { __APP_VERSION__: '"test-page"', __BUILD_ID__: '"test-page"' },
  build: { outDir: dir, emptyOutDir: true, target: 'es2022', minify: false, sourcemap: false, reportCompressedSize: false },
});
const server = await startStaticServer({ root: dir });
const profileDir = await mkdtemp(join(tmpdir(), 'plummet-profile-import-profile-'));
const context = await chromium.launchPersistentContext(profileDir, { executablePath: found.path, args: CHROMIUM_ARGS, viewport: { width: 390, height: 844 }, isMobile: true });
try {
  const page = await context.newPage();
  await page.goto(`${server.url}/`);
  await page.waitForFunction(() => (window as unknown as { harness?: unknown }).harness !== undefined);
  const cdp = await context.newCDPSession(page);
  await cdp.send('Profiler.enable');
  await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
  // A first import warms the code up, as a phone that has already imported once would be; then the profiled one,
  // the log made and the store filled before the profile starts (console.profile in the page).
  await page.evaluate((n) => (window as unknown as { harness: Harness }).harness.benchImport(n), Math.min(DROPS, 2000));
  const before = loadavg()[0]!.toFixed(2);
  const finished = new Promise<Profile>((resolve) => cdp.once('Profiler.consoleProfileFinished', (e) => resolve((e as unknown as { profile: Profile }).profile)));
  const f = await page.evaluate((n) => (window as unknown as { harness: Harness }).harness.benchImport(n, true), DROPS);
  const profile = await finished;
  if (OUT) await writeFile(OUT, JSON.stringify(profile));
  console.log(`${DROPS} drops: ${(f.total_ms / 1000).toFixed(2)} s; ${Object.entries(f.phases).map(([k, v]) => `${k} ${(v / 1000).toFixed(2)} s`).join(', ')}; load ${before} → ${loadavg()[0]!.toFixed(2)}`);
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const name = (n: Node) => `${n.callFrame.functionName || '(anonymous)'} ${n.callFrame.url.split('/').pop()}:${n.callFrame.lineNumber + 1}`;
  const self = new Map<string, number>();
  const total = new Map<string, number>();
  let all = 0;
  profile.samples.forEach((id, i) => {
    const dt = profile.timeDeltas[i + 1] ?? 0;
    all += dt;
    const leaf = byId.get(id)!;
    self.set(name(leaf), (self.get(name(leaf)) ?? 0) + dt);
    const seen = new Set<string>();
    for (let at: number | undefined = id; at !== undefined; at = parent.get(at)) {
      const k = name(byId.get(at)!);
      if (seen.has(k)) continue;
      seen.add(k);
      total.set(k, (total.get(k) ?? 0) + dt);
    }
  });
  const table = (m: Map<string, number>) =>
    [...m].sort((a, b) => b[1] - a[1]).slice(0, TOP).map(([k, v]) => `  ${(v / 1000).toFixed(0).padStart(6)} ms ${((100 * v) / all).toFixed(1).padStart(5)} %  ${k}`).join('\n');
  console.log(`sampled ${(all / 1000).toFixed(0)} ms\nby self time:\n${table(self)}\nby total time:\n${table(total)}`);
} finally {
  await context.close();
  await server.close();
  await rm(dir, { recursive: true, force: true });
  await rm(profileDir, { recursive: true, force: true });
}
