// The Send screen's "Sync now" and "Tables for a spreadsheet (CSV)" in the built app, in a phone-sized Chromium
// with its real IndexedDB, against a real nginx WebDAV folder (page on another origin, CORS) behind a proxy that
// slows each read and write down, so a sync takes seconds as on a field connection. The same bar as the import:
// after half a second, a progressbar that says "Reading 3 of 13 files…", "Uploading 3 of 13 parts…", a Cancel of
// at least 48 px and its "Cancelling…" state. Cancelled while reading the folder, the log on the phone is as it
// was and nothing of this phone is in the folder; cancelled while uploading, everything read is merged, the folder
// holds some parts and no index naming a part that is not there; the next Sync now finishes the job. The CSV
// tables stop between two series. Screenshots in reports/screens/sync-cancel/.
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { chmod, mkdir, readdir, readFile, rm } from 'node:fs/promises';
import { join } from 'node:path';
import { contentHash } from '../../src/sync/content-hash';
import { partFileName, readPartIndex, splitLog } from '../../src/log/log-parts';
import type { DayRecord, LogRecord } from '../../src/log/types';
import { deviceIndexName } from '../../src/sync/sync-run';
import { SYNC_CANCELLED_TEXT } from '../../src/ui/progress-text';
import { partsOf } from '../sync/folder-log';
import { sampleLog } from '../sync/sample-log';
import { putFolderFile, type DavServer } from '../servers/dav-server';
import { startFaultProxy, type FaultProxy } from '../servers/fault-proxy';
import { nginxMissing, startNginx } from '../servers/nginx';
import { PHONE, baseUrl, expectVisible, haveChromium, launchBrowser, storedRecordCount } from './harness';

const SHOTS = 'reports/screens/sync-cancel';
/** Each read and write of the folder waits this long at the proxy: a slow field connection. */
const SLOW_MS = 250;
const OTHER = 'phoneB';

/** Another phone's log in the folder: twelve days of our own invented demo data, one part each. */
const otherLog: LogRecord[] = (() => {
  let d = 0;
  return sampleLog({ device: OTHER, seed: 7, days: 12, seriesPerDay: 1, dropsPerSeries: 3, startMs: Date.UTC(2026, 4, 1) }).map((r) =>
    r.kind === 'day' ? ({ ...r, date: `2026-05-${String(++d).padStart(2, '0')}` } as DayRecord) : r,
  );
})();

let browser: Browser;
let server: DavServer;
let proxy: FaultProxy;
let context: BrowserContext;
let page: Page;

/** Records in the app's database, counted in IndexedDB itself. */
const storedRecords = () => storedRecordCount(page);

/** The files of a phone in the folder: its index (or null) and the names in its part folder. */
async function phoneFiles(device: string): Promise<{ index: string | null; parts: string[] }> {
  const index = await readFile(join(server.dataDir, deviceIndexName(device)), 'utf8').catch(() => null);
  const parts = await readdir(join(server.dataDir, partsOf(device))).catch(() => [] as string[]);
  return { index, parts: parts.sort() };
}

/** Every part the phone's index names exists with the hash the index states. */
async function expectIndexHolds(device: string): Promise<number> {
  const { index } = await phoneFiles(device);
  expect(index).not.toBeNull();
  const parsed = readPartIndex(index!);
  for (const entry of parsed.parts) {
    const text = await readFile(join(server.dataDir, partsOf(device), partFileName(entry.key)), 'utf8');
    expect(contentHash(text), entry.key).toBe(entry.hash);
  }
  return parsed.parts.length;
}

/** The progressbar's words once they match, read in the page itself as the bar changes. */
async function waitForBar(pattern: RegExp, timeout = 60_000): Promise<string> {
  const handle = await page.waitForFunction(
    (source) => {
      const text = document.querySelector('[role="progressbar"]')?.getAttribute('aria-valuetext') ?? '';
      return new RegExp(source).test(text) ? text : null;
    },
    pattern.source,
    { timeout, polling: 20 },
  );
  return (await handle.jsonValue()) as string;
}

async function cancelButtonBox() {
  return (await page.getByTestId('transfer').getByRole('button', { name: 'Cancel' }).boundingBox())!;
}

