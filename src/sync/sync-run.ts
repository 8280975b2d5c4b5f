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
 *     read and checked; an index is checked and each part whose hash differs from the part last read is read and
 *     checked. A file, index or part that cannot be merged (not a log, a newer format, truncated, a record
 *     refused) is skipped and named with the reason, kept in the sync state for the Send screen; the run goes on,
 *     so one bad file never keeps this phone's own upload from happening.
 *  3. Everything read is merged into the store at once: one reading of the store, one transaction (mergeIncoming),
 *     so a run stopped at any point leaves the store as it was or with all of it merged.
 *  4. Split this phone's log into its parts, write those whose hash differs from the part last uploaded (PUT), then
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
 * the progress made (files merged, parts uploaded) is saved in the sync state once it is made. A run cut while
 * reading the folder reads it again next time. The run itself never throws for a failure: the report carries the
 * error, and the state remembers it for the screens and the back-off. It reports its phases (SyncOptions.
 * onProgress) and stops on its caller's Cancel (SyncOptions.signal, handed to every request) with
 * TransferCancelled: see syncFolder for what a cancelled run leaves.
 */
import {
  assembleParts,
  exportLog,
  partFileName,
  readLogFile,
  readPartIndex,
  splitLog,
  throwIfCancelled,
  TransferCancelled,
  type CancelSignal,
  type Conflict,
  type LogFile,
  type LogPartIndex,
  type MergePreview,
  type ProgressListener,
  type TransferOptions,
  type TransferPhase,
  type TransferProgress,
} from '../log';
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
  /** How far the run is: listing, downloading (files read of those known so far), reading, merging, writing
   *  (records), uploading (parts), indexing. */
  onProgress?: ProgressListener;
  /** The caller's Cancel: the run stops with TransferCancelled (see syncFolder). */
  signal?: CancelSignal;
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

/**
 * One sync run. It never throws for a failure (the report carries the error), but it rejects with
 * TransferCancelled when the caller's signal is raised: not a failure, so the sync state counts no failure and the
 * scheduler waits for no back-off. What a cancelled run leaves:
 * - the store as it was, or with everything read from the folder merged (one transaction; mergeIncoming);
 * - the sync state as the folder is: files merged are remembered only once merged, parts only once uploaded and
 *   read back;
 * - this phone's index and parts in the folder: stopped before the index is written, the old index still names
 *   the parts of the last complete run. A part rewritten since holds a newer version of its day; the old index
 *   then states a hash that part no longer has (a reader merges the newer part and reads the index again next
 *   time), and a record moved from a part already rewritten to one not yet rewritten is, for a reader that had
 *   never read it, in neither until this phone's next run writes the rest and the index. Nothing is lost: every
 *   record is on this phone, marked unsent, and every reader that merged it keeps it.
 * - stopped once the index is written, the run goes on to its end (removing parts the index no longer names, and
 *   the old single file) and the log is marked sent.
 */
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
  let phase: TransferPhase | null = null;
  const run: RunProgress = {
    report(progress) {
      phase = progress.phase;
      options.onProgress?.(progress);
    },
    check: (at) => throwIfCancelled(options.signal, at),
    signal: options.signal,
    onProgress: options.onProgress
      ? (progress) => {
          phase = progress.phase;
          options.onProgress!(progress);
        }
      : undefined,
  };
  let cancelled: TransferCancelled | null = null;
  try {
    run.check('listing');
    const client = new WebDavClient({
      folderUrl: settings.folder_url,
      username: settings.username,
      password: settings.password,
      timeoutMs: settings.timeout_ms,
      fetch: options.fetch,
      setTimeout: options.setTimeout,
      clearTimeout: options.clearTimeout,
      signal: options.signal,
    });
    state = await loadSyncState(source, client.folderUrl);
    state.last_attempt_at = report.started_at;
    await runSteps(client, state, report, options, device, run);
    state.last_success_at = iso();
    state.last_error = null;
    state.failures = 0;
    report.ok = true;
  } catch (error) {
    if (error instanceof TransferCancelled) {
      // Not a failure: no error remembered, no back-off; what was done (parts uploaded) is saved below.
      cancelled = new TransferCancelled(phase);
    } else {
      report.error = describeError(error);
    }
    if (state && !cancelled && report.error) {
      state.last_error = { code: report.error.code, message: report.error.message, status: report.error.status, at: iso() };
      state.failures += 1;
    }
  }
  if (state) await saveSyncState(source, state).catch(() => undefined);
  report.finished_at = iso();
  if (cancelled) throw cancelled;
  return report;
}

