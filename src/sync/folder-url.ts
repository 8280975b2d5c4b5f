/**
 * The office folder's address. HTTPS only, because the Basic credentials (RFC 7617 §4: sent in clear text,
 * merely encoded) and the log travel with every request; plain http is allowed for this machine only
 * (localhost, 127.0.0.0/8, [::1]), which browsers also treat as a secure context.
 */
import { SyncError } from './errors';

const URL_ALLOWED = 'an https:// address without user name or password (http:// only for localhost)';
const LOCAL_HOSTS = /^(localhost|127(\.\d{1,3}){3}|\[::1\])$/i;

export function isLocalHost(hostname: string): boolean {
  return LOCAL_HOSTS.test(hostname) || hostname.toLowerCase().endsWith('.localhost');
}

/** The folder URL, checked and ending in "/" (WebDAV collections are named with a trailing slash). */
export function parseFolderUrl(text: string): string {
  const input = text.trim();
  let url: URL;
  try {
    url = new URL(input);
  } catch {
    throw new SyncError({ code: 'sync-url-invalid', field: 'folder_url', value: text, allowed: URL_ALLOWED, message: `"${text}" is not a web address; the folder URL looks like https://files.example.org/plummet/` });
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') {
    throw new SyncError({ code: 'sync-url-invalid', field: 'folder_url', value: text, allowed: URL_ALLOWED, message: `"${text}" is a ${url.protocol} address; the folder needs https://` });
  }
  if (url.protocol === 'http:' && !isLocalHost(url.hostname)) {
    throw new SyncError({
      code: 'sync-url-insecure',
      field: 'folder_url',
      value: text,
      allowed: URL_ALLOWED,
      message: `"${text}" uses plain http: the password and the log would cross the network readable by anyone; use https:// (http is allowed only for localhost and 127.0.0.1)`,
    });
  }
  if (url.username || url.password) {
    throw new SyncError({ code: 'sync-url-credentials', field: 'folder_url', value: text, allowed: URL_ALLOWED, message: 'put the user name and the password in their own fields, not in the folder URL' });
  }
  url.hash = '';
  url.search = '';
  if (!url.pathname.endsWith('/')) url.pathname += '/';
  return url.href;
}
