/**
 * One sync with the office folder.
 *
 * The folder holds each phone's log in parts, one per day (log/log-parts.ts): the parts in a sub-folder
 * "plummet-log-<device>.parts/" and, beside it, the index "plummet-log-<device>.index" naming every part with the
 * hash of its text. Only this phone writes its own index and parts, so even a server that ignores conditions on
 * PUT (nginx) cannot lose another phone's work. Older versions of the app wrote the whole log to one file,
 * "plummet-log-<device>.json"; such files (and any other .json log in the folder, such as the office's specimen
 * catalogue) are still read and merged, and this phone's own one is merged and then removed once its parts hold
 * the whole log (it never ends in ".index", so older phones never try to read an index as a log).
 *
 *  1. List the folder (PROPFIND, Depth 1): one entry per phone's index, whatever the size of its log.
 *  2. For every other .json file and every other phone's index that changed since last time (GET): a log file is
 *     merged; an index is checked and each part whose hash differs from the part last read is read and merged.
 *     A file, index or part that cannot be merged (not a log, a newer format, truncated, a record refused) is
 *     skipped and named with the reason, kept in the sync state for the Send screen; the run goes on, so one bad
 *     file never keeps this phone's own upload from happening.
 *  3. Split this phone's log into its parts, write those whose hash differs from the part last uploaded (PUT), then
 *     the index. After every PUT the file is read back and compared with what was sent (content hash): only then
 *     does it count, and only when all is written is the log marked sent, so an upload the server acknowledged but
 *     did not keep is sent again, never taken as done. Parts are written before the index that names them, so an
 *     index never names a part that is not there; a reader that meets a part newer than its index merges it and
 *     reads the index again next time.
 *
 * Requests per run: one PROPFIND; for each phone whose index changed, one GET of the index and one per part that
 * changed; for this phone, a PUT and a GET per part it changed and for the index. Unchanged files cost nothing
 * beyond the listing, so the cost of a run follows what changed, not the size of the season.
 *
 * Nothing is lost or duplicated whatever fails when: records are merged by id and version (merging twice is
 * merging once), the local store is only ever written by merges, a PUT replaces a whole file or nothing, and
 * the progress made (files merged, parts uploaded) is saved in the sync state as it happens. The run itself
 * never throws: the report carries the error, and the state remembers it for the screens and the back-off.
 */
import { assembleParts, exportLog, partFileName, readLogFile, readPartIndex, splitLog, type Conflict, type LogFile, type LogPartIndex } from '../log';
import { contentHash } from './content-hash';
import { describeError, SyncError } from './errors';
import { PlummetError } from '../errors';
import { fileProblem, problemWeight, type FileProblem } from './file-problem';
import { applyImport } from './import-log';
import type { RecordSource } from './record-source';
import { sendRecords } from './send-records';
import { loadSyncSettings, type SyncSettings } from './settings';
import { listedUnchanged, loadSyncState, remoteState, saveSyncState, type RemoteFileState, type SyncState } from './sync-state';
import { WebDavClient, type FetchedFile, type FilePath } from './webdav-client';

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
  /** This phone's old single file in the folder (removed once its parts are written). */
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

/** The index of a phone's parts: "plummet-log-<device>.index" (":" becomes "~"). */
export function deviceIndexName(device: string): string {
  return `plummet-log-${device.replace(/:/g, '~')}.index`;
}

/** The sub-folder holding the parts an index names: "plummet-log-<device>.parts". */
export function partFolderName(indexName: string): string {
  return indexName.replace(/\.index$/, '.parts');
}

const indexNameOf = (partFolder: string) => partFolder.replace(/\.parts$/, '.index');

