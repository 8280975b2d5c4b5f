/**
 * One sync with the office folder.
 *
 *  1. List the folder (PROPFIND, Depth 1).
 *  2. Read every other .json file that changed since last time (GET) and merge it: other phones' files and
 *     the office's own (a specimen catalogue, the sites). A file that cannot be merged (not a log, a newer
 *     format, truncated, a record refused) is skipped and named with the reason, kept in the sync state for the
 *     Send screen; the run goes on, so one bad file never keeps this phone's own upload from happening.
 *  3. Write this phone's whole log, canonical, to its own file "plummet-log-<device>.json" (PUT). Only this
 *     phone writes that file, so even a server that ignores conditions on PUT (nginx) cannot lose another
 *     phone's work. Where the server gives ETags (Apache) the PUT carries If-Match on the version last seen (or
 *     If-None-Match: * for a first upload); on 412 the file is read, merged and written again. After every
 *     PUT the file is read back and compared with what was sent (content hash): only then is the log marked
 *     sent, so an upload the server acknowledged but did not keep is sent again, never taken as done.
 *
 * Requests per run: one PROPFIND, one GET per file that changed since the last run, and for the own file at
 * most a GET, then a PUT and a GET to verify it per attempt. Unchanged files cost nothing beyond the listing.
 *
 * Nothing is lost or duplicated whatever fails when: records are merged by id and version (merging twice is
 * merging once), the local store is only ever written by merges, a PUT replaces the whole file or nothing, and
 * the progress made (files merged, the upload) is saved in the sync state as it happens. The run itself never
 * throws: the report carries the error, and the state remembers it for the screens and the back-off.
 */
import { readLogFile, type Conflict, type LogFile } from '../log';
import { contentHash } from './content-hash';
import { describeError, SyncError } from './errors';
import { fileProblem, problemWeight, type FileProblem } from './file-problem';
import { applyImport } from './import-log';
import type { RecordSource } from './record-source';
import { sendLog } from './send-log';
import { loadSyncSettings, type SyncSettings } from './settings';
import { isStrongTag, listedUnchanged, loadSyncState, remoteState, saveSyncState, type RemoteFileState, type SyncState } from './sync-state';
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
  /** Files in the folder that could not be merged at this run, with the reason (file, phone, record, field);
   *  each was skipped and the run went on. */
  problems: ({ name: string } & FileProblem)[];
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

type MergeOutcome = { ok: true } | { ok: false; problem: FileProblem; weight: 'file' | 'passing'; error: unknown };

/**
 * Reads and merges one file of the folder. A file that cannot be merged, whatever the reason (not a log, a
 * newer format, truncated, a record refused on the way into the store), is reported and skipped: one bad file
 * never stops the run. Only a store that cannot be used at all stops it.
 */
async function mergeFetched(source: RecordSource, name: string, fetched: FetchedFile, report: SyncReport): Promise<MergeOutcome> {
  let file: LogFile | null = null;
  try {
    file = readLogFile(fetched.body);
    const done = await applyImport(source, file);
    report.merged.push({ name, added: done.added.length, updated: done.updated.length, unchanged: done.unchanged, conflicts: done.conflicts.length });
    report.conflicts.push(...done.conflicts);
    return { ok: true };
  } catch (error) {
    const weight = problemWeight(error);
    if (weight === 'fatal') throw error;
    const problem = fileProblem(error, fetched.body, file);
    report.problems.push({ name, ...problem });
    return { ok: false, problem, weight, error };
  }
}

/** What to remember of a file read: a file refused for itself is not read again until it changes; one this phone
 *  could not take in now is read again next time (an empty hash matches nothing, and it is never settled). */
function rememberRead(fetched: FetchedFile, hash: string, outcome: MergeOutcome): RemoteFileState {
  if (outcome.ok) return remoteState(fetched, hash);
  if (outcome.weight === 'file') return remoteState(fetched, hash, outcome.problem);
  return { ...remoteState(fetched, '', outcome.problem), settled: false, seen_at: null };
}

/** Files read between two saves of the sync state. */
const SAVE_EVERY_FILES = 25;

