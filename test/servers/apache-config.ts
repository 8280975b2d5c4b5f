// Apache httpd configuration for a private instance with mod_dav, generated for the tests.
// Facts from Apache 2.4 on Debian: modules load by absolute path; PidFile, ErrorLog, DavLockDB and the Mutex
// directory must lie inside the instance's folder; a root start needs User/Group. mod_dav honours If-Match and
// If-None-Match on PUT (412) and lists getetag.

export interface ApacheOptions {
  base: string;
  port: number;
  dataDir: string;
  appOrigins: string[];
  /** 'basic': AuthType Basic with a password file; 'no-challenge': 401 from mod_rewrite, without WWW-Authenticate. */
  auth: { kind: 'basic'; userFile: string } | { kind: 'no-challenge'; authorizations: string[] };
  runAs: { user: string; group: string } | null;
}

const MODULES = [
  'mpm_event',
  'authn_core',
  'authn_file',
  'authz_core',
  'authz_user',
  'auth_basic',
  'dav',
  'dav_fs',
  'headers',
  'rewrite',
  'alias',
  'mime',
  'setenvif',
];

const escapeRegex = (text: string) => text.replace(/[.*+?^${}()|[\]\\/ ]/g, (c) => (c === ' ' ? '\\ ' : `\\${c}`));

export function apacheConfig(o: ApacheOptions): string {
  const modules = MODULES.map((m) => `LoadModule ${m}_module /usr/lib/apache2/modules/mod_${m}.so`).join('\n');
  const origins = o.appOrigins.map(escapeRegex).join('|');
  const auth =
    o.auth.kind === 'basic'
      ? `  AuthType Basic
  AuthName "Plummet office folder"
  AuthBasicProvider file
  AuthUserFile ${o.auth.userFile}
  <RequireAny>
    Require method OPTIONS
    Require valid-user
  </RequireAny>`
      : `  Require all granted
  RewriteCond %{REQUEST_METHOD} !=OPTIONS
  RewriteCond %{HTTP:Authorization} !^(${o.auth.authorizations.map(escapeRegex).join('|')})$
  RewriteRule ^ - [R=401,L]`;
  return `ServerRoot ${o.base}
ServerName 127.0.0.1
Listen 127.0.0.1:${o.port}
${modules}
${o.runAs ? `User ${o.runAs.user}\nGroup ${o.runAs.group}` : ''}
PidFile ${o.base}/run/httpd.pid
ErrorLog ${o.base}/run/error.log
LogLevel warn
Mutex file:${o.base}/run default
DavLockDB ${o.base}/run/davlock
TypesConfig /etc/mime.types
Timeout 30
Alias /dav ${o.dataDir}
${origins ? `SetEnvIf Origin "^(${origins})$" PLUMMET_ORIGIN=$0` : ''}
<Directory ${o.dataDir}>
  Dav On
  Options FollowSymLinks
  AllowOverride None
  RewriteEngine On
  RewriteCond %{REQUEST_METHOD} =OPTIONS
  RewriteRule ^ - [R=204,L]
${auth}
  Header always set Access-Control-Allow-Origin "%{PLUMMET_ORIGIN}e" env=PLUMMET_ORIGIN
  Header always set Access-Control-Allow-Methods "GET, HEAD, PUT, DELETE, MKCOL, PROPFIND, OPTIONS" env=PLUMMET_ORIGIN
  Header always set Access-Control-Allow-Headers "Authorization, Content-Type, Depth, If-Match, If-None-Match" env=PLUMMET_ORIGIN
  Header always set Access-Control-Expose-Headers "ETag, DAV, Content-Length, Last-Modified, Date" env=PLUMMET_ORIGIN
  Header always set Vary Origin
  Header always set Cache-Control "no-cache"
</Directory>
`;
}
