// The app shell on the real Chromium at phone size: it loads, the service worker takes control, and the app
// keeps working offline and with its server gone; every screen passes an axe scan; it is installable.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import AxeBuilder from '@axe-core/playwright';
import type { Browser } from 'playwright-core';
import { startStaticServer } from '../../scripts/static-server.mjs';
import { PHONE, baseUrl, collectErrors, distDir, haveChromium, launchBrowser, launchPersistent, waitForServiceWorker, expectVisible } from './harness';

describe.skipIf(!haveChromium)('the app shell in Chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('loads at phone size with the main navigation and no errors', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const errors = collectErrors(page);
    await page.goto(`${baseUrl}/`);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const name of ['Test day', 'Planner', 'Specimens', 'Log', 'Send']) {
      await expectVisible(nav.getByRole('link', { name }));
    }
    await expectVisible(page.getByRole('link', { name: 'Settings' }));
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(390);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('registers the service worker, which activates and controls the page', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${baseUrl}/`);
    await waitForServiceWorker(page);
    const scope = await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.scope);
    expect(scope).toBe(`${baseUrl}/`);
    const caches = await page.evaluate(async () => {
      const names = await self.caches.keys();
      const entries = await Promise.all(names.map(async (n) => (await (await self.caches.open(n)).keys()).map((r) => r.url)));
      return entries.flat();
    });
    expect(caches.some((u) => u.includes('/index.html'))).toBe(true);
    expect(caches.some((u) => /\/assets\/.+\.js/.test(u))).toBe(true);
    await context.close();
  });

  it('reloads offline from the service worker, deep links included', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${baseUrl}/`);
    await waitForServiceWorker(page);
    await context.setOffline(true);
    await page.evaluate(() => (location.hash = '#/log'));
    const response = await page.reload();
    expect(response?.fromServiceWorker()).toBe(true);
    await expectVisible(page.getByRole('heading', { level: 1, name: 'Log' }));
    // A path the server never had is answered with the app too, offline.
    const deep = await page.goto(`${baseUrl}/some/deep/path`);
    expect(deep?.fromServiceWorker()).toBe(true);
    await expectVisible(page.getByRole('navigation', { name: 'Main' }));
    await context.close();
  });

  it('a context that never had the worker fails offline (the control for the test above)', async () => {
    const context = await browser.newContext({ ...PHONE, serviceWorkers: 'block' });
    const page = await context.newPage();
    await page.goto(`${baseUrl}/`);
    await context.setOffline(true);
    await expect(page.reload()).rejects.toThrow(/ERR_INTERNET_DISCONNECTED/);
    await context.close();
  });

  it('keeps working after its server is stopped, with the worker started cold', async () => {
    const server = await startStaticServer({ root: distDir });
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${server.url}/`);
    await waitForServiceWorker(page);
    await server.close();
    const cdp = await context.newCDPSession(page);
    await cdp.send('ServiceWorker.enable');
    await cdp.send('ServiceWorker.stopAllWorkers');
    await page.evaluate(() => (location.hash = '#/specimens'));
    const response = await page.reload();
    expect(response?.fromServiceWorker()).toBe(true);
    await expectVisible(page.getByRole('heading', { level: 1, name: 'Specimens' }));
    // Control: bypassing the worker, the stopped server cannot answer.
    await cdp.send('Network.enable');
    await cdp.send('Network.setBypassServiceWorker', { bypass: true });
    await expect(page.reload()).rejects.toThrow(/ERR_CONNECTION_REFUSED/);
    await context.close();
  });

  it('passes an axe scan (WCAG 2 A and AA) on every screen', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    for (const screen of ['day', 'plan', 'specimens', 'log', 'send', 'settings']) {
      await page.goto(`${baseUrl}/#/${screen}`);
      await page.getByRole('navigation', { name: 'Main' }).waitFor();
      const result = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
      const found = result.violations.map((v) => `${screen}: ${v.id} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
      expect(found).toEqual([]);
    }
    await context.close();
  });
});

describe.skipIf(!haveChromium)('installing the app', () => {
  it('is installable by Chromium: a manifest with name, start URL, standalone display and suitable icons', async () => {
    const phone = await launchPersistent();
    try {
      const page = await phone.context.newPage();
      await page.goto(`${baseUrl}/`);
      await waitForServiceWorker(page);
      const cdp = await phone.context.newCDPSession(page);
      const { installabilityErrors } = await cdp.send('Page.getInstallabilityErrors');
      expect(installabilityErrors).toEqual([]);
      const manifest = (await cdp.send('Page.getAppManifest')) as { data?: string; errors: unknown[] };
      expect(manifest.errors).toEqual([]);
      const parsed = JSON.parse(manifest.data ?? '{}') as Record<string, unknown>;
      expect(parsed).toMatchObject({ name: 'Plummet field log', short_name: 'Plummet', display: 'standalone', start_url: '/' });
      const icons = parsed.icons as Array<{ sizes: string; purpose?: string }>;
      expect(icons.map((i) => `${i.sizes}:${i.purpose ?? 'any'}`)).toEqual(
        expect.arrayContaining(['192x192:any', '512x512:any', '512x512:maskable', 'any:any']),
      );
    } finally {
      await phone.dispose();
    }
  });
});
