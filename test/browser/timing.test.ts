// Sound timing on the real Chromium with its fake microphone playing a WAV file we write: two clicks at
// known samples must be measured to the sample, and silence inserted between them must be refused.
// Then the timer pad itself at phone size: its targets, its accessibility, and taps timed by the touch.
// The fake microphone runs at 44 100 Hz in 10 ms buffers; a 16-bit mono 44.1 kHz file arrives unresampled.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import AxeBuilder from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createRandom } from '../../src/physics/createRandom';
import { PHONE, collectErrors, expectVisible, haveChromium, launchBrowser } from './harness';
import { serveTimingPage, type TimingPage } from './fixtures/timing-page/build';
import type { HeardInterval, TimingHarness } from './fixtures/timing-page/main';
import type { SoundTravel } from '../../src/timing';

const RATE = 44_100;
// Our own test signal: the release tick 1.0 s into the file (clear of the start-up, where Chromium may insert
// a block of zeros), the impact 1.2345 s later. Odd sample numbers, so no block boundary lines up with them.
const RELEASE_SAMPLE = 44_101;
const TRUE_INTERVAL = 54_443;
const IMPACT_SAMPLE = RELEASE_SAMPLE + TRUE_INTERVAL;
const FILE_SAMPLES = 3 * RATE;
/** Exact zeros at the end: with %noloop the last 10 ms buffer repeats, and it must be silence. */
const TAIL_ZEROS = Math.round(0.1 * RATE);

/** A 16-bit mono PCM WAV (RIFF header as in the Microsoft/IBM multimedia spec, 1991). */
function wav(samples: Float32Array): Buffer {
  const data = Buffer.alloc(samples.length * 2);
  samples.forEach((x, i) => data.writeInt16LE(Math.max(-32768, Math.min(32767, Math.round(x * 32768))), i * 2));
  const header = Buffer.alloc(44);
  header.write('RIFF', 0, 'ascii');
  header.writeUInt32LE(36 + data.length, 4);
  header.write('WAVEfmt ', 8, 'ascii');
  header.writeUInt32LE(16, 16);
  header.writeUInt16LE(1, 20); // PCM
  header.writeUInt16LE(1, 22); // mono
  header.writeUInt32LE(RATE, 24);
  header.writeUInt32LE(RATE * 2, 28); // byte rate
  header.writeUInt16LE(2, 32); // block align
  header.writeUInt16LE(16, 34);
  header.write('data', 36, 'ascii');
  header.writeUInt32LE(data.length, 40);
  return Buffer.concat([header, data]);
}

function click(signal: Float32Array, at: number, amplitude: number, frequency_Hz: number, decay_s: number): void {
  for (let n = 0; n < decay_s * RATE * 12 && at + n < signal.length; n++) {
    signal[at + n]! += amplitude * Math.exp(-n / (decay_s * RATE)) * Math.cos((2 * Math.PI * frequency_Hz * n) / RATE);
  }
}

/** Background noise (about −54 dBFS) with a release tick and an impact thud; optional inserted silence. */
function dropRecording(seed: number, zeros?: { at: number; length: number }): Float32Array {
  const random = createRandom(seed);
  const signal = new Float32Array(FILE_SAMPLES);
  for (let i = 0; i < FILE_SAMPLES - TAIL_ZEROS; i++) signal[i] = 0.002 * random.normal();
  click(signal, RELEASE_SAMPLE, 0.15, 2500, 0.001);
  click(signal, IMPACT_SAMPLE, 0.5, 900, 0.004);
  if (zeros) signal.fill(0, zeros.at, zeros.at + zeros.length);
  return signal;
}

function fakeMicrophone(file: string): Promise<Browser> {
  return launchBrowser([
    '--use-fake-ui-for-media-stream',
    '--use-fake-device-for-media-stream',
    `--use-file-for-fake-audio-capture=${file}%noloop`,
    '--autoplay-policy=no-user-gesture-required',
  ]);
}

/** The harness page puts its API on window. */
type Win = { timing: TimingHarness };

