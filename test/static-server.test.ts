import { afterEach, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CSP_REPORT_PATH, startStaticServer, type StaticServer } from '../scripts/static-server.mjs';

let server: StaticServer | undefined;
let dir = '';
afterEach(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

function site(): string {
  dir = mkdtempSync(join(tmpdir(), 'plummet-static-'));
  mkdirSync(join(dir, 'assets'));
  writeFileSync(join(dir, 'index.html'), '<!doctype html><title>app</title>');
  writeFileSync(join(dir, 'assets', 'a.js'), 'export {}');
  return dir;
}

describe('the static server', () => {
  it('serves files below a root given with a trailing slash', async () => {
    server = await startStaticServer({ root: `${site()}/` });
    const res = await fetch(`${server.url}/assets/a.js`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toContain('text/javascript');
    expect(res.headers.get('cache-control')).toContain('immutable');
  });

  it('answers a navigation to an unknown path with index.html, but a missing file with 404', async () => {
    server = await startStaticServer({ root: site() });
    const page = await fetch(`${server.url}/day/123`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('<title>app</title>');
    expect(page.headers.get('cache-control')).toBe('no-cache');
    expect((await fetch(`${server.url}/assets/missing.js`)).status).toBe(404);
  });

  it('refuses paths that climb out of the root', async () => {
    server = await startStaticServer({ root: site() });
    const res = await fetch(`${server.url}/..%2F..%2Fetc%2Fpasswd`);
    expect(res.status).toBe(403);
  });
});

describe('the static server, compressing', () => {
  it('sends text gzip-compressed when the browser accepts it, and plain otherwise', async () => {
    server = await startStaticServer({ root: site() });
    const { request } = await import('node:http');
    const get = (encoding: string) =>
      new Promise<{ encoding: string | undefined; length: number }>((resolve, reject) => {
        request(`${server!.url}/assets/a.js`, { headers: { 'accept-encoding': encoding } }, (res) => {
          let length = 0;
          res.on('data', (c: Buffer) => (length += c.length));
          res.on('end', () => resolve({ encoding: res.headers['content-encoding'], length }));
        })
          .on('error', reject)
          .end();
      });
    expect((await get('gzip, deflate')).encoding).toBe('gzip');
    const plain = await get('identity');
    expect(plain.encoding).toBeUndefined();
    expect(plain.length).toBe('export {}'.length);
  });
});

describe('the static server’s security headers', () => {
  it('sends the policy, nosniff, the referrer and permissions policies with a page and a root script (a worker)', async () => {
    writeFileSync(join(site(), 'sw.js'), '');
    server = await startStaticServer({ root: dir, folderOrigins: ['https://files.example.org'] });
    for (const path of ['/', '/some/screen', '/sw.js']) {
      const res = await fetch(`${server.url}${path}`);
      const csp = res.headers.get('content-security-policy') ?? '';
      expect(csp, path).toContain("script-src 'self' blob:");
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).toContain(`report-uri ${CSP_REPORT_PATH}`);
      expect(csp, path).toMatch(/connect-src 'self' http:\/\/localhost:\* http:\/\/127\.0\.0\.1:\* http:\/\/\*\.localhost:\* https:\/\/files\.example\.org(;|$)/);
      expect(csp, path).not.toMatch(/unsafe-(inline|eval)/);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('referrer-policy'), path).toBe('no-referrer');
      expect(res.headers.get('permissions-policy'), path).toContain('microphone=(self)');
    }
  });

  it('sends nosniff and the referrer policy with every other answer, a 404 included', async () => {
    server = await startStaticServer({ root: site() });
    for (const path of ['/assets/a.js', '/missing.js']) {
      const res = await fetch(`${server.url}${path}`);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('referrer-policy'), path).toBe('no-referrer');
      expect(res.headers.get('content-security-policy'), path).toBeNull();
    }
  });

  it('hands a posted violation report to onCspReport and answers 204', async () => {
    const reports: unknown[] = [];
    server = await startStaticServer({ root: site(), onCspReport: (r) => reports.push(r) });
    const body = { 'csp-report': { 'violated-directive': 'script-src-elem', 'blocked-uri': 'inline' } };
    const res = await fetch(`${server.url}${CSP_REPORT_PATH}`, { method: 'POST', headers: { 'content-type': 'application/csp-report' }, body: JSON.stringify(body) });
    expect(res.status).toBe(204);
    await new Promise((resolve) => setImmediate(resolve));
    expect(reports).toEqual([body]);
  });
});

describe('the static server without a favicon', () => {
  it('answers the browser’s own /favicon.ico request with 204, and any other missing file with 404', async () => {
    server = await startStaticServer({ root: site() });
    expect((await fetch(`${server.url}/favicon.ico`)).status).toBe(204);
    expect((await fetch(`${server.url}/missing.ico`)).status).toBe(404);
  });
});
