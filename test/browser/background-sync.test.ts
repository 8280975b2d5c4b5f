// Background Sync with no page of the app open: the service worker itself sends the log to the office folder
// once the phone is online again (here: once the server is back), from the same IndexedDB the pages use.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { deviceIndexName } from '../../src/sync/sync-run';
import { folderLog } from '../sync/folder-log';
import { BACKGROUND_SYNC_TAG } from '../../src/sync/scheduler';
import { folderFiles, type DavServer } from '../servers/dav-server';
import { nginxMissing, startNginx } from '../servers/nginx';
import { PHONE, baseUrl, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';

describe.skipIf(!haveChromium || nginxMissing() !== null)('Background Sync in the service worker', () => {
  let browser: Browser;
  let server: DavServer;
  beforeAll(async () => {
    browser = await launchBrowser();
    server = await startNginx({ setup: 'cors', appOrigins: [baseUrl] });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.dispose();
  });

  it('sends the log from the worker when no page is open, after a sync that failed', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${baseUrl}/#/settings`);
    await waitForServiceWorker(page);
    await page.getByRole('button', { name: 'Load the sample log' }).click();
    await expectVisible(page.getByText('The sample log is loaded'));
    const device = (await page.locator('dd.mono').textContent())!.trim();

    // The office server is down when the crew sets up the folder: the first sync fails and asks the browser
    // for a Background Sync.
    await server.stop();
    await page.goto(`${baseUrl}/#/send`);
    await page.getByRole('textbox', { name: 'Folder URL' }).fill(server.folderUrl);
    await page.getByRole('textbox', { name: 'User name' }).fill(server.credentials.username);
    await page.getByLabel('Password').fill(server.credentials.password);
    await page.getByRole('button', { name: 'Save folder' }).click();
    await page.getByRole('button', { name: 'Sync now' }).click();
    await expectVisible(page.getByText('Last sync failed'));
    // The registration follows the failure asynchronously: wait for it rather than race it.
    const tags = () =>
      page.evaluate(async () => {
        const reg = (await navigator.serviceWorker.ready) as ServiceWorkerRegistration & { sync?: { getTags(): Promise<string[]> } };
        return (await reg.sync?.getTags()) ?? [];
      });
    await expect.poll(tags, { timeout: 10_000, interval: 100 }).toContain(BACKGROUND_SYNC_TAG);

    // No window of the app is left; the server comes back; the browser fires the sync event.
    const cdp = await context.newCDPSession(page);
    await cdp.send('ServiceWorker.enable');
    const registrations: { registrationId: string; scopeURL: string }[] = [];
    cdp.on('ServiceWorker.workerRegistrationUpdated', (e: { registrations: { registrationId: string; scopeURL: string }[] }) => registrations.push(...e.registrations));
    await page.goto('about:blank');
    await server.start();
    await expect.poll(() => registrations.find((r) => r.scopeURL === `${baseUrl}/`), { timeout: 10_000 }).toBeTruthy();
    const registration = registrations.find((r) => r.scopeURL === `${baseUrl}/`)!;
    expect(await folderFiles(server)).not.toContain(deviceIndexName(device));
    await cdp.send('ServiceWorker.dispatchSyncEvent', { origin: baseUrl, registrationId: registration.registrationId, tag: BACKGROUND_SYNC_TAG, lastChance: false });
    await expect.poll(async () => (await folderFiles(server)).includes(deviceIndexName(device)), { timeout: 20_000, interval: 250 }).toBe(true);
    const sent = await folderLog(server, device);
    expect(sent.filter((r) => r.kind === 'drop').length).toBe(26);
    await context.close();
  });
});