const isLogName = (name: string) => /\.json$/i.test(name) && !name.startsWith('.');
const isIndexName = (name: string) => /^plummet-log-[^/]+\.index$/.test(name);

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
async function mergeFetched(source: RecordSource, name: string, fetched: FetchedFile, report: SyncReport, read: LogFile | null = null): Promise<MergeOutcome> {
  let file: LogFile | null = read;
  try {
    const passed = new WeakSet<object>();
    file ??= readLogFile(fetched.body, { passed });
    const done = await applyImport(source, file, undefined, { passed });
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
  const ownIndex = deviceIndexName(device);
  state.own_problem = null;
  const { files, folders, date: listedAt } = await client.listing();
  const listing = files.filter((r) => isLogName(r.name) || isIndexName(r.name));
  const listed = new Set(listing.map((r) => r.name));
  const progress = progressSaver(source, state);

  // 2. Other files: old single files and other phones' part indexes (with the parts that changed).
  for (const entry of [...listing].sort((a, b) => (a.name < b.name ? -1 : 1))) {
    if (entry.name === ownName || entry.name === ownIndex) continue;
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
    } else if (isIndexName(entry.name)) {
      state.files[entry.name] = await mergeIndexed(client, source, entry.name, fetched, hash, report, state.files, progress);
    } else {
      state.files[entry.name] = rememberRead(fetched, hash, await mergeFetched(source, entry.name, fetched, report));
    }
    await progress.tick();
  }
  for (const name of Object.keys(state.files)) {
    const slash = name.indexOf('/');
    const owner = slash < 0 ? name : indexNameOf(name.slice(0, slash));
    if (!listed.has(owner)) delete state.files[name];
  }
  await saveSyncState(source, state);

  // 3. This phone's old single file (written by an older version of the app): merged if someone else wrote it
  //    since, and removed once the parts hold the whole log, read back.
  const ownEntry = listing.find((r) => r.name === ownName) ?? null;
  const mergeOwn = async (name: string, fetched: FetchedFile) => {
    const outcome = await mergeFetched(source, name, fetched, report);
    // A file refused for itself is replaced by this phone's upload (the crew still sees what was refused); one
    // this phone could not take in now (its storage full) must not be overwritten: the run stops, to try again.
    if (!outcome.ok && outcome.weight === 'passing') throw outcome.error;
    if (!outcome.ok) state.own_problem = { name, ...outcome.problem };
  };
  if (ownEntry && !listedUnchanged(state.own, ownEntry, listedAt)) {
    const fetched = await client.get(ownName);
    if (fetched) {
      const hash = contentHash(fetched.body);
      if (hash !== state.uploaded_hash) await mergeOwn(ownName, fetched);
      state.own = remoteState(fetched, hash);
    }
  } else if (!ownEntry) {
    state.own = null;
    state.uploaded_hash = null;
  }

  // 4. This phone's part index: if someone else wrote it (a restored backup, another tab), its parts that differ
  //    from what this phone uploaded are merged first. If it is gone, every part is written again.
  const indexEntry = listing.find((r) => r.name === ownIndex) ?? null;
  state.own_parts ??= {};
  if (indexEntry && !listedUnchanged(state.own_index, indexEntry, listedAt)) {
    const fetched = await client.get(ownIndex);
    if (fetched) {
      const hash = contentHash(fetched.body);
      if (hash !== state.uploaded_index_hash) {
        const seen: Record<string, RemoteFileState> = {};
        const folder = partFolderName(ownIndex);
        for (const [key, partHash] of Object.entries(state.own_parts)) seen[`${folder}/${partFileName(key)}`] = { ...emptyRemote(), hash: partHash };
        const read = await mergeIndexed(client, source, ownIndex, fetched, hash, report, seen, progress, mergeOwn);
        // What the folder holds now is not what this phone uploaded: write every part again.
        state.own_parts = {};
        state.uploaded_index_hash = null;
        state.own_index = read;
      } else {
        state.own_index = remoteState(fetched, hash);
      }
    }
  } else if (!indexEntry) {
    state.own_index = null;
    state.own_parts = {};
    state.uploaded_index_hash = null;
  }

  // 5. Split the log into its parts, upload those that changed and then the index, each read back before it
  //    counts; then remove parts no longer in the index, and the old single file. Marked sent at the end.
  await sendRecords(source, { now: () => options.now?.() ?? Date.now() }, async (records) => {
    const split = splitLog(records, { device, app_version: options.appVersion });
    const ownParts = state.own_parts!;
    const folder = partFolderName(ownIndex);
    const changed = split.parts.filter((p) => ownParts[p.key] !== p.hash);
    try {
      // The phone's part folder is made before its first part when the listing lacks it, so no request is sent
      // that is sure to fail (a PUT into a missing folder: 409 on Apache, and an error in the browser's console).
      if (changed.length > 0 && !folders.some((f) => f.name.replace(/\/$/, '') === folder)) await makePartFolder(client, folder);
      for (const part of changed) {
        await putVerified(client, [folder, partFileName(part.key)], part.text, part.hash, options);
        ownParts[part.key] = part.hash;
        report.uploaded = true;
        await progress.tick();
      }
    } catch (error) {
      if (!(error instanceof NoPartFolder)) throw error;
      // A folder whose server does not let this phone make a sub-folder (a CORS set-up that allows only the
      // methods of older versions, or a server without MKCOL): the whole log goes to the single file as before.
      const text = exportLog(records, { device, app_version: options.appVersion });
      const hash = contentHash(text);
      if (!(ownEntry && state.own?.hash === hash && state.uploaded_hash === hash)) {
        state.own = await putVerified(client, ownName, text, hash, options);
        state.uploaded_hash = hash;
        report.uploaded = true;
      }
      await saveSyncState(source, state);
      return { sent: true, value: undefined };
    }
    const indexHash = contentHash(split.indexText);
    if (!indexEntry || state.uploaded_index_hash !== indexHash || state.own_index?.hash !== indexHash) {
      state.own_index = await putVerified(client, ownIndex, split.indexText, indexHash, options);
      state.uploaded_index_hash = indexHash;
      report.uploaded = true;
    }
    await saveSyncState(source, state);
    const keep = new Set(split.parts.map((p) => p.key));
    // Removing is tidying only: a server (or a CORS set-up) that does not allow DELETE leaves a file no index
    // names (never read) or an old single file that no longer changes (read once more, merging nothing new).
    for (const key of Object.keys(ownParts)) {
      if (keep.has(key)) continue;
      await removeQuietly(client, [folder, partFileName(key)]);
      delete ownParts[key];
    }
    if (ownEntry) {
      // The old single file's records are in the parts now (it was merged above, or it is what this phone wrote);
      // one refused for itself is named in this run's report (own_problem), as when an upload replaced it.
      if (await removeQuietly(client, ownName)) {
        state.own = null;
        state.uploaded_hash = null;
      }
    }
    await saveSyncState(source, state);
    return { sent: true, value: undefined };
  });
}

