/**
 * One sync with the office folder.
 *
 *  1. List the folder (PROPFIND, Depth 1).
 *  2. Read every other .json file that changed since last time (GET) and merge it: other phones' files and
 *     the office's own (a specimen catalogue, the sites). A file that is not a valid log is reported and left.
 *  3. Write this phone's whole log, canonical, to its own file "plummet-log-<device>.json" (PUT). Only this
 *     phone writes that file, so even a server that ignores conditions on PUT (nginx) cannot lose another
 *     phone's work. Where the server gives ETags (Apache) the PUT carries If-Match on the version last seen (or
 *     If-None-Match: * for a first upload); on 412 the file is read, merged and written again.
 *
 * Nothing is lost or duplicated whatever fails when: records are merged by id and version (merging twice is
 * merging once), the local store is only ever written by merges, a PUT replaces the whole file or nothing, and
 * the progress made (files merged, the upload) is saved in the sync state as it happens. The run itself never
 * throws: the report carries the error, and the state remembers it for the screens and the back-off.
 */
import { LogFileError, readLogFile, type Conflict } from '../log';
import { contentHash } from './content-hash';
import { describeError, SyncError } from './errors';
import { applyImport } from './import-log';
import type { RecordSource } from './record-source';
import { sendLog } from './send-log';
import { loadSyncSettings, type SyncSettings } from './settings';
import { isStrongTag, listedUnchanged, loadSyncState, remoteState, saveSyncState, type SyncState } from './sync-state';
import { WebDavClient, type FetchedFile, type PutConditions } from './webdav-client';

/** A Web Locks manager (navigator.locks), so two tabs or a tab and the service worker never sync at once. */
export interface LockManagerLike {
  request<T>(name: string, callback: () => Promise<T>): Promise<T>;
}

export interface SyncOptions {
  source: RecordSource;
  appVersion: string;
  /** Taken from the store when not given. */
  settings?: SyncSettings;
  now?: () => number;
  fetch?: typeof fetch;
  setTimeout?: (fn: () => void, ms: number) => unknown;
  clearTimeout?: (handle: unknown) => void;
  locks?: LockManagerLike | null;
  /** Writes tried before giving up on a file others keep changing (412); default 3. */
  maxPutAttempts?: number;
}

export interface FileReport {
  name: string;
  added: number;
  updated: number;
  unchanged: number;
  conflicts: number;
}

export interface SyncReport {
  ok: boolean;
  started_at: string;
  finished_at: string;
  /** This phone's file in the folder. */
  own_file: string;
  /** Files read and merged (this phone's own file too, when someone else had written it). */
  merged: FileReport[];
  /** Files the listing showed unchanged, not read. */
  skipped: number;
  /** Files in the folder that could not be merged, with the reason. */
  problems: { name: string; code: string; message: string }[];
  uploaded: boolean;
  conflicts: Conflict[];
  error: { code: string; message: string; status: number | null; retryable: boolean } | null;
}

export const SYNC_LOCK = 'plummet-office-folder-sync';

/** The file a phone writes: "plummet-log-<device>.json" (":" becomes "~"). */
export function deviceFileName(device: string): string {
  return `plummet-log-${device.replace(/:/g, '~')}.json`;
}

const isLogName = (name: string) => /\.json$/i.test(name) && !name.startsWith('.');

/** Runs without a Web Locks manager still must not overlap within one page. */
const running = new WeakMap<RecordSource, Promise<SyncReport>>();

export function syncFolder(options: SyncOptions): Promise<SyncReport> {
  const go = () => {
    const current = running.get(options.source);
    if (current) return current;
    const run = runSync(options).finally(() => running.delete(options.source));
    running.set(options.source, run);
    return run;
  };
  return options.locks ? options.locks.request(SYNC_LOCK, go) : go();
}

function emptyReport(device: string, at: string): SyncReport {
  return { ok: false, started_at: at, finished_at: at, own_file: deviceFileName(device), merged: [], skipped: 0, problems: [], uploaded: false, conflicts: [], error: null };
}

/** A report of a run that did not start, for the reason given. */
export function refusedReport(device: string, error: SyncError, at: string): SyncReport {
  return { ...emptyReport(device, at), error: describeError(error) };
}

async function runSync(options: SyncOptions): Promise<SyncReport> {
  const now = options.now ?? (() => Date.now());
  const iso = () => new Date(now()).toISOString();
  const { source } = options;
  const device = await source.deviceId();
  const settings = options.settings ?? (await loadSyncSettings(source));
  if (!settings) {
    return refusedReport(device, new SyncError({ code: 'sync-not-configured', field: null, value: null, allowed: null, message: 'no office folder is set up: add its URL, user name and password in the settings' }), iso());
  }
  const report = emptyReport(device, iso());
  let state: SyncState | null = null;
  try {
    const client = new WebDavClient({
      folderUrl: settings.folder_url,
      username: settings.username,
      password: settings.password,
      timeoutMs: settings.timeout_ms,
      fetch: options.fetch,
      setTimeout: options.setTimeout,
      clearTimeout: options.clearTimeout,
    });
    state = await loadSyncState(source, client.folderUrl);
    state.last_attempt_at = report.started_at;
    await runSteps(client, state, report, options, device);
    state.last_success_at = iso();
    state.last_error = null;
    state.failures = 0;
    report.ok = true;
  } catch (error) {
    report.error = describeError(error);
    if (state) {
      state.last_error = { code: report.error.code, message: report.error.message, status: report.error.status, at: iso() };
      state.failures += 1;
    }
  }
  if (state) await saveSyncState(source, state).catch(() => undefined);
  report.finished_at = iso();
  return report;
}

