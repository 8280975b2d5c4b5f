// A small static file server for the built app: used by `npm start` and by the browser tests.
// It serves a folder, answers every navigation that names no file with index.html (as the service worker
// does offline), and keeps the service worker and the page itself uncached so updates are seen at once.
// Text files are sent gzip-compressed when the browser accepts it, as any production web server does.
// Every answer carries the app's security headers (scripts/security-headers.mjs); the browser posts
// Content-Security-Policy violations to /csp-report, which the server hands to `onCspReport` (or prints).
import { createServer } from 'node:http';
import { createReadStream } from 'node:fs';
import { readFile, stat } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { extname, join, normalize, sep } from 'node:path';
import { ANY_FOLDER, securityHeaders } from './security-headers.mjs';

/** Where the browser posts violation reports (the report-uri of the policy this server sends). */
export const CSP_REPORT_PATH = '/csp-report';
/** A report is a small JSON object; anything longer is cut off unread. */
const MAX_REPORT_BYTES = 64 * 1024;
/** A server for trying the app on one computer: a folder on this computer, over plain http, is allowed too. */
const LOCAL_FOLDERS = ANY_FOLDER.filter((source) => source.startsWith('http://'));

const COMPRESSIBLE = /^(text\/|application\/(json|manifest\+json)|image\/svg\+xml)/;

const TYPES = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.webmanifest': 'application/manifest+json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.txt': 'text/plain; charset=utf-8',
  '.ico': 'image/x-icon',
  '.wav': 'audio/wav',
};

/**
 * @param {{ root: string, port?: number, host?: string, folderOrigins?: readonly string[], onCspReport?: (report: unknown) => void }} options
 *   folderOrigins: office folder origins the page may connect to, beside itself and this computer;
 *   onCspReport: receives each violation report the browser posts (by default it is printed).
 * @returns {Promise<{ url: string, port: number, setRoot(dir: string): void, close(): Promise<void> }>}
 */
export async function startStaticServer({ root, port = 0, host = '127.0.0.1', folderOrigins = [], onCspReport }) {
  const security = securityHeaders({ connectSrc: [...LOCAL_FOLDERS, ...folderOrigins], reportUri: CSP_REPORT_PATH });
  // Every answer says nosniff and no-referrer; the policies themselves (a kilobyte) go with what they govern: a
  // page, and a script that may become a worker (a service worker takes its policy from its script's answer).
  const everyAnswer = { 'x-content-type-options': security['x-content-type-options'], 'referrer-policy': security['referrer-policy'] };
  const report = onCspReport ?? ((body) => console.warn('Content-Security-Policy violation:', JSON.stringify(body)));
  // Without a trailing separator, so that the containment check below holds for "dist/" and "dist" alike.
  const clean = (dir) => normalize(dir).replace(/[\\/]+$/, '') || sep;
  let base = clean(root);
  const sockets = new Set();
  const server = createServer(async (req, res) => {
    for (const [name, value] of Object.entries(everyAnswer)) res.setHeader(name, value);
    try {
      const url = new URL(req.url ?? '/', 'http://localhost');
      if (url.pathname === CSP_REPORT_PATH && req.method === 'POST') {
        receiveReport(req, res, report);
        return;
      }
      let path = decodeURIComponent(url.pathname);
      const file = normalize(join(base, path));
      if (file !== base && !file.startsWith(base + sep)) {
        res.writeHead(403).end('forbidden');
        return;
      }
      let target = file;
      let info = await stat(target).catch(() => null);
      if (info?.isDirectory()) {
        target = join(target, 'index.html');
        info = await stat(target).catch(() => null);
      }
      if (!info && !extname(path)) {
        target = join(base, 'index.html');
        info = await stat(target).catch(() => null);
      }
      if (!info && path === '/favicon.ico') {
        // Browsers ask for it on their own for a page that names no icon (the test pages): no icon, and no 404
        // logged in the page's console. The app names its icons.
        res.writeHead(204, { 'cache-control': 'no-cache' }).end();
        return;
      }
      if (!info) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
        return;
      }
      const type = TYPES[extname(target)] ?? 'application/octet-stream';
      if (type.startsWith('text/html') || (type.startsWith('text/javascript') && !target.includes(`${sep}assets${sep}`))) {
        for (const [name, value] of Object.entries(security)) res.setHeader(name, value);
      }
      const cache = target.includes(`${sep}assets${sep}`) ? 'public, max-age=31536000, immutable' : 'no-cache';
      if (COMPRESSIBLE.test(type) && /\bgzip\b/.test(String(req.headers['accept-encoding'] ?? ''))) {
        const body = gzipSync(await readFile(target));
        res.writeHead(200, { 'content-type': type, 'content-length': body.length, 'content-encoding': 'gzip', vary: 'Accept-Encoding', 'cache-control': cache });
        res.end(req.method === 'HEAD' ? undefined : body);
        return;
      }
      res.writeHead(200, { 'content-type': type, 'content-length': info.size, 'cache-control': cache, vary: 'Accept-Encoding' });
      if (req.method === 'HEAD') res.end();
      else createReadStream(target).pipe(res);
    } catch (error) {
      res.writeHead(500).end(String(error));
    }
  });
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve(undefined));
  });
  const address = server.address();
  const actualPort = typeof address === 'object' && address ? address.port : port;
  return {
    url: `http://${host}:${actualPort}`,
    port: actualPort,
    setRoot(dir) {
      base = clean(dir);
    },
    close() {
      return new Promise((resolve) => {
        for (const socket of sockets) socket.destroy();
        server.close(() => resolve());
      });
    },
  };
}

/** Reads a posted violation report (application/csp-report or reports+json) and answers 204. */
function receiveReport(req, res, report) {
  const chunks = [];
  let size = 0;
  req.on('data', (chunk) => {
    size += chunk.length;
    if (size <= MAX_REPORT_BYTES) chunks.push(chunk);
  });
  req.on('end', () => {
    res.writeHead(204).end();
    if (size > MAX_REPORT_BYTES) return;
    try {
      report(JSON.parse(Buffer.concat(chunks).toString('utf8')));
    } catch {
      // Not JSON: nothing a browser sends; ignored.
    }
  });
}
