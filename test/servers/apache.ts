// A private Apache httpd with mod_dav on a free port of 127.0.0.1: /usr/sbin/apache2 -f CONF -DFOREGROUND.
import { existsSync } from 'node:fs';
import { chmod, mkdir, readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { userInfo } from 'node:os';
import { basicAuthorization } from '../../src/sync/basic-auth';
import { apacheConfig } from './apache-config';
import { makeServerDirs, removeDirs, TEST_USER, type DavServer } from './dav-server';
import { htpasswdFile, type Credentials } from './htpasswd';
import { freePort, startProcess, type RunningProcess } from './process';

export const APACHE = '/usr/sbin/apache2';

export function apacheMissing(): string | null {
  if (!existsSync(APACHE)) return `no ${APACHE} (apt-get install apache2)`;
  if (!existsSync('/usr/lib/apache2/modules/mod_dav_fs.so')) return 'no mod_dav_fs (apt-get install apache2)';
  return null;
}

export interface ApacheStartOptions {
  appOrigins?: string[];
  challenge?: boolean;
  users?: Credentials[];
  port?: number;
}

export async function startApache(options: ApacheStartOptions = {}): Promise<DavServer> {
  const dirs = await makeServerDirs('plummet-apache-');
  const run = join(dirs.base, 'run');
  await mkdir(run, { recursive: true });
  await chmod(run, 0o777);
  const users = options.users ?? [TEST_USER];
  const userFile = join(dirs.base, 'htpasswd');
  await writeFile(userFile, htpasswdFile(users));
  await chmod(userFile, 0o644);
  const port = options.port ?? (await freePort());
  const config = apacheConfig({
    base: dirs.base,
    port,
    dataDir: dirs.dataDir,
    appOrigins: options.appOrigins ?? [],
    auth: options.challenge
      ? { kind: 'basic', userFile }
      : { kind: 'no-challenge', authorizations: users.map((u) => basicAuthorization(u.username, u.password)) },
    // Started by root, Apache drops to this user; the data folder is 0777 so it can write.
    runAs: userInfo().uid === 0 ? { user: 'www-data', group: 'www-data' } : null,
  });
  const confPath = join(dirs.base, 'httpd.conf');
  await writeFile(confPath, config);
  let process: RunningProcess | null = null;
  const server: DavServer = {
    kind: 'apache',
    origin: `http://127.0.0.1:${port}`,
    folderUrl: `http://127.0.0.1:${port}/dav/`,
    port,
    dataDir: dirs.dataDir,
    credentials: users[0]!,
    running: false,
    config,
    async start() {
      if (process) return;
      process = await startProcess(APACHE, ['-f', confPath, '-DFOREGROUND'], port, 'apache2');
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
      return readFile(join(run, 'error.log'), 'utf8').catch(() => '');
    },
  };
  await server.start();
  return server;
}
