// The app's security headers and Content-Security-Policy, in one place: the page's <meta> (written into
// index.html at build time by vite.config.ts), the project's static server (scripts/static-server.mjs) and the
// nginx configurations of docs/office-folder.md (test/servers/nginx-config.ts) all take them from here.
//
// What the app loads, and so what the policy allows:
// - scripts: its own files only (no inline script, no eval: the built index.html has none, Vite writes
//   <script src>, and the log's schema check is a small interpreter, not a compiled validator), plus `blob:` for
//   the AudioWorklet of sound timing, whose source is a string in the bundle so that it is precached
//   (src/timing/audio-capture.ts; a worklet's module is governed by script-src);
// - styles: its own stylesheet and Lit's constructed stylesheets (adoptedStyleSheets, which CSP does not
//   govern); styles set through the DOM (element.style) are allowed by CSP, a style="" attribute in markup is
//   not, so no 'unsafe-inline' is needed and none is given;
// - images: its own icons; connections: itself and the office folder; the service worker and the manifest:
//   its own. Nothing else: no frames, no plugins, no <base>, forms post only to the page itself.

/** Directives every copy of the policy carries (the page's meta and the servers' headers). */
const BASE_DIRECTIVES = [
  ["default-src", "'none'"],
  ["script-src", "'self' blob:"],
  ["style-src", "'self'"],
  ["img-src", "'self'"],
  ["manifest-src", "'self'"],
  ["worker-src", "'self'"],
  ["object-src", "'none'"],
  ["base-uri", "'none'"],
  ["form-action", "'self'"],
];

/**
 * Where the page may connect when nothing narrower is known: itself, any https:// origin and the local hosts
 * the app accepts as a folder over plain http (src/sync/folder-url.ts). A server that knows the office folder
 * sends connect-src with that origin only; the browser enforces both policies, so the narrower one wins.
 */
export const ANY_FOLDER = ["https:", "http://localhost:*", "http://127.0.0.1:*", "http://*.localhost:*"];

/**
 * @param {{ connectSrc?: readonly string[], frameAncestors?: boolean, reportUri?: string | null }} [options]
 *   connectSrc: origins beside 'self' the page may connect to (the office folder's origin);
 *   frameAncestors: add frame-ancestors 'none' (headers only: a <meta> policy ignores it);
 *   reportUri: where the browser posts violation reports (headers only).
 * @returns {string}
 */
export function contentSecurityPolicy({ connectSrc = [], frameAncestors = false, reportUri = null } = {}) {
  const directives = [...BASE_DIRECTIVES, ["connect-src", ["'self'", ...connectSrc].join(' ')]];
  if (frameAncestors) directives.push(["frame-ancestors", "'none'"]);
  if (reportUri) directives.push(["report-uri", reportUri]);
  return directives.map(([name, value]) => `${name} ${value}`).join('; ');
}

/**
 * The page's own copy, in a <meta http-equiv>: it travels with the files to any host and is served from the
 * service worker's cache offline. `folderOrigins` narrows connect-src at build time (PLUMMET_FOLDER_ORIGINS).
 * @param {readonly string[] | null} folderOrigins
 */
export function pageContentSecurityPolicy(folderOrigins = null) {
  return contentSecurityPolicy({ connectSrc: folderOrigins ?? ANY_FOLDER });
}

/**
 * The powerful features the app uses: the microphone (timing by sound), the position (the site), the share
 * sheet (sending a log) and the screen wake lock (the screen stays on while a series is open). Video clips are picked with <input type="file" capture>, which opens the phone's own
 * camera app and needs no camera permission for the page. Everything else is denied, to the page and to any
 * frame. Only names Chromium knows are listed (it logs an error for any other).
 */
export const PERMISSIONS_POLICY = [
  'microphone=(self)',
  'geolocation=(self)',
  'web-share=(self)',
  'screen-wake-lock=(self)',
  'camera=()',
  'display-capture=()',
  'accelerometer=()',
  'gyroscope=()',
  'magnetometer=()',
  'usb=()',
  'serial=()',
  'hid=()',
  'bluetooth=()',
  'midi=()',
  'payment=()',
  'publickey-credentials-get=()',
  'idle-detection=()',
  'xr-spatial-tracking=()',
  'clipboard-read=()',
].join(', ');

/** The referrer is never sent: the folder has no use for the app's address. */
export const REFERRER_POLICY = 'no-referrer';

/**
 * Every header a server sends with the app's files.
 * @param {{ connectSrc?: readonly string[], reportUri?: string | null }} [options]
 * @returns {Record<string, string>}
 */
export function securityHeaders({ connectSrc = [], reportUri = null } = {}) {
  return {
    'content-security-policy': contentSecurityPolicy({ connectSrc, frameAncestors: true, reportUri }),
    'x-content-type-options': 'nosniff',
    'referrer-policy': REFERRER_POLICY,
    'permissions-policy': PERMISSIONS_POLICY,
    'cross-origin-opener-policy': 'same-origin',
  };
}

/**
 * For the office folder's own answers (the phones' JSON files): nothing in them may ever run or be framed,
 * even a file someone with the password put there to look like a page.
 */
export const FOLDER_CONTENT_SECURITY_POLICY = "default-src 'none'; sandbox; frame-ancestors 'none'";
