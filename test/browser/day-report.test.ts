// The printed day report, checked the way a person meets it: rendered by Chromium, every series and figure held
// against the analysis core's own numbers, then printed to PDF on A4 and Letter and turned into page images
// (pdftoppm from poppler-utils, 100 dpi, about what a printer gives) kept under reports/screens/report/.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { analyzeDay, seriesDropRows } from '../../src/analysis';
import { mergeLogs, type DayRecord, type LogRecord } from '../../src/log';
import { dayRecords, dayReport, reportHtml } from '../../src/report';
import { haveChromium, launchBrowser } from './harness';
import { reportLog, sampleDayRecords } from '../report/report-fixture';

const DRAWS = 2000;
const root = fileURLToPath(new URL('../..', import.meta.url));
const screens = join(root, 'reports/screens/report');
const havePoppler = existsSync('/usr/bin/pdftoppm') && existsSync('/usr/bin/pdftotext');

let browser: Browser;
let page: Page;
let records: LogRecord[];
let html = '';
const scratch = mkdtempSync(join(tmpdir(), 'plummet-report-pdf-'));

beforeAll(async () => {
  if (!haveChromium) return;
  records = mergeLogs(reportLog().records, await sampleDayRecords());
  html = reportHtml(dayReport(records, { generatedAt: '2026-07-04T08:00:00.000Z', monteCarloDraws: DRAWS }));
  browser = await launchBrowser();
  const context = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 1000, height: 1400 } });
  // Nothing may be fetched: every request the page would make fails the test below.
  const requests: string[] = [];
  context.on('request', (r) => requests.push(r.url()));
  page = await context.newPage();
  await page.setContent(html, { waitUntil: 'load' });
  expect(requests).toEqual([]);
}, 60_000);

afterAll(async () => {
  await browser?.close();
  rmSync(scratch, { recursive: true, force: true });
});

/** Every `data-field` figure of one series section as Chromium shows it: field → [value, shown text]. */
async function figuresOf(seriesId: string): Promise<Record<string, { value: number; text: string }>> {
  return page.$$eval(`section[data-series-id="${seriesId}"] dl.rp-figures dd[data-field]`, (els) =>
    Object.fromEntries(els.map((e) => [e.getAttribute('data-field'), { value: Number(e.getAttribute('data-value')), text: (e as HTMLElement).innerText }])),
  );
}

