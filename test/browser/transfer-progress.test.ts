// The progress bar of a long import on the Send screen, in the built app on a phone-sized Chromium: it appears
// only after half a second (a small file never shows it), says what is happening ("Checking 12 400 of 30 409
// records") as a progressbar with aria-valuenow, and its Cancel (at least 44 × 44 px, WCAG 2.5.5) stops the
// import while the file is checked and while the store is written, leaving the log empty as it was.
// Screenshots in reports/screens/progress/.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { exportLog } from '../../src/log/export';
import { benchLog } from '../../bench/export-log';
import { sampleLog } from '../sync/sample-log';
import { PHONE, baseUrl, expectVisible, haveChromium, launchBrowser, storedRecordCount } from './harness';

const SHOTS = 'reports/screens/progress';
let browser: Browser;
let page: Page;
const dir = mkdtempSync(join(tmpdir(), 'plummet-progress-'));

// Our own invented demo log, large enough that checking and writing it take seconds on a phone.
const big = Buffer.from(exportLog(benchLog(30_000, 'officephone'), { device: 'officephone', app_version: 'test' }));
const small = Buffer.from(exportLog(sampleLog({ days: 1, seriesPerDay: 1, dropsPerSeries: 3, device: 'phoneB' }), { device: 'phoneB', app_version: 'test' }));

beforeAll(async () => {
  if (!haveChromium) return;
  mkdirSync(SHOTS, { recursive: true });
  browser = await launchBrowser();
  page = await (await browser.newContext(PHONE)).newPage();
  await page.goto(`${baseUrl}/#/send`);
  await expectVisible(page.getByRole('button', { name: 'Import a log file' }));
}, 120_000);
afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

/** Picks the file on the Send screen; from a path on disk, which the browser reads itself (a buffer this size
 *  would cross the DevTools protocol in base64). */
async function pick(name: string, buffer: Buffer): Promise<void> {
  const path = join(dir, name);
  writeFileSync(path, buffer);
  const chooser = page.waitForEvent('filechooser');
  await page.getByRole('button', { name: 'Import a log file' }).click();
  await (await chooser).setFiles(path, { timeout: 120_000 });
}

const storedRecords = () => storedRecordCount(page);

describe.skipIf(!haveChromium)('the progress of a long import, and its Cancel', () => {
  it('shows a quick import without any progress bar', async () => {
    await page.evaluate(() => {
      const w = window as unknown as { sawTransfer: boolean };
      w.sawTransfer = false;
      new MutationObserver(() => {
        if (document.querySelector('[data-testid="transfer"]')) w.sawTransfer = true;
      }).observe(document.body, { childList: true, subtree: true });
    });
    await pick('small.json', small);
    await expectVisible(page.getByRole('button', { name: 'Merge into this log' }));
    await page.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.evaluate(() => (window as unknown as { sawTransfer: boolean }).sawTransfer)).toBe(false);
  }, 60_000);

  it('shows what it is checking, and cancelling leaves the log as it was', async () => {
    // The page itself taps Cancel the moment the bar counts records, and notes what the bar said and how large the
    // button was. A phone's processor is several times slower than this desktop's, whose checking of these 30 000
    // drops ends about when the bar would show (it shows after half a second, and the page gets a turn every tenth
    // of a second): the page's processor is slowed four times (Chromium's own CPU throttling) while it checks.
    await page.evaluate(() => {
      const w = window as unknown as { seenBar: { text: string; now: string | null; width: number; height: number } | null };
      w.seenBar = null;
      const watch = new MutationObserver(() => {
        const bar = document.querySelector('[role="progressbar"]');
        const text = bar?.getAttribute('aria-valuetext') ?? '';
        if (!bar || !/^Checking \d/.test(text)) return;
        const cancel = document.querySelector<HTMLButtonElement>('[data-testid="transfer"] button')!;
        const box = cancel.getBoundingClientRect();
        w.seenBar = { text, now: bar.getAttribute('aria-valuenow'), width: box.width, height: box.height };
        watch.disconnect();
        cancel.click();
      });
      watch.observe(document.body, { childList: true, subtree: true, attributes: true, characterData: true });
    });
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await pick('plummet-log-officephone.json', big);
    await expectVisible(page.getByText('Cancelled: the file was not imported and nothing was changed.'), 120_000);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    await cdp.detach();
    const seen = await page.evaluate(() => (window as unknown as { seenBar: { text: string; now: string | null; width: number; height: number } }).seenBar);
    expect(seen.text).toMatch(/^Checking [\d\u00a0]+ of 30\u00a0\d{3} records$/);
    expect(seen.now).toMatch(/^\d+$/);
    expect(seen.width).toBeGreaterThanOrEqual(44);
    expect(seen.height).toBeGreaterThanOrEqual(44);
    expect(await page.getByTestId('transfer').count()).toBe(0);
    expect(await storedRecords()).toBe(0);
  }, 180_000);

  it('shows the records being saved, and cancelling the write saves none of them', async () => {
    await pick('plummet-log-officephone.json', big);
    await expectVisible(page.getByRole('button', { name: 'Merge into this log' }), 170_000);
    // The store writes 30 000 drops in a few hundred packs, done within the half second before the bar shows on
    // this desktop processor. A phone's processor is several times slower: the page's processor is slowed 20 times
    // here (Chromium's own CPU throttling) for the write, so it lasts long enough to be seen. As for checking, the
    // page itself taps Cancel the moment the bar says it is saving, and notes what the bar said and the button's size.
    await page.evaluate(() => {
      const w = window as unknown as { seenSaving: { text: string; width: number; height: number } | null };
      w.seenSaving = null;
      const watch = new MutationObserver(() => {
        const bar = document.querySelector('[role="progressbar"]');
        const text = bar?.getAttribute('aria-valuetext') ?? '';
        if (!bar || !text.startsWith('Saving')) return;
        const cancel = document.querySelector<HTMLButtonElement>('[data-testid="transfer"] button')!;
        const box = cancel.getBoundingClientRect();
        w.seenSaving = { text, width: box.width, height: box.height };
        watch.disconnect();
        cancel.click();
      });
      watch.observe(document.body, { childList: true, subtree: true, attributes: true, characterData: true });
    });
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 20 });
    await page.getByRole('button', { name: 'Merge into this log' }).click();
    await expectVisible(page.getByText('Cancelled: nothing was merged, this log is as it was.'), 120_000);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    await cdp.detach();
    await page.screenshot({ path: `${SHOTS}/cancelled.png` });
    const seen = await page.evaluate(() => (window as unknown as { seenSaving: { text: string; width: number; height: number } }).seenSaving);
    expect(seen.text).toMatch(/^Saving/);
    expect(seen.width).toBeGreaterThanOrEqual(44);
    expect(seen.height).toBeGreaterThanOrEqual(44);
    expect(await storedRecords()).toBe(0);
  }, 300_000);
});
