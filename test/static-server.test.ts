import { afterEach, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startStaticServer, type StaticServer } from '../scripts/static-server.mjs';

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
