// A day in US customary units on a phone-sized Chromium: one switch in Settings, a site typed in degrees,
// minutes and seconds, a cool reading in °F, a series whose whole screen is read for any metric unit; every
// screen's controls measured as tap targets; the Send screen saying what happened to each file and naming the
// files by site and date. Screenshots in reports/screens/units/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { analyzeSeries, type AnalysisRequest } from '../../src/physics';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';

const SHOTS = 'reports/screens/units';

// Our own invented scenario: a 7.41 oz ball of 3.74 in dropped from 39.37 ft on a cool morning.
const FT = 0.3048; // international foot (NIST SP 811, B.8)
const TIMES = [1.597, 1.601, 1.612, 1.594, 1.598];
const request = (times: number[]): AnalysisRequest => ({
  site: { latitude_deg: 46 + 6 / 60 + 30 / 3600, elevation_m: 1410 * FT },
  air: {
    temperature_C: ((57.2 - 32) * 5) / 9,
    pressure_Pa: 28.4 * 3386.389, // conventional inch of mercury (NIST SP 811, B.8)
    pressure_reference: 'station',
    relative_humidity_pct: 55,
  },
  specimen: { mass_kg: (7.41 * 0.45359237) / 16, shape: 'sphere', diameter_m: 3.74 * 0.0254 },
  drops: times.map((time_s) => ({ height_m: 39.37 * FT, time_s })),
  timing: { standard_uncertainty_s: 0.02, offset: 'none' },
  uncertainty: { height_m: 0.01, mass_kg: 0.0005, diameter_m: 0.0002, temperature_C: 0.3, pressure_Pa: 50, relative_humidity_pct: 3 },
});

// A number followed by a metric symbol, or a metric symbol in brackets as a column's unit.
const METRIC =
  /(\d\s*(mm|cm|km|m|kg|g|°C|hPa|kPa|Pa|J|N|m\/s²|m\/s|kg\/m³|µPa·s)(?![\p{L}\d/²³]))|\((mm|cm|m|kg|g|°C|hPa|Pa|J|m\/s)\)|kg\/m³|°C|hPa|µPa|metres|kilogram/u;