// The fake microphone feeds its file in real time from a thread of its own: on a machine whose two cores are busy
// with other tests it has been seen to deliver two 10 ms buffers more than the file holds between the clicks
// (an interval 882 samples too long, in one CI run of many). That is the test device's fault, not the capture's,
// so a run is repeated up to twice; every run must still measure to the exact sample.
describe.skipIf(!haveChromium)('sound timing in Chromium with a fake microphone', { retry: 2 }, () => {
  let site: TimingPage;
  let dir: string;
  const open: Browser[] = [];

  beforeAll(async () => {
    site = await serveTimingPage();
    dir = await mkdtemp(join(tmpdir(), 'plummet-timing-audio-'));
  });
  afterAll(async () => {
    for (const b of open) await b.close().catch(() => undefined);
    await site?.close();
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  /** Opens the harness page in a browser whose microphone plays `signal`, and starts listening. */
  async function run(
    name: string,
    signal: Float32Array,
    options: { offline?: boolean; soundTravel?: SoundTravel; height_m?: number } = {},
  ): Promise<{ page: Page; errors: string[] }> {
    const file = join(dir, name);
    await writeFile(file, wav(signal));
    const browser = await fakeMicrophone(file);
    open.push(browser);
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const errors = collectErrors(page);
    await page.goto(site.url);
    await page.waitForFunction(() => 'timing' in window);
    if (options.offline) await context.setOffline(true);
    const started = await page.evaluate(
      ([travel, height]) => (window as unknown as Win).timing.start(travel, height),
      [options.soundTravel ?? null, options.height_m] as const,
    );
    expect(started).toEqual({ ok: true, sample_rate_Hz: RATE });
    return { page, errors };
  }

  const intervals = (page: Page, count: number): Promise<HeardInterval[]> =>
    page.evaluate((n) => (window as unknown as Win).timing.intervals(n, 8000), count);

  it('measures the interval between two clicks to the sample, offline, with the worklet inside the bundle', async () => {
    // The worklet's module is no separate file: the build is one page and its script.
    expect(site.files.filter((f) => !/\.(js|html)$/.test(f))).toEqual([]);
    const { page, errors } = await run('two-clicks.wav', dropRecording(1), { offline: true });
    const heard = await intervals(page, 1);
    expect(heard).toHaveLength(1);
    const [interval] = heard;
    expect(interval!.problem).toBeNull();
    expect(interval!.frames).toBe(TRUE_INTERVAL);
    expect(interval!.time_s).toBe(TRUE_INTERVAL / RATE);
    expect(interval!.raw.kind).toBe('sound');
    expect(interval!.raw.sample_rate_Hz).toBe(RATE);
    expect(Math.round((interval!.raw.onsets_s[1]! - interval!.raw.onsets_s[0]!) * RATE)).toBe(TRUE_INTERVAL);
    // Nothing else was taken for a sound: the two clicks are the only onsets.
    const onsets = await page.evaluate(() => (window as unknown as Win).timing.onsets());
    expect(onsets.map((o) => o.role)).toEqual(['release', 'impact']);
    // Any silence Chromium inserted (it often does just after start) lies outside the interval.
    const gaps = await page.evaluate(() => (window as unknown as Win).timing.gaps());
    for (const gap of gaps) expect(gap.end_frame <= interval!.release_frame || gap.start_frame >= interval!.impact_frame).toBe(true);
    await page.evaluate(() => (window as unknown as Win).timing.stop());
    expect(errors).toEqual([]);
  });

  it('corrects the heard interval for sound travel', async () => {
    // Phone at the landing point of a 10 m drop, 20 °C: the release is heard 10 m / 343.2 m/s late
    // (ISO 9613-1:1993 reference speed), so the fall took that much longer than the phone heard.
    const { page } = await run('travel.wav', dropRecording(2), {
      soundTravel: { distance_to_release_m: 10, distance_to_landing_m: 0, speed_of_sound_m_s: 343.2 },
      height_m: 10,
    });
    const [interval] = await intervals(page, 1);
    expect(interval!.frames).toBe(TRUE_INTERVAL);
    expect(interval!.sound_travel_correction_s).toBeCloseTo(10 / 343.2, 12);
    expect(interval!.time_s).toBeCloseTo(TRUE_INTERVAL / RATE + 10 / 343.2, 12);
    // The capture carries the correction as data (inputs and value), ready for the drop record, and the
    // time follows from the capture alone.
    expect(interval!.raw.sound_travel).toEqual({
      distance_to_release_m: 10,
      distance_to_landing_m: 0,
      speed_of_sound_m_s: 343.2,
      temperature_C: null,
      correction_s: interval!.sound_travel_correction_s,
    });
    const [release, impact] = interval!.raw.onsets_s;
    expect(impact! - release! + interval!.raw.sound_travel!.correction_s).toBeCloseTo(interval!.time_s!, 12);
  });

  it('refuses the interval when 10 ms of exact silence lie between release and impact', async () => {
    const zeros = { at: RELEASE_SAMPLE + 20_000, length: 441 };
    const { page } = await run('gap.wav', dropRecording(3, zeros));
    const heard = await intervals(page, 1);
    expect(heard).toHaveLength(1);
    expect(heard[0]!.frames).toBe(TRUE_INTERVAL);
    expect(heard[0]!.time_s).toBeNull();
    expect(heard[0]!.problem?.code).toBe('spans-gap');
    expect(heard[0]!.problem?.message).toMatch(/441 samples of exact silence/);
  });
});

describe.skipIf(!haveChromium)('the timer pad in Chromium at phone size', () => {
  let site: TimingPage;
  let browser: Browser;

  beforeAll(async () => {
    site = await serveTimingPage();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await site?.close();
  });

  async function openPad(): Promise<Page> {
    const page = await (await browser.newContext(PHONE)).newPage();
    await page.goto(site.url);
    await page.waitForFunction(() => 'timing' in window);
    return page;
  }

  it('has Release and Impact targets of at least 64 px and passes an axe scan', async () => {
    const page = await openPad();
    for (const name of ['Release', 'Impact']) {
      const box = await page.getByRole('button', { name }).boundingBox();
      expect(box!.width).toBeGreaterThanOrEqual(64);
      expect(box!.height).toBeGreaterThanOrEqual(64);
    }
    await expectVisible(page.getByRole('group', { name: 'Drop timer' }));
    const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
    expect(result.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
    await page.context().close();
  });

  it('times two touches by their own timestamps, to the 0.1 ms the browser gives', async () => {
    const page = await openPad();
    const cdp = await page.context().newCDPSession(page);
    const release = (await page.getByRole('button', { name: 'Release' }).boundingBox())!;
    const impact = (await page.getByRole('button', { name: 'Impact' }).boundingBox())!;
    // Touches stamped 1.2345 s apart; the page reads them only later, when the test gets round to it.
    const t0 = Date.now() / 1000;
    for (const [box, t] of [
      [release, t0],
      [impact, t0 + 1.2345],
    ] as const) {
      await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: [{ x: box.x + box.width / 2, y: box.y + box.height / 2 }], timestamp: t });
      await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [], timestamp: t + 0.08 });
    }
    await page.waitForFunction(() => (window as unknown as Win).timing.captured().length > 0);
    const captured = await page.evaluate(() => (window as unknown as Win).timing.captured());
    expect(captured).toHaveLength(1);
    expect(captured[0]!.raw.kind).toBe('taps');
    // Chromium coarsens event times to 100 µs outside cross-origin isolation (from memory): allow that.
    expect(Math.abs(captured[0]!.time_s - 1.2345)).toBeLessThanOrEqual(0.0001 + 1e-9);
    await expectVisible(page.getByText('Fall time 1.23'));
    await page.context().close();
  });

  it('works from the keyboard with a visible focus ring, one mark per key press', async () => {
    const page = await openPad();
    // Tab order: Tap, Listen, Release, Impact.
    for (let i = 0; i < 3; i++) await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => {
      const button = document.querySelector('pl-timer-pad')!.shadowRoot!.activeElement as HTMLElement;
      const style = getComputedStyle(button);
      return { text: button.textContent!.trim(), outline: `${style.outlineStyle} ${style.outlineWidth}` };
    });
    expect(focused).toEqual({ text: 'Release', outline: 'solid 4px' });
    // Two marks in quick succession are a double tap, refused with the time and the range. Both are made in one
    // task of the page, so the gap is under a millisecond whatever the machine's load (two key presses sent one
    // after the other from here can be more than the double-tap window apart on a busy machine).
    await page.evaluate(() => {
      const buttons = [...document.querySelector('pl-timer-pad')!.shadowRoot!.querySelectorAll('button')];
      buttons.find((b) => b.textContent!.trim() === 'Release')!.click();
      buttons.find((b) => b.textContent!.trim() === 'Impact')!.click();
    });
    await page.keyboard.press('Tab');
    await expectVisible(page.getByRole('alert').filter({ hasText: /shorter than any fall.*Allowed: a fall time from 0.05 s to 3600 s/ }));
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press(' ');
    await page.waitForTimeout(400);
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => (window as unknown as Win).timing.captured().length > 0);
    await page.waitForTimeout(200);
    const captured = await page.evaluate(() => (window as unknown as Win).timing.captured());
    expect(captured).toHaveLength(1);
    const [release, impact] = (captured[0]!.raw as { timestamps_ms: number[] }).timestamps_ms;
    expect(captured[0]!.time_s).toBeCloseTo((impact! - release!) / 1000, 12);
    expect(captured[0]!.time_s).toBeGreaterThanOrEqual(0.4);
    expect(captured[0]!.time_s).toBeLessThan(5);
    await page.context().close();
  });
});