/** An empty remembered version (a part known only by the hash this phone uploaded). */
function emptyRemote(): RemoteFileState {
  return { etag: null, last_modified: null, content_length: null, hash: '', settled: false, seen_at: null, problem: null };
}

/** Saves the progress as it is made, but not after every file: the state of a big folder is large, and a save per
 *  file would cost time growing with the square of the folder's size. A run cut between saves reads at most that
 *  many files again, and merging a file twice is merging it once. */
function progressSaver(source: RecordSource, state: SyncState) {
  let sinceSave = 0;
  return {
    async tick() {
      if (++sinceSave >= SAVE_EVERY_FILES) {
        await saveSyncState(source, state);
        sinceSave = 0;
      }
    },
  };
}

/**
 * Another phone's part index, read: checked (log/log-parts.ts readPartIndex) and then every part whose hash
 * differs from the version remembered in `seen` is read and merged, each as any file from outside. A refused
 * index or part is reported and skipped; the run goes on. Returns what to remember of the index: settled only
 * when every part it names was read as named, so an index read while its phone was between writing a part and
 * writing the index is read again next time.
 */
async function mergeIndexed(
  client: WebDavClient,
  source: RecordSource,
  name: string,
  fetched: FetchedFile,
  hash: string,
  report: SyncReport,
  seen: Record<string, RemoteFileState>,
  progress: { tick(): Promise<void> },
  onPart?: (name: string, fetched: FetchedFile) => Promise<void>,
): Promise<RemoteFileState> {
  let index: LogPartIndex;
  try {
    index = readPartIndex(fetched.body, { name });
  } catch (error) {
    const problem = fileProblem(error, fetched.body, null);
    report.problems.push({ name, ...problem });
    return remoteState(fetched, hash, problem);
  }
  const folder = partFolderName(name);
  let complete = true;
  const named = new Set<string>();
  const pending: { path: string; part: FetchedFile; hash: string; file: LogFile }[] = [];
  // The records the gate checks whole as each part is read, so the merge and the store's write do not again.
  const passed = new WeakSet<object>();
  for (const entry of index.parts) {
    const path = `${folder}/${partFileName(entry.key)}`;
    named.add(path);
    if (seen[path]?.hash === entry.hash) continue;
    const part = await client.get([folder, partFileName(entry.key)]);
    if (!part) {
      complete = false;
      continue;
    }
    const partHash = contentHash(part.body);
    if (partHash !== entry.hash) complete = false;
    if (onPart) {
      await onPart(path, part);
      seen[path] = remoteState(part, partHash);
    } else {
      try {
        pending.push({ path, part, hash: partHash, file: readLogFile(part.body, { passed }) });
      } catch (error) {
        const problem = fileProblem(error, part.body, null);
        report.problems.push({ name: path, ...problem });
        seen[path] = remoteState(part, partHash, problem);
      }
    }
    await progress.tick();
  }
  // The parts read are merged together, in one reading of the store and one write: a phone's first sync reads
  // hundreds of parts, and merging each alone would read the whole store once per part. Should the merge be
  // refused, each part is merged alone, so the part to blame is named and the others are taken in.
  let together = false;
  if (pending.length > 1) {
    try {
      const done = await applyImport(source, assembleParts(pending.map((p) => p.file)), undefined, { passed });
      report.merged.push({ name: `${folder}/`, added: done.added.length, updated: done.updated.length, unchanged: done.unchanged, conflicts: done.conflicts.length });
      report.conflicts.push(...done.conflicts);
      for (const p of pending) seen[p.path] = remoteState(p.part, p.hash);
      together = true;
    } catch (error) {
      if (problemWeight(error) === 'fatal') throw error;
    }
  }
  if (!together) {
    for (const p of pending) {
      const outcome = await mergeFetched(source, p.path, p.part, report, p.file);
      seen[p.path] = rememberRead(p.part, p.hash, outcome);
      if (!outcome.ok && outcome.weight === 'passing') complete = false;
    }
  }
  for (const path of Object.keys(seen)) if (path.startsWith(`${folder}/`) && !named.has(path)) delete seen[path];
  return complete ? remoteState(fetched, hash) : { ...remoteState(fetched, '', null), settled: false, seen_at: null };
}