type MergeOutcome = { ok: true } | { ok: false; problem: FileProblem; weight: 'file' | 'passing'; error: unknown };

/**
 * A file of the folder read and checked, waiting to be merged with the others of this run. `group` names it in
 * the report: the file itself, or a phone's part folder ("plummet-log-<device>.parts/") for its parts.
 */
interface Incoming {
  name: string;
  group: string;
  fetched: FetchedFile;
  hash: string;
  file: LogFile;
  /** What to remember once the merge is done (or the file refused). */
  settle(outcome: MergeOutcome): void;
}

/** What a run tells its caller as it goes, and its Cancel. */
interface RunProgress {
  report(progress: TransferProgress): void;
  /** Throws TransferCancelled when the caller has asked to stop. */
  check(phase: TransferPhase): void;
  signal: CancelSignal | undefined;
  onProgress: ProgressListener | undefined;
}

/** The outcome of a file that could not be read or merged, or the error again when the store cannot be used (or
 *  the caller cancelled): those stop the run. */
function refusal(error: unknown, body: string, file: LogFile | null): MergeOutcome {
  if (error instanceof TransferCancelled) throw error;
  const weight = problemWeight(error);
  if (weight === 'fatal') throw error;
  return { ok: false, problem: fileProblem(error, body, file), weight, error };
}

/** Reads one file's text as a log; the refusal when it is not one (named in the report). */
function checkFile(name: string, fetched: FetchedFile, report: SyncReport, passed: WeakSet<object>): { file: LogFile } | { refused: MergeOutcome & { ok: false } } {
  try {
    return { file: readLogFile(fetched.body, { passed }) };
  } catch (error) {
    const refused = refusal(error, fetched.body, null) as MergeOutcome & { ok: false };
    report.problems.push({ name, ...refused.problem });
    return { refused };
  }
}

/**
 * Merges one file of the folder alone, in one transaction. A file that cannot be merged, whatever the reason (a
 * record refused on the way into the store, this phone's storage full), is reported and skipped: one bad file
 * never stops the run. Only a store that cannot be used at all stops it, and a Cancel.
 */
async function mergeOne(source: RecordSource, item: Incoming, report: SyncReport, passed: WeakSet<object>, transfer: TransferOptions = {}): Promise<MergeOutcome> {
  try {
    const done = await applyImport(source, item.file, undefined, { passed, ...transfer });
    report.merged.push({ name: item.name, added: done.added.length, updated: done.updated.length, unchanged: done.unchanged, conflicts: done.conflicts.length });
    report.conflicts.push(...done.conflicts);
    return { ok: true };
  } catch (error) {
    const outcome = refusal(error, item.fetched.body, item.file);
    if (!outcome.ok) report.problems.push({ name: item.name, ...outcome.problem });
    return outcome;
  }
}

/**
 * Everything read from the folder in this run, merged into the store in one reading of it and one transaction:
 * a run cancelled before that write leaves the store as it was, one cancelled after it leaves the store with
 * everything merged (the store's write checks the signal between its steps and fails whole; see
 * store/merged-records.ts). Should the merge be refused (a record the store's gate refuses once merged, this
 * phone's storage full), each file is merged alone, so the file to blame is named and the others are taken in;
 * a Cancel is then looked at before the first of those writes only, so the store is again either as it was or
 * holds every file it could take.
 */
