// A private nginx with the WebDAV modules, on a free port of 127.0.0.1, with a configuration generated from
// nginx-config.ts. Runs as `nginx -p DIR -c DIR/nginx.conf -g 'daemon off;'`.
import { existsSync } from 'node:fs';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { basicAuthorization } from '../../src/sync/basic-auth';
import { makeServerDirs, removeDirs, TEST_USER, type DavServer } from './dav-server';
import { htpasswdFile, type Credentials } from './htpasswd';
import { nginxPrivateConfig, type NginxSetup } from './nginx-config';
import { freePort, startProcess, type RunningProcess } from './process';

export const NGINX = '/usr/sbin/nginx';
export const DAV_EXT_MODULE = '/usr/lib/nginx/modules/ngx_http_dav_ext_module.so';

export function nginxMissing(): string | null {
  if (!existsSync(NGINX)) return `no ${NGINX} (apt-get install nginx libnginx-mod-http-dav-ext)`;
  if (!existsSync(DAV_EXT_MODULE)) return `no ${DAV_EXT_MODULE} (apt-get install libnginx-mod-http-dav-ext)`;
  return null;
}

export interface NginxOptions {
  setup?: NginxSetup;
  /** cors: the app's origins. */
  appOrigins?: string[];
  /** same-origin: the folder served at / beside /dav/. */
  appRoot?: string;
  /** Send a WWW-Authenticate challenge with 401 (auth_basic) rather than the tests' plain 401. */
  challenge?: boolean;
  users?: Credentials[];
  port?: number;
}

export async function startNginx(options: NginxOptions = {}): Promise<DavServer> {
  const dirs = await makeServerDirs('plummet-nginx-');
  await mkdir(join(dirs.base, 'tmp'), { recursive: true });
  const users = options.users ?? [TEST_USER];
  const userFile = join(dirs.base, 'htpasswd');
  await writeFile(userFile, htpasswdFile(users));
  const port = options.port ?? (await freePort());
  const config = nginxPrivateConfig(dirs.base, {
    setup: options.setup ?? 'cors',
    listen: `127.0.0.1:${port}`,
    serverName: '127.0.0.1',
    tls: null,
    folderRoot: dirs.dataDir,
    folderPath: '/dav/',
    appRoot: options.appRoot,
    appOrigins: options.appOrigins ?? [],
    auth: options.challenge
      ? { kind: 'basic', userFile }
      : { kind: 'no-challenge', authorizations: users.map((u) => basicAuthorization(u.username, u.password)) },
    maxBodySize: '200m',
  });
  const confPath = join(dirs.base, 'nginx.conf');
  await writeFile(confPath, config);
  let process: RunningProcess | null = null;
  const server: DavServer = {
    kind: 'nginx',
    origin: `http://127.0.0.1:${port}`,
    folderUrl: `http://127.0.0.1:${port}/dav/`,
    port,
    dataDir: dirs.dataDir,
    credentials: users[0]!,
    running: false,
    config,
    async start() {
      if (process) return;
      process = await startProcess(NGINX, ['-p', dirs.base, '-c', confPath, '-g', 'daemon off;'], port, 'nginx');
      server.running = true;
    },
    async stop() {
      const p = process;
      process = null;
      server.running = false;
      await p?.stop();
    },
    async dispose() {
      await server.stop();
      await removeDirs(dirs);
    },
    async errorLog() {
      return readFile(join(dirs.base, 'error.log'), 'utf8').catch(() => '');
    },
  };
  await server.start();
  return server;
}
