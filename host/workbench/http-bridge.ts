/**
 * Browser mode's host: serves the built renderer and the host interface on 127.0.0.1 only.
 *
 * Protection, because any local program or web page could otherwise reach a local port:
 * - it listens on the loopback address alone;
 * - every API call must carry the per-run random token (header `x-twofold-token`), compared
 *   in constant time; the page receives it in the URL fragment, which browsers never send;
 * - the Host header must name this exact address (stops DNS-rebinding pages), and a
 *   cross-origin Origin header is refused;
 * - only POST with a JSON body reaches the API, and the body size is capped;
 * - static files come from the renderer's build folder only, with a strict
 *   Content-Security-Policy that allows no remote content.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { readFile } from 'node:fs/promises';
import { timingSafeEqual } from 'node:crypto';
import { extname, join, normalize, sep } from 'node:path';
import type { AddressInfo } from 'node:net';
import { dispatch, MAX_FILE_CHARS, type HostService } from './api';
import { CONTENT_SECURITY_POLICY } from './csp';

const TYPES: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
  '.ttf': 'font/ttf',
  '.ico': 'image/x-icon',
};

export interface BridgeOptions {
  readonly service: HostService;
  readonly distDir: string;
  readonly token: string;
  /** 0 picks a free port. */
  readonly port?: number;
}

export interface RunningBridge {
  readonly server: Server;
  readonly port: number;
  /** The address to open, token in the fragment. */
  readonly url: string;
  close(): Promise<void>;
}

function sameToken(given: string | string[] | undefined, expected: string): boolean {
  if (typeof given !== 'string') return false;
  const a = Buffer.from(given);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

function send(res: ServerResponse, status: number, type: string, body: string | Buffer): void {
  res.writeHead(status, {
    'content-type': type,
    'content-security-policy': CONTENT_SECURITY_POLICY,
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'no-referrer',
    'cross-origin-opener-policy': 'same-origin',
    'cache-control': 'no-store',
  });
  res.end(body);
}

async function readBody(req: IncomingMessage, limit: number): Promise<string | null> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of req) {
    size += (chunk as Buffer).length;
    if (size > limit) return null;
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks).toString('utf8');
}

export async function startBridge(options: BridgeOptions): Promise<RunningBridge> {
  const root = normalize(options.distDir);
  let port = 0;
  const allowedHost = () => `127.0.0.1:${port}`;

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (req.headers.host !== allowedHost()) return send(res, 421, 'text/plain', 'wrong host');
    const origin = req.headers.origin;
    if (origin !== undefined && origin !== `http://${allowedHost()}`) return send(res, 403, 'text/plain', 'cross-origin request refused');
    const url = new URL(req.url ?? '/', `http://${allowedHost()}`);

    if (url.pathname.startsWith('/api/')) {
      if (req.method !== 'POST') return send(res, 405, 'text/plain', 'POST only');
      if (!sameToken(req.headers['x-twofold-token'], options.token)) return send(res, 403, 'text/plain', 'missing or wrong token');
      if (!(req.headers['content-type'] ?? '').startsWith('application/json')) return send(res, 415, 'text/plain', 'JSON only');
      const body = await readBody(req, MAX_FILE_CHARS * 2 + 10_000);
      if (body === null) return send(res, 413, 'text/plain', 'request too large');
      let request: unknown;
      try {
        request = JSON.parse(body);
      } catch {
        return send(res, 400, 'text/plain', 'the body is not JSON');
      }
      const reply = await dispatch(options.service, url.pathname.slice('/api/'.length), request);
      return send(res, 200, 'application/json; charset=utf-8', JSON.stringify(reply));
    }

    if (req.method !== 'GET' && req.method !== 'HEAD') return send(res, 405, 'text/plain', 'GET only');
    const relative = decodeURIComponent(url.pathname === '/' ? '/index.html' : url.pathname);
    const path = normalize(join(root, relative));
    if (path !== root && !path.startsWith(root + sep)) return send(res, 403, 'text/plain', 'outside the app');
    try {
      const bytes = await readFile(path);
      return send(res, 200, TYPES[extname(path)] ?? 'application/octet-stream', bytes);
    } catch {
      return send(res, 404, 'text/plain', 'not found');
    }
  }

  const server = createServer((req, res) => {
    handle(req, res).catch((error: unknown) => {
      if (!res.headersSent) send(res, 500, 'text/plain', error instanceof Error ? error.message : String(error));
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  port = (server.address() as AddressInfo).port;
  return {
    server,
    port,
    url: `http://127.0.0.1:${port}/#token=${options.token}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
