// nginx configuration for an office folder, in the two set-ups docs/office-folder.md describes. The examples in
// that document are rendered from these same functions (a test checks they match), and the tests run nginx
// with them, so the documented configuration is the tested one.
//
// Facts from nginx 1.22 with libnginx-mod-http-dav-ext: dav_methods/dav_ext_methods give PUT and PROPFIND;
// add_header needs `always` or 207 and 401 answers lose it; the preflight OPTIONS must be answered before
// authentication, and `return` in an `if` runs in the rewrite phase, before auth_basic.

import { FOLDER_CONTENT_SECURITY_POLICY, securityHeaders } from '../../scripts/security-headers.mjs';

export type NginxSetup = 'same-origin' | 'cors';

export interface NginxSiteOptions {
  setup: NginxSetup;
  /** e.g. "443 ssl" in production, "127.0.0.1:8123" in the tests. */
  listen: string;
  serverName: string;
  tls: { certificate: string; key: string } | null;
  /** The folder's files on disk. */
  folderRoot: string;
  /** The folder's path in URLs, with slashes: "/plummet/". */
  folderPath: string;
  /** same-origin: the built app (the dist/ folder), served at /. */
  appRoot?: string;
  /** cors: the origins the app is served from. */
  appOrigins?: string[];
  /**
   * 'basic': auth_basic with a password file (what an office runs).
   * 'no-challenge': the tests' variant, answering 401 without WWW-Authenticate (a map of the accepted
   * Authorization values), for browsers that would otherwise show a login prompt.
   */
  auth: { kind: 'basic'; userFile: string } | { kind: 'no-challenge'; authorizations: string[] };
  /** Largest upload; a phone's whole log is one file (about 1 MB per 2000 drops). */
  maxBodySize: string;
}

const indent = (text: string, by: string) =>
  text
    .split('\n')
    .map((line) => (line ? by + line : line))
    .join('\n');

/** Blocks that belong in the http { } context: the maps the server block uses. */
export function nginxHttpMaps(o: NginxSiteOptions): string {
  const maps: string[] = [];
  if (o.setup === 'cors') {
    maps.push(
      [
        '# The origins the app is served from; any other origin gets no CORS headers.',
        'map $http_origin $plummet_cors_origin {',
        '    default "";',
        ...(o.appOrigins ?? []).map((origin) => `    "${origin}" $http_origin;`),
        '}',
      ].join('\n'),
    );
  }
  if (o.auth.kind === 'no-challenge') {
    maps.push(
      [
        'map $http_authorization $plummet_authorized {',
        '    default 0;',
        ...o.auth.authorizations.map((value) => `    "${value}" 1;`),
        '}',
      ].join('\n'),
    );
  }
  return maps.join('\n\n');
}

function folderLocation(o: NginxSiteOptions): string {
  const lines: string[] = [`location ${o.folderPath} {`];
  if (o.setup === 'cors') {
    lines.push(
      '    # CORS for the app (a page on another origin); `always` keeps them on 207, 401 and 412 answers.',
      '    add_header Access-Control-Allow-Origin $plummet_cors_origin always;',
      '    add_header Access-Control-Allow-Methods "GET, HEAD, PUT, DELETE, MKCOL, PROPFIND, OPTIONS" always;',
      '    add_header Access-Control-Allow-Headers "Authorization, Content-Type, Depth, If-Match, If-None-Match" always;',
      '    add_header Access-Control-Expose-Headers "ETag, DAV, Content-Length, Last-Modified, Date" always;',
      '    add_header Access-Control-Max-Age 600 always;',
      '    add_header Vary Origin always;',
    );
  }
  lines.push(
    '    # Never answer a GET from a cache: the phones compare versions.',
    '    add_header Cache-Control "no-cache" always;',
    '    # Nothing in the folder is ever run or framed, whatever a file in it looks like: every file is sent as',
    "    # bytes, which with nosniff no page loads as a script (else, on the app's own origin, script-src 'self'",
    '    # would let a page load one), and a file opened as a page is sandboxed.',
    '    types { }',
    '    default_type application/octet-stream;',
    `    add_header Content-Security-Policy "${FOLDER_CONTENT_SECURITY_POLICY}" always;`,
    '    add_header X-Content-Type-Options "nosniff" always;',
  );
  if (o.setup === 'cors') {
    lines.push('    # The preflight carries no credentials: answer it before authentication.', '    if ($request_method = OPTIONS) {', '        return 204;', '    }');
  }
  if (o.auth.kind === 'basic') {
    lines.push('    auth_basic "Plummet office folder";', `    auth_basic_user_file ${o.auth.userFile};`);
  } else {
    lines.push('    if ($plummet_authorized = 0) {', '        return 401;', '    }');
  }
  lines.push(
    `    alias ${o.folderRoot.endsWith('/') ? o.folderRoot : `${o.folderRoot}/`};`,
    '    dav_methods PUT DELETE MKCOL COPY MOVE;',
    '    dav_ext_methods PROPFIND OPTIONS;',
    '    create_full_put_path on;',
    `    client_max_body_size ${o.maxBodySize};`,
    '}',
  );
  return lines.join('\n');
}

