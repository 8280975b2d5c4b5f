// A small static file server for the built app: used by `npm start` and by the browser tests.
// It serves a folder, answers every navigation that names no file with index.html (as the service worker
// does offline), and keeps the service worker and the page itself uncached so updates are seen at once.
// Text files are sent gzip-compressed when the browser accepts it, as any production web server does.
import { createServer } from 'node:http';
import { createReadStream } from 'node:fs';
import { readFile, stat } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { extname, join, normalize, sep } from 'node:path';

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
 * @param {{ root: string, port?: number, host?: string }} options
 * @returns {Promise<{ url: string, port: number, setRoot(dir: string): void, close(): Promise<void> }>}
 */
export async function startStaticServer({ root, port = 0, host = '127.0.0.1' }) {
  // Without a trailing separator, so that the containment check below holds for "dist/" and "dist" alike.
  const clean = (dir) => normalize(dir).replace(/[\\/]+$/, '') || sep;
  let base = clean(root);
  const sockets = new Set();
  const server = createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? '/', 'http://localhost');
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
      if (!info) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
        return;
      }
      const type = TYPES[extname(target)] ?? 'application/octet-stream';
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
