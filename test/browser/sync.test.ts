// Two phones (two browser contexts of the system Chromium) sync through real WebDAV servers: Apache mod_dav
// and nginx, the page on another origin (CORS) and, for nginx, served by the folder's own server. Faults: the
// server stopped, answering errors, restarted mid-sync, a wrong password, no network, a server that never
// answers. The page is a small harness around the real store, sync and share code (fixtures/sync-page).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { chmod, mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startStaticServer, type StaticServer } from '../../scripts/static-server.mjs';
import { exportLog } from '../../src/log/export';
import { readLogFile } from '../../src/log/export-parse';
import type { LogRecord, DropRecord } from '../../src/log/types';
import { deviceFileName, deviceIndexName } from '../../src/sync/sync-run';
import { folderLog as folderLogOf, partsOf } from '../sync/folder-log';
import type { SyncSettings } from '../../src/sync/settings';
import { apacheMissing, startApache } from '../servers/apache';
import { folderFiles, putFolderFile, readFolderFile, type DavServer } from '../servers/dav-server';
import { startFaultProxy, startSilentServer, type FaultProxy } from '../servers/fault-proxy';
import { nginxMissing, startNginx } from '../servers/nginx';
import { buildSyncPage } from './fixtures/sync-page/build';
import type { Harness } from './fixtures/sync-page/main';
import { collectErrors, haveChromium, launchBrowser, PHONE } from './harness';

type Method = { [K in keyof Harness]: Harness[K] extends (...args: never[]) => unknown ? K : never }[keyof Harness];
type Result<K extends Method> = Awaited<ReturnType<Harness[K]>>;

/** Calls window.harness[name](...args) in the page. */
function call<K extends Method>(page: Page, name: K, ...args: Parameters<Harness[K]>): Promise<Result<K>> {
  return page.evaluate(
    ({ name, args }) => (window as unknown as { harness: Record<string, (...a: unknown[]) => unknown> }).harness[name]!(...args),
    { name, args: args as unknown[] },
  ) as Promise<Result<K>>;
}

interface Phone {
  context: BrowserContext;
  page: Page;
  errors: string[];
  device: string;
}

let browser: Browser;
let pageDir: string;
let site: StaticServer;

beforeAll(async () => {
  if (!haveChromium) return;
  pageDir = await mkdtemp(join(tmpdir(), 'plummet-sync-page-'));
  await buildSyncPage(pageDir);
  // mkdtemp makes the folder 0700; nginx's workers (nobody) serve it in the same-origin test.
  await chmod(pageDir, 0o755);
  site = await startStaticServer({ root: pageDir });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await site?.close();
  if (pageDir) await rm(pageDir, { recursive: true, force: true });
});

async function openPhone(origin: string, query = ''): Promise<Phone> {
  const context = await browser.newContext(PHONE);
  const page = await context.newPage();
  const errors = collectErrors(page);
  await page.goto(`${origin}/${query}`);
  await page.waitForFunction(() => (window as unknown as { harness?: unknown }).harness !== undefined);
  return { context, page, errors, device: await call(page, 'deviceId') };
}

function settings(folderUrl: string, server: DavServer, extra: Partial<SyncSettings> = {}): SyncSettings {
  return { folder_url: folderUrl, ...server.credentials, enabled: true, timeout_ms: 5000, ...extra };
}

/** The phone's log as its part index and parts in the folder hold it. */
const folderLog = (server: DavServer, device: string): Promise<LogRecord[]> => folderLogOf(server, device);

const ids = (records: LogRecord[]) => records.map((r) => r.id).sort();
const times = [1.578, 1.581, 1.576];

const kinds = [
  ['Apache mod_dav', apacheMissing(), startApache],
  ['nginx', nginxMissing(), startNginx],
] as const;

