// Correcting and removing on a phone-sized Chromium with touch: a drop's time corrected with a reason and the C_d
// changing to the physics core's figure for the corrected series; the undo bar; a reading's time changed and the
// series picking up the reading now nearest its start; a series removed and restored. Screenshots of each changed
// screen go to reports/screens/fix/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import AxeBuilder from '@axe-core/playwright';
import { mkdirSync } from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { analyzeSeries, type AnalysisRequest } from '../../src/physics';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser } from './harness';

const SHOTS = 'reports/screens/fix';

// Our own invented scenario: a 210 g ball of 95 mm dropped from 12 m; two air readings of one morning.
const TIMES = [1.597, 1.601, 1.652, 1.594, 1.598];
const WARM = { temperature_C: 17.5, pressure_Pa: 96_120, pressure_reference: 'station' as const, relative_humidity_pct: 55 };
const COLD = { ...WARM, temperature_C: 4 };
const request = (times: number[], air = WARM): AnalysisRequest => ({
  site: { latitude_deg: 46.1, elevation_m: 430 },
  air,
  specimen: { mass_kg: 0.21, shape: 'sphere', diameter_m: 0.095 },
  drops: times.map((time_s) => ({ height_m: 12, time_s })),
  timing: { standard_uncertainty_s: 0.02, offset: 'none' },
  uncertainty: { height_m: 0.01, mass_kg: 0.0005, diameter_m: 0.0002, temperature_C: 0.3, pressure_Pa: 50, relative_humidity_pct: 3 },
});
const cdOf = (times: number[], air = WARM) => analyzeSeries(request(times, air)).drag_coefficient!.toFixed(3);

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

