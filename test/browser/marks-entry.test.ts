// A series timed by three gates, entered as a crew enters it on a phone at 390×844 in Chromium with its real
// IndexedDB: the gates' distances typed once with the series, then five drops of three gate times each (Enter
// moves to the next gate, the last adds the drop), stored, the page reloaded, the tables exported with the
// marks in their own CSV. Screenshots in reports/screens/marks/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';
import { parseCsv } from '../log/csv-reader';

const SHOTS = 'reports/screens/marks';
const GATES = [0.5, 1, 1.5];
// Our own invented gate times (demo data): a vacuum fall t = √(2d/g), g = 9.81 m/s², gives 0.319, 0.452 and
// 0.553 s; a ball loses a little to drag, and the drops scatter by a millisecond or two.
const DROPS = [
  [0.321, 0.455, 0.557],
  [0.322, 0.456, 0.559],
  [0.32, 0.454, 0.556],
  [0.323, 0.457, 0.56],
  [0.321, 0.455, 0.558],
];

const box = (page: Page, name: RegExp | string) => page.getByRole('textbox', { name }).first();

describe.skipIf(!haveChromium)('a gates series typed on the phone', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    browser = await launchBrowser();
    context = await browser.newContext({ ...PHONE, acceptDownloads: true });
    page = await context.newPage();
    errors = collectErrors(page);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('starts a series with three gates, their distances typed once', async () => {
    await page.goto(`${baseUrl}/`);
    await waitForServiceWorker(page);
    await expectVisible(page.getByRole('heading', { name: 'Start a test day' }));
    await box(page, 'Site name').fill('Stairwell west');
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
    await box(page, 'Name').fill('Steel ball 25 mm');
    await box(page, /^Mass/).fill('64');
    await box(page, /^Diameter/).fill('25');
    await page.getByRole('button', { name: 'Add to the catalogue' }).click();
    await expectVisible(page.getByText('Steel ball 25 mm'));
    await page.goto(`${baseUrl}/#/day`);
    await page.getByRole('button', { name: 'Start a series' }).click();
    await page.getByRole('button', { name: /Understood/ }).click();
    await box(page, /^Release height/).fill('1.5');
    await page.getByLabel('Timing method').selectOption('gates');
    await expectVisible(page.getByTestId('gate-distances'));
    // A gate above the one before is named with its value.
    await box(page, /^Gate 1/).fill('0.5');
    await box(page, /^Gate 2/).fill('0.4');
    await box(page, /^Gate 3/).focus();
    await expectVisible(page.getByText(/Gate 2 at .* must be further down than gate 1/));
    await page.getByTestId('gate-distances').scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/01-gates-out-of-order.png` });
    for (const [i, g] of GATES.entries()) await box(page, new RegExp(`^Gate ${i + 1}`)).fill(String(g));
    await page.screenshot({ path: `${SHOTS}/02-gates-typed.png` });
    await page.getByRole('button', { name: 'Start the series' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Drop 1' }));
    await expectVisible(page.getByTestId('marks-entry'));
    await page.screenshot({ path: `${SHOTS}/03-gate-times-empty.png` });
  });

  it('takes five drops of three gate times each, Enter moving from gate to gate and the last adding the drop', async () => {
    await box(page, /^Gate 1 time/).tap();
    for (const [k, times] of DROPS.entries()) {
      for (const t of times) {
        await page.keyboard.type(String(t));
        await page.keyboard.press('Enter');
      }
      await expectVisible(page.getByTestId('drop-saved').getByText(`Drop ${k + 1} saved: 3 marks, the last at ${times[2]!.toFixed(3)} s`));
      await expectVisible(page.getByRole('heading', { name: `Drop ${k + 2}` }));
      if (k === 1) await page.screenshot({ path: `${SHOTS}/04-two-drops.png` });
    }
    expect(await page.locator('table.drops tbody tr').count()).toBe(5);
    await expectVisible(page.getByRole('heading', { name: 'Marks along the fall' }));
    await page.getByRole('heading', { name: 'Marks along the fall' }).scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/05-marks-chart.png` });
    await page.screenshot({ path: `${SHOTS}/05-five-drops.png`, fullPage: true });
  });

  it('keeps the drops and their marks across a reload, and exports the marks in their own CSV table', async () => {
    await page.reload();
    await expectVisible(page.getByRole('heading', { name: 'Drop 6' }));
    expect(await page.locator('table.drops tbody tr').count()).toBe(5);
    await page.goto(`${baseUrl}/#/send`);
    const downloads: { name: string; path: string }[] = [];
    page.on('download', async (d) => downloads.push({ name: d.suggestedFilename(), path: (await d.path())! }));
    await page.getByRole('button', { name: 'Tables for a spreadsheet (CSV)' }).click();
    await expect.poll(() => downloads.length, { timeout: 20_000 }).toBe(3);
    await expectVisible(page.getByTestId('send-message').getByText(/three CSV files/));
    await page.screenshot({ path: `${SHOTS}/06-three-tables.png` });
    const marks = downloads.find((d) => d.name.endsWith('-marks.csv'))!;
    const [header, ...rows] = parseCsv(readFileSync(marks.path, 'utf8').replace(/^\ufeff/, ''));
    const at = (name: string) => header!.indexOf(name);
    expect(rows).toHaveLength(15);
    expect(rows.map((r) => [Number(r[at('seq')]), Number(r[at('mark_index')]), Number(r[at('distance_m')]), Number(r[at('time_s')])])).toEqual(
      DROPS.flatMap((times, k) => times.map((t, i) => [k + 1, i + 1, GATES[i], t])),
    );
    const series = downloads.find((d) => d.name.endsWith('-series.csv'))!;
    expect(readFileSync(series.path, 'utf8')).toContain('0.5 1 1.5');
    expect(errors).toEqual([]);
  });
});