describe.skipIf(!haveChromium).each(kinds)('two phones syncing through %s, the page on another origin', (_name, missing, start) => {
  let server: DavServer;
  let proxy: FaultProxy;
  let phones: Phone[] = [];

  beforeAll(async () => {
    if (missing) return;
    server = await start({ appOrigins: [site.url] });
    proxy = await startFaultProxy(server.port);
  });
  afterAll(async () => {
    for (const p of phones) await p.context.close();
    await proxy?.close();
    await server?.dispose();
  });

  async function freshPhones(query = ''): Promise<[Phone, Phone]> {
    for (const p of phones) await p.context.close();
    await server.start();
    proxy.set(null);
    for (const f of await readdir(server.dataDir)) await rm(join(server.dataDir, f), { recursive: true, force: true });
    phones = [await openPhone(site.url, query), await openPhone(site.url, query)];
    return phones as [Phone, Phone];
  }

  it.skipIf(missing)('exchange their logs, each writing its own index and parts, and see edits and deletions of the other', async () => {
    const [a, b] = await freshPhones();
    await call(a.page, 'configure', settings(server.folderUrl, server));
    await call(b.page, 'configure', settings(server.folderUrl, server));
    await call(a.page, 'addSeries', 'North quarry wall', times);
    await call(b.page, 'addSeries', 'South terrace', times.slice(0, 2));
    for (const p of [a, b, a]) expect((await call(p.page, 'sync')).error).toBeNull();
    const recordsA = await call(a.page, 'records');
    const recordsB = await call(b.page, 'records');
    expect(ids(recordsA)).toEqual(ids(recordsB));
    expect(recordsA).toHaveLength(5 + 3 + 5 + 2);
    expect(await folderFiles(server)).toEqual([deviceIndexName(a.device), partsOf(a.device), deviceIndexName(b.device), partsOf(b.device)].sort());

    // B corrects one of A's drops and deletes another; A sees both after a sync each.
    const drops = recordsB.filter((r): r is DropRecord => r.kind === 'drop' && r.device === a.device);
    await call(b.page, 'editDrop', drops[0]!.id, 1.59, 'misread the stopwatch');
    await call(b.page, 'removeDrop', drops[1]!.id, 'dropped by the wind');
    expect((await call(b.page, 'sync')).error).toBeNull();
    expect((await call(a.page, 'sync')).error).toBeNull();
    const after = await call(a.page, 'records');
    expect((after.find((r) => r.id === drops[0]!.id) as DropRecord).time_s).toBe(1.59);
    expect(after.find((r) => r.id === drops[1]!.id)!.deleted).toBe(true);
    expect(a.errors, a.errors.join('\n')).toEqual([]);
    expect(b.errors, b.errors.join('\n')).toEqual([]);
  });

  it.skipIf(missing)('keep both values of a drop time changed on both phones, and show the conflict', async () => {
    const [a, b] = await freshPhones();
    for (const p of [a, b]) await call(p.page, 'configure', settings(server.folderUrl, server));
    await call(a.page, 'addSeries', 'North quarry wall', times);
    await call(a.page, 'sync');
    await call(b.page, 'sync');
    const drop = (await call(b.page, 'records')).find((r): r is DropRecord => r.kind === 'drop')!;
    await call(a.page, 'editDrop', drop.id, 1.6, 'retimed from the video');
    await call(b.page, 'editDrop', drop.id, 1.61, 'retyped');
    await call(a.page, 'sync');
    const report = await call(b.page, 'sync');
    expect(report.conflicts).toHaveLength(1);
    expect(await call(b.page, 'conflicts')).toEqual([expect.objectContaining({ id: drop.id, fields: ['time_s'], measured: true })]);
    const kept = (await call(b.page, 'records')).find((r) => r.id === drop.id) as DropRecord;
    const values = [kept.time_s, ...kept.history.map((h) => (h.body as { time_s: number }).time_s)];
    expect(values).toContain(1.6);
    expect(values).toContain(1.61);
  });

  it.skipIf(missing)('lose nothing while the server is stopped: the changes wait across a reload and go once it is back', async () => {
    const [a] = await freshPhones('?auto=1');
    await call(a.page, 'configure', settings(server.folderUrl, server));
    await call(a.page, 'addSeries', 'North quarry wall', times);
    expect((await call(a.page, 'sync')).error).toBeNull();
    await server.stop();
    const series = (await call(a.page, 'records')).find((r) => r.kind === 'series')!;
    const late = await call(a.page, 'addDrop', series.id, 4, 1.579);
    const failed = await call(a.page, 'sync');
    expect(failed.error).toMatchObject({ code: 'sync-network', retryable: true });
    expect(await call(a.page, 'nextRetryMs')).toBeGreaterThan(0);
    // The page is closed and opened again while the server is still down, then the server comes back.
    await a.page.reload();
    await a.page.waitForFunction(() => (window as unknown as { harness?: { reports: unknown[] } }).harness?.reports.length === 1);
    expect(await a.page.evaluate(() => (window as unknown as { harness: Harness }).harness.reports[0]!.error?.code)).toBe('sync-network');
    await server.start();
    expect((await call(a.page, 'sync')).error).toBeNull();
    const file = await folderLog(server, a.device);
    expect(file.map((r) => r.id)).toContain(late);
    expect(new Set(ids(file)).size).toBe(file.length);
    expect(file).toHaveLength((await call(a.page, 'records')).length);
  });

  it.skipIf(missing)('report a server answering 500, retry later, and then succeed', async () => {
    const [a] = await freshPhones();
    await call(a.page, 'configure', settings(proxy.folderUrl, server));
    await call(a.page, 'addSeries', 'North quarry wall', times);
    proxy.set({ fault: { kind: 'status', status: 500 }, methods: ['PROPFIND'], times: 1 });
    const failed = await call(a.page, 'sync');
    expect(failed.error).toMatchObject({ code: 'sync-server', status: 500, retryable: true });
    expect(await folderFiles(server)).toEqual([]);
    expect((await call(a.page, 'sync')).error).toBeNull();
    expect(await folderLog(server, a.device)).toHaveLength(5 + 3);
  });

  it.skipIf(missing)('survive the server restarting in the middle of a sync', async () => {
    const [a, b] = await freshPhones();
    for (const p of [a, b]) await call(p.page, 'configure', settings(server.folderUrl, server));
    await call(b.page, 'addSeries', 'South terrace', times);
    await call(b.page, 'sync');
    await call(a.page, 'addSeries', 'North quarry wall', times);
    // A has read B's parts; as its first PUT leaves, the server goes down.
    await a.page.route('**/dav/**', async (route) => {
      if (route.request().method() !== 'PUT') return route.continue();
      await server.stop();
      return route.continue().catch(() => undefined);
    });
    const cut = await call(a.page, 'sync');
    expect(cut.error?.code).toBe('sync-network');
    await a.page.unroute('**/dav/**');
    expect(await call(a.page, 'records')).toHaveLength(16);
    await server.start();
    expect((await call(a.page, 'sync')).error).toBeNull();
    expect((await call(b.page, 'sync')).error).toBeNull();
    expect(ids(await call(b.page, 'records'))).toEqual(ids(await call(a.page, 'records')));
  });

  it.skipIf(missing)("skip a colleague's file whose merge the store refuses, name it, send their own anyway, and send again an upload the server dropped", async () => {
    const [a, b] = await freshPhones();
    for (const p of [a, b]) await call(p.page, 'configure', settings(proxy.folderUrl, server));
    await call(b.page, 'addSeries', 'South terrace', times);
    expect((await call(b.page, 'sync')).error).toBeNull();
    expect((await call(a.page, 'sync')).error).toBeNull();
    // A file of B's in the old single-file layout appears that passes every check of the file, but whose merge
    // with the copy A holds makes a drop the store refuses (a history entry newer than the current version, with
    // an empty body).
    const bFile = { records: await folderLog(server, b.device) };
    const drop = bFile.records.find((r): r is DropRecord => r.kind === 'drop')!;
    const newer = drop.rev.replace(/^(\d{15})/, (ms) => String(Number(ms) + 5000).padStart(15, '0'));
    const poisoned = bFile.records.map((r) =>
      r.id === drop.id ? { ...r, history: [{ rev: newer, device: r.device, updated_at: r.updated_at, reason: null, deleted: false, body: {} }] } : r,
    ) as LogRecord[];
    await putFolderFile(server, deviceFileName(b.device), exportLog(poisoned, { device: b.device, app_version: 'test-page' }));
    const series = (await call(a.page, 'records')).find((r) => r.kind === 'series' && r.device === b.device)!;
    const late = await call(a.page, 'addDrop', series.id, 9, 1.58);
    const before = await call(a.page, 'records');
    // And the server acknowledges A's first upload (the day's part) without storing it: it goes again, then the index.
    proxy.set({ fault: { kind: 'acknowledge', status: 204 }, methods: ['PUT'], times: 1 });
    proxy.seen.length = 0;
    const report = await call(a.page, 'sync');
    expect(proxy.seen.filter((r) => r.startsWith('PUT '))).toHaveLength(3);
    expect(report.error).toBeNull();
    expect(report.uploaded).toBe(true);
    expect(report.problems).toEqual([expect.objectContaining({ name: deviceFileName(b.device), device: b.device, record: drop.id })]);
    expect((await folderLog(server, a.device)).map((r) => r.id)).toContain(late);
    expect(await call(a.page, 'records')).toEqual(before);
    const state = (await call(a.page, 'state')) as { files: Record<string, { problem: { record: string | null } | null }> };
    expect(state.files[deviceFileName(b.device)]!.problem).toMatchObject({ record: drop.id });
    expect(a.errors, a.errors.join('\n')).toEqual([]);
  });

  it.skipIf(missing)('do not follow a redirect to another origin, and say so', async () => {
    const [a] = await freshPhones();
    const elsewhere = await startFaultProxy(server.port);
    try {
      await call(a.page, 'configure', settings(proxy.folderUrl, server));
      await call(a.page, 'addSeries', 'North quarry wall', times);
      // Writing starts with the phone's part folder (MKCOL) and goes on with PUTs: both are redirected.
      for (const methods of [['PROPFIND'], ['MKCOL', 'PUT']]) {
        const method = methods.join('+');
        proxy.set({ fault: { kind: 'redirect', status: 307, location: `${elsewhere.folderUrl}${deviceFileName(a.device)}` }, methods });
        const report = await call(a.page, 'sync');
        expect(report.error, method).toMatchObject({ code: 'sync-redirected', retryable: false });
        expect(report.error!.message).toMatch(/redirect/);
      }
      expect(elsewhere.seen).toEqual([]);
      expect(await folderFiles(server)).toEqual([]);
    } finally {
      await elsewhere.close();
    }
  });

  it.skipIf(missing)('report a wrong password at once, without retrying it', async () => {
    const [a] = await freshPhones();
    await call(a.page, 'configure', settings(server.folderUrl, server, { password: 'wrong' }));
    const report = await call(a.page, 'sync');
    expect(report.error).toMatchObject({ code: 'sync-unauthorized', status: 401, retryable: false });
    expect(await call(a.page, 'nextRetryMs')).toBeNull();
  });
});