async function mergeIncoming(source: RecordSource, incoming: readonly Incoming[], report: SyncReport, passed: WeakSet<object>, run: RunProgress): Promise<void> {
  if (incoming.length === 0) return;
  const transfer: TransferOptions = { signal: run.signal, onProgress: run.onProgress };
  if (incoming.length === 1) {
    const item = incoming[0]!;
    item.settle(await mergeOne(source, item, report, passed, transfer));
    return;
  }
  try {
    const done = await applyImport(source, assembleParts(incoming.map((i) => i.file)), undefined, { passed, ...transfer });
    reportByGroup(incoming, done, report);
    report.conflicts.push(...done.conflicts);
    for (const item of incoming) item.settle({ ok: true });
    return;
  } catch (error) {
    if (error instanceof TransferCancelled || problemWeight(error) === 'fatal') throw error;
  }
  run.check('writing');
  for (const item of incoming) item.settle(await mergeOne(source, item, report, passed));
}

/** The report of one merge of many files, told by file (or phone's part folder): each record changed is counted
 *  with the first group that brought it, as merging them one after the other would have counted it. */
function reportByGroup(incoming: readonly Incoming[], done: MergePreview, report: SyncReport): void {
  const groupOf = new Map<string, string>();
  const sizes = new Map<string, number>();
  for (const item of incoming) {
    if (!sizes.has(item.group)) sizes.set(item.group, 0);
    for (const r of item.file.records) {
      if (groupOf.has(r.id)) continue;
      groupOf.set(r.id, item.group);
      sizes.set(item.group, sizes.get(item.group)! + 1);
    }
  }
  const count = () => new Map([...sizes.keys()].map((g) => [g, 0]));
  const added = count();
  const updated = count();
  const conflicts = count();
  const bump = (m: Map<string, number>, id: string) => {
    const g = groupOf.get(id);
    if (g !== undefined) m.set(g, m.get(g)! + 1);
  };
  for (const r of done.added) bump(added, r.id);
  for (const u of done.updated) bump(updated, u.after.id);
  for (const c of done.conflicts) bump(conflicts, c.id);
  for (const [group, size] of sizes) {
    const a = added.get(group)!;
    const u = updated.get(group)!;
    report.merged.push({ name: group, added: a, updated: u, unchanged: Math.max(0, size - a - u), conflicts: conflicts.get(group)! });
  }
}

/** What to remember of a file read: a file refused for itself is not read again until it changes; one this phone
 *  could not take in now is read again next time (an empty hash matches nothing, and it is never settled). */
function rememberRead(fetched: FetchedFile, hash: string, outcome: MergeOutcome): RemoteFileState {
  if (outcome.ok) return remoteState(fetched, hash);
  if (outcome.weight === 'file') return remoteState(fetched, hash, outcome.problem);
  return { ...remoteState(fetched, '', outcome.problem), settled: false, seen_at: null };
}

/** Parts written between two saves of the sync state. */
const SAVE_EVERY_FILES = 25;

const byteLength = (text: string) => new TextEncoder().encode(text).length;

/** Counts the files read from the folder; the total grows as each index names the parts to read. */
function downloadCounter(run: RunProgress) {
  let done = 0;
  let total = 0;
  return {
    add(n: number) {
      total += n;
      run.report({ phase: 'downloading', done, total });
    },
    read() {
      done++;
      run.report({ phase: 'downloading', done, total });
    },
  };
}

