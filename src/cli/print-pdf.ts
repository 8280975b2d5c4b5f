/**
 * A self-contained HTML document printed to PDF by the system Chromium (playwright-core, loaded only when a PDF is
 * asked for). The page runs with JavaScript off and every request refused, so printing reads nothing but the
 * document. Paper: A4 or US Letter; the document's own @page rule sets the margins and its CSS the page breaks.
 */
import { existsSync } from 'node:fs';
import { PlummetError } from '../errors';
// The project's one list of Chromium flags (the tests, the benchmarks and this command; each explained there).
import { CHROMIUM_ARGS } from '../../scripts/chromium-args.mjs';

export type Paper = 'a4' | 'letter';

/** Where a Chromium is (CHROME_PATH, then Debian's and Ubuntu's paths), or null. */
export function findChromium(env: Record<string, string | undefined> = process.env): string | null {
  for (const path of [env['CHROME_PATH'], '/usr/bin/chromium', '/usr/bin/chromium-browser']) if (path && existsSync(path)) return path;
  return null;
}

export async function printPdf(html: string, paper: Paper, chromiumPath: string): Promise<Uint8Array> {
  let playwright: typeof import('playwright-core');
  try {
    playwright = await import('playwright-core');
  } catch (error) {
    throw new PlummetError({ code: 'pdf-unavailable', field: '--pdf', value: 'playwright-core', allowed: 'an installation with playwright-core (npm ci)', message: 'cannot print a PDF: the package playwright-core is not installed', cause: error });
  }
  const browser = await playwright.chromium.launch({ executablePath: chromiumPath, args: [...CHROMIUM_ARGS], headless: true });
  try {
    const context = await browser.newContext({ javaScriptEnabled: false, offline: true });
    await context.route('**/*', (route) => route.abort());
    const page = await context.newPage();
    await page.setContent(html, { waitUntil: 'load' });
    await page.emulateMedia({ media: 'print' });
    const pdf = await page.pdf({ format: paper === 'a4' ? 'A4' : 'Letter', printBackground: true, preferCSSPageSize: false });
    return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  } finally {
    await browser.close();
  }
}