describe.skipIf(!haveChromium || nginxMissing() !== null)('two phones with the app served by the folder server itself (same origin)', () => {
  it('sync without any CORS set-up', async () => {
    const server = await startNginx({ setup: 'same-origin', appRoot: pageDir });
    const phones: Phone[] = [];
    try {
      for (let i = 0; i < 2; i++) phones.push(await openPhone(server.origin));
      const [a, b] = phones as [Phone, Phone];
      for (const p of phones) await call(p.page, 'configure', settings(server.folderUrl, server));
      await call(a.page, 'addSeries', 'North quarry wall', times);
      await call(b.page, 'addSeries', 'South terrace', times);
      for (const p of [a, b, a]) expect((await call(p.page, 'sync')).error).toBeNull();
      expect(ids(await call(a.page, 'records'))).toEqual(ids(await call(b.page, 'records')));
      expect(server.config).not.toContain('Access-Control');
    } finally {
      for (const p of phones) await p.context.close();
      await server.dispose();
    }
  });
});

describe.skipIf(!haveChromium).each(kinds)('a phone and %s sending the standard login challenge', (_name, missing, start) => {
  it.skipIf(missing)('gets a plain error for a wrong password (no login prompt left waiting), and syncs with the right one', async () => {
    const server = await start({ appOrigins: [site.url], challenge: true });
    const phone = await openPhone(site.url);
    try {
      await call(phone.page, 'configure', settings(server.folderUrl, server, { password: 'wrong', timeout_ms: 20_000 }));
      const started = Date.now();
      const report = await call(phone.page, 'sync');
      expect(report.error).toMatchObject({ code: 'sync-unauthorized', status: 401 });
      expect(Date.now() - started).toBeLessThan(5000);
      await call(phone.page, 'configure', settings(server.folderUrl, server));
      expect((await call(phone.page, 'sync')).error).toBeNull();
    } finally {
      await phone.context.close();
      await server.dispose();
    }
  });
});

