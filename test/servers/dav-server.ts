// What the tests need from a WebDAV test server, whichever kind it is.
import { chmod, mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Credentials } from './htpasswd';

export type DavKind = 'apache' | 'nginx';

export interface DavServer {
  kind: DavKind;
  /** http://127.0.0.1:<port> */
  origin: string;
  /** The folder: origin + "/dav/". */
  folderUrl: string;
  port: number;
  /** The folder's files on disk. */
  dataDir: string;
  credentials: Credentials;
  running: boolean;
  start(): Promise<void>;
  /** SIGTERM, then wait for the process to exit. */
  stop(): Promise<void>;
  /** Stop and remove every file the server had. */
  dispose(): Promise<void>;
  /** The generated configuration, for failure messages. */
  config: string;
  /** The server's error log, for failure messages. */
  errorLog(): Promise<string>;
}

export const TEST_USER: Credentials = { username: 'fieldteam', password: 'quarry-2026' };

export interface ServerDirs {
  base: string;
  dataDir: string;
}

/** A private folder tree: mkdtemp makes it 0700, and the server's workers (nobody, www-data) must get in. */
export async function makeServerDirs(prefix: string): Promise<ServerDirs> {
  const base = await mkdtemp(join(tmpdir(), prefix));
  await chmod(base, 0o755);
  const dataDir = join(base, 'data');
  await mkdir(dataDir, { recursive: true });
  await chmod(dataDir, 0o777);
  return { base, dataDir };
}

/** A file put straight into the folder, as the office would (readable by the server's workers). */
export async function putFolderFile(server: DavServer, name: string, text: string): Promise<void> {
  const path = join(server.dataDir, name);
  await writeFile(path, text);
  await chmod(path, 0o666);
}

export async function readFolderFile(server: DavServer, name: string): Promise<string> {
  return readFile(join(server.dataDir, name), 'utf8');
}

export async function folderFiles(server: DavServer): Promise<string[]> {
  return (await readdir(server.dataDir)).filter((n) => !n.startsWith('.')).sort();
}

export async function removeDirs(dirs: ServerDirs): Promise<void> {
  await rm(dirs.base, { recursive: true, force: true });
}