describe.skipIf(!haveChromium)('the day report in Chromium', () => {
  it('shows every day and every series of the log, each with the core figures', async () => {
    const days = records.filter((r): r is DayRecord => r.kind === 'day' && !r.deleted);
    expect(days.length).toBe(2);
    expect(await page.locator('section.rp-day').count()).toBe(2);
    let checked = 0;
    let spreads = 0;
    for (const day of days) {
      for (const s of analyzeDay(dayRecords(records, day), { monteCarloDraws: DRAWS })) {
        const section = page.locator(`section[data-series-id="${s.series.id}"]`);
        expect(await section.count(), `series ${s.series.id}`).toBe(1);
        expect(await section.getAttribute('data-state')).toBe(s.outcome.kind);
        if (s.outcome.kind !== 'ready') continue;
        const r = s.outcome.result;
        const f = await figuresOf(s.series.id);
        expect(f['drag_coefficient']!.value).toBe(r.drag_coefficient);
        expect(f['drag_coefficient']!.text).toBe(r.drag_coefficient!.toFixed(3));
        expect(f['drag_coefficient_standard_uncertainty']!.value).toBe(r.drag_coefficient_standard_uncertainty);
        expect(f['drag_coefficient_interval_95_low']!.value).toBe(r.drag_coefficient_interval_95[0]);
        expect(f['drag_coefficient_interval_95_high']!.value).toBe(r.drag_coefficient_interval_95[1]);
        expect(f['density_kg_m3']!.value).toBe(r.air.density_kg_m3);
        expect(f['gravity_m_s2']!.value).toBe(r.gravity_m_s2);
        expect(f['gravity_m_s2']!.text).toBe(`${r.gravity_m_s2.toFixed(5)} m/s²`);
        expect(f['monte_carlo_draws']!.value).toBe(DRAWS);
        if (r.terminal_velocity_m_s !== null) expect(f['terminal_velocity_m_s']!.value).toBe(r.terminal_velocity_m_s);
        expect(await section.locator('.rp-verdict').innerText()).toContain(`C_d = ${r.drag_coefficient!.toFixed(3)} ± ${(2 * r.drag_coefficient_standard_uncertainty).toFixed(3)}`);

        // The drop table: one row per live drop, the fit's residuals and times as the core has them.
        const rows = seriesDropRows(s.series, s.drops, s.outcome);
        const shown = await section.locator('table.rp-drops tbody tr').evaluateAll((trs) =>
          trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => ({ field: td.getAttribute('data-field'), value: td.getAttribute('data-value'), text: td.innerText }))),
        );
        expect(shown).toHaveLength(rows.length);
        rows.forEach((row, i) => {
          const cells = shown[i]!;
          expect(Number(cells.find((c) => c.field === 'time_s')!.value)).toBe(row.drop.time_s);
          expect(Number(cells.find((c) => c.field === 'height_m')!.value)).toBe(row.height_m);
          if (row.residual_s !== null) expect(Number(cells.find((c) => c.field === 'residual_s')!.value)).toBe(row.residual_s);
          const predicted = cells.find((c) => c.field === 'predicted_time_s');
          if (row.predicted_time_s !== null) expect(Number(predicted!.value)).toBe(row.predicted_time_s);
          // The standard sphere curve's own uncertainty beside the predicted time, in milliseconds.
          if (row.predicted_time_standard_uncertainty_s !== null) {
            expect(predicted!.text).toContain(`± ${(row.predicted_time_standard_uncertainty_s * 1000).toFixed(1)} ms`);
            spreads++;
          }
          if (row.drop.excluded) expect(cells[7]!.text).toContain(row.drop.exclusion_reason ?? 'excluded');
        });

        // The budget: one row per input and the combined uncertainty.
        const contributions = await section.locator('table.rp-budget td[data-field="contribution"]').evaluateAll((tds) => tds.map((td) => Number(td.getAttribute('data-value'))));
        expect(contributions).toEqual(r.budget.map((b) => b.contribution));
        expect(Number(await section.locator('td[data-field="combined_standard_uncertainty"]').getAttribute('data-value'))).toBe(r.gum.combined_standard_uncertainty);

        // The chart: a mark per live drop, hollow ones for the excluded, and the fitted and drag-free curves.
        const live = s.drops.filter((d) => !d.deleted);
        const firstChart = section.locator('figure.rp-chart').first();
        expect(await firstChart.locator('svg.rp-plot circle.rp-mark').count()).toBe(live.length);
        expect(await firstChart.locator('svg.rp-plot circle.rp-hollow').count()).toBe(live.filter((d) => d.excluded).length);
        expect(await firstChart.locator('svg.rp-plot polyline.rp-brand').count()).toBe(1);
        expect(await firstChart.locator('svg.rp-plot polyline.rp-dot').count()).toBe(1);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(4);
    expect(spreads).toBeGreaterThan(0);
  });

  it('states the methods with their sources and the safety caution', async () => {
    const text = await page.locator('section.rp-methods').innerText();
    for (const topic of ['Air density', 'Gravity', 'Drag law', 'Buoyancy and added mass', 'CIPM-2007', 'NIMA TR8350.2', 'JCGM 101:2008']) expect(text).toContain(topic);
    expect(await page.locator('.rp-caution').innerText()).toContain('local rules');
  });

  for (const paper of ['A4', 'Letter'] as const) {
    it.skipIf(!havePoppler)(`prints on ${paper} with every series starting a page of its own`, { timeout: 120_000 }, async () => {
      await page.emulateMedia({ media: 'print' });
      const pdf = await page.pdf({ format: paper, printBackground: true });
      const pdfPath = join(scratch, `report-${paper}.pdf`);
      writeFileSync(pdfPath, pdf);
      const pages = Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [pdfPath], { encoding: 'utf8' }))![1]);
      const titles = await page.locator('section.rp-series h2').allInnerTexts();
      expect(titles.length).toBeGreaterThanOrEqual(4);
      // Each series' heading is the first text of some page.
      const firsts: string[] = [];
      for (let p = 1; p <= pages; p++) {
        const text = execFileSync('pdftotext', ['-layout', '-f', String(p), '-l', String(p), pdfPath, '-'], { encoding: 'utf8' });
        firsts.push(text.trim().split('\n')[0]!.trim());
      }
      for (const t of titles) expect(firsts.some((line) => line.startsWith(t.slice(0, 30))), `"${t}" opens a page`).toBe(true);
      // The pages as a person would see them printed, kept for review.
      mkdirSync(screens, { recursive: true });
      for (const old of readdirSync(screens).filter((f) => f.startsWith(`report-${paper.toLowerCase()}-`))) rmSync(join(screens, old));
      execFileSync('pdftoppm', ['-r', '100', '-png', pdfPath, join(screens, `report-${paper.toLowerCase()}`)]);
      expect(readdirSync(screens).filter((f) => f.startsWith(`report-${paper.toLowerCase()}-`))).toHaveLength(pages);
    });
  }
});