describe.skipIf(!haveChromium || nginxMissing() !== null)('Sync now and the CSV tables: progress and Cancel on the Send screen', () => {
  let device = '';
  let sampleCount = 0;

  beforeAll(async () => {
    await mkdir(SHOTS, { recursive: true });
    browser = await launchBrowser();
    server = await startNginx({ setup: 'cors', appOrigins: [baseUrl] });
    proxy = await startFaultProxy(server.port);
  }, 60_000);
  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await proxy?.close();
    await server?.dispose();
  });

  /** A phone with the sample log, the folder set up (automatic sync off, so only Sync now syncs), and the other
   *  phone's twelve days in the folder. */
  beforeEach(async () => {
    await context?.close();
    for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
    const split = splitLog(otherLog, { device: OTHER, app_version: 'test' });
    await mkdir(join(server.dataDir, partsOf(OTHER)));
    await chmod(join(server.dataDir, partsOf(OTHER)), 0o777);
    for (const part of split.parts) await putFolderFile(server, `${partsOf(OTHER)}/${partFileName(part.key)}`, part.text);
    await putFolderFile(server, deviceIndexName(OTHER), split.indexText);
    proxy.set(null);

    context = await browser.newContext(PHONE);
    page = await context.newPage();
    await page.goto(`${baseUrl}/#/settings`);
    await page.getByRole('button', { name: 'Load the sample log' }).click();
    await expectVisible(page.getByText('The sample log is loaded'));
    device = (await page.locator('dd.mono').textContent())!.trim();
    sampleCount = await storedRecords();
    await page.goto(`${baseUrl}/#/send`);
    await page.getByRole('textbox', { name: 'Folder URL' }).fill(proxy.folderUrl);
    await page.getByRole('textbox', { name: 'User name' }).fill(server.credentials.username);
    await page.getByLabel('Password').fill(server.credentials.password);
    await page.getByLabel('Sync by itself when the phone is online').uncheck();
    await page.getByRole('button', { name: 'Save folder' }).click();
    proxy.set({ fault: { kind: 'delay', ms: SLOW_MS }, methods: ['GET', 'PUT'] });
  }, 60_000);

  it('cancelled while reading the folder: the log on the phone as it was, nothing of this phone in the folder, and the next sync does it all', async () => {
    await page.getByRole('button', { name: 'Sync now' }).click();
    const text = await waitForBar(/^Reading [3-9] of \d+ files from the office folder$/);
    // The other phone's index and its thirteen parts (twelve days and "other").
    expect(text).toMatch(/ of 14 files/);
    await page.screenshot({ path: `${SHOTS}/reading-the-folder.png` });
    const box = await cancelButtonBox();
    expect(box.height).toBeGreaterThanOrEqual(48);
    expect(box.width).toBeGreaterThanOrEqual(48);
    await page.getByTestId('transfer').getByRole('button', { name: 'Cancel' }).click();
    await expectVisible(page.getByText(SYNC_CANCELLED_TEXT), 30_000);
    await page.screenshot({ path: `${SHOTS}/cancelled-while-reading.png` });
    expect(await page.getByTestId('transfer').count()).toBe(0);
    expect(await storedRecords()).toBe(sampleCount);
    expect(await phoneFiles(device)).toEqual({ index: null, parts: [] });

    proxy.set(null);
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expectVisible(page.getByText('Last sync succeeded'), 60_000);
    expect(await storedRecords()).toBe(sampleCount + otherLog.length);
    expect(await expectIndexHolds(device)).toBe((await phoneFiles(device)).parts.length);
  }, 120_000);

  it('cancelled while uploading: everything read is merged, the folder holds parts but no index naming a missing one, and the next sync finishes', async () => {
    await page.getByRole('button', { name: 'Sync now' }).click();
    await waitForBar(/^Reading \d+ of \d+ files/);
    await page.screenshot({ path: `${SHOTS}/progress-reading.png` });
    const text = await waitForBar(/^Uploading [2-9] of \d+ parts to the office folder$/);
    await page.screenshot({ path: `${SHOTS}/uploading.png` });
    // The sample's day, the other phone's twelve and "other": this phone's log holds them all after the merge.
    expect(text).toMatch(/ of 14 parts/);
    // Between the tap and the stop the bar says so and its button can no longer be tapped. That state may last a
    // millisecond only, so the page itself notes every button of the bar as it is drawn (asking from the test driver
    // afterwards raced with the bar going away).
    await page.evaluate(() => {
      const w = window as unknown as { seenCancelling: boolean[] };
      w.seenCancelling = [];
      const note = () => {
        for (const b of document.querySelectorAll('[data-testid="transfer"] button')) {
          if (b.textContent?.trim() === 'Cancelling…') w.seenCancelling.push((b as HTMLButtonElement).disabled);
        }
      };
      new MutationObserver(note).observe(document.body, { subtree: true, childList: true, characterData: true, attributes: true });
    });
    await page.getByTestId('transfer').getByRole('button', { name: 'Cancel' }).click();
    await expectVisible(page.getByText(SYNC_CANCELLED_TEXT), 30_000);
    const seenCancelling = await page.evaluate(() => (window as unknown as { seenCancelling: boolean[] }).seenCancelling);
    // Every drawing of the cancelling state had its button disabled (none may be an enabled "Cancelling…").
    expect(seenCancelling.every((disabled) => disabled)).toBe(true);
    await page.screenshot({ path: `${SHOTS}/cancelled-while-uploading.png` });
    expect(await storedRecords()).toBe(sampleCount + otherLog.length);
    const mid = await phoneFiles(device);
    // A first sync: no index yet, so no index names a part that is not there; some parts are already in.
    expect(mid.index).toBeNull();
    expect(mid.parts.length).toBeGreaterThanOrEqual(2);
    expect(mid.parts.length).toBeLessThan(14);

    proxy.set(null);
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expectVisible(page.getByText('Last sync succeeded'), 60_000);
    expect(await expectIndexHolds(device)).toBe(14);
    expect(await storedRecords()).toBe(sampleCount + otherLog.length);
  }, 120_000);

  it('the CSV tables: computed series by series with a bar, and Cancel stops them with no file made', async () => {
    proxy.set(null);
    // The other phone's twelve series come in through a sync first: the tables then hold fifteen series.
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expectVisible(page.getByText('Last sync succeeded'), 60_000);
    // A phone's processor, not a desktop's: each series' analysis takes its time.
    const cdp = await context.newCDPSession(page);
    const throttle = (rate: number) => cdp.send('Emulation.setCPUThrottlingRate', { rate });
    await throttle(4);
    // The page itself taps Cancel the moment the bar counts the other phone's twelve series done (a test driver's
    // round trip may come after the last one), and notes what the bar said and how large the button was. The
    // sample's series come last (their day is today) and take longest: the one under way is finished first.
    await page.evaluate(() => {
      const w = window as unknown as { seenBar: { text: string; width: number; height: number } | null };
      w.seenBar = null;
      const watch = new MutationObserver(() => {
        const text = document.querySelector('[role="progressbar"]')?.getAttribute('aria-valuetext') ?? '';
        if (!/^Computing 1[2-5] of \d+ series$/.test(text)) return;
        const cancel = document.querySelector<HTMLButtonElement>('[data-testid="transfer"] button')!;
        const box = cancel.getBoundingClientRect();
        w.seenBar = { text, width: box.width, height: box.height };
        watch.disconnect();
        cancel.click();
      });
      watch.observe(document.body, { childList: true, subtree: true, attributes: true, characterData: true });
    });
    await page.getByRole('button', { name: 'Tables for a spreadsheet (CSV)' }).click();
    // The series being computed when Cancel was tapped is finished first: the bar says it is stopping.
    await waitForBar(/^Cancelling… no tables will be made$/, 10_000)
      .then(async () => {
        await throttle(30);
        await page.screenshot({ path: `${SHOTS}/tables-cancelling.png` });
      })
      .catch(() => console.warn('the Cancelling… state passed before it could be pictured'));
    await throttle(4);
    await expectVisible(page.getByText('Cancelled: no tables were made and nothing left the phone.'), 60_000);
    await page.screenshot({ path: `${SHOTS}/tables-cancelled.png` });
    expect(await page.getByTestId('transfer').count()).toBe(0);
    const seen = await page.evaluate(() => (window as unknown as { seenBar: { text: string; width: number; height: number } }).seenBar);
    expect(seen.text).toMatch(/^Computing 1[2-5] of 15 series$/);
    expect(seen.height).toBeGreaterThanOrEqual(48);
    expect(seen.width).toBeGreaterThanOrEqual(48);

    // Not cancelled, they are made and saved (this headless phone has no share sheet).
    // Slowed to a crawl from the start, so the picture catches the bar however idle this machine is.
    // Its own ceiling: Playwright's 30 s default runs out while the page is slowed a hundredfold on a busy machine.
    const download = page.waitForEvent('download', { timeout: 170_000 });
    await throttle(100);
    await page.getByRole('button', { name: 'Tables for a spreadsheet (CSV)' }).click();
    await waitForBar(/^Computing [1-9]\d* of 15 series$/, 120_000);
    await page.screenshot({ path: `${SHOTS}/computing-tables.png` });
    await throttle(1);
    expect((await download).suggestedFilename()).toMatch(/\.csv$/);
    await expectVisible(page.getByText(/Saved as a file on this phone/), 60_000);
  }, 180_000);
});