describe.skipIf(!haveChromium || nginxMissing() !== null)('a phone going offline and online', () => {
  it('syncs by itself when the connection returns', async () => {
    const server = await startNginx({ appOrigins: [site.url] });
    const phone = await openPhone(site.url, '?auto=1');
    try {
      await call(phone.page, 'configure', settings(server.folderUrl, server));
      // The series is made offline: an automatic sync started by configuring the folder may already have written
      // the phone's file, but it cannot hold what was made after the connection went.
      await phone.context.setOffline(true);
      await call(phone.page, 'addSeries', 'North quarry wall', times);
      const failed = await call(phone.page, 'sync');
      expect(failed.ok).toBe(false);
      const held = (await folderFiles(server)).length === 0 ? [] : await folderLog(server, phone.device);
      expect(held.length).toBeLessThan(8);
      const before = await phone.page.evaluate(() => (window as unknown as { harness: Harness }).harness.reports.length);
      await phone.context.setOffline(false);
      await phone.page.waitForFunction(
        (n) => {
          const reports = (window as unknown as { harness: Harness }).harness.reports;
          return reports.length > n && reports[reports.length - 1]!.ok;
        },
        before,
        { timeout: 15_000 },
      );
      expect(await folderLog(server, phone.device)).toHaveLength(8);
    } finally {
      await phone.context.close();
      await server.dispose();
    }
  });
});