async function mergeFetched(
  source: RecordSource,
  name: string,
  fetched: FetchedFile,
  report: SyncReport,
): Promise<{ ok: true } | { ok: false; problem: { code: string; message: string } }> {
  let file;
  try {
    file = readLogFile(fetched.body);
  } catch (error) {
    if (!(error instanceof LogFileError)) throw error;
    const problem = { code: error.code, message: error.message };
    report.problems.push({ name, ...problem });
    return { ok: false, problem };
  }
  const done = await applyImport(source, file);
  report.merged.push({ name, added: done.added.length, updated: done.updated.length, unchanged: done.unchanged, conflicts: done.conflicts.length });
  report.conflicts.push(...done.conflicts);
  return { ok: true };
}

async function runSteps(client: WebDavClient, state: SyncState, report: SyncReport, options: SyncOptions, device: string): Promise<void> {
  const { source } = options;
  const ownName = report.own_file;
  const listing = (await client.list()).filter((r) => isLogName(r.name));
  const listed = new Set(listing.map((r) => r.name));

  // 2. Other files.
  for (const entry of [...listing].sort((a, b) => (a.name < b.name ? -1 : 1))) {
    if (entry.name === ownName) continue;
    const known = state.files[entry.name];
    if (listedUnchanged(known, entry)) {
      report.skipped++;
      continue;
    }
    const fetched = await client.get(entry.name);
    if (!fetched) {
      delete state.files[entry.name];
      continue;
    }
    const hash = contentHash(fetched.body);
    if (known && known.hash === hash) {
      state.files[entry.name] = remoteState(fetched, hash, known.problem);
    } else {
      const merged = await mergeFetched(source, entry.name, fetched, report);
      state.files[entry.name] = remoteState(fetched, hash, merged.ok ? null : merged.problem);
    }
    await saveSyncState(source, state);
  }
  for (const name of Object.keys(state.files)) if (!listed.has(name)) delete state.files[name];

  // 3. This phone's own file: merge it first if someone else wrote it (a restored backup, another tab).
  const ownEntry = listing.find((r) => r.name === ownName) ?? null;
  let ownEtag: string | null = null;
  if (ownEntry) {
    if (!listedUnchanged(state.own, ownEntry)) {
      const fetched = await client.get(ownName);
      if (fetched) {
        const hash = contentHash(fetched.body);
        if (hash !== state.uploaded_hash) await mergeFetched(source, ownName, fetched, report);
        state.own = remoteState(fetched, hash);
        ownEtag = fetched.etag;
      }
    } else {
      ownEtag = ownEntry.etag ?? state.own?.etag ?? null;
    }
  } else if (state.own) {
    // The file is gone from the folder (deleted by someone): write it again.
    state.own = null;
    state.uploaded_hash = null;
  }

  // 4. Export, upload, and mark what was sent (sendLog counts the unsent changes before reading the records).
  await sendLog(source, { appVersion: options.appVersion, device, now: () => options.now?.() ?? Date.now() }, async (log) => {
    let text = log.text;
    let hash = contentHash(text);
    if (ownEntry && state.own && hash === state.uploaded_hash && hash === state.own.hash) return { sent: true, value: undefined };
    // Conditions only with a strong tag: a weak one never matches in If-Match (RFC 9110 §13.1.1).
    let conditions: PutConditions = ownEntry ? (isStrongTag(ownEtag) ? { ifMatch: ownEtag } : {}) : { ifNoneMatch: '*' };
    const attempts = options.maxPutAttempts ?? 3;
    for (let attempt = 1; ; attempt++) {
      try {
        let version = await client.put(ownName, text, conditions);
        // Neither Apache nor nginx sends an ETag with a PUT's answer: ask for the version just written.
        if (!version.etag && !version.lastModified) version = (await client.head(ownName)) ?? version;
        state.own = remoteState({ ...version, contentLength: new TextEncoder().encode(text).length }, hash);
        state.uploaded_hash = hash;
        report.uploaded = true;
        break;
      } catch (error) {
        if (!(error instanceof SyncError) || error.code !== 'sync-precondition' || attempt >= attempts) throw error;
        const fetched = await client.get(ownName);
        if (fetched) {
          await mergeFetched(source, ownName, fetched, report);
          conditions = isStrongTag(fetched.etag) ? { ifMatch: fetched.etag } : {};
        } else {
          conditions = { ifNoneMatch: '*' };
        }
        text = await log.again();
        hash = contentHash(text);
      }
    }
    await saveSyncState(source, state);
    return { sent: true, value: undefined };
  });
}

