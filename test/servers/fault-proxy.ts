// A proxy in front of a real WebDAV server that can fail on purpose: answer with an error status, never answer,
// answer slowly, or cut the connection halfway through a request or a response. Injected answers carry the
// CORS headers the real server would send, so a browser sees them as the server's.
import { createServer, request, type IncomingMessage, type ServerResponse } from 'node:http';
import type { Socket } from 'node:net';

export type Fault =
  | { kind: 'pass' }
  | { kind: 'status'; status: number }
  | { kind: 'hang' }
  | { kind: 'delay'; ms: number }
  /** Forward the request, then send the answer's headers and this many bytes of its body, and cut. */
  | { kind: 'cut-response'; afterBytes: number }
  /** Forward the request, then send the answer's headers and this many bytes of its body, and go quiet. */
  | { kind: 'stall-response'; afterBytes: number }
  /** Forward this many bytes of the request body to the server, then cut both connections. */
  | { kind: 'cut-request'; afterBytes: number }
  /** Read the whole request, answer this 2xx as if it had been done, and never pass it on: a write that is
   *  acknowledged but not stored (a full disk behind a cache, a broken box in between). */
  | { kind: 'acknowledge'; status: number }
  /** Answer with a redirect (this 3xx) to `location`, reading the request body but passing nothing on. */
  | { kind: 'redirect'; status: number; location: string };

export interface FaultRule {
  fault: Fault;
  /** Methods it applies to (default: all but OPTIONS). */
  methods?: string[];
  /** Only requests whose (decoded) path contains this. */
  pathContains?: string;
  /** How many requests it applies to before the proxy passes everything again (default: all). */
  times?: number;
}

export interface FaultProxy {
  origin: string;
  folderUrl: string;
  port: number;
  /** Method and path of every request seen, in order. */
  seen: string[];
  set(rule: FaultRule | null): void;
  close(): Promise<void>;
}

export async function startFaultProxy(targetPort: number): Promise<FaultProxy> {
  let rule: (FaultRule & { left: number }) | null = null;
  const sockets = new Set<Socket>();
  const seen: string[] = [];

  function corsHeaders(req: IncomingMessage): Record<string, string> {
    const origin = req.headers.origin;
    return origin
      ? {
          'Access-Control-Allow-Origin': origin,
          'Access-Control-Expose-Headers': 'ETag, DAV, Content-Length, Last-Modified, Date',
          Vary: 'Origin',
        }
      : {};
  }

  function forward(req: IncomingMessage, res: ServerResponse, fault: Fault): void {
    const upstream = request(
      { host: '127.0.0.1', port: targetPort, method: req.method, path: req.url, headers: { ...req.headers, host: `127.0.0.1:${targetPort}` } },
      (answer) => {
        if (fault.kind === 'cut-response' || fault.kind === 'stall-response') {
          const cut = fault.kind === 'cut-response';
          res.writeHead(answer.statusCode ?? 502, answer.headers);
          let sent = 0;
          answer.on('data', (chunk: Buffer) => {
            if (sent >= fault.afterBytes) return;
            const part = chunk.subarray(0, fault.afterBytes - sent);
            sent += part.length;
            res.write(part);
            if (sent >= fault.afterBytes) {
              answer.destroy();
              if (cut) res.socket?.destroy();
            }
          });
          answer.on('end', () => {
            if (cut) res.socket?.destroy();
          });
          return;
        }
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      },
    );
    upstream.on('error', () => res.socket?.destroy());
    if (fault.kind === 'cut-request') {
      let sent = 0;
      req.on('data', (chunk: Buffer) => {
        if (sent >= fault.afterBytes) return;
        const part = chunk.subarray(0, fault.afterBytes - sent);
        sent += part.length;
        upstream.write(part);
        if (sent >= fault.afterBytes) {
          upstream.destroy();
          req.socket.destroy();
        }
      });
      req.on('end', () => {
        upstream.destroy();
        req.socket.destroy();
      });
      return;
    }
    req.pipe(upstream);
  }

  const server = createServer((req, res) => {
    seen.push(`${req.method} ${req.url}`);
    let fault: Fault = { kind: 'pass' };
    if (rule && rule.left > 0 && (rule.methods ?? ['GET', 'HEAD', 'PUT', 'PROPFIND', 'DELETE']).includes(req.method ?? '') && (!rule.pathContains || decodeURIComponent(req.url ?? '').includes(rule.pathContains))) {
      fault = rule.fault;
      rule.left--;
    }
    switch (fault.kind) {
      case 'hang':
        req.resume();
        return;
      case 'status':
        req.resume();
        req.on('end', () => res.writeHead(fault.status, { 'Content-Type': 'text/plain', ...corsHeaders(req) }).end(`injected ${fault.status}`));
        return;
      case 'acknowledge':
        req.resume();
        req.on('end', () => res.writeHead(fault.status, { 'Content-Length': '0', ...corsHeaders(req) }).end());
        return;
      case 'redirect':
        req.resume();
        req.on('end', () => res.writeHead(fault.status, { Location: fault.location, 'Content-Length': '0', ...corsHeaders(req) }).end());
        return;
      case 'delay':
        setTimeout(() => forward(req, res, fault), fault.ms);
        return;
      default:
        forward(req, res, fault);
    }
  });
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    origin: `http://127.0.0.1:${port}`,
    folderUrl: `http://127.0.0.1:${port}/dav/`,
    port,
    seen,
    set(next) {
      rule = next ? { ...next, left: next.times ?? Infinity } : null;
    },
    close() {
      for (const s of sockets) s.destroy();
      return new Promise((resolve) => server.close(() => resolve()));
    },
  };
}

/** A server that accepts connections and never answers: the request must time out. */
export async function startSilentServer(): Promise<{ origin: string; folderUrl: string; connections: () => number; close(): Promise<void> }> {
  const sockets = new Set<Socket>();
  let count = 0;
  const server = createServer(() => {
    /* never answer */
  });
  server.on('connection', (socket) => {
    count++;
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    origin: `http://127.0.0.1:${port}`,
    folderUrl: `http://127.0.0.1:${port}/dav/`,
    connections: () => count,
    close() {
      for (const s of sockets) s.destroy();
      return new Promise((resolve) => server.close(() => resolve()));
    },
  };
}
