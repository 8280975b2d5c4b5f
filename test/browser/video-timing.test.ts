// Video timing in the series screen, in the system Chromium at phone size: synthetic clips of a computed fall
// (test/support/fall-scene.ts, written by Debian's ffmpeg as H.264 MP4 and VP9 WebM at 30, 120 and 240 frames/s)
// picked through the real file input; the crew's taps on the still frame; every frame decoded by WebCodecs in
// the worker; the release and the impact the app finds compared with the fall's own instants (within half a
// frame), the fall time with its stated uncertainty; and the refusals (HEVC, a file that is no video, a clip
// with nothing falling) each with its message and nothing stored.
//
// Run time is bounded by small frames (270 × 480) and short clips (1 s): rendering the frames in Node is the
// slow part (a few seconds a clip on this machine).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';
import { clipFolder, findFfmpeg, makeFallClip, makeStillClip, makeUndecodableFile, type ClipCodec, type MadeClip } from '../support/make-clip';
import type { FallSceneOptions } from '../support/fall-scene';

const SHOTS = 'reports/screens/video';
const haveFfmpeg = findFfmpeg().path !== null;

/** Our own invented scene (test data): a 60 mm ball let go 1.2 m above the floor, filmed from the side. */
const SCENE: Omit<FallSceneOptions, 'frame_rate_hz'> = {
  width_px: 270,
  height_px: 480,
  duration_s: 1,
  release_s: 0.2,
  release_height_m: 1.2,
  noise_grey: 2,
  shake_px: 0.2,
  shadow: true,
  scale_heights_m: [0.4, 0.8, 1.2],
};

const CASES: { codec: ClipCodec; fps: number }[] = [
  { codec: 'h264', fps: 30 },
  { codec: 'h264', fps: 120 },
  { codec: 'h264', fps: 240 },
  { codec: 'vp9', fps: 30 },
  { codec: 'vp9', fps: 120 },
  { codec: 'vp9', fps: 240 },
];

const box = (page: Page, name: RegExp | string) => page.getByRole('textbox', { name }).first();

async function numberAttr(page: Page, testId: string, attr: string): Promise<number> {
  return Number(await page.getByTestId(testId).getAttribute(attr));
}

