// The Planner screen on a phone-sized Chromium: a sphere without a C_d is planned on the standard sphere curve and
// its fall time carries the curve's own uncertainty, the very figure the physics core gives; a specimen with a
// reference C_d shows no such row. Screenshots in reports/screens/plan/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync } from 'node:fs';
import type { Browser, Locator, Page } from 'playwright-core';
import { planDrop } from '../../src/physics';
import { PLAN_DEFAULTS } from '../../src/analysis';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser } from './harness';

const SHOTS = 'reports/screens/plan';

/** The sample log's first specimen (src/ui/sample-log.ts, invented data), planned as the screen plans it without a current day. */
const uOfTime = (height_m: number): number =>
  planDrop({
    site: { ...PLAN_DEFAULTS.site },
    air: { ...PLAN_DEFAULTS.air },
    specimen: { shape: 'sphere', mass_kg: 0.0582, diameter_m: 0.0702 },
    timing: { standard_uncertainty_s: 0.03 },
    height_m,
  }).at_height!.fall_time_standard_uncertainty_s!;

/** Centre what is to be seen (the pinned header and tab bar would hide an edge), then take the phone's screen. */
async function shotAt(page: Page, locator: Locator, name: string): Promise<void> {
  await locator.first().evaluate((el) => el.scrollIntoView({ block: 'center' }));
  await shot(page, name);
}

async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `${SHOTS}/${name}.png` });
}

describe.skipIf(!haveChromium)('the Planner screen', () => {
  let browser: Browser;
  beforeAll(async () => {
    mkdirSync(SHOTS, { recursive: true });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shows a sphere’s fall time uncertainty from the standard curve, and none for a reference C_d', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const errors = collectErrors(page);
    await page.goto(`${baseUrl}/#/settings`);
    await page.getByRole('button', { name: 'Load the sample log' }).click();
    await expectVisible(page.getByRole('button', { name: 'Remove the sample log' }));
    await page.goto(`${baseUrl}/#/plan`);
    await expectVisible(page.getByText('What to expect'));
    await page.getByLabel('Specimen', { exact: true }).selectOption({ label: 'Hollow rubber ball 70 mm (sample)' });

    const row = page.getByTestId('plan-time-u');
    await expectVisible(row);
    // The figure is the core's, to its two significant digits, in milliseconds.
    const shown = async () => Number((await row.textContent())!.replace(/^±\s*/, '').replace(/\s*ms$/, ''));
    expect(await shown()).toBe(Number((uOfTime(10) * 1000).toPrecision(2)));
    await expectVisible(page.getByText('the standard sphere curve at impact'));
    const hint = page.getByTestId('plan-time-u-hint');
    expect(await hint.textContent()).toContain('5\u00a0% of C_d at this speed');
    await shotAt(page, row, '01-sphere-on-the-curve');

    // From 40 m the ball is faster and the curve moves the time more.
    const height = page.getByRole('textbox', { name: /Release height/ }).first();
    await height.fill('40');
    await expect.poll(shown, { timeout: 10_000 }).toBe(Number((uOfTime(40) * 1000).toPrecision(2)));
    expect(uOfTime(40)).toBeGreaterThan(uOfTime(10));
    await height.blur();
    await shotAt(page, row, '02-sphere-from-40-m');

    // The foam cube has a reference C_d: no uncertainty comes with it, and no row is shown.
    await page.getByLabel('Specimen', { exact: true }).selectOption({ label: 'Foam cube 80 mm (sample)' });
    await expectVisible(page.getByText('the specimen’s reference value'));
    expect(await row.count()).toBe(0);
    await shotAt(page, page.getByText('C_d uncertainty from one drop'), '03-reference-cd');
    expect(errors).toEqual([]);
    await context.close();
  });
});
