// Watching a page for Content-Security-Policy violations and for anything Chromium logs as an error (console
// messages, and the Log domain, where header parse errors such as an unknown Permissions-Policy feature land).
import type { Page } from 'playwright-core';

export interface Violation {
  directive: string;
  blocked: string;
  /** The policy that was violated: the page's <meta> has no report-uri, the server's header has one. */
  policy: string;
}

declare global {
  interface Window {
    __violations?: Violation[];
    __xss?: unknown;
  }
}

/** Installs the listener before any of the page's own scripts run, in every document the page loads. */
export async function watchViolations(page: Page): Promise<void> {
  await page.addInitScript(() => {
    window.__violations = [];
    document.addEventListener('securitypolicyviolation', (e) => {
      window.__violations!.push({ directive: e.effectiveDirective, blocked: e.blockedURI, policy: e.originalPolicy });
    });
  });
}

export function violations(page: Page): Promise<Violation[]> {
  return page.evaluate(() => window.__violations ?? []);
}

/** Everything Chromium logs at error level through the DevTools Log domain (browser-side messages). */
export async function collectLogErrors(page: Page): Promise<string[]> {
  const entries: string[] = [];
  const cdp = await page.context().newCDPSession(page);
  cdp.on('Log.entryAdded', ({ entry }) => {
    if (entry.level === 'error') entries.push(`${entry.source}: ${entry.text}${entry.url ? ` (${entry.url})` : ''}`);
  });
  await cdp.send('Log.enable');
  return entries;
}

/**
 * Follows every in-app link (#/…) from the main screens, breadth first, and waits on each screen until nothing
 * is loading. Returns the addresses visited.
 */
export async function walkEveryScreen(page: Page): Promise<{ visited: string[]; elements: Set<string> }> {
  const queue = ['#/day', '#/day/new', '#/plan', '#/specimens', '#/specimens/new', '#/log', '#/send', '#/settings'];
  const seen = new Set(queue);
  const visited: string[] = [];
  const elements = new Set<string>();
  while (queue.length && visited.length < 80) {
    const hash = queue.shift()!;
    await page.evaluate((h) => (location.hash = h), hash);
    await page.waitForFunction(() => {
      const main = document.querySelector('main');
      return main !== null && main.childElementCount > 0 && !/Loading/.test(main.textContent ?? '');
    }, undefined, { timeout: 30_000 });
    visited.push(hash);
    // A screen fills in from the store after its first render (the log's list of days, for one): read its links
    // once they have stopped changing, not at the first paint.
    const readLinks = () => page.evaluate(() => [...document.querySelectorAll('a[href^="#/"]')].map((a) => a.getAttribute('href')!).join('\n'));
    let before = await readLinks();
    for (let i = 0; i < 20; i++) {
      await page.waitForTimeout(150);
      const now = await readLinks();
      if (now === before && i >= 2) break;
      before = now;
    }
    const links = before.split('\n').filter(Boolean);
    const rendered = await page.evaluate(() => [...document.querySelectorAll('main *')].map((e) => e.localName).filter((n) => n.startsWith('pl-') && (document.querySelector(n)?.shadowRoot?.childElementCount ?? 0) > 0));
    for (const name of rendered) elements.add(name);
    for (const link of links) {
      if (!seen.has(link)) {
        seen.add(link);
        queue.push(link);
      }
    }
  }
  return { visited, elements };
}
