/**
 * The multistatus answer of a PROPFIND (RFC 4918 §9.1, §13, §14.16): one <D:response> per resource with its
 * <D:href> and <D:propstat> blocks. Only properties in a propstat with status 200 count (§9.1.2); a resource
 * answered with its own status only (no propstat) is left out.
 */
import { SyncError } from './errors';
import { childrenNamed, parseXml, textOf, XmlError, type XmlElement } from './xml';

const DAV = 'DAV:';

export interface DavResource {
  /** The absolute URL of the resource. */
  url: string;
  /** The last segment of its path, percent-decoded ("plummet-log-phoneA.json"). */
  name: string;
  collection: boolean;
  /** DAV:getetag as given (strong "x" or weak W/"x"), or null when the server lists none (nginx). */
  etag: string | null;
  /** DAV:getlastmodified, an HTTP-date (RFC 9110 §5.6.7), whole seconds. */
  lastModified: string | null;
  contentLength: number | null;
}

function statusOk(propstat: XmlElement): boolean {
  const status = childrenNamed(propstat, DAV, 'status')[0];
  return status !== undefined && /^HTTP\/\d(\.\d)?\s+2\d\d\b/.test(textOf(status).trim());
}

function lastSegment(pathname: string): string {
  const parts = pathname.split('/').filter((p) => p !== '');
  const last = parts[parts.length - 1] ?? '';
  try {
    return decodeURIComponent(last);
  } catch {
    return last;
  }
}

export function parseMultistatus(xml: string, requestUrl: string): DavResource[] {
  let root: XmlElement;
  try {
    root = parseXml(xml);
  } catch (error) {
    throw new SyncError({ code: 'sync-bad-response', field: null, value: xml.slice(0, 200), allowed: null, message: `the folder's listing is not well-formed XML: ${(error as XmlError).message}` });
  }
  if (root.ns !== DAV || root.local !== 'multistatus') {
    throw new SyncError({ code: 'sync-bad-response', field: null, value: xml.slice(0, 200), allowed: null, message: `the folder answered <${root.local}> where a WebDAV listing has <multistatus> (RFC 4918 §14.16)` });
  }
  const resources: DavResource[] = [];
  for (const response of childrenNamed(root, DAV, 'response')) {
    const href = childrenNamed(response, DAV, 'href')[0];
    if (!href) continue;
    let url: URL;
    try {
      url = new URL(textOf(href).trim(), requestUrl);
    } catch {
      continue;
    }
    const resource: DavResource = {
      url: url.href,
      name: lastSegment(url.pathname),
      collection: false,
      etag: null,
      lastModified: null,
      contentLength: null,
    };
    let any = false;
    for (const propstat of childrenNamed(response, DAV, 'propstat')) {
      if (!statusOk(propstat)) continue;
      any = true;
      for (const prop of childrenNamed(propstat, DAV, 'prop')) {
        for (const p of prop.children) {
          if (typeof p === 'string' || p.ns !== DAV) continue;
          const value = textOf(p).trim();
          if (p.local === 'getetag' && value) resource.etag = value;
          else if (p.local === 'getlastmodified' && value) resource.lastModified = value;
          else if (p.local === 'getcontentlength' && /^\d+$/.test(value)) resource.contentLength = Number(value);
          else if (p.local === 'resourcetype') resource.collection = childrenNamed(p, DAV, 'collection').length > 0;
        }
      }
    }
    if (any) resources.push(resource);
  }
  return resources;
}
