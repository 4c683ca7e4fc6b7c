// A small static file server for a built folio, for previewing on this machine.
// The root is looked up again on every request: a build swaps the whole output folder, so a handle
// opened on the old one would keep serving the old site.

import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { open, realpath, type FileHandle } from 'node:fs/promises';
import { extname, join, relative, sep, isAbsolute } from 'node:path';

export interface StaticServerOptions {
  /** The folder to serve (need not exist yet: requests then get 503). */
  root: string;
  /** 0 lets the system choose. Default 8080. */
  port?: number;
  /** Default 127.0.0.1: only this machine. */
  host?: string;
  /** How many ports to try, upwards from `port`, when it is taken. Default 20. */
  portAttempts?: number;
}

export interface StaticServer {
  url: string;
  port: number;
  /** The port asked for (differs from `port` when that one was busy). */
  requestedPort: number;
  close(): Promise<void>;
}

export const DEFAULT_PORT = 8080;
export const DEFAULT_HOST = '127.0.0.1';

const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.json': 'application/json; charset=utf-8',
  '.csv': 'text/csv; charset=utf-8',
  '.pdf': 'application/pdf',
  '.txt': 'text/plain; charset=utf-8',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
};

/** The Content-Type for a file name; unknown kinds are plain bytes. */
export function contentType(file: string): string {
  return CONTENT_TYPES[extname(file).toLowerCase()] ?? 'application/octet-stream';
}

export type RequestPath = { segments: string[]; folder: boolean } | { refused: string };

/**
 * The site-relative path segments a request names, or why it is refused. Each segment is decoded
 * once; a segment that decodes to `.`, `..`, or holds a slash, backslash or NUL is refused, so no
 * spelling (`..`, `%2e%2e`, `..%2f..`) can climb out of the site.
 */
export function requestPath(rawUrl: string): RequestPath {
  const path = rawUrl.split(/[?#]/, 1)[0];
  if (!path.startsWith('/')) return { refused: 'the path must start with /' };
  const segments: string[] = [];
  for (const raw of path.split('/').slice(1)) {
    let segment: string;
    try {
      segment = decodeURIComponent(raw);
    } catch {
      return { refused: 'the path is not valid percent-encoding' };
    }
    if (segment === '.' || segment === '..') return { refused: 'the path leaves the site' };
    if (/[/\\\0]/.test(segment)) return { refused: 'the path holds an encoded separator' };
    if (segment !== '') segments.push(segment);
  }
  return { segments, folder: path.endsWith('/') };
}

const inside = (root: string, path: string) => {
  const rel = relative(root, path);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
};

function send(res: ServerResponse, status: number, text: string, headers: Record<string, string> = {}): void {
  const body = Buffer.from(text + '\n', 'utf8');
  res.writeHead(status, { ...headers, 'Content-Type': 'text/plain; charset=utf-8', 'Content-Length': body.length });
  res.end(res.req.method === 'HEAD' ? undefined : body);
}

async function openInside(rootReal: string, path: string): Promise<FileHandle | undefined> {
  let real: string;
  try {
    real = await realpath(path);
  } catch {
    return undefined;
  }
  // A link inside the site must not lead out of it.
  if (!inside(rootReal, real)) return undefined;
  try {
    return await open(real, 'r');
  } catch {
    return undefined;
  }
}

async function handle(root: string, req: IncomingMessage, res: ServerResponse): Promise<void> {
  // Previews change under the reader's feet; nothing may be kept.
  res.setHeader('Cache-Control', 'no-store');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  if (req.method !== 'GET' && req.method !== 'HEAD') return send(res, 405, 'Only GET and HEAD are served.', { Allow: 'GET, HEAD' });
  const asked = requestPath(req.url ?? '/');
  if ('refused' in asked) return send(res, 400, `Bad request: ${asked.refused}.`);

  let rootReal: string;
  try {
    rootReal = await realpath(root);
  } catch {
    return send(res, 503, 'The folio has not been built yet: see the terminal running zfolio serve.', { 'Retry-After': '2' });
  }
  const target = join(rootReal, ...asked.segments);
  if (!inside(rootReal, target)) return send(res, 400, 'Bad request: the path leaves the site.');

  let file = await openInside(rootReal, target);
  let name = target;
  if (file && (await file.stat()).isDirectory()) {
    await file.close();
    if (!asked.folder) {
      // Pages link relatively, so a folder is only ever served under its trailing-slash address.
      const query = (req.url ?? '').slice((req.url ?? '').split(/[?#]/, 1)[0].length);
      const location = '/' + asked.segments.map(encodeURIComponent).join('/') + '/' + query;
      return send(res, 301, `Moved to ${location}`, { Location: location });
    }
    name = join(target, 'index.html');
    file = await openInside(rootReal, name);
  }
  if (!file) return send(res, 404, `Not found: /${asked.segments.join('/')}`);
  try {
    const stat = await file.stat();
    if (!stat.isFile()) return send(res, 404, `Not found: /${asked.segments.join('/')}`);
    res.writeHead(200, { 'Content-Type': contentType(name), 'Content-Length': stat.size });
    if (req.method === 'HEAD') {
      res.end();
      return;
    }
    // The handle stays valid even if a rebuild removes the file meanwhile.
    const stream = file.createReadStream({ autoClose: false });
    await new Promise<void>((resolve) => {
      stream.on('error', () => {
        res.destroy();
        resolve();
      });
      stream.on('end', resolve);
      res.on('close', resolve);
      stream.pipe(res);
    });
  } finally {
    await file.close();
  }
}

function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error) => {
      server.off('listening', onListening);
      reject(error);
    };
    const onListening = () => {
      server.off('error', onError);
      resolve((server.address() as AddressInfo).port);
    };
    server.once('error', onError);
    server.once('listening', onListening);
    server.listen(port, host);
  });
}

/** Serve `root` on host:port, or on the next free port above it. Rejects when no port in range is free. */
export async function startServer(options: StaticServerOptions): Promise<StaticServer> {
  const host = options.host ?? DEFAULT_HOST;
  const requestedPort = options.port ?? DEFAULT_PORT;
  const attempts = requestedPort === 0 ? 1 : Math.max(1, Math.min(options.portAttempts ?? 20, 65536 - requestedPort));
  const server = createServer((req, res) => {
    handle(options.root, req, res).catch(() => {
      if (!res.headersSent) send(res, 500, 'The file could not be read.');
      else res.destroy();
    });
  });
  let port = -1;
  for (let i = 0; i < attempts && port < 0; i++) {
    try {
      port = await listen(server, requestedPort + i, host);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE' || i === attempts - 1) throw error;
    }
  }
  const shownHost = host.includes(':') ? `[${host}]` : host;
  return {
    url: `http://${shownHost}:${port}/`,
    port,
    requestedPort,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}
