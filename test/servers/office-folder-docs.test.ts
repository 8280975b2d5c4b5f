// docs/office-folder.md shows two nginx configurations. They are rendered from the same templates the tests run
// (nginx-config.ts); here: the document matches them, both pass `nginx -t` with real certificate files, and
// both serve the folder over TLS as the document says (checked with node:https trusting the test certificate).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { request } from 'node:https';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { basicAuthorization } from '../../src/sync/basic-auth';
import { makeServerDirs, removeDirs, TEST_USER, type ServerDirs } from './dav-server';
import { htpasswdFile } from './htpasswd';
import { documentedExample, nginxPrivateConfig, nginxSiteConfig, type NginxSetup, type NginxSiteOptions } from './nginx-config';
import { NGINX, nginxMissing } from './nginx';
import { freePort, startProcess } from './process';

const run = promisify(execFile);
const DOC = fileURLToPath(new URL('../../docs/office-folder.md', import.meta.url));

function documentedBlock(text: string, setup: NginxSetup): string {
  const marker = `<!-- example: ${setup} -->\n\`\`\`nginx\n`;
  const start = text.indexOf(marker);
  if (start < 0) throw new Error(`no example marked "${setup}" in docs/office-folder.md`);
  const end = text.indexOf('```', start + marker.length);
  return text.slice(start + marker.length, end);
}

describe('the nginx examples of docs/office-folder.md', () => {
  it.each(['same-origin', 'cors'] as const)('show the %s configuration exactly as the tests generate it', async (setup) => {
    const text = await readFile(DOC, 'utf8');
    expect(documentedBlock(text, setup)).toBe(nginxSiteConfig(documentedExample(setup)));
  });
});

const missing = nginxMissing() ?? (existsSync('/usr/bin/openssl') ? null : 'no /usr/bin/openssl');

interface Answer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/** An HTTPS request to 127.0.0.1 for the example's host name, trusting only the test certificate. */
function https(port: number, ca: string, method: string, path: string, headers: Record<string, string> = {}, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, servername: 'files.example.org', ca, method, path, headers: { Host: 'files.example.org', ...headers } }, (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (d) => (text += d));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
    });
    req.on('error', reject);
    req.end(body);
  });
}

describe.skipIf(missing)('the documented nginx configurations, run for real', () => {
  let dirs: ServerDirs;
  let certificate: string;
  let key: string;
  let userFile: string;
  let appRoot: string;

  beforeAll(async () => {
    dirs = await makeServerDirs('plummet-docs-');
    certificate = join(dirs.base, 'files.example.org.pem');
    key = join(dirs.base, 'files.example.org.key');
    // A self-signed certificate for the example's name (openssl req -x509).
    await run('openssl', ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-days', '1', '-subj', '/CN=files.example.org', '-addext', 'subjectAltName=DNS:files.example.org', '-keyout', key, '-out', certificate]);
    userFile = join(dirs.base, 'plummet.htpasswd');
    await writeFile(userFile, htpasswdFile([TEST_USER]));
    appRoot = join(dirs.base, 'app');
    await mkdir(appRoot);
    await writeFile(join(appRoot, 'index.html'), '<!doctype html><title>Plummet</title>');
  });
  afterAll(async () => {
    if (dirs) await removeDirs(dirs);
  });

  /** The documented example with this machine's paths and a free port: what an office gets, here. */
  function local(setup: NginxSetup, port: number): NginxSiteOptions {
    const example = documentedExample(setup);
    return { ...example, listen: `127.0.0.1:${port} ssl`, tls: { certificate, key }, folderRoot: dirs.dataDir, appRoot, auth: { kind: 'basic', userFile } };
  }

  async function prefix(name: string): Promise<string> {
    const base = join(dirs.base, name);
    await mkdir(join(base, 'tmp'), { recursive: true });
    return base;
  }

  it.each(['same-origin', 'cors'] as const)('%s: passes nginx -t', async (setup) => {
    const base = await prefix(`t-${setup}`);
    await writeFile(join(base, 'nginx.conf'), nginxPrivateConfig(base, local(setup, await freePort())));
    const { stderr } = await run(NGINX, ['-t', '-p', base, '-c', join(base, 'nginx.conf')]);
    expect(stderr).toMatch(/test is successful/);
  });

  it.each(['same-origin', 'cors'] as const)('%s: serves the folder over TLS with Basic authentication', async (setup) => {
    const port = await freePort();
    const base = await prefix(`r-${setup}`);
    await writeFile(join(base, 'nginx.conf'), nginxPrivateConfig(base, local(setup, port)));
    const server = await startProcess(NGINX, ['-p', base, '-c', join(base, 'nginx.conf'), '-g', 'daemon off;'], port, 'nginx');
    const folder = documentedExample(setup).folderPath;
    const ca = await readFile(certificate, 'utf8');
    const auth = { Authorization: basicAuthorization(TEST_USER.username, TEST_USER.password) };
    try {
      expect((await https(port, ca, 'PUT', `${folder}plummet-log-${setup}.json`, auth, '{"format":"plummet-log"}')).status).toBe(201);
      const listing = await https(port, ca, 'PROPFIND', folder, { ...auth, Depth: '1' });
      expect(listing.status).toBe(207);
      expect(listing.body).toContain(`plummet-log-${setup}.json`);
      expect(listing.headers['cache-control']).toBe('no-cache');
      const refused = await https(port, ca, 'PROPFIND', folder, { Depth: '1' });
      expect(refused.status).toBe(401);
      expect(refused.headers['www-authenticate']).toMatch(/^Basic /);
      if (setup === 'cors') {
        const origin = 'https://plummet.example.org';
        const preflight = await https(port, ca, 'OPTIONS', folder, { Origin: origin, 'Access-Control-Request-Method': 'PROPFIND' });
        expect(preflight.status).toBe(204);
        expect(preflight.headers['access-control-allow-origin']).toBe(origin);
        expect((await https(port, ca, 'PROPFIND', folder, { Origin: origin, Depth: '1' })).headers['access-control-allow-origin']).toBe(origin);
        expect((await https(port, ca, 'OPTIONS', folder, { Origin: 'https://elsewhere.example.org' })).headers['access-control-allow-origin'] ?? '').toBe('');
      } else {
        const page = await https(port, ca, 'GET', '/days/2026-06-14');
        expect(page.status).toBe(200);
        expect(page.body).toContain('<title>Plummet</title>');
      }
    } finally {
      await server.stop();
    }
  });
});