async function axe(page: Page, name: string): Promise<void> {
  const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  expect(result.violations.map((v) => `${name}: ${v.id} ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
}

/** An instant `minutes` from now as the page's local "YYYY-MM-DDTHH:MM" (what a datetime-local input takes). */
const localInput = (page: Page, minutes: number) =>
  page.evaluate((m) => {
    const d = new Date(Date.now() + m * 60_000);
    const p = (n: number) => String(n).padStart(2, '0');
    return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}T${p(d.getHours())}:${p(d.getMinutes())}`;
  }, minutes);

const box = (page: Page, name: RegExp | string) => page.getByRole('textbox', { name }).first();
const cd = (page: Page, value: string) => expectVisible(page.getByTestId('cd-value').getByText(value));

describe.skipIf(!haveChromium)('correcting, removing and undoing on the phone', () => {
  let browser: Browser;
  let page: Page;
  let errors: string[];
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    browser = await launchBrowser();
    page = await (await browser.newContext(PHONE)).newPage();
    errors = collectErrors(page);
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('sets up a day with two readings, a specimen and a series of five drops', async () => {
    await page.goto(`${baseUrl}/`);
    await expectVisible(page.getByRole('heading', { name: 'Start a test day' }));
    await box(page, 'Site name').fill('Quarry rim');
    await box(page, /^Latitude/).fill('46.1');
    await box(page, /^Longitude/).fill('7.05');
    await box(page, /^Elevation/).fill('430');
    await page.getByRole('button', { name: 'Start the day' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Air readings' }));
    for (const [air, minutes] of [
      [WARM, null],
      [COLD, -180],
    ] as const) {
      await page.getByRole('button', { name: 'Add an air reading' }).click();
      await box(page, /^Air temperature/).fill(String(air.temperature_C));
      await box(page, /^Air pressure/).fill('961.2');
      await page.getByText('Read on site: the air pressure where we stand', { exact: true }).click();
      await box(page, /^Relative humidity/).fill('55');
      if (minutes !== null) await page.getByLabel('Time of the reading').fill(await localInput(page, minutes));
      if (minutes !== null) await shot(page, '01-reading-with-its-time');
      await page.getByRole('button', { name: 'Save reading' }).click();
      await expectVisible(page.getByRole('button', { name: 'Add an air reading' }));
    }
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
    for (const [i, t] of TIMES.entries()) {
      await box(page, /^Fall time/).fill(String(t));
      await page.getByRole('button', { name: `Add drop ${i + 1}` }).click();
      await expectVisible(page.getByRole('heading', { name: `Drop ${i + 2}` }));
    }
    await cd(page, cdOf(TIMES));
    // The series says which reading it uses: the warm one, taken just before it started.
    await expectVisible(page.getByTestId('series-reading').getByText(/nearest in time/));
  });

  it('corrects a drop time only with a reason, recomputes, and shows the old value in the history', async () => {
    await page.getByRole('button', { name: 'Correct or remove drop 3' }).click();
    await page.getByRole('button', { name: 'Correct drop 3' }).click();
    await box(page, /^Fall time/).nth(0);
    const group = page.getByRole('group', { name: 'Correct drop 3' });
    await group.getByRole('textbox', { name: /^Fall time/ }).fill('1.602');
    const save = group.getByRole('button', { name: 'Save the correction' });
    await expect(save.isDisabled()).resolves.toBe(true);
    await group.getByRole('textbox', { name: /Why the correction/ }).fill('typed 1.652 for 1.602');
    await shot(page, '02-drop-correction');
    await axe(page, 'drop correction');
    await save.click();
    const corrected = [...TIMES.slice(0, 2), 1.602, ...TIMES.slice(3)];
    await cd(page, cdOf(corrected));
    await expectVisible(page.locator('.undo-bar').getByText('Drop 3 corrected'));
    await shot(page, '03-corrected-with-undo-bar');
    await page.getByRole('button', { name: 'History of drop 3' }).click();
    await expectVisible(page.getByText('time: 1.652 s → 1.602 s'));
    await expectVisible(page.getByText('Why: typed 1.652 for 1.602'));
    await shot(page, '04-drop-history');
  });

  it('undoes the correction with one tap, as a new version', async () => {
    await page.getByRole('button', { name: 'Correct drop 3' }).click();
    const group = page.getByRole('group', { name: 'Correct drop 3' });
    await group.getByRole('textbox', { name: /^Note/ }).fill('gust at release');
    await group.getByRole('button', { name: 'Save the correction' }).click();
    await page.locator('.undo-bar').getByRole('button', { name: 'Undo' }).click();
    await expectVisible(page.locator('.undo-bar').getByText(/Undone: Drop 3 corrected/));
    const corrected = [...TIMES.slice(0, 2), 1.602, ...TIMES.slice(3)];
    await cd(page, cdOf(corrected));
    await page.getByRole('button', { name: 'History of drop 3' }).click();
    await expectVisible(page.getByText('note: gust at release → —'));
  });

  it('undoes an added drop', async () => {
    await box(page, /^Fall time/).fill('1.9');
    await page.getByRole('button', { name: 'Add drop 6' }).click();
    await expectVisible(page.locator('.undo-bar').getByText('Drop 6 added: 1.900 s'));
    await page.locator('.undo-bar').getByRole('button', { name: 'Undo' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Drop 6' }));
    expect(await page.locator('table.drops tbody tr').count()).toBe(5);
  });

  it('moves a reading’s time and the series picks up the reading now nearest its start', async () => {
    await page.getByRole('link', { name: /Quarry rim/ }).click();
    const warm = page.locator('summary', { hasText: '17.5' });
    await warm.click();
    await page.getByRole('button', { name: /^Correct the reading of/ }).first().click();
    await page.getByLabel('Time of the reading').fill(await localInput(page, -300));
    await shot(page, '05-reading-time-correction');
    await axe(page, 'reading correction');
    await page.getByRole('button', { name: 'Save the correction' }).click();
    await page.locator('a.row-link').first().click();
    const corrected = [...TIMES.slice(0, 2), 1.602, ...TIMES.slice(3)];
    await cd(page, cdOf(corrected, COLD));
    await expectVisible(page.getByTestId('series-reading').getByText(/nearest in time, 1\d\d min before the start/));
    await shot(page, '06-series-picks-the-nearer-reading');
  });

  it('removes a series with a reason and restores it', async () => {
    await page.getByRole('button', { name: 'Remove this series' }).click();
    await box(page, 'Why remove this series?').fill('wrong specimen picked');
    await page.getByRole('button', { name: 'Remove it' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Removed' }));
    await expectVisible(page.getByText(/removed: wrong specimen picked/));
    await expect(page.locator('a.row-link').count()).resolves.toBe(0);
    await shot(page, '07-series-removed');
    await axe(page, 'removed list');
    await page.getByRole('button', { name: /^Restore series/ }).click();
    await box(page, /^Why restore series/).fill('it was the right ball');
    await page.getByRole('button', { name: 'Restore it' }).click();
    await expectVisible(page.locator('a.row-link'));
    await page.locator('a.row-link').first().click();
    const corrected = [...TIMES.slice(0, 2), 1.602, ...TIMES.slice(3)];
    await cd(page, cdOf(corrected, COLD));
    expect(await page.locator('table.drops tbody tr').count()).toBe(5);
    await page.getByRole('button', { name: 'History of this series' }).click();
    await expectVisible(page.getByText('Why: it was the right ball'));
    await shot(page, '08-series-restored-history');
  });

  it('removes the whole day with a reason and restores it from the Log', async () => {
    await page.getByRole('link', { name: /Quarry rim/ }).click();
    await page.getByText('Correct the day or the site').click();
    await page.getByRole('button', { name: 'Remove this day' }).click();
    await box(page, 'Why remove this day?').fill('wrong site chosen');
    await shot(page, '09-day-remove');
    await page.getByRole('button', { name: 'Remove it' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Removed days' }));
    // The only day is gone: the Log says so and where it can come back from, not that the log is empty.
    await expectVisible(page.getByText(/No day is left in the log: the one day was removed/));
    await shot(page, '10-log-removed-days');
    await axe(page, 'removed days');
    await page.getByRole('button', { name: /^Restore day/ }).click();
    await box(page, /^Why restore day/).fill('right site after all');
    await page.getByRole('button', { name: 'Restore it' }).click();
    await page.locator('a.row-link', { hasText: 'Quarry rim' }).click();
    await page.locator('a.row-link').first().click();
    const corrected = [...TIMES.slice(0, 2), 1.602, ...TIMES.slice(3)];
    await cd(page, cdOf(corrected, COLD));
    await page.goto(`${baseUrl}/#/specimens`);
    await page.getByRole('link', { name: /Leather ball/ }).click();
    await page.getByRole('button', { name: 'History of Leather ball 95 mm' }).click();
    await expectVisible(page.getByText('created'));
    await shot(page, '11-specimen-history');
    expect(errors).toEqual([]);
  });

  it('lists the sites in the Log, refuses to remove one a day still uses, and says why', async () => {
    await page.goto(`${baseUrl}/#/log`);
    await expectVisible(page.getByRole('heading', { name: 'Sites' }));
    await page.getByLabel(/^Site Quarry rim/).click();
    await page.getByRole('button', { name: /^Remove the site Quarry rim/ }).click();
    await box(page, /^Why remove the site Quarry rim/).fill('typed twice');
    await page.getByRole('button', { name: 'Remove it' }).click();
    // The store refuses: the day is still at this site, and nothing is removed.
    await expectVisible(page.getByText(/The site “Quarry rim” is still used by 1 day \(\d{4}-\d\d-\d\d\); change or remove it first/));
    await shot(page, '12-log-sites-in-use');
    await axe(page, 'sites in the log');
    expect(errors).toEqual([]);
  });
});