describe.skipIf(!haveChromium)('a phone and a server that never answers', () => {
  it('gives up after the timeout with a clear error', async () => {
    const silent = await startSilentServer();
    const phone = await openPhone(site.url);
    try {
      await call(phone.page, 'configure', { folder_url: silent.folderUrl, username: 'fieldteam', password: 'x', enabled: true, timeout_ms: 1500 });
      const started = Date.now();
      const report = await call(phone.page, 'sync');
      expect(report.error).toMatchObject({ code: 'sync-timeout', retryable: true });
      expect(Date.now() - started).toBeLessThan(6000);
    } finally {
      await phone.context.close();
      await silent.close();
    }
  });
});

describe.skipIf(!haveChromium)('sharing the log from a phone without the Web Share API', () => {
  it('downloads the export instead (headless Chromium has no navigator.share)', async () => {
    const phone = await openPhone(site.url);
    try {
      expect(await phone.page.evaluate(() => typeof navigator.share)).toBe('undefined');
      await call(phone.page, 'addSeries', 'North quarry wall', times);
      const [download, shared] = await Promise.all([phone.page.waitForEvent('download'), call(phone.page, 'share')]);
      expect(shared.outcome).toBe('downloaded');
      expect(download.suggestedFilename()).toMatch(new RegExp(`^plummet-log-${phone.device}-\\d{4}-\\d{2}-\\d{2}\\.json$`));
      const path = await download.path();
      const { readFile } = await import('node:fs/promises');
      const text = await readFile(path, 'utf8');
      expect(text).toBe(shared.text);
      expect(readLogFile(text).records).toHaveLength(8);
      // And the file imports into another phone.
      const other = await openPhone(site.url);
      expect(await call(other.page, 'importText', text)).toMatchObject({ added: 8, written: 8 });
      await other.context.close();
    } finally {
      await phone.context.close();
    }
  });

  it('refuses an insecure folder address with a clear message', async () => {
    const phone = await openPhone(site.url);
    try {
      const error = await call(phone.page, 'configureError', { folder_url: 'http://files.example.org/dav/', username: 'a', password: 'b', enabled: true });
      expect(error).toMatchObject({ code: 'sync-url-insecure' });
      expect(error!.message).toMatch(/https/);
    } finally {
      await phone.context.close();
    }
  });
});
