// Shared pieces for the browser tests: the system Chromium at phone size, driven by playwright-core.
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Locator, type Page } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inject } from 'vitest';
import { CHROMIUM_ARGS } from '../support/chromium';

export const chromiumPath = inject('chromiumPath');
export const baseUrl = inject('baseUrl');
export const distDir = inject('distDir');
/** False when no Chromium was found: the global setup has already said why (and failed under CI=true). */
export const haveChromium = chromiumPath !== '';

export const PHONE: BrowserContextOptions = {
  viewport: { width: 390, height: 844 },
  deviceScaleFactor: 2,
  isMobile: true,
  hasTouch: true,
  serviceWorkers: 'allow',
  locale: 'en-GB',
};

export function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  return chromium.launch({ executablePath: chromiumPath, args: [...CHROMIUM_ARGS, ...extraArgs] });
}

/** A browser with its own profile folder, which survives closing and reopening (and allows install checks). */
export async function launchPersistent(
  options: BrowserContextOptions = PHONE,
  extraArgs: string[] = [],
): Promise<{ context: BrowserContext; profile: string; reopen(): Promise<BrowserContext>; dispose(): Promise<void> }> {
  const profile = await mkdtemp(join(tmpdir(), 'plummet-profile-'));
  const open = () =>
    chromium.launchPersistentContext(profile, {
      ...options,
      executablePath: chromiumPath,
      args: [...CHROMIUM_ARGS, ...extraArgs],
    });
  let context = await open();
  return {
    get context() {
      return context;
    },
    profile,
    async reopen() {
      await context.close();
      context = await open();
      return context;
    },
    async dispose() {
      await context.close().catch(() => undefined);
      await rm(profile, { recursive: true, force: true });
    },
  };
}

/** Wait until the service worker is active and controls the page (it claims the page of the first load). */
export async function waitForServiceWorker(page: Page): Promise<void> {
  // A synchronous predicate: an async one returns a Promise, which counts as truthy at once.
  await page.waitForFunction(() => navigator.serviceWorker.controller?.state === 'activated', undefined, {
    timeout: 30_000,
  });
}

/** Collect uncaught page errors and console errors, to assert a clean run. */
export function collectErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`console: ${m.text()}`);
  });
  return errors;
}

/** Waits until the locator is visible (Playwright's own expect is not part of playwright-core). */
export async function expectVisible(locator: Locator, timeout = 20_000): Promise<void> {
  await locator.first().waitFor({ state: 'visible', timeout });
}

/**
 * The log's records in the app's database, counted in IndexedDB itself (not through the app): every kind's object
 * store, and since database version 5 the drops inside each series' value of drop_pack.
 */
export const storedRecordCount = (page: Page): Promise<number> =>
  page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const open = indexedDB.open('plummet-log');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const db = open.result;
          // Since version 5 the drops of a series are one value of drop_pack: its drops are counted.
          const kinds = ['site', 'specimen', 'day', 'reading', 'series', 'drop', 'drop_pack'].filter((k) => db.objectStoreNames.contains(k));
          const tx = db.transaction(kinds, 'readonly');
          let total = 0;
          let left = kinds.length;
          const done = () => {
            if (--left === 0) {
              db.close();
              resolve(total);
            }
          };
          for (const k of kinds) {
            if (k === 'drop_pack') {
              const all = tx.objectStore(k).getAll();
              all.onsuccess = () => {
                for (const p of all.result as { drops: unknown[] }[]) total += p.drops.length;
                done();
              };
              continue;
            }
            const count = tx.objectStore(k).count();
            count.onsuccess = () => {
              total += count.result;
              done();
            };
          }
        };
      }),
  );
