// The printable day report inside the app, with the sample log (an invented scenario of our own): its charts are
// the series screen's charts point for point (one geometry, src/charts), it breaks no rule of the
// Content-Security-Policy, and printed it is the report alone, without the app's bar and tabs.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser } from './harness';

const root = fileURLToPath(new URL('../..', import.meta.url));
const screens = join(root, 'reports/screens/report');
const havePoppler = existsSync('/usr/bin/pdftoppm');

let browser: Browser;
let context: BrowserContext;
let page: Page;
let errors: string[];
let dayId = '';
let seriesIds: string[] = [];

interface Drawn {
  lines: string[];
  marks: { cx: number; cy: number; hollow: boolean }[];
}

beforeAll(async () => {
  if (!haveChromium) return;
  browser = await launchBrowser();
  context = await browser.newContext(PHONE);
  page = await context.newPage();
  errors = collectErrors(page);
  await page.goto(`${baseUrl}/#/settings`);
  await page.getByRole('button', { name: 'Load the sample log' }).click();
  await expectVisible(page.getByRole('button', { name: 'Remove the sample log' }));
  await page.goto(`${baseUrl}/#/log`);
  const dayLink = page.locator('a.row-link[href^="#/day/"]').first();
  await expectVisible(dayLink);
  dayId = /^#\/day\/([^/]+)$/.exec((await dayLink.getAttribute('href'))!)![1]!;
  await page.goto(`${baseUrl}/#/day/${dayId}`);
  await expectVisible(page.locator(`a[href="#/day/${dayId}/summary"]`));
  const links = await page.locator(`a[href*="#/day/${dayId}/series/"]`).evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
  seriesIds = [...new Set(links.map((h) => h.split('/').at(-1)!))];
}, 60_000);

afterAll(async () => {
  await browser?.close();
});

describe.skipIf(!haveChromium)('the printable day report in the app', () => {
  it('is reached from the end of the day', async () => {
    await page.goto(`${baseUrl}/#/day/${dayId}/summary`);
    await page.getByRole('link', { name: 'Printable day report' }).click();
    await expectVisible(page.getByRole('button', { name: 'Print or save as PDF' }));
    expect(await page.locator('section.rp-series').count()).toBe(seriesIds.length);
  });

  it("draws each series' chart exactly as the series screen does", { timeout: 120_000 }, async () => {
    expect(seriesIds.length).toBeGreaterThanOrEqual(3);
    for (const id of seriesIds) {
      await page.goto(`${baseUrl}/#/day/${dayId}/series/${id}`);
      const plot = page.locator('pl-plot').first();
      await expectVisible(plot.locator('polyline').first());
      const widget: Drawn = await plot.evaluate((el) => ({
        lines: [...el.shadowRoot!.querySelectorAll('svg[role=img] polyline')].map((p) => p.getAttribute('points')!),
        marks: [...el.shadowRoot!.querySelectorAll('svg[role=img] circle')].map((c) => ({ cx: Number(c.getAttribute('cx')), cy: Number(c.getAttribute('cy')), hollow: c.classList.contains('hollow') })),
      }));
      await page.goto(`${baseUrl}/#/day/${dayId}/report`);
      const chart = page.locator(`section.rp-series[data-series-id="${id}"] svg.rp-plot`).first();
      await expectVisible(chart);
      const printed: Drawn = await chart.evaluate((el) => ({
        lines: [...el.querySelectorAll('polyline')].map((p) => p.getAttribute('points')!),
        marks: [...el.querySelectorAll('circle')].map((c) => ({ cx: Number(c.getAttribute('cx')), cy: Number(c.getAttribute('cy')), hollow: c.classList.contains('rp-hollow') })),
      }));
      expect(printed.lines.length).toBeGreaterThanOrEqual(2);
      expect(printed.lines).toEqual(widget.lines);
      expect(printed.marks).toHaveLength(widget.marks.length);
      printed.marks.forEach((m, i) => {
        // The report writes two decimals of the same number.
        expect(m.cx).toBeCloseTo(widget.marks[i]!.cx, 2);
        expect(m.cy).toBeCloseTo(widget.marks[i]!.cy, 2);
        expect(m.hollow).toBe(widget.marks[i]!.hollow);
      });
    }
    expect(errors).toEqual([]);
  });

  it('prints the report alone, each series on a page of its own', { timeout: 120_000 }, async () => {
    await page.goto(`${baseUrl}/#/day/${dayId}/report`);
    await expectVisible(page.locator('section.rp-series').first());
    mkdirSync(screens, { recursive: true });
    await page.screenshot({ path: join(screens, 'app-report-390x844.png') });
    await page.emulateMedia({ media: 'print' });
    expect(await page.locator('nav.tabbar').isVisible()).toBe(false);
    expect(await page.locator('header.topbar').isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print or save as PDF' }).isVisible()).toBe(false);
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    if (havePoppler) {
      const scratch = mkdtempSync(join(tmpdir(), 'plummet-app-report-'));
      writeFileSync(join(scratch, 'app.pdf'), pdf);
      const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [join(scratch, 'app.pdf')], { encoding: 'utf8' }))![1]);
      expect(pages).toBeGreaterThanOrEqual(seriesIds.length + 1);
      for (const old of readdirSync(screens).filter((f) => f.startsWith('app-a4-'))) rmSync(join(screens, old));
      execFileSync('pdftoppm', ['-r', '100', '-png', join(scratch, 'app.pdf'), join(screens, 'app-a4')]);
      rmSync(scratch, { recursive: true, force: true });
    }
    await page.emulateMedia({ media: 'screen' });
  });
});
