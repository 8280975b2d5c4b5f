// Benchmark of video timing on the phone's path, in headless Chromium at 390×844: a 3 s clip at 240 frames/s,
// 1280 × 720, H.264 MP4, picked through the series screen's file input; from the pick to the drop's fall time on
// screen. Run: npm run bench:video [runs]
//
// Measures, per run: opening the clip (container read, limits checked, still frame drawn), reading every frame
// (WebCodecs in the worker, the grey band of each) and finding the fall (motion/), the frames processed per
// second, and the peak memory of the browser's processes (resident set size from /proc, sampled every 50 ms: the
// renderer that runs the page and its worker, and all of the browser's processes together). Targets: the whole
// clip in at most 10 s, peak memory under 300 MB. The median of the runs is reported with the load average.
//
// The clip is drawn by ffmpeg's own filters (a textured, noisy wall; a white disc falling from rest with
// y = y0 + ½·a·(t − t0)² until it lands), which is quick to make at this size; the detector's accuracy is tested
// elsewhere (test/browser/video-timing.test.ts, test/motion/).
import { chromium, type Page } from 'playwright-core';
import { spawnSync } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { readFileSync, readdirSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { CHROMIUM_ARGS, findChromium } from '../test/support/chromium';
import { findFfmpeg } from '../test/support/make-clip';
import { buildApp } from '../test/browser/global-setup';
import { startStaticServer } from '../scripts/static-server.mjs';

const runs = Number(process.argv[2] ?? 3);
const W = 1280;
const H = 720;
const FPS = 240;
const DURATION_S = 3;
/** The disc: rests at row Y0 until T0, then falls with A px/s² (9.81 m/s² at 350 px/m) to the floor at Y1. */
const X = 640;
const Y0 = 80;
const Y1 = 640;
const T0 = 0.8;
const A = 9.81 * 350;
const R = 18;

const chromiumPath = findChromium().path;
const ffmpeg = findFfmpeg().path;
if (!chromiumPath || !ffmpeg) {
  console.error(`needs Chromium and ffmpeg: ${findChromium().reason} ${findFfmpeg().reason}`);
  process.exit(1);
}

function makeClip(file: string): void {
  // A still texture (fixed noise, softened), then noise that changes from frame to frame.
  const wall = `color=c=0x6e6e6e:s=${W}x${H}:r=${FPS}:d=${DURATION_S},noise=alls=40:allf=u,gblur=sigma=1.5,noise=alls=5:allf=t`;
  const disc = `color=c=white:s=${2 * R}x${2 * R}:r=${FPS}:d=${DURATION_S},format=yuva420p,geq=lum=235:cb=128:cr=128:a='if(lt(hypot(X-${R},Y-${R}),${R - 1}),255,0)'`;
  const y = `min(${Y1 - R},${Y0 - R}+if(lt(t,${T0}),0,0.5*${A}*(t-${T0})*(t-${T0})))`;
  const graph = `${wall}[w];${disc}[d];[w][d]overlay=x=${X - R}:y='${y}':eval=frame,format=yuv420p`;
  const out = spawnSync(ffmpeg!, ['-y', '-loglevel', 'error', '-f', 'lavfi', '-i', graph, '-c:v', 'libx264', '-preset', 'veryfast', '-crf', '20', '-r', String(FPS), '-movflags', '+faststart', file], {
    encoding: 'utf8',
  });
  if (out.status !== 0) throw new Error(`ffmpeg: ${out.stderr}`);
}

/** Resident memory of a process and all its descendants, and of the renderers among them, MB. */
function memoryOf(root: number): { total: number; renderer: number } {
  const parent = new Map<number, number>();
  const rss = new Map<number, number>();
  const renderer = new Set<number>();
  for (const name of readdirSync('/proc')) {
    const pid = Number(name);
    if (!Number.isInteger(pid)) continue;
    try {
      const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
      parent.set(pid, Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
      const status = readFileSync(`/proc/${pid}/status`, 'utf8');
      rss.set(pid, Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024);
      if (readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('--type=renderer')) renderer.add(pid);
    } catch {
      // The process ended while we read it.
    }
  }
  const inTree = (pid: number): boolean => {
    for (let p = pid, hops = 0; p > 1 && hops < 20; p = parent.get(p) ?? 0, hops++) if (p === root) return true;
    return false;
  };
  let total = 0;
  let renderers = 0;
  for (const [pid, mb] of rss) {
    if (!inTree(pid)) continue;
    total += mb;
    if (renderer.has(pid)) renderers = Math.max(renderers, mb);
  }
  return { total, renderer: renderers };
}

/** The browser's main process: the one whose command line carries this run's marker. */
function browserPid(marker: string): number {
  for (const name of readdirSync('/proc')) {
    try {
      if (readFileSync(`/proc/${name}/cmdline`, 'utf8').includes(marker) && !readFileSync(`/proc/${name}/cmdline`, 'utf8').includes('--type=')) return Number(name);
    } catch {
      // gone
    }
  }
  throw new Error('browser process not found');
}

async function setUpSeries(page: Page, base: string): Promise<void> {
  const box = (name: RegExp | string) => page.getByRole('textbox', { name }).first();
  await page.goto(`${base}/`);
  await box('Site name').fill('Bench wall');
  await box(/^Latitude/).fill('46.1');
  await box(/^Longitude/).fill('7.05');
  await box(/^Elevation/).fill('430');
  await page.getByRole('button', { name: 'Start the day' }).click();
  await page.getByRole('button', { name: 'Add an air reading' }).click();
  await box(/^Air temperature/).fill('20');
  await box(/^Air pressure/).fill('961.2');
  await page.getByText('Read on site: the air pressure where we stand', { exact: true }).click();
  await box(/^Relative humidity/).fill('50');
  await page.getByRole('button', { name: 'Save reading' }).click();
  await page.goto(`${base}/#/specimens/new`);
  await box('Name').fill('Bench disc 60 mm');
  await box(/^Mass/).fill('45');
  await box(/^Diameter/).fill('60');
  await page.getByRole('button', { name: 'Add to the catalogue' }).click();
  // The catalogue lists it once saved (a bare "Disc" would also match the shape's own option).
  await page.getByText('Bench disc 60 mm').first().waitFor();
  await page.goto(`${base}/#/day`);
  await page.getByRole('button', { name: 'Start a series' }).click();
  await page.getByRole('button', { name: /Understood/ }).click();
  await box(/^Release height/).fill('1.6');
  await page.getByLabel('Timing method').selectOption('video');
  await page.getByRole('button', { name: 'Start the series' }).click();
  await page.getByTestId('clip-pick').waitFor({ state: 'attached' });
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor((xs.length - 1) / 2)]!;

const work = await mkdtemp(join(tmpdir(), 'plummet-bench-video-'));
try {
  const clip = join(work, 'fall-240fps-1280x720.mp4');
  makeClip(clip);
  const dist = join(work, 'dist');
  await buildApp(dist);
  const server = await startStaticServer({ root: dist });
  const marker = `--plummet-bench-video-${process.pid}`;
  const browser = await chromium.launch({ executablePath: chromiumPath, args: [...CHROMIUM_ARGS, marker] });
  const root = browserPid(marker);
  const results: { open_ms: number; read_ms: number; total_ms: number; fps: number; renderer_MB: number; total_MB: number; load: number }[] = [];
  try {
    for (let run = 0; run < runs; run++) {
      const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });
      const page = await context.newPage();
      await setUpSeries(page, server.url);
      let peak = { total: 0, renderer: 0 };
      const sampler = setInterval(() => {
        const m = memoryOf(root);
        peak = { total: Math.max(peak.total, m.total), renderer: Math.max(peak.renderer, m.renderer) };
      }, 50);
      const t0 = performance.now();
      await page.getByTestId('clip-pick').setInputFiles(clip);
      const still = page.getByTestId('clip-still');
      await still.waitFor({ timeout: 60_000 });
      const t1 = performance.now();
      const at = async (x: number, y: number) => {
        await still.scrollIntoViewIfNeeded();
        const box = (await still.boundingBox())!;
        await still.click({ position: { x: (x / W) * box.width, y: (y / H) * box.height } });
      };
      await at(X, Y0 - 40);
      await page.getByText('Tap the bottom of the fall line').waitFor();
      // The floor is where the disc's bottom rests: its centre stops at Y1.
      await at(X, Y1 + R);
      await page.getByText('Tap the landing line').waitFor();
      await at(X, Y1 + R);
      await page.getByText('Ready').waitFor();
      const t2 = performance.now();
      await page.getByRole('button', { name: 'Read every frame' }).click();
      const found = page.getByTestId('found-time');
      const refused = page.locator('.video-entry .notice-bad');
      await Promise.race([found.waitFor({ timeout: 120_000 }), refused.waitFor({ timeout: 120_000 })]);
      const t3 = performance.now();
      clearInterval(sampler);
      if (await refused.count()) throw new Error(`refused: ${await refused.innerText()}`);
      const frames = FPS * DURATION_S;
      const time = Number(await found.getAttribute('data-time-s'));
      const open_ms = t1 - t0;
      const read_ms = t3 - t2;
      results.push({ open_ms, read_ms, total_ms: open_ms + read_ms, fps: frames / ((open_ms + read_ms) / 1000), renderer_MB: peak.renderer, total_MB: peak.total, load: loadavg()[0]! });
      console.log(
        `run ${run + 1}: open ${open_ms.toFixed(0)} ms, read and find ${read_ms.toFixed(0)} ms, total ${(open_ms + read_ms).toFixed(0)} ms (${(frames / ((open_ms + read_ms) / 1000)).toFixed(0)} frames/s), fall time ${time.toFixed(4)} s (drawn: ${Math.sqrt((2 * (Y1 - Y0)) / A).toFixed(4)} s), peak renderer ${peak.renderer.toFixed(0)} MB, all processes ${peak.total.toFixed(0)} MB, load ${loadavg()
          .map((l) => l.toFixed(2))
          .join(' ')}`,
      );
      await context.close();
    }
  } finally {
    await browser.close();
    await server.close();
  }
  const total = median(results.map((r) => r.total_ms));
  const renderer = median(results.map((r) => r.renderer_MB));
  console.log(
    `\nmedian of ${results.length} runs (${cpus().length} cores, load ${loadavg()
      .map((l) => l.toFixed(2))
      .join(' ')}): ${FPS * DURATION_S} frames of ${W}×${H} in ${(total / 1000).toFixed(2)} s (${((FPS * DURATION_S) / (total / 1000)).toFixed(0)} frames/s; target ≤ 10 s: ${total <= 10_000 ? 'met' : 'MISSED'}), open ${median(results.map((r) => r.open_ms)).toFixed(0)} ms, read and find ${median(results.map((r) => r.read_ms)).toFixed(0)} ms; peak renderer memory ${renderer.toFixed(0)} MB (target < 300 MB: ${renderer < 300 ? 'met' : 'MISSED'}), all of the browser's processes ${median(results.map((r) => r.total_MB)).toFixed(0)} MB`,
  );
} finally {
  await rm(work, { recursive: true, force: true });
}
