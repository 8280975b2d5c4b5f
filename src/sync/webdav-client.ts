/**
 * A WebDAV client for one folder (RFC 4918): list it (PROPFIND, Depth 1), read a file (GET, HEAD), write one
 * (PUT, conditional on an ETag where the server gives ETags), remove one (DELETE), make a sub-folder (MKCOL).
 * A file is named by its name in the folder, or by a path of names inside a sub-folder (["a.parts", "b.json"]);
 * each name is one path segment, encoded as such, and "." or ".." is refused.
 *
 * Every request has a timeout covering the whole exchange, the body included (AbortController), so a server
 * that never answers, or stops halfway, cannot hang a sync. Requests go with `credentials: 'omit'` and an
 * explicit Authorization header: the browser then never shows its own login prompt for a 401 (Fetch standard,
 * HTTP-network-or-cache fetch: the prompt needs credentials included), which in a headless or installed app
 * could wait forever. `cache: 'no-store'` because a cached GET could hand back an old file.
 */
import { TransferCancelled, type CancelSignal } from '../log';
import { basicAuthorization } from './basic-auth';
import { SyncError } from './errors';
import { parseFolderUrl } from './folder-url';
import { parseMultistatus, type DavResource } from './multistatus';

export interface WebDavClientOptions {
  folderUrl: string;
  username: string;
  password: string;
  /** Per request, the body included; default 20 s. */
  timeoutMs?: number;
  fetch?: typeof fetch;
  setTimeout?: (fn: () => void, ms: number) => unknown;
  clearTimeout?: (handle: unknown) => void;
  /**
   * The caller's Cancel (a sync run's signal): checked before every request, and, when it is an AbortSignal,
   * handed to fetch so a request on its way is dropped at once. A request stopped so throws TransferCancelled.
   */
  signal?: CancelSignal;
}

/** What a GET or HEAD says about a file. */
export interface FileVersion {
  etag: string | null;
  /** Last-Modified, an HTTP-date. */
  lastModified: string | null;
  contentLength: number | null;
  /** The server's Date header: its clock when it answered. */
  date: string | null;
}

export interface FetchedFile extends FileVersion {
  body: string;
}

/** A file's name in the folder, or its path of names inside a sub-folder. */
export type FilePath = string | readonly string[];

const pathName = (name: FilePath): string => (typeof name === 'string' ? name : name.join('/'));

export interface PutConditions {
  /** Write only if the file is still this version (RFC 9110 §13.1.1). */
  ifMatch?: string;
  /** "*": write only if there is no such file yet (RFC 9110 §13.1.2). */
  ifNoneMatch?: '*';
}

const PROPFIND_BODY =
  '<?xml version="1.0" encoding="utf-8"?>' +
  '<D:propfind xmlns:D="DAV:"><D:prop><D:resourcetype/><D:getetag/><D:getlastmodified/><D:getcontentlength/></D:prop></D:propfind>';

interface Answer {
  status: number;
  headers: Headers;
  text: string;
}

function decodedPath(url: string): string {
  const path = new URL(url).pathname;
  try {
    return decodeURIComponent(path).replace(/\/+$/, '');
  } catch {
    return path.replace(/\/+$/, '');
  }
}

function versionOf(headers: Headers): FileVersion {
  const length = headers.get('content-length');
  return {
    etag: headers.get('etag'),
    lastModified: headers.get('last-modified'),
    contentLength: length !== null && /^\d+$/.test(length) ? Number(length) : null,
    date: headers.get('date'),
  };
}

function redirected(url: string, what: string, status: number | null, location: string | null): SyncError {
  let target = '';
  if (location) {
    try {
      target = ` to ${new URL(location, url).href}`;
    } catch {
      target = '';
    }
  }
  return new SyncError({
    code: 'sync-redirected',
    field: 'folder_url',
    value: url,
    allowed: 'an address the server answers itself, without a redirect',
    message: `the server answered with a redirect${status ? ` (${status})` : ''}${target} when trying to ${what}; Plummet does not follow redirects, so nothing was sent there: enter the folder's final address in the settings`,
    status,
  });
}

export class WebDavClient {
  readonly folderUrl: string;
  private readonly authorization: string;
  private readonly timeoutMs: number;
  private readonly fetchFn: typeof fetch;
  private readonly setTimer: (fn: () => void, ms: number) => unknown;
  private readonly clearTimer: (handle: unknown) => void;
  private readonly signal: CancelSignal | undefined;