const byteLength = (text: string) => new TextEncoder().encode(text).length;

async function runSteps(client: WebDavClient, state: SyncState, report: SyncReport, options: SyncOptions, device: string): Promise<void> {
  const { source } = options;
  const ownName = report.own_file;
  state.own_problem = null;
  const { files, date: listedAt } = await client.listing();
  const listing = files.filter((r) => isLogName(r.name));
  const listed = new Set(listing.map((r) => r.name));

  // 2. Other files.
  let readSinceSave = 0;
  for (const entry of [...listing].sort((a, b) => (a.name < b.name ? -1 : 1))) {
    if (entry.name === ownName) continue;
    const known = state.files[entry.name];
    if (listedUnchanged(known, entry, listedAt)) {
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
      state.files[entry.name] = rememberRead(fetched, hash, await mergeFetched(source, entry.name, fetched, report));
    }
    // The progress is saved as it is made, but not after every file: the state of a big folder is large, and a
    // save per file would cost time growing with the square of the folder's size. A run cut between saves reads
    // at most that many files again, and merging a file twice is merging it once.
    if (++readSinceSave >= SAVE_EVERY_FILES) {
      await saveSyncState(source, state);
      readSinceSave = 0;
    }
  }
  for (const name of Object.keys(state.files)) if (!listed.has(name)) delete state.files[name];
  await saveSyncState(source, state);

  // 3. This phone's own file: merge it first if someone else wrote it (a restored backup, another tab).
  const ownEntry = listing.find((r) => r.name === ownName) ?? null;
  let ownEtag: string | null = null;
  const mergeOwn = async (fetched: FetchedFile) => {
    const outcome = await mergeFetched(source, ownName, fetched, report);
    // A file refused for itself is replaced by this phone's upload (the crew still sees what was refused); one
    // this phone could not take in now (its storage full) must not be overwritten: the run stops, to try again.
    if (!outcome.ok && outcome.weight === 'passing') throw outcome.error;
    state.own_problem = outcome.ok ? null : { name: ownName, ...outcome.problem };
  };
  if (ownEntry) {
    if (!listedUnchanged(state.own, ownEntry, listedAt)) {
      const fetched = await client.get(ownName);
      if (fetched) {
        const hash = contentHash(fetched.body);
        if (hash !== state.uploaded_hash) await mergeOwn(fetched);
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
        await client.put(ownName, text, conditions);
      } catch (error) {
        if (!(error instanceof SyncError) || error.code !== 'sync-precondition' || attempt >= attempts) throw error;
      }
      // A 2xx only says the server took the request: read the file back and compare it with what was sent
      // before anything is marked sent. A server (or a box in between) that acknowledges and keeps the old file
      // is caught here; so is another writer that replaced the file since (a 412 lands here too).
      const held = await client.get(ownName);
      const heldHash = held ? contentHash(held.body) : null;
      if (held && heldHash === hash) {
        state.own = remoteState(held, hash);
        state.uploaded_hash = hash;
        report.uploaded = true;
        break;
      }
      if (attempt >= attempts) {
        const sent = byteLength(text);
        throw new SyncError({
          code: 'sync-upload-unverified',
          field: null,
          value: held ? `${held.contentLength ?? byteLength(held.body)} bytes` : 'no file',
          allowed: `the ${sent} bytes sent`,
          message: `the server acknowledged writing ${ownName} but holds ${held ? `another version (${held.contentLength ?? byteLength(held.body)} bytes, not the ${sent} sent)` : 'no such file'} when read back, ${attempts} times; nothing was marked sent and it will be sent again`,
        });
      }
      if (held) {
        // Not the version this phone knew: someone else wrote it; merge theirs before writing again.
        if (heldHash !== state.own?.hash && heldHash !== state.uploaded_hash) await mergeOwn(held);
        conditions = isStrongTag(held.etag) ? { ifMatch: held.etag } : {};
      } else {
        conditions = { ifNoneMatch: '*' };
      }
      text = await log.again();
      hash = contentHash(text);
    }
    await saveSyncState(source, state);
    return { sent: true, value: undefined };
  });
}