/**
 * The phone's part folder could not be made (a server that refuses MKCOL): the run falls back to the single
 * file. Caught inside the run, never shown.
 */
export class NoPartFolder extends PlummetError<'no-part-folder'> {
  constructor(folder: string, cause: unknown) {
    super({ code: 'no-part-folder', field: 'folder', value: folder, allowed: 'a folder where this phone may make a sub-folder', message: `the office folder refused the sub-folder ${folder}`, cause });
    this.name = 'NoPartFolder';
  }
}

/** Makes the phone's part folder; NoPartFolder when the server will not (the run falls back to the single file). */
async function makePartFolder(client: WebDavClient, folder: string): Promise<void> {
  try {
    await client.makeFolder(folder);
  } catch (refused) {
    if (refused instanceof SyncError && ['sync-network', 'sync-forbidden', 'sync-http'].includes(refused.code)) throw new NoPartFolder(folder, refused);
    throw refused;
  }
}

/** Removes a file; false when the server refused (the run goes on). */
async function removeQuietly(client: WebDavClient, name: FilePath): Promise<boolean> {
  try {
    await client.delete(name);
    return true;
  } catch (error) {
    if (error instanceof SyncError && (error.code === 'sync-unauthorized' || error.code === 'sync-redirected')) throw error;
    return false;
  }
}

/**
 * Writes a file and reads it back: a 2xx only says the server took the request, so the file counts as written only
 * when the copy read back has the hash of what was sent. A server (or a box in between) that acknowledges and
 * keeps the old file is caught here and written to again, up to maxPutAttempts times.
 */
async function putVerified(client: WebDavClient, name: FilePath, text: string, hash: string, options: SyncOptions): Promise<RemoteFileState> {
  const attempts = options.maxPutAttempts ?? 3;
  const shown = typeof name === 'string' ? name : name.join('/');
  for (let attempt = 1; ; attempt++) {
    try {
      await client.put(name, text);
    } catch (error) {
      // The first part of a phone: its sub-folder is made on demand (Apache answers 409 Conflict for a missing
      // parent, RFC 4918 §9.7.1; nginx makes it itself with create_full_put_path).
      if (!(error instanceof SyncError && error.status === 409 && typeof name !== 'string' && name.length === 2)) throw error;
      await makePartFolder(client, name[0]!);
      await client.put(name, text);
    }
    const held = await client.get(name);
    if (held && contentHash(held.body) === hash) return remoteState(held, hash);
    if (attempt >= attempts) {
      const sent = byteLength(text);
      const size = held ? `${held.contentLength ?? byteLength(held.body)} bytes` : 'no file';
      throw new SyncError({
        code: 'sync-upload-unverified',
        field: null,
        value: size,
        allowed: `the ${sent} bytes sent`,
        message: `the server acknowledged writing ${shown} but holds ${held ? `another version (${size}, not the ${sent} sent)` : 'no such file'} when read back, ${attempts} times; nothing was marked sent and it will be sent again`,
      });
    }
  }
}
