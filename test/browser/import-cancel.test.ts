// Cancelling an import in the real Chromium with the real IndexedDB store: the database is dumped (every object
// store, every key and value) before the import and after it is cancelled, and the two dumps must be the same text,
// whether the import was cancelled while the file was being checked or halfway through the store's write. The
// control: the same import not cancelled changes the dump. The page is fixtures/sync-page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startStaticServer, type StaticServer } from '../../scripts/static-server.mjs';
import { buildSyncPage } from './fixtures/sync-page/build';
import type { Harness } from './fixtures/sync-page/main';
import { haveChromium, launchBrowser, PHONE } from './harness';

let browser: Browser;
let page: Page;
let dir: string;
let site: StaticServer;

beforeAll(async () => {
  if (!haveChromium) return;
  dir = await mkdtemp(join(tmpdir(), 'plummet-cancel-page-'));
  await buildSyncPage(dir);
  site = await startStaticServer({ root: dir });
  browser = await launchBrowser();
  page = await (await browser.newContext(PHONE)).newPage();
  await page.goto(`${site.url}/`);
  await page.waitForFunction(() => (window as unknown as { harness?: unknown }).harness !== undefined);
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await site?.close();
  if (dir) await rm(dir, { recursive: true, force: true });
});

const cancelImport = (drops: number, phase: string | null, at: number) =>
  page.evaluate(([d, p, a]) => (window as unknown as { harness: Harness }).harness.cancelImport(d, p, a), [drops, phase, at] as const);

// 20 000 drops: the file holds 20 000 records the store lacks, so the store's write reports several steps and
// the cancel lands with thousands of records already put in the transaction.
const DROPS = 20_000;

describe.skipIf(!haveChromium)('cancelling an import (real IndexedDB)', () => {
  it('leaves the store byte for byte as it was when cancelled halfway through the write', async () => {
    const r = await cancelImport(DROPS, 'writing', 2500);
    expect(r.ended).toBe('transfer-cancelled');
    // The write had started: records were being put when the cancel came.
    expect(r.seen.some((p) => p.phase === 'writing' && p.done >= 2500)).toBe(true);
    expect(r.after.length).toBe(r.before.length);
    expect(r.after === r.before).toBe(true);
  }, 240_000);

  it('leaves the store as it was when cancelled while the file is checked', async () => {
    const r = await cancelImport(DROPS, 'checking', 5000);
    expect(r.ended).toBe('transfer-cancelled');
    expect(r.seen.some((p) => p.phase === 'writing')).toBe(false);
    expect(r.after === r.before).toBe(true);
  }, 240_000);

  it('changes the store when not cancelled (the control), reporting every phase on the way', async () => {
    const r = await cancelImport(DROPS, null, 0);
    expect(r.ended).toBe('imported');
    expect(r.after).not.toBe(r.before);
    expect(new Set(r.seen.map((p) => p.phase))).toEqual(new Set(['checking', 'reading', 'merging', 'writing']));
    const last = r.seen.filter((p) => p.phase === 'writing').at(-1)!;
    expect(last.done).toBe(last.total);
    // Progress never runs backwards within a phase.
    for (let i = 1; i < r.seen.length; i++) if (r.seen[i]!.phase === r.seen[i - 1]!.phase) expect(r.seen[i]!.done).toBeGreaterThanOrEqual(r.seen[i - 1]!.done);
  }, 240_000);
});
