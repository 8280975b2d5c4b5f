/**
 * What sync remembers between runs, in the store's meta (so it survives reloads): the version of every file in
 * the folder as last read, this phone's own file as last written, and when the last run succeeded or failed.
 *
 * Telling whether a file changed without reading it: by its ETag where the listing has one (Apache lists
 * getetag), else by getlastmodified plus getcontentlength. Both rest on the file's modification time: the
 * listing's has whole-second resolution, so a file rewritten within the same second at the same size looks
 * unchanged (nginx lists no getetag, and its GET ETag is "mtime-size", the same blind spot; Apache's ETag has
 * finer times, but only as fine as the file system keeps them). A version read at a server time (the Date
 * header) at least a second after its Last-Modified is "settled": any later write lands in a later second and
 * shows. An unsettled version is read again next time and compared by content hash.
 */
import type { FileProblem } from './file-problem';
import type { DavResource } from './multistatus';
import type { FileVersion } from './webdav-client';
import { SYNC_META, type RecordSource } from './record-source';

export interface RemoteFileState {
  etag: string | null;
  last_modified: string | null;
  content_length: number | null;
  /** contentHash of the text read or written. */
  hash: string;
  /** True when the version was seen at least a second after it was written (see above). */
  settled: boolean;
  /** The server's clock (Date) when the version was read; absent in states saved by older versions. */
  seen_at?: string | null;
  /** Why the file could not be merged (not a log, invalid, a record refused); it is read again only when it
   *  changes, or at the next run when the cause was this phone's (see file-problem.ts). */
  problem: FileProblem | null;
}

export interface SyncState {
  folder_url: string;
  files: Record<string, RemoteFileState>;
  /** This phone's own file, as last written or read. */
  own: RemoteFileState | null;
  /** contentHash of the log text last uploaded. */
  uploaded_hash: string | null;
  last_success_at: string | null;
  last_attempt_at: string | null;
  last_error: { code: string; message: string; status: number | null; at: string } | null;
  /** Runs failed in a row (for the back-off). */
  failures: number;
  /** This phone's own file, written by someone else, could not be merged at the last run (absent in old states). */
  own_problem?: SkippedFile | null;
  /** This phone's part index (see log/log-parts.ts) as last written or read; absent in old states. */
  own_index?: RemoteFileState | null;
  /** contentHash of the part index last uploaded and read back. */
  uploaded_index_hash?: string | null;
  /** This phone's parts in the folder, by key: the contentHash of each as uploaded and read back. */
  own_parts?: Record<string, string>;
  /** contentHash of the part index this phone was writing when its run was cancelled (or cut): found in the
   *  folder next time, it is this phone's own, not one written by someone else. */
  pending_index_hash?: string | null;
}

export function emptySyncState(folderUrl: string): SyncState {
  return { folder_url: folderUrl, files: {}, own: null, uploaded_hash: null, last_success_at: null, last_attempt_at: null, last_error: null, failures: 0 };
}

/** The saved state, or a fresh one when there is none or it belongs to another folder. */
export async function loadSyncState(source: RecordSource, folderUrl: string): Promise<SyncState> {
  const saved = (await source.getMeta(SYNC_META.state)) as SyncState | undefined | null;
  if (!saved || saved.folder_url !== folderUrl) return emptySyncState(folderUrl);
  return saved;
}

export function saveSyncState(source: RecordSource, state: SyncState): Promise<void> {
  return source.setMeta(SYNC_META.state, state);
}

/** The opaque part of an entity tag: weak comparison (RFC 9110 §8.8.3.2) ignores the W/ prefix. */
export function opaqueTag(etag: string): string {
  return etag.startsWith('W/') ? etag.slice(2) : etag;
}

export function isStrongTag(etag: string | null | undefined): etag is string {
  return typeof etag === 'string' && !etag.startsWith('W/') && etag.startsWith('"');
}

const SECOND_MS = 1000;

/** Whether a version read with these headers is settled (see the top of this file). */
export function isSettled(version: Pick<FileVersion, 'lastModified' | 'date'>): boolean {
  if (!version.lastModified || !version.date) return false;
  const modified = Date.parse(version.lastModified);
  const seen = Date.parse(version.date);
  return Number.isFinite(modified) && Number.isFinite(seen) && seen >= modified + SECOND_MS;
}

/**
 * A version whose modification time was well ahead of the server's clock when it was read (a file copied with the
 * times of a machine whose clock runs fast) never settles until the server's clock passes it, and would be read
 * again at every run: a folder of such files would cost a request per file per run. It can be trusted while the
 * listing is made well before that time: a write since the read happened at a server time before it, so it shows
 * as another modification time.
 *
 * "Well": by more than AHEAD_MARGIN_MS. A file system whose clock differs from the HTTP server's by a few seconds
 * (a network share) dates ordinary writes a little ahead of the Date header; for those, a rewrite in the same
 * second is still possible, so they are read again until they settle, as any fresh file.
 */
const AHEAD_MARGIN_MS = 60_000;

function stillAhead(known: RemoteFileState, listed: DavResource, listedAt: string | null): boolean {
  // The listing's time, not the GET's: Apache never sends a Last-Modified later than its Date (it clamps it),
  // while its listing gives the file's own time. Used only when the tags (or time and size) below match.
  if (!known.seen_at || !listed.lastModified || !listedAt) return false;
  const modified = Date.parse(listed.lastModified);
  const seen = Date.parse(known.seen_at);
  const now = Date.parse(listedAt);
  if (!Number.isFinite(modified) || !Number.isFinite(seen) || !Number.isFinite(now)) return false;
  return seen < modified - AHEAD_MARGIN_MS && now < modified - AHEAD_MARGIN_MS;
}

/** Whether the listing (made at the server time `listedAt`, its Date header) shows the same version as the one
 *  remembered, so the file need not be read. */
export function listedUnchanged(known: RemoteFileState | null | undefined, listed: DavResource, listedAt: string | null = null): boolean {
  // Even an ETag is only as fine as the file system's clock (Apache's is "size-mtime"; on a file system with
  // whole-second times two writes in one second share it), so only a settled version is trusted.
  if (!known || !(known.settled || stillAhead(known, listed, listedAt))) return false;
  if (listed.etag && known.etag) return opaqueTag(listed.etag) === opaqueTag(known.etag);
  if (!listed.lastModified || !known.last_modified || listed.contentLength === null || known.content_length === null) return false;
  return Date.parse(listed.lastModified) === Date.parse(known.last_modified) && listed.contentLength === known.content_length;
}

export function remoteState(version: FileVersion, hash: string, problem: RemoteFileState['problem'] = null): RemoteFileState {
  return {
    etag: version.etag,
    last_modified: version.lastModified,
    content_length: version.contentLength,
    hash,
    settled: isSettled(version),
    seen_at: version.date,
    problem,
  };
}

/** A file of the folder that sync skipped, and why: what the Send screen lists after a run. */
export interface SkippedFile extends FileProblem {
  name: string;
}

/** The files of the folder skipped at the last runs (each until it changes), own file included, by name. */
export function skippedFiles(state: SyncState | null | undefined): SkippedFile[] {
  if (!state) return [];
  const out: SkippedFile[] = [];
  for (const [name, file] of Object.entries(state.files)) if (file?.problem) out.push({ name, ...file.problem });
  if (state.own_problem) out.push(state.own_problem);
  return out.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
}

/** The skipped files as the saved state has them (for the screens; no folder URL needed). */
export async function loadSkippedFiles(source: RecordSource): Promise<SkippedFile[]> {
  return skippedFiles((await source.getMeta(SYNC_META.state)) as SyncState | undefined | null);
}