const box = (page: Page, name: RegExp | string) => page.getByRole('textbox', { name }).first();

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${SHOTS}/${name}.png`, fullPage: true });
}

/** Every visible control smaller than 44 × 44 CSS px (WCAG 2.5.5), by a short description. */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    const seen = new Set<Element>();
    const visit = (root: Document | ShadowRoot) => {
      for (const el of root.querySelectorAll('*')) {
        if (el.shadowRoot) visit(el.shadowRoot);
        const tag = el.tagName.toLowerCase();
        let target: Element | null = null;
        if (tag === 'button' || tag === 'select' || tag === 'summary' || tag === 'textarea') target = el;
        else if (tag === 'a' && (el as HTMLAnchorElement).href) target = el;
        else if (tag === 'input') {
          const type = (el as HTMLInputElement).type;
          if (type === 'hidden' || type === 'file') continue;
          // A checkbox or a radio button is tapped through its label.
          target = type === 'checkbox' || type === 'radio' ? (el.closest('label') ?? el) : el.closest('.row') ?? el;
        }
        if (!target || seen.has(target)) continue;
        seen.add(target);
        const r = target.getBoundingClientRect();
        if (r.width === 0 && r.height === 0) continue; // not shown
        if (r.height < 44 || r.width < 44) {
          const text = (target.textContent ?? '').trim().replace(/\s+/g, ' ').slice(0, 40);
          out.push(`${tag} "${text || target.getAttribute('aria-label') || ''}" ${Math.round(r.width)}×${Math.round(r.height)}`);
        }
      }
    };
    visit(document);
    return out;
  });
}

describe.skipIf(!haveChromium)('units, whole, and sending that says what happened', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];
  let seriesUrl = '';
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

  it('switches every unit to US customary with one choice in Settings', async () => {
    await page.goto(`${baseUrl}/#/settings`);
    await waitForServiceWorker(page);
    await page.getByText('US customary (ft, °F, inHg)', { exact: true }).click();
    await page.getByText('Choose the unit of each quantity').click();
    for (const [label, symbol] of [
      ['Heights and distances', 'ft'],
      ['Temperature', '°F'],
      ['Pressure', 'inHg'],
      ['Air density', 'lb/ft³'],
      ['Gravity', 'ft/s²'],
    ] as const) {
      await expect.poll(() => page.getByLabel(label, { exact: true }).inputValue()).toBe(symbol);
    }
    await shot(page, '01-settings-units');
  });

  it('starts a day at a site typed in degrees, minutes and seconds with hemisphere letters', async () => {
    await page.goto(`${baseUrl}/#/day`);
    await box(page, 'Site name').fill('Tower Hill');
    await box(page, /^Latitude/).fill(`46°06'30" N`);
    await box(page, /^Longitude/).fill(`8°15' W`);
    await box(page, /^Elevation/).fill('1410');
    await shot(page, '02-start-day-dms');
    await page.getByRole('button', { name: 'Start the day' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Air readings' }));
    // 46°06'30" = 46.1083°; 8°15' W = -8.25° (1° = 60′ = 3600″).
    await expectVisible(page.getByText(/46\.1083° N, 8\.2500° W/));
  });

  it('takes a cool reading in °F and inHg and prints it without floating-point tails', async () => {
    await page.getByRole('button', { name: 'Add an air reading' }).click();
    await box(page, /^Air temperature/).fill('57.2');
    await box(page, /^Air pressure/).fill('28.40');
    await page.getByText('Read on site: the air pressure where we stand', { exact: true }).click();
    await box(page, /^Relative humidity/).fill('55');
    // 57.2 °F is 14.000000000000004 °C inside: below the 15–27 °C CIPM-2007 range (59–81 °F).
    await expectVisible(page.getByText(/Air temperature 57\.2 °F is outside 59–81 °F/));
    const text = await page.locator('main').innerText();
    expect(text).not.toMatch(/\d\.\d*0{6,}\d/);
    expect(text).not.toMatch(METRIC);
    await shot(page, '03-reading-us');
    await page.getByRole('button', { name: 'Save reading' }).click();
    await expectVisible(page.locator('.row', { hasText: 'on site' }));
  });

  it('adds a specimen in ounces and inches from inside the series form, and runs a series of five drops', async () => {
    await page.getByRole('button', { name: 'Start a series' }).click();
    await page.getByRole('button', { name: /Understood/ }).click();
    // The catalogue is empty: the specimen is made right here, without leaving the day.
    await expectVisible(page.getByText(/The specimen catalogue is empty/));
    await box(page, 'Name').fill('Leather ball 3.74 in');
    await box(page, /^Mass/).fill('7.41');
    await box(page, /^Diameter/).fill('3.74');
    await shot(page, '03b-specimen-inside-series-form');
    await page.getByRole('button', { name: 'Add to the catalogue' }).click();
    await expect.poll(() => page.getByLabel('Specimen', { exact: true }).locator('option:checked').textContent()).toBe('Leather ball 3.74 in');
    expect(page.url()).toContain('#/day');
    await box(page, /^Release height/).fill('39.37');
    await page.getByLabel('Timing method').selectOption('typed');
    await page.getByRole('button', { name: 'Start the series' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Drop 1' }));
    for (const [i, t] of TIMES.entries()) {
      await box(page, /^Fall time/).fill(String(t));
      await page.getByRole('button', { name: `Add drop ${i + 1}` }).click();
      await expectVisible(page.getByRole('heading', { name: `Drop ${i + 2}` }));
    }
    seriesUrl = page.url();
    const expected = analyzeSeries(request(TIMES));
    await expectVisible(page.getByTestId('cd-value').getByText(expected.drag_coefficient!.toFixed(3)));
  });

  it('shows no metric unit anywhere in the series screen’s text', async () => {
    await expectVisible(page.getByRole('heading', { name: 'Fall time, drop by drop' }));
    const text = await page.locator('main').innerText();
    const metric = text.split('\n').filter((line) => METRIC.test(line));
    expect(metric).toEqual([]);
    // The figures are there, in US units: air density in lb/ft³, gravity in ft/s².
    expect(text).toMatch(/lb\/ft³/);
    expect(text).toMatch(/ft\/s²/);
    // The last column says which way round it is, and no value prints as a negative zero.
    expect(text).toMatch(/t − pred\./);
    expect(text).not.toMatch(/-0\.0(?!\d*[1-9])/);
    await shot(page, '04-series-us');
  });

  it('keeps every control of every screen at least 44 px in each direction', async () => {
    const screens = ['#/day', seriesUrl.slice(seriesUrl.indexOf('#')), '#/plan', '#/specimens', '#/specimens/new', '#/log', '#/send', '#/settings'];
    const found: string[] = [];
    for (const hash of screens) {
      await page.goto(`${baseUrl}/${hash}`);
      await page.waitForTimeout(500);
      if (hash === '#/settings') await page.getByText('Choose the unit of each quantity').click();
      found.push(...(await smallTargets(page)).map((t) => `${hash}: ${t}`));
    }
    await page.goto(`${baseUrl}/#/day`);
    await page.getByRole('link', { name: 'End of the day' }).click();
    await expectVisible(page.getByRole('heading', { name: 'End of the day' }));
    found.push(...(await smallTargets(page)).map((t) => `summary: ${t}`));
    await shot(page, '05-day-summary-us');
    expect(found).toEqual([]);
  });

  it('says a JSON file was saved as a file on this phone, next to the button, named by site and date', async () => {
    await page.goto(`${baseUrl}/#/send`);
    const button = page.getByRole('button', { name: 'Send as a log file (JSON)' });
    const [download] = await Promise.all([page.waitForEvent('download'), button.click()]);
    const message = page.getByTestId('send-message');
    await expectVisible(message.getByText(/^Saved as a file on this phone/));
    expect(await message.getAttribute('role')).toBe('status');
    // The message sits under the button that caused it and is in view.
    const [b, m] = [await button.boundingBox(), await message.boundingBox()];
    expect(m!.y).toBeGreaterThan(b!.y);
    expect(m!.y - (b!.y + b!.height)).toBeLessThan(200);
    expect(m!.y + m!.height).toBeLessThanOrEqual(844 + (await page.evaluate(() => window.scrollY)));
    const today = await page.evaluate(() => {
      const d = new Date();
      return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
    });
    expect(download.suggestedFilename()).toMatch(new RegExp(`^plummet-log-.+-${today}-Tower_Hill\\.json$`));
    // A download is not a send: the header still counts the changes and says where the file is.
    await expectVisible(page.getByRole('heading', { name: /not yet shared or in the office folder/ }));
    await expectVisible(page.getByText(/Last saved as a file on this phone/));
    await shot(page, '06-send-saved');
  });

  it('hands both CSV tables over in one go and names them by site and date', async () => {
    const names: string[] = [];
    page.on('download', (d) => names.push(d.suggestedFilename()));
    await page.getByRole('button', { name: 'Tables for a spreadsheet (CSV)' }).click();
    await expect.poll(() => names.length, { timeout: 20_000 }).toBe(2);
    expect(names.sort()).toEqual([expect.stringMatching(/^plummet-\d{4}-\d\d-\d\d-Tower_Hill-drops\.csv$/), expect.stringMatching(/^plummet-\d{4}-\d\d-\d\d-Tower_Hill-series\.csv$/)]);
    await expectVisible(page.getByTestId('send-message').getByText(/^Saved as a file on this phone \(two CSV files/));
    expect(errors).toEqual([]);
  });
});
