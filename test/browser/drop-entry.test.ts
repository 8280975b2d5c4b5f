// A series entered as a crew enters it on a phone: ten drops typed with Enter only (focus stays in the time
// field), a time faster than a fall in vacuum refused at the door with the drop number and the vacuum time, the
// verdict withheld until five drops and then shown at the top, the C_d the physics core computes for the same
// times, and the end-of-day summary reading the same verdict. Keystrokes and taps per drop are counted.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { analyzeSeries, type AnalysisRequest } from '../../src/physics';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';

const SHOTS = 'reports/screens/entry';

// Our own invented scenario (demo data): a 210 g ball of 95 mm dropped ten times from 12 m.
const TIMES = [1.597, 1.601, 1.612, 1.594, 1.598, 1.605, 1.603, 1.596, 1.608, 1.6];
const request = (times: number[]): AnalysisRequest => ({
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air: { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station', relative_humidity_pct: 55 },
  specimen: { mass_kg: 0.21, shape: 'sphere', diameter_m: 0.095 },
  drops: times.map((time_s) => ({ height_m: 12, time_s })),
  timing: { standard_uncertainty_s: 0.02, offset: 'none' },
  uncertainty: { height_m: 0.01, mass_kg: 0.0005, diameter_m: 0.0002, temperature_C: 0.3, pressure_Pa: 50, relative_humidity_pct: 3 },
});

const box = (page: Page, name: RegExp | string) => page.getByRole('textbox', { name }).first();

describe.skipIf(!haveChromium)('a drop in one motion', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    browser = await launchBrowser();
    context = await browser.newContext(PHONE);
    page = await context.newPage();
    errors = collectErrors(page);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('sets up a day, a reading, a specimen and a typed series', async () => {
    await page.goto(`${baseUrl}/`);
    await waitForServiceWorker(page);
    await expectVisible(page.getByRole('heading', { name: 'Start a test day' }));
    await box(page, 'Site name').fill('North meadow mast');
    await box(page, /^Latitude/).fill('46.1');
    await box(page, /^Longitude/).fill('7.05');
    await box(page, /^Elevation/).fill('430');
    await page.getByRole('button', { name: 'Start the day' }).click();
    await page.getByRole('button', { name: 'Add an air reading' }).click();
    await box(page, /^Air temperature/).fill('17.5');
    await box(page, /^Air pressure/).fill('961.2');
    await page.getByText('Read on site: the air pressure where we stand', { exact: true }).click();
    await box(page, /^Relative humidity/).fill('55');
    await page.getByRole('button', { name: 'Save reading' }).click();
    await page.goto(`${baseUrl}/#/specimens/new`);
    await box(page, 'Name').fill('Leather ball 95 mm');
    await box(page, /^Mass/).fill('210');
    await box(page, /^Diameter/).fill('95');
    await page.getByRole('button', { name: 'Add to the catalogue' }).click();
    await expectVisible(page.getByText('Leather ball 95 mm'));
    await page.goto(`${baseUrl}/#/day`);
    await page.getByRole('button', { name: 'Start a series' }).click();
    await page.getByRole('button', { name: /Understood/ }).click();
    await box(page, /^Release height/).fill('12');
    await page.getByLabel('Timing method').selectOption('typed');
    await page.getByRole('button', { name: 'Start the series' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Drop 1' }));
    await page.screenshot({ path: `${SHOTS}/01-series-empty.png` });
  });

  it('enters ten drops with Enter only, the verdict withheld until five, then at the top', async () => {
    // Count what the crew does: every key pressed and every touch, from here on.
    await page.evaluate(() => {
      const w = window as unknown as { keys: number; taps: number };
      w.keys = 0;
      w.taps = 0;
      document.addEventListener('keydown', () => w.keys++, true);
      document.addEventListener('pointerdown', () => w.taps++, true);
    });
    await page.getByRole('textbox', { name: /^Fall time/ }).first().tap();
    for (const [i, t] of TIMES.entries()) {
      // No click between drops: the focus must still be in the time field after the previous Enter.
      await page.keyboard.type(String(t));
      await page.keyboard.press('Enter');
      await expectVisible(page.getByTestId('drop-saved').getByText(`Drop ${i + 1} saved: ${t.toFixed(3)} s`));
      await expectVisible(page.getByRole('heading', { name: `Drop ${i + 2}` }));
      const line = (await page.getByTestId('verdict-line').textContent()) ?? '';
      if (i + 1 < 5) expect(line).toBe(`Verdict after 5 drops (${i + 1} so far)`);
      else expect(line).toMatch(/^Target (met|not met yet): /);
      if (i === 2) await page.screenshot({ path: `${SHOTS}/02-three-drops-no-verdict.png` });
      // The verdict is pinned at the top and the Add control stays on screen while entering.
      const bar = (await page.getByTestId('verdict-bar').boundingBox())!;
      expect(bar.y).toBeGreaterThanOrEqual(0);
      expect(bar.y).toBeLessThan(160);
      const add = (await page.getByRole('button', { name: `Add drop ${i + 2}` }).boundingBox())!;
      expect(add.y + add.height).toBeLessThanOrEqual(844);
    }
    const counts = await page.evaluate(() => {
      const w = window as unknown as { keys: number; taps: number };
      return { keys: w.keys, taps: w.taps };
    });
    // One tap into the field for the whole series; per drop the digits of the time and Enter.
    const typedChars = TIMES.reduce((n, t) => n + String(t).length, 0);
    expect(counts.taps).toBe(1);
    expect(counts.keys).toBe(typedChars + TIMES.length);
    console.log(`typed entry: ${counts.taps} tap(s) for ${TIMES.length} drops, ${counts.keys} keystrokes (${(counts.keys / TIMES.length).toFixed(1)} per drop, Enter included)`);
    const expected = analyzeSeries(request(TIMES));
    await expectVisible(page.getByTestId('verdict-bar').getByText(`C_d ${expected.drag_coefficient!.toFixed(3)}`));
    await expectVisible(page.getByTestId('cd-value').getByText(expected.drag_coefficient!.toFixed(3)));
    await expectVisible(page.getByTestId('cd-meaning'));
    // Under the drop table: how far the prediction itself may be off (the standard sphere curve's own uncertainty).
    const spread = expected.prediction.heights![0]!.time_standard_uncertainty_s;
    const curve = expected.prediction.drag_coefficient_relative_standard_uncertainty!;
    await expectVisible(page.getByTestId('prediction-spread').getByText(`±${(spread * 1000).toFixed(1)} ms (one standard uncertainty), from the standard sphere curve’s own ±${(curve * 100).toFixed(0)} % in C_d`, { exact: false }));
    await page.getByTestId('prediction-spread').scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/04b-prediction-spread.png` });
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: `${SHOTS}/03-ten-drops-verdict-top.png` });
    await page.screenshot({ path: `${SHOTS}/04-ten-drops-full.png`, fullPage: true });
  });

  it('refuses a time shorter than a fall in vacuum, naming the drop, the vacuum time and what to check', async () => {
    await page.keyboard.type('1.2');
    await page.keyboard.press('Enter');
    // 12 m at the site's normal gravity (about 9.806 m/s²): √(24/9.806) = 1.564 s (h = ½·g·t²).
    await expectVisible(page.getByText(/Drop 11: 1\.200 s is shorter than a fall in vacuum from 12\.00 m \(1\.564 s\)/));
    await expectVisible(page.getByRole('heading', { name: 'Drop 11' }));
    await page.screenshot({ path: `${SHOTS}/05-too-fast-refused.png` });
    const rows = await page.locator('table.drops tbody tr').count();
    expect(rows).toBe(10);
  });

  it('shows the same verdict in the day’s list and in the end-of-day summary', async () => {
    const line = (await page.getByTestId('verdict-line').textContent()) ?? '';
    await page.goto(`${baseUrl}/#/day`);
    await expectVisible(page.getByTestId('row-verdict').getByText(line));
    await page.screenshot({ path: `${SHOTS}/06-day-rows.png`, fullPage: true });
    await page.getByRole('link', { name: /summary|end of the day/i }).first().click();
    await expectVisible(page.getByTestId('summary-verdict').getByText(line));
    await page.screenshot({ path: `${SHOTS}/07-summary.png`, fullPage: true });
    expect(errors).toEqual([]);
  });
});
