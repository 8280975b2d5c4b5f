// An in-memory twin of a WebDAV folder for the sync tests, beside the real Apache and nginx ones (sync-servers,
// sync-cancel): a fetch that answers PROPFIND (Depth 1), GET, PUT, DELETE and MKCOL as Apache's mod_dav does
// (409 for a PUT into a missing sub-folder, 405 for MKCOL on an existing one, strong ETags, getetag listed). Its
// clock moves one second and a half per request, so every version it hands out is "settled" (sync-state.ts).
// Like a real server it honours the request's AbortSignal: aborted before, nothing happens; aborted while the
// request is with the server (see `hook`), the server has done it and the phone never hears.

export type DavEvent = { method: string; path: string; stage: 'before' | 'after' };

export interface MemoryDav {
  folderUrl: string;
  /** Files by path below the folder ("a.index", "a.parts/2026-06-14.json"). */
  files: Map<string, { text: string; modified: number; etag: string }>;
  folders: Set<string>;
  fetch: typeof fetch;
  /** Called as a request reaches the server and again once it has acted, before the answer leaves. */
  hook: ((event: DavEvent) => void) | null;
  requests: { method: string; path: string }[];
}

const FOLDER = '/dav/';
// 127.0.0.1: the app allows plain http only for this computer (sync/folder-url.ts).
const ORIGIN = 'http://127.0.0.1:9';

function abortError(): DOMException {
  return new DOMException('This operation was aborted', 'AbortError');
}

export function memoryDav(): MemoryDav {
  let clock = Date.UTC(2026, 6, 1, 9);
  let etags = 0;
  const dav: MemoryDav = {
    folderUrl: `${ORIGIN}${FOLDER}`,
    files: new Map(),
    folders: new Set(),
    hook: null,
    requests: [],
    fetch: async (input, init = {}) => {
      const url = new URL(String(input));
      const method = (init.method ?? 'GET').toUpperCase();
      const path = decodeURIComponent(url.pathname.slice(FOLDER.length)).replace(/\/$/, '');
      const signal = init.signal ?? null;
      if (signal?.aborted) throw abortError();
      dav.requests.push({ method, path });
      dav.hook?.({ method, path, stage: 'before' });
      if (signal?.aborted) throw abortError();
      clock += 1500;
      const date = new Date(clock).toUTCString();
      const answer = (status: number, body: string | null = null, headers: Record<string, string> = {}) => {
        dav.hook?.({ method, path, stage: 'after' });
        if (signal?.aborted) throw abortError();
        return new Response(body, { status, headers: { Date: date, ...headers } });
      };
      const parent = path.includes('/') ? path.slice(0, path.lastIndexOf('/')) : '';
      switch (method) {
        case 'PROPFIND': {
          const entry = (href: string, props: string) =>
            `<D:response><D:href>${href}</D:href><D:propstat><D:prop>${props}</D:prop><D:status>HTTP/1.1 200 OK</D:status></D:propstat></D:response>`;
          const rows = [entry(FOLDER, '<D:resourcetype><D:collection/></D:resourcetype>')];
          for (const f of dav.folders) if (!f.includes('/')) rows.push(entry(`${FOLDER}${encodeURIComponent(f)}/`, '<D:resourcetype><D:collection/></D:resourcetype>'));
          for (const [name, file] of dav.files) {
            if (name.includes('/')) continue;
            rows.push(
              entry(
                `${FOLDER}${encodeURIComponent(name)}`,
                `<D:resourcetype/><D:getetag>${file.etag}</D:getetag><D:getlastmodified>${new Date(file.modified).toUTCString()}</D:getlastmodified><D:getcontentlength>${new TextEncoder().encode(file.text).length}</D:getcontentlength>`,
              ),
            );
          }
          return answer(207, `<?xml version="1.0" encoding="utf-8"?><D:multistatus xmlns:D="DAV:">${rows.join('')}</D:multistatus>`, { 'Content-Type': 'application/xml' });
        }
        case 'GET': {
          const file = dav.files.get(path);
          if (!file) return answer(404, 'not found');
          return answer(200, file.text, { ETag: file.etag, 'Last-Modified': new Date(file.modified).toUTCString() });
        }
        case 'PUT': {
          if (parent && !dav.folders.has(parent)) return answer(409, 'no such folder');
          const existed = dav.files.has(path);
          dav.files.set(path, { text: String(init.body ?? ''), modified: clock, etag: `"${(++etags).toString(16)}"` });
          return answer(existed ? 204 : 201);
        }
        case 'DELETE': {
          if (!dav.files.delete(path)) return answer(404);
          return answer(204);
        }
        case 'MKCOL': {
          if (dav.folders.has(path)) return answer(405);
          dav.folders.add(path);
          return answer(201);
        }
        default:
          return answer(405);
      }
    },
  };
  return dav;
}
