// A new version waits until the person taps the notice: nothing switches mid-entry, and the draft survives.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';
import { startStaticServer, type StaticServer } from '../../scripts/static-server.mjs';
import { buildApp } from './global-setup';
import { PHONE, distDir, expectVisible, haveChromium, launchBrowser, waitForServiceWorker } from './harness';

describe.skipIf(!haveChromium)('updating the app', () => {
  let browser: Browser;
  let server: StaticServer;
  let nextDir: string;
  beforeAll(async () => {
    nextDir = await mkdtemp(join(tmpdir(), 'plummet-next-'));
    await buildApp(nextDir, { PLUMMET_BUILD_ID: 'next-build' });
    server = await startStaticServer({ root: distDir });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
    await rm(nextDir, { recursive: true, force: true });
  });

  it('shows a notice for a waiting version and switches only when it is tapped, keeping the draft', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${server.url}/#/settings`);
    await waitForServiceWorker(page);
    const before = await page.getByTestId('build-id').textContent();
    expect(before).not.toBe('next-build');

    // Someone is in the middle of an entry when the new version arrives.
    await page.goto(`${server.url}/#/day/new`);
    const name = page.getByRole('textbox', { name: 'Site name' });
    await name.fill('Half-typed site');
    server.setRoot(nextDir);
    await page.evaluate(async () => {
      await (await navigator.serviceWorker.getRegistration())?.update();
    });
    await expectVisible(page.getByText('A new version of Plummet is ready.'), 30_000);
    // Nothing switched: the same page, the same text, the old version still in control.
    expect(await name.inputValue()).toBe('Half-typed site');
    await page.waitForTimeout(1500);
    expect(await name.inputValue()).toBe('Half-typed site');

    await Promise.all([page.waitForEvent('load'), page.getByRole('button', { name: 'Switch now' }).click()]);
    await page.goto(`${server.url}/#/settings`);
    await expectVisible(page.getByTestId('build-id'));
    expect(await page.getByTestId('build-id').textContent()).toBe('next-build');
    await page.goto(`${server.url}/#/day/new`);
    await expectVisible(page.getByText('Your unsaved entries were brought back.'));
    expect(await page.getByRole('textbox', { name: 'Site name' }).inputValue()).toBe('Half-typed site');
    await context.close();
  });
});