/**
 * The app's security headers (scripts/security-headers.mjs), for the pages and the service worker (location /,
 * which serves index.html and sw.js). nginx drops the server's add_header lines in any location that has its
 * own, so /assets/ (scripts and styles, which no policy governs) says nosniff itself.
 */
function appSecurityHeaders(folderOrigins: readonly string[]): string[] {
  return Object.entries(securityHeaders({ connectSrc: folderOrigins })).map(([name, value]) => `    add_header ${headerName(name)} "${value}" always;`);
}

const headerName = (name: string) => name.replace(/(^|-)([a-z])/g, (_m, dash: string, c: string) => dash + c.toUpperCase());

function appLocations(root: string, folderOrigins: readonly string[]): string {
  return [
    `root ${root};`,
    'location / {',
    '    # Screens are routed in the page: every path that names no file gets index.html.',
    '    try_files $uri $uri/ /index.html;',
    '    add_header Cache-Control "no-cache";',
    '    # What the page may load and connect to, and which sensors it may ask for (docs/office-folder.md).',
    ...appSecurityHeaders(folderOrigins),
    '}',
    'location /assets/ {',
    '    # File names carry a content hash: keep them for a year.',
    '    add_header Cache-Control "public, max-age=31536000, immutable";',
    '    add_header X-Content-Type-Options "nosniff" always;',
    '}',
  ].join('\n');
}

/** The server { } block. */
export function nginxServerBlock(o: NginxSiteOptions): string {
  const body: string[] = [`listen ${o.listen};`, `server_name ${o.serverName};`];
  if (o.tls) body.push(`ssl_certificate ${o.tls.certificate};`, `ssl_certificate_key ${o.tls.key};`);
  body.push('');
  if (o.setup === 'same-origin') body.push(appLocations(o.appRoot ?? '', []), '');
  body.push(folderLocation(o));
  return `server {\n${indent(body.join('\n'), '    ')}\n}`;
}

export interface NginxAppHostOptions {
  listen: string;
  serverName: string;
  tls: { certificate: string; key: string } | null;
  /** The built app (the dist/ folder). */
  appRoot: string;
  /** The office folders' origins the page may connect to. */
  folderOrigins: string[];
}

/** Set-up 2's other half: the server of the app itself, on its own origin, allowing the folder's origin. */
export function nginxAppHost(o: NginxAppHostOptions): string {
  const body: string[] = [`listen ${o.listen};`, `server_name ${o.serverName};`];
  if (o.tls) body.push(`ssl_certificate ${o.tls.certificate};`, `ssl_certificate_key ${o.tls.key};`);
  body.push('', appLocations(o.appRoot, o.folderOrigins));
  return `server {\n${indent(body.join('\n'), '    ')}\n}\n`;
}

/** The app's server of docs/office-folder.md, set-up 2. */
export function documentedAppHost(): NginxAppHostOptions {
  return {
    listen: '443 ssl',
    serverName: 'plummet.example.org',
    tls: { certificate: '/etc/ssl/certs/plummet.example.org.pem', key: '/etc/ssl/private/plummet.example.org.key' },
    appRoot: '/srv/plummet/app',
    folderOrigins: ['https://files.example.org'],
  };
}

/** What an office adds to its nginx configuration: the maps (http context) and the server block. */
export function nginxSiteConfig(o: NginxSiteOptions): string {
  const maps = nginxHttpMaps(o);
  return `${maps ? `${maps}\n\n` : ''}${nginxServerBlock(o)}\n`;
}

/** A whole configuration for a private nginx instance under `prefix` (the tests' own server). */
export function nginxPrivateConfig(prefix: string, site: NginxSiteOptions): string {
  return `load_module /usr/lib/nginx/modules/ngx_http_dav_ext_module.so;
worker_processes 1;
pid ${prefix}/nginx.pid;
error_log ${prefix}/error.log;
events {
    worker_connections 256;
}
http {
    include /etc/nginx/mime.types;
    default_type application/octet-stream;
    access_log ${prefix}/access.log;
    client_body_temp_path ${prefix}/tmp/body;
    proxy_temp_path ${prefix}/tmp/proxy;
    fastcgi_temp_path ${prefix}/tmp/fastcgi;
    uwsgi_temp_path ${prefix}/tmp/uwsgi;
    scgi_temp_path ${prefix}/tmp/scgi;

${indent(nginxSiteConfig(site).trimEnd(), '    ')}
}
`;
}

/** The two examples of docs/office-folder.md, with the placeholder names the document uses. */
export function documentedExample(setup: NginxSetup): NginxSiteOptions {
  const common = {
    listen: '443 ssl',
    tls: { certificate: '/etc/ssl/certs/files.example.org.pem', key: '/etc/ssl/private/files.example.org.key' },
    folderRoot: '/srv/plummet/folder/',
    auth: { kind: 'basic' as const, userFile: '/etc/nginx/plummet.htpasswd' },
    maxBodySize: '100m',
  };
  return setup === 'same-origin'
    ? { ...common, setup, serverName: 'files.example.org', appRoot: '/srv/plummet/app', folderPath: '/dav/' }
    : { ...common, setup, serverName: 'files.example.org', appOrigins: ['https://plummet.example.org'], folderPath: '/plummet/' };
}