  constructor(private readonly options: WebDavClientOptions) {
    this.signal = options.signal;
    this.folderUrl = parseFolderUrl(options.folderUrl);
    this.authorization = basicAuthorization(options.username, options.password);
    this.timeoutMs = options.timeoutMs ?? 20_000;
    this.fetchFn = options.fetch ?? ((input, init) => globalThis.fetch(input, init));
    this.setTimer = options.setTimeout ?? ((fn, ms) => globalThis.setTimeout(fn, ms));
    this.clearTimer = options.clearTimeout ?? ((h) => globalThis.clearTimeout(h as ReturnType<typeof setTimeout>));
  }

  /** The same folder without the caller's signal: for requests that must finish once begun (tidying up after
   *  the index is written). */
  detached(): WebDavClient {
    return new WebDavClient({ ...this.options, signal: undefined });
  }

  /** The URL of a file in the folder, or of one in a sub-folder when given as a path of names. */
  fileUrl(name: FilePath): string {
    const segments = typeof name === 'string' ? [name] : name;
    for (const segment of segments) {
      // A caller's bug: the names come from the listing (one segment each) or from a checked part index.
      if (segment === '' || segment === '.' || segment === '..') throw new RangeError(`not a file name in the folder: ${JSON.stringify(segment)}`);
    }
    return new URL(segments.map(encodeURIComponent).join('/'), this.folderUrl).href;
  }

  /** The files of the folder (not the folder itself, not sub-folders). */
  async list(): Promise<DavResource[]> {
    return (await this.listing()).files;
  }

  /** The files of the folder, and the server's clock (its Date header) when it listed them. One request,
   *  whatever the folder's size: Depth 1 gives every file's name, size, modification time and, where the
   *  server keeps one, its ETag. */
  async listing(): Promise<{ files: DavResource[]; folders: DavResource[]; date: string | null }> {
    const answer = await this.request('PROPFIND', this.folderUrl, {
      headers: { Depth: '1', 'Content-Type': 'application/xml; charset=utf-8' },
      body: PROPFIND_BODY,
      what: 'list its files',
    });
    if (answer.status === 404) {
      throw new SyncError({ code: 'sync-folder-missing', field: null, value: this.folderUrl, allowed: null, message: `there is no folder at ${this.folderUrl} (404): check the address`, status: 404 });
    }
    this.expect(answer, [207], 'list its files');
    const own = decodedPath(this.folderUrl);
    const all = parseMultistatus(answer.text, this.folderUrl).filter((r) => decodedPath(r.url) !== own);
    // The sub-folders too (a phone's part folder): a phone makes its own only when the listing lacks it.
    return { files: all.filter((r) => !r.collection), folders: all.filter((r) => r.collection), date: answer.headers.get('date') };
  }

  /** The file's text and version, or null when there is no such file. */
  async get(name: FilePath): Promise<FetchedFile | null> {
    const answer = await this.request('GET', this.fileUrl(name), { headers: { Accept: 'application/json' }, what: `read ${pathName(name)}` });
    if (answer.status === 404) return null;
    this.expect(answer, [200], `read ${pathName(name)}`);
    // The size of the file itself, as the listing's getcontentlength counts it (a compressed transfer's
    // Content-Length would differ).
    return { ...versionOf(answer.headers), contentLength: new TextEncoder().encode(answer.text).length, body: answer.text };
  }

  /** The file's version without its body, or null when there is no such file. */
  async head(name: string): Promise<FileVersion | null> {
    const answer = await this.request('HEAD', this.fileUrl(name), { what: `look at ${name}` });
    if (answer.status === 404) return null;
    this.expect(answer, [200], `look at ${name}`);
    return versionOf(answer.headers);
  }

  /**
   * Write the file. Throws SyncError 'sync-precondition' (412) when a condition fails: someone else wrote it
   * since. Servers that ignore conditions on PUT (nginx) simply write.
   */
  async put(name: FilePath, body: string, conditions: PutConditions = {}): Promise<FileVersion> {
    const headers: Record<string, string> = { 'Content-Type': 'application/json; charset=utf-8' };
    if (conditions.ifMatch) headers['If-Match'] = conditions.ifMatch;
    if (conditions.ifNoneMatch) headers['If-None-Match'] = conditions.ifNoneMatch;
    const answer = await this.request('PUT', this.fileUrl(name), { headers, body, what: `write ${pathName(name)}` });
    if (answer.status === 412) {
      throw new SyncError({ code: 'sync-precondition', field: null, value: conditions.ifMatch ?? conditions.ifNoneMatch ?? null, allowed: null, message: `${pathName(name)} changed on the server since it was read (412)`, status: 412 });
    }
    this.expect(answer, [200, 201, 204], `write ${pathName(name)}`);
    return versionOf(answer.headers);
  }

