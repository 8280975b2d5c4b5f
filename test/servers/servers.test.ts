// The test servers themselves: that they are what the sync tests take them for (the facts in
// /work/shared/TOOLCHAIN.md about Apache mod_dav and nginx's DAV module, checked on the real programs).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { basicAuthorization } from '../../src/sync/basic-auth';
import { apacheMissing, startApache } from './apache';
import { folderFiles, putFolderFile, TEST_USER, type DavServer } from './dav-server';
import { htpasswdLine } from './htpasswd';
import { nginxMissing, startNginx } from './nginx';
import { portAnswers } from './process';

const APP_ORIGIN = 'http://127.0.0.1:45678';
const auth = basicAuthorization(TEST_USER.username, TEST_USER.password);

describe('the password file line', () => {
  it('is what Apache\'s own htpasswd -nbs writes', () => {
    const line = execFileSync('htpasswd', ['-nbs', 'crew', 'quarry-2026'], { encoding: 'utf8' }).trim();
    expect(htpasswdLine({ username: 'crew', password: 'quarry-2026' })).toBe(line);
  });
});

const kinds = [
  ['apache', apacheMissing(), startApache],
  ['nginx', nginxMissing(), startNginx],
] as const;

describe.each(kinds)('the %s test server', (kind, missing, start) => {
  if (missing && process.env.CI === 'true') throw new Error(missing);
  let server: DavServer;
  beforeAll(async () => {
    server = await start({ appOrigins: [APP_ORIGIN] });
  });
  afterAll(async () => {
    await server?.dispose();
  });

  const put = (name: string, body: string, headers: Record<string, string> = {}) =>
    fetch(server.folderUrl + name, { method: 'PUT', body, headers: { Authorization: auth, ...headers } });

  it.skipIf(missing)('stores a file and lists it with PROPFIND Depth 1', async () => {
    expect((await put('a.json', '{"a":1}')).status).toBe(201);
    const list = await fetch(server.folderUrl, { method: 'PROPFIND', headers: { Authorization: auth, Depth: '1' } });
    expect(list.status).toBe(207);
    expect(await list.text()).toContain('/dav/a.json');
  });

  it.skipIf(missing)('answers the preflight without credentials, with the CORS headers for the app', async () => {
    const res = await fetch(server.folderUrl, {
      method: 'OPTIONS',
      headers: { Origin: APP_ORIGIN, 'Access-Control-Request-Method': 'PROPFIND', 'Access-Control-Request-Headers': 'authorization,depth' },
    });
    expect(res.status).toBe(204);
    expect(res.headers.get('access-control-allow-origin')).toBe(APP_ORIGIN);
    expect(res.headers.get('access-control-allow-headers')).toMatch(/Authorization/);
    expect(res.headers.get('access-control-expose-headers')).toMatch(/ETag.*DAV.*Content-Length/);
  });

  it.skipIf(missing)('gives no CORS headers to another origin', async () => {
    const res = await fetch(server.folderUrl, { method: 'OPTIONS', headers: { Origin: 'http://127.0.0.1:1' } });
    expect(res.headers.get('access-control-allow-origin') ?? '').toBe('');
  });

  it.skipIf(missing)('answers a wrong password with 401, CORS headers and no login challenge', async () => {
    const res = await fetch(server.folderUrl + 'a.json', {
      headers: { Authorization: basicAuthorization('crew', 'wrong'), Origin: APP_ORIGIN },
    });
    expect(res.status).toBe(401);
    expect(res.headers.get('www-authenticate')).toBeNull();
    expect(res.headers.get('access-control-allow-origin')).toBe(APP_ORIGIN);
  });

  it.skipIf(missing)('keeps its files across a stop and a start on the same port, and frees the port when stopped', async () => {
    await put('kept.json', '{"kept":true}');
    await server.stop();
    expect(await portAnswers(server.port)).toBe(false);
    await server.start();
    const res = await fetch(server.folderUrl + 'kept.json', { headers: { Authorization: auth } });
    expect(await res.text()).toBe('{"kept":true}');
  });

  it.skipIf(missing)('serves a file the office put straight into the folder', async () => {
    await putFolderFile(server, 'office.json', '{"office":1}');
    const res = await fetch(server.folderUrl + 'office.json', { headers: { Authorization: auth } });
    expect(await res.text()).toBe('{"office":1}');
    expect(await folderFiles(server)).toContain('office.json');
  });

  if (kind === 'apache') {
    it.skipIf(missing)('honours If-Match on PUT (412 on a stale tag) and lists getetag', async () => {
      await put('c.json', '{"v":1}');
      await new Promise((r) => setTimeout(r, 1100));
      const etag = (await fetch(server.folderUrl + 'c.json', { method: 'HEAD', headers: { Authorization: auth } })).headers.get('etag')!;
      expect(etag).toMatch(/^"/);
      expect((await put('c.json', '{"v":2}', { 'If-Match': etag })).status).toBe(204);
      expect((await put('c.json', '{"v":3}', { 'If-Match': etag })).status).toBe(412);
      expect((await put('c.json', '{"v":3}', { 'If-None-Match': '*' })).status).toBe(412);
      const list = await (await fetch(server.folderUrl, { method: 'PROPFIND', headers: { Authorization: auth, Depth: '1' } })).text();
      expect(list).toMatch(/getetag/);
    });
  } else {
    it.skipIf(missing)('ignores If-Match on PUT (the last writer wins) and lists no getetag', async () => {
      await put('c.json', '{"v":1}');
      expect((await put('c.json', '{"v":2}', { 'If-Match': '"stale"' })).status).toBe(204);
      expect(await (await fetch(server.folderUrl + 'c.json', { headers: { Authorization: auth } })).text()).toBe('{"v":2}');
      const list = await (await fetch(server.folderUrl, { method: 'PROPFIND', headers: { Authorization: auth, Depth: '1' } })).text();
      expect(list).not.toMatch(/getetag/);
    });
  }
});

describe.each(kinds)('the %s test server with the standard login challenge', (_kind, missing, start) => {
  it.skipIf(missing)('sends WWW-Authenticate: Basic with its 401, as an office server would', async () => {
    const server = await start({ appOrigins: [APP_ORIGIN], challenge: true });
    try {
      const res = await fetch(server.folderUrl, { method: 'PROPFIND', headers: { Depth: '1' } });
      expect(res.status).toBe(401);
      expect(res.headers.get('www-authenticate')).toMatch(/^Basic /);
      const ok = await fetch(server.folderUrl, { method: 'PROPFIND', headers: { Depth: '1', Authorization: auth } });
      expect(ok.status).toBe(207);
    } finally {
      await server.dispose();
    }
  });
});
