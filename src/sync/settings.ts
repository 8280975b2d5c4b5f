/**
 * The office folder settings: URL, user name and password. They are kept in this phone's store only. No export
 * and no uploaded file can hold them: those are written from records alone (src/log/export.ts).
 */
import { basicAuthorization } from './basic-auth';
import { SyncError } from './errors';
import { parseFolderUrl } from './folder-url';
import { SYNC_META, type RecordSource } from './record-source';

export interface SyncSettings {
  /** The folder URL, https (or http on this machine), ending in "/". */
  folder_url: string;
  username: string;
  password: string;
  /** False pauses automatic sync. */
  enabled: boolean;
  /** Per request; default 20 000 ms. */
  timeout_ms?: number;
}

/** The settings checked and normalised (URL rules, user-name rules); throws SyncError naming the problem. */
export function checkSyncSettings(settings: SyncSettings): SyncSettings {
  const folder_url = parseFolderUrl(settings.folder_url);
  basicAuthorization(settings.username, settings.password);
  const timeout = settings.timeout_ms;
  if (timeout !== undefined && !(Number.isFinite(timeout) && timeout >= 1000 && timeout <= 300_000)) {
    throw new SyncError({ code: 'sync-url-invalid', field: 'timeout_ms', value: timeout, allowed: 'between 1000 and 300000 ms', message: `timeout_ms ${timeout} must be between 1000 and 300000 ms` });
  }
  return { ...settings, folder_url };
}

export async function loadSyncSettings(source: RecordSource): Promise<SyncSettings | null> {
  const value = (await source.getMeta(SYNC_META.settings)) as SyncSettings | undefined | null;
  return value ?? null;
}

export async function saveSyncSettings(source: RecordSource, settings: SyncSettings): Promise<SyncSettings> {
  const checked = checkSyncSettings(settings);
  await source.setMeta(SYNC_META.settings, checked);
  return checked;
}