async function runSteps(client: WebDavClient, state: SyncState, report: SyncReport, options: SyncOptions, device: string, run: RunProgress): Promise<void> {
  const { source } = options;
  const ownName = report.own_file;
  const ownIndex = deviceIndexName(device);
  state.own_problem = null;

  // 1. The listing.
  run.check('listing');
  run.report({ phase: 'listing', done: 0, total: 0 });
  const { files, folders, date: listedAt } = await client.listing();
  const listing = files.filter((r) => isLogName(r.name) || isIndexName(r.name));
  const listed = new Set(listing.map((r) => r.name));

  // 2. Every file to merge is read and checked first; the store is not touched until all are (see mergeIncoming).
  //    Other phones' old single files and part indexes with the parts that changed, this phone's own old file
  //    and its index when someone else wrote them.
  const incoming: Incoming[] = [];
  const afterMerge: (() => void)[] = [];
  // The records the gate checks whole as each file is read, so the merge and the store's write do not again.
  const passed = new WeakSet<object>();
  const downloads = downloadCounter(run);
  // A file of this phone's own that it could not take in now (its storage full) must not be overwritten by the
  // upload: the run stops after the merge, to try again. One refused for itself is replaced, and named.
  let ownStop: unknown = null;
  const ownOutcome = (name: string, outcome: MergeOutcome) => {
    if (outcome.ok) return;
    if (outcome.weight === 'passing') ownStop ??= outcome.error;
    else state.own_problem = { name, ...outcome.problem };
  };

  const others = [...listing]
    .sort((a, b) => (a.name < b.name ? -1 : 1))
    .filter((entry) => {
      if (entry.name === ownName || entry.name === ownIndex) return false;
      if (!listedUnchanged(state.files[entry.name], entry, listedAt)) return true;
      report.skipped++;
      return false;
    });
  const ownEntry = listing.find((r) => r.name === ownName) ?? null;
  const indexEntry = listing.find((r) => r.name === ownIndex) ?? null;
  const readOwnFile = ownEntry !== null && !listedUnchanged(state.own, ownEntry, listedAt);
  const readOwnIndex = indexEntry !== null && !listedUnchanged(state.own_index, indexEntry, listedAt);
  downloads.add(others.length + (readOwnFile ? 1 : 0) + (readOwnIndex ? 1 : 0));

  for (const entry of others) {
    const name = entry.name;
    const known = state.files[name];
    const fetched = await client.get(name);
    downloads.read();
    if (!fetched) {
      delete state.files[name];
      continue;
    }
    const hash = contentHash(fetched.body);
    if (known && known.hash === hash) {
      state.files[name] = remoteState(fetched, hash, known.problem);
    } else if (isIndexName(name)) {
      const remember = await collectIndexed(client, name, fetched, hash, report, state.files, incoming, passed, downloads);
      afterMerge.push(() => (state.files[name] = remember()));
    } else {
      const checked = checkFile(name, fetched, report, passed);
      if ('refused' in checked) state.files[name] = rememberRead(fetched, hash, checked.refused);
      else incoming.push({ name, group: name, fetched, hash, file: checked.file, settle: (o) => (state.files[name] = rememberRead(fetched, hash, o)) });
    }
  }
  for (const name of Object.keys(state.files)) {
    const slash = name.indexOf('/');
    const owner = slash < 0 ? name : indexNameOf(name.slice(0, slash));
    if (!listed.has(owner)) delete state.files[name];
  }

  // This phone's old single file (written by an older version of the app): merged if someone else wrote it since,
  // and removed once the parts hold the whole log, read back.
  if (readOwnFile) {
    const fetched = await client.get(ownName);
    downloads.read();
    if (fetched) {
      const hash = contentHash(fetched.body);
      const remember = () => (state.own = remoteState(fetched, hash));
      if (hash === state.uploaded_hash) remember();
      else {
        const checked = checkFile(ownName, fetched, report, passed);
        if ('refused' in checked) {
          ownOutcome(ownName, checked.refused);
          remember();
        } else {
          incoming.push({ name: ownName, group: ownName, fetched, hash, file: checked.file, settle: (o) => ownOutcome(ownName, o) });
          afterMerge.push(remember);
        }
      }
    }
  } else if (!ownEntry) {
    state.own = null;
    state.uploaded_hash = null;
  }

  // This phone's part index: if someone else wrote it (a restored backup, another tab), its parts that differ from
  // what this phone uploaded are merged too. If it is gone, every part is written again.
  state.own_parts ??= {};
  if (readOwnIndex) {
    const fetched = await client.get(ownIndex);
    downloads.read();
    if (fetched) {
      const hash = contentHash(fetched.body);
      if (hash !== state.uploaded_index_hash && hash !== state.pending_index_hash) {
        const seen: Record<string, RemoteFileState> = {};
        const folder = partFolderName(ownIndex);
        for (const [key, partHash] of Object.entries(state.own_parts)) seen[`${folder}/${partFileName(key)}`] = { ...emptyRemote(), hash: partHash };
        const remember = await collectIndexed(client, ownIndex, fetched, hash, report, seen, incoming, passed, downloads, ownOutcome);
        afterMerge.push(() => {
          // What the folder holds now is not what this phone uploaded: write every part again.
          state.own_index = remember();
          state.own_parts = {};
          state.uploaded_index_hash = null;
        });
      } else {
        // The index this phone wrote (or was writing when a run was cancelled: it is read back below either way).
        state.own_index = remoteState(fetched, hash);
        if (hash === state.pending_index_hash) state.uploaded_index_hash = hash;
      }
    }
  } else if (!indexEntry) {
    state.own_index = null;
    state.own_parts = {};
    state.uploaded_index_hash = null;
  }
  state.pending_index_hash = null;

  // 3. One merge, one transaction; then what each file read leaves to remember.
  run.check('reading');
  await mergeIncoming(source, incoming, report, passed, run);
  for (const remember of afterMerge) remember();
  await saveSyncState(source, state);
  if (ownStop) throw ownStop;

  // 4. Split the log into its parts, upload those that changed and then the index, each read back before it
  //    counts; then remove parts no longer in the index, and the old single file. Marked sent at the end.
  run.check('uploading');
  const saver = progressSaver(source, state);
  await sendRecords(source, { now: () => options.now?.() ?? Date.now() }, async (records) => {
    const split = splitLog(records, { device, app_version: options.appVersion });
    const ownParts = state.own_parts!;
    const folder = partFolderName(ownIndex);
    const changed = split.parts.filter((p) => ownParts[p.key] !== p.hash);
    run.report({ phase: 'uploading', done: 0, total: changed.length });
    try {
      // The phone's part folder is made before its first part when the listing lacks it, so no request is sent
      // that is sure to fail (a PUT into a missing folder: 409 on Apache, and an error in the browser's console).
      if (changed.length > 0 && !folders.some((f) => f.name.replace(/\/$/, '') === folder)) await makePartFolder(client, folder);
      for (const [i, part] of changed.entries()) {
        run.check('uploading');
        await putVerified(client, [folder, partFileName(part.key)], part.text, part.hash, options);
        ownParts[part.key] = part.hash;
        report.uploaded = true;
        run.report({ phase: 'uploading', done: i + 1, total: changed.length });
        await saver.tick();
      }
    } catch (error) {
      if (!(error instanceof NoPartFolder)) throw error;
      // A folder whose server does not let this phone make a sub-folder (a CORS set-up that allows only the
      // methods of older versions, or a server without MKCOL): the whole log goes to the single file as before.
      const text = exportLog(records, { device, app_version: options.appVersion });
      const hash = contentHash(text);
      if (!(ownEntry && state.own?.hash === hash && state.uploaded_hash === hash)) {
        run.report({ phase: 'uploading', done: 0, total: 0 });
        state.own = await putVerified(client, ownName, text, hash, options);
        state.uploaded_hash = hash;
        report.uploaded = true;
      }
      await saveSyncState(source, state);
      return { sent: true, value: undefined };
    }
    const indexHash = contentHash(split.indexText);
    if (!indexEntry || state.uploaded_index_hash !== indexHash || state.own_index?.hash !== indexHash) {
      run.check('indexing');
      run.report({ phase: 'indexing', done: 0, total: 1 });
      // Remembered before the index is written: a run cancelled while the index was on its way does not take its
      // own index, found in the folder next time, for one written by someone else (and write every part again).
      state.pending_index_hash = indexHash;
      await saveSyncState(source, state);
      state.own_index = await putVerified(client, ownIndex, split.indexText, indexHash, options);
      state.uploaded_index_hash = indexHash;
      state.pending_index_hash = null;
      report.uploaded = true;
      run.report({ phase: 'indexing', done: 1, total: 1 });
    }
    await saveSyncState(source, state);
    // From here the log is in the folder: the tidying goes on whatever the Cancel says, and the log is marked sent.
    const tidy = client.detached();
    const keep = new Set(split.parts.map((p) => p.key));
    // Removing is tidying only: a server (or a CORS set-up) that does not allow DELETE leaves a file no index
    // names (never read) or an old single file that no longer changes (read once more, merging nothing new).
    for (const key of Object.keys(ownParts)) {
      if (keep.has(key)) continue;
      await removeQuietly(tidy, [folder, partFileName(key)]);
      delete ownParts[key];
    }
    if (ownEntry) {
      // The old single file's records are in the parts now (it was merged above, or it is what this phone wrote);
      // one refused for itself is named in this run's report (own_problem), as when an upload replaced it.
      if (await removeQuietly(tidy, ownName)) {
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
 *  file would cost time growing with the square of the folder's size. A run cut between saves writes at most that
 *  many parts again. */
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
 * A phone's part index, read: checked (log/log-parts.ts readPartIndex), then every part whose hash differs from
 * the version remembered in `seen` is read and checked, and added to the run's incoming files (merged later with
 * all the others). A refused index or part is reported and skipped; the run goes on. Returns what to remember of
 * the index once the merge is done: settled only when every part it names was read as named and taken in, so an
 * index read while its phone was between writing a part and writing the index is read again next time.
 * `own` is given for this phone's own index (written by someone else): its parts' refusals go there.
 */
async function collectIndexed(
  client: WebDavClient,
  name: string,
  fetched: FetchedFile,
  hash: string,
  report: SyncReport,
  seen: Record<string, RemoteFileState>,
  incoming: Incoming[],
  passed: WeakSet<object>,
  downloads: { add(n: number): void; read(): void },
  own?: (name: string, outcome: MergeOutcome) => void,
): Promise<() => RemoteFileState> {
  let index: LogPartIndex;
  try {
    index = readPartIndex(fetched.body, { name });
  } catch (error) {
    const problem = fileProblem(error, fetched.body, null);
    report.problems.push({ name, ...problem });
    return () => remoteState(fetched, hash, problem);
  }
  const folder = partFolderName(name);
  let complete = true;
  const named = new Set<string>();
  const toRead = index.parts.filter((entry) => {
    const path = `${folder}/${partFileName(entry.key)}`;
    named.add(path);
    return seen[path]?.hash !== entry.hash;
  });
  downloads.add(toRead.length);
  for (const entry of toRead) {
    const path = `${folder}/${partFileName(entry.key)}`;
    const part = await client.get([folder, partFileName(entry.key)]);
    downloads.read();
    if (!part) {
      complete = false;
      continue;
    }
    const partHash = contentHash(part.body);
    if (partHash !== entry.hash) complete = false;
    const checked = checkFile(path, part, report, passed);
    if ('refused' in checked) {
      if (own) {
        own(path, checked.refused);
        seen[path] = remoteState(part, partHash);
      } else seen[path] = remoteState(part, partHash, checked.refused.problem);
      continue;
    }
    incoming.push({
      name: path,
      group: `${folder}/`,
      fetched: part,
      hash: partHash,
      file: checked.file,
      settle(outcome) {
        if (own) {
          own(path, outcome);
          seen[path] = remoteState(part, partHash);
          return;
        }
        seen[path] = rememberRead(part, partHash, outcome);
        if (!outcome.ok && outcome.weight === 'passing') complete = false;
      },
    });
  }
  return () => {
    for (const path of Object.keys(seen)) if (path.startsWith(`${folder}/`) && !named.has(path)) delete seen[path];
    return complete ? remoteState(fetched, hash) : { ...remoteState(fetched, '', null), settled: false, seen_at: null };
  };
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