describe.skipIf(!haveChromium || !haveFfmpeg)('video timing in the series screen', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];
  const folder = clipFolder();
  const clips = new Map<string, MadeClip>();

  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    for (const { codec, fps } of CASES) {
      clips.set(`${codec}-${fps}`, await makeFallClip(folder, `fall-${codec}-${fps}`, { ...SCENE, frame_rate_hz: fps, seed: fps + (codec === 'vp9' ? 1 : 0) }, codec));
    }
    browser = await launchBrowser();
    context = await browser.newContext(PHONE);
    page = await context.newPage();
    errors = collectErrors(page);
  }, 600_000);

  afterAll(async () => {
    await browser?.close();
  });

  it('sets up a day and a series timed by video', async () => {
    await page.goto(`${baseUrl}/`);
    await waitForServiceWorker(page);
    await expectVisible(page.getByRole('heading', { name: 'Start a test day' }));
    await box(page, 'Site name').fill('Stairwell wall');
    await box(page, /^Latitude/).fill('46.1');
    await box(page, /^Longitude/).fill('7.05');
    await box(page, /^Elevation/).fill('430');
    await page.getByRole('button', { name: 'Start the day' }).click();
    await page.getByRole('button', { name: 'Add an air reading' }).click();
    await box(page, /^Air temperature/).fill('20');
    await box(page, /^Air pressure/).fill('961.2');
    await page.getByText('Read on site: the air pressure where we stand', { exact: true }).click();
    await box(page, /^Relative humidity/).fill('50');
    await page.getByRole('button', { name: 'Save reading' }).click();
    await page.goto(`${baseUrl}/#/specimens/new`);
    await box(page, 'Name').fill('Ball 60 mm');
    await box(page, /^Mass/).fill('45');
    await box(page, /^Diameter/).fill('60');
    await page.getByRole('button', { name: 'Add to the catalogue' }).click();
    await expectVisible(page.getByText('Ball 60 mm'));
    await page.goto(`${baseUrl}/#/day`);
    await page.getByRole('button', { name: 'Start a series' }).click();
    await page.getByRole('button', { name: /Understood/ }).click();
    await box(page, /^Release height/).fill('1.2');
    await page.getByLabel('Timing method').selectOption('video');
    await page.getByRole('button', { name: 'Start the series' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Drop 1' }));
    await expectVisible(page.getByTestId('clip-pick'));
    await page.screenshot({ path: `${SHOTS}/01-pick.png` });
  });

  it('refuses an HEVC clip, naming its codec and what to do, and stores nothing', async () => {
    const hevc = await makeFallClip(folder, 'fall-hevc', { ...SCENE, frame_rate_hz: 30, duration_s: 0.5 }, 'hevc');
    await page.getByTestId('clip-pick').setInputFiles(hevc.file);
    const notice = page.locator('.video-entry .notice-bad');
    await expectVisible(notice);
    const text = await notice.innerText();
    expect(text).toMatch(/hvc1|hev1/);
    expect(text).toContain('most compatible format (H.264)');
    await page.screenshot({ path: `${SHOTS}/02-hevc-refused.png` });
    expect(await page.getByRole('heading', { name: 'Drop 1' }).count()).toBe(1);
  });

  it('refuses a file that is no video', async () => {
    await page.getByTestId('clip-pick').setInputFiles(makeUndecodableFile(folder));
    const notice = page.locator('.video-entry .notice-bad');
    await expectVisible(notice);
    expect(await notice.innerText()).toContain('undecodable.mp4 is not a video this app reads');
  });

  /** Picks a clip, taps the scene's fall line and landing line, reads every frame; the found strip or a refusal. */
  async function timeClip(made: MadeClip, shot?: string): Promise<void> {
    // A case that failed may have left a clip open: start again from the pick buttons.
    for (const name of ['Pick another clip', 'Discard this clip']) {
      const back = page.getByRole('button', { name });
      if (await back.count()) await back.click();
    }
    await page.getByTestId('clip-pick').setInputFiles(made.file);
    const still = page.getByTestId('clip-still');
    await expectVisible(still);
    const facts = await page.getByTestId('clip-facts').innerText();
    expect(facts).toContain(`${made.scene.width} × ${made.scene.height}`);
    // A tap on the still frame at a full-frame pixel (scrolled into view first, as a crew would).
    const at = async (x: number, y: number) => {
      await still.scrollIntoViewIfNeeded();
      const frame = await still.boundingBox();
      if (!frame) throw new Error('no still frame on screen');
      await still.click({ position: { x: (x / made.scene.width) * frame.width, y: (y / made.scene.height) * frame.height } });
    };
    const { fall_line, landing_y_px } = made.scene.setup;
    const step = page.getByTestId('tap-step');
    await at(fall_line.x0_px, fall_line.y0_px);
    await page.getByText('Tap the bottom of the fall line').waitFor();
    await at(fall_line.x1_px, fall_line.y1_px);
    await page.getByText('Tap the landing line').waitFor();
    await at(fall_line.x1_px, landing_y_px);
    await step.getByText('Ready').waitFor();
    if (shot) await page.screenshot({ path: `${SHOTS}/${shot}-setup.png` });
    await page.getByRole('button', { name: 'Read every frame' }).click();
  }

  for (const { codec, fps } of CASES) {
    it(`finds the release and the impact of a ${codec === 'h264' ? 'H.264' : 'VP9'} clip at ${fps} frames/s within half a frame`, async () => {
      const made = clips.get(`${codec}-${fps}`)!;
      const first = codec === 'h264' && fps === 240;
      await timeClip(made, first ? '03' : undefined);
      await expectVisible(page.getByTestId('clip-found'), 60_000);
      const frame_s = 1 / fps;
      const release = await numberAttr(page, 'found-release', 'data-time-s');
      const impact = await numberAttr(page, 'found-impact', 'data-time-s');
      const time = await numberAttr(page, 'found-time', 'data-time-s');
      const u = await numberAttr(page, 'found-time', 'data-u-s');
      const truth = made.scene.truth;
      expect(Math.abs(release - truth.release_s) / frame_s, `release ${release} s, truth ${truth.release_s} s`).toBeLessThanOrEqual(0.5);
      expect(Math.abs(impact - truth.impact_s) / frame_s, `impact ${impact} s, truth ${truth.impact_s} s`).toBeLessThanOrEqual(0.5);
      // The stated uncertainty covers the error at k = 2 (GUM 6.2: the expanded uncertainty of about 95 %).
      expect(u).toBeGreaterThan(0);
      expect(Math.abs(time - truth.fall_time_s), `fall time ${time} ± ${u} s, truth ${truth.fall_time_s} s`).toBeLessThanOrEqual(2 * u);
      if (first) await page.screenshot({ path: `${SHOTS}/04-found.png`, fullPage: true });
      await page.getByRole('button', { name: 'Make the drop' }).click();
      const saved = page.getByTestId('clip-drop-saved');
      await expectVisible(saved);
      expect(await saved.innerText()).toContain('from the clip');
    }, 120_000);
  }

  it('says so when nothing falls in the clip, and stores nothing', async () => {
    // Each clip above made one drop: the entry waits for the next one (read once the last save has shown).
    const before = `Drop ${CASES.length + 1}`;
    await expect.poll(() => page.getByRole('heading', { name: /^Drop \d+$/ }).innerText(), { timeout: 30_000 }).toBe(before);
    const still = await makeStillClip(folder, { ...SCENE, frame_rate_hz: 60 });
    await timeClip(still);
    const notice = page.locator('.video-entry .notice-bad');
    await expectVisible(notice, 60_000);
    await page.screenshot({ path: `${SHOTS}/05-nothing-falls.png` });
    expect((await notice.innerText()).length).toBeGreaterThan(20);
    expect(await page.getByRole('heading', { name: /^Drop \d+$/ }).innerText()).toBe(before);
    expect(errors.filter((e) => !/Permissions-Policy/.test(e))).toEqual([]);
  }, 120_000);
});