  /** Removes the file; a file already gone is fine. */
  async delete(name: FilePath): Promise<void> {
    const answer = await this.request('DELETE', this.fileUrl(name), { what: `remove ${pathName(name)}` });
    if (answer.status === 404) return;
    this.expect(answer, [200, 204], `remove ${pathName(name)}`);
  }

  /** Makes a sub-folder of the folder; one that exists already is fine (405, RFC 4918 §9.3.1). */
  async makeFolder(name: string): Promise<void> {
    const url = `${this.fileUrl(name)}/`;
    const answer = await this.request('MKCOL', url, { what: `make the folder ${name}` });
    if (answer.status === 405) return;
    this.expect(answer, [200, 201, 204], `make the folder ${name}`);
  }

  private expect(answer: Answer, ok: number[], what: string): void {
    if (ok.includes(answer.status)) return;
    const s = answer.status;
    if (s === 401) {
      throw new SyncError({ code: 'sync-unauthorized', field: null, value: s, allowed: null, message: `the folder refused the user name or password (401) when trying to ${what}`, status: s });
    }
    if (s === 403) throw new SyncError({ code: 'sync-forbidden', field: null, value: s, allowed: null, message: `the folder does not allow this user to ${what} (403)`, status: s });
    if (s === 413) throw new SyncError({ code: 'sync-too-large', field: null, value: s, allowed: null, message: `the server refused a file this large when trying to ${what} (413): raise its upload limit`, status: s });
    // Before the general 5xx case: a full folder is not a passing failure, and waiting does not empty it.
    if (s === 507) throw new SyncError({ code: 'sync-folder-full', field: null, value: s, allowed: null, message: `the office folder is full (507) when trying to ${what}: ask the office to free space on it`, status: s });
    if (s >= 500) throw new SyncError({ code: 'sync-server', field: null, value: s, allowed: null, message: `the server failed when trying to ${what} (${s}); trying again later`, status: s });
    throw new SyncError({ code: 'sync-http', field: null, value: s, allowed: null, message: `unexpected answer ${s} when trying to ${what}`, status: s });
  }

  private async request(
    method: string,
    url: string,
    init: { headers?: Record<string, string>; body?: string; what: string },
  ): Promise<Answer> {
    if (this.signal?.aborted) throw new TransferCancelled(null);
    const controller = new AbortController();
    let timedOut = false;
    const timer = this.setTimer(() => {
      timedOut = true;
      controller.abort();
    }, this.timeoutMs);
    const caller = this.signal as Partial<AbortSignal> | undefined;
    const cancel = () => controller.abort();
    caller?.addEventListener?.('abort', cancel);
    try {
      const response = await this.fetchFn(url, {
        method,
        headers: { ...init.headers, Authorization: this.authorization },
        body: init.body,
        signal: controller.signal,
        credentials: 'omit',
        cache: 'no-store',
        // Never followed: a redirect would re-send the log (and the Authorization header) to wherever the
        // Location points, possibly another origin. The crew is told to enter the folder's final address.
        redirect: 'manual',
      });
      // A browser hands back an opaque answer (type "opaqueredirect", status 0, no Location); Node the 3xx itself.
      if (response.type === 'opaqueredirect' || (response.status >= 300 && response.status < 400)) {
        void response.body?.cancel().catch(() => undefined);
        const location = response.headers.get('location');
        throw redirected(url, init.what, response.status || null, location);
      }
      const text = method === 'HEAD' ? '' : await response.text();
      return { status: response.status, headers: response.headers, text };
    } catch (error) {
      if (error instanceof SyncError) throw error;
      // Asked to stop: the server may or may not have taken a PUT or DELETE on its way; the run counts it as not
      // done and the next run writes it again (a PUT replaces a whole file or nothing).
      if (this.signal?.aborted && !timedOut) throw new TransferCancelled(null);
      if (timedOut) {
        throw new SyncError({ code: 'sync-timeout', field: null, value: this.timeoutMs, allowed: null, message: `no answer within ${this.timeoutMs / 1000} s when trying to ${init.what}; the server may be down or slow` });
      }
      const cause = (error as { cause?: { code?: string; message?: string } }).cause;
      const detail = cause?.code ?? cause?.message ?? (error as Error).message;
      throw new SyncError({ code: 'sync-network', field: null, value: url, allowed: null, message: `could not reach the folder to ${init.what} (${detail}); will try again` });
    } finally {
      this.clearTimer(timer);
      caller?.removeEventListener?.('abort', cancel);
    }
  }
}
