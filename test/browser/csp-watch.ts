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
