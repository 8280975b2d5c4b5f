// A phone's log as the office folder holds it (its part index and parts, see src/log/log-parts.ts), read straight
// from the server's data folder, for the sync tests.
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { assembleParts, partFileName, readLogFile, readPartIndex, type LogRecord } from '../../src/log';
import { deviceIndexName, partFolderName } from '../../src/sync/sync-run';
import type { DavServer } from '../servers/dav-server';

/** The phone's part folder in the folder, e.g. "plummet-log-phoneA.parts". */
export const partsOf = (device: string): string => partFolderName(deviceIndexName(device));

/** The phone's whole log: its index read and checked, every part it names read, checked and assembled. */
export async function folderLog(server: DavServer, device: string): Promise<LogRecord[]> {
  const index = readPartIndex(await readFile(join(server.dataDir, deviceIndexName(device)), 'utf8'));
  const parts = [];
  for (const entry of index.parts) parts.push(readLogFile(await readFile(join(server.dataDir, partsOf(device), partFileName(entry.key)), 'utf8')));
  return assembleParts(parts).records;
}

/** Every file of the phone's log in the folder (the index and the parts) with its text, by path. */
export async function folderLogFiles(server: DavServer, device: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  const index = deviceIndexName(device);
  out[index] = await readFile(join(server.dataDir, index), 'utf8').catch(() => '');
  const names = await readdir(join(server.dataDir, partsOf(device))).catch(() => [] as string[]);
  for (const name of names.sort()) out[`${partsOf(device)}/${name}`] = await readFile(join(server.dataDir, partsOf(device), name), 'utf8');
  return out;
}
