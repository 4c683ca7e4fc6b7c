// The preview server on a small hand-made site: content types, folders, 404, HEAD, refused methods,
// and no way out of the site folder however the path is spelled.

import { request } from 'node:http';
import { mkdirSync, mkdtempSync, renameSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contentType, requestPath, startServer, type StaticServer } from '../../src/serve/static-server.js';

interface Reply {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

/** A request with the path sent exactly as written (fetch would normalise away `..`). */
function raw(port: number, path: string, method = 'GET'): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path, method, agent: false }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('error', reject);
    req.end();
  });
}

const SECRET = 'OUTSIDE-THE-SITE-7f3a';
const FILES: Record<string, string> = {
  'index.html': '<!doctype html><title>Index</title><p>index page</p>',
  'parts/CAP-A/index.html': '<!doctype html><title>CAP-A</title><p>part page</p>',
  'parts/CAP-A/figures.json': '{"id": "CAP-A"}\n',
  'parts/CAP-A/sweep.csv': 'frequency_hz,z_ohm\n1000,1.5\n',
  'parts/CAP-A/impedance.vl.json': '{"mark": "line"}\n',
  'assets/folio.css': 'body { margin: 0 }\n',
  'assets/folio.js': 'void 0;\n',
  'assets/mark.svg': '<svg xmlns="http://www.w3.org/2000/svg"/>',
  'pdf/parts/CAP-A.pdf': '%PDF-1.7\n%%EOF\n',
  'data.bin': 'bytes',
};

describe('startServer', () => {
  let tmp: string;
  let site: string;
  let server: StaticServer;

  beforeAll(async () => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-static-'));
    site = join(tmp, 'lib', '_site');
    for (const [path, text] of Object.entries(FILES)) {
      mkdirSync(dirname(join(site, path)), { recursive: true });
      writeFileSync(join(site, path), text);
    }
    // Decoys one and two levels above the site, where each traversal spelling would land.
    writeFileSync(join(tmp, 'lib', 'package.json'), `{"secret": "${SECRET}"}`);
    writeFileSync(join(tmp, 'package.json'), `{"secret": "${SECRET}"}`);
    symlinkSync(join(tmp, 'lib', 'package.json'), join(site, 'link.json'));
    server = await startServer({ root: site, port: 0, host: '127.0.0.1' });
  });

  afterAll(async () => {
    await server?.close();
    rmSync(tmp, { recursive: true, force: true });
  });

  it('serves the index for / with its content type and no caching', async () => {
    const r = await raw(server.port, '/');
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(r.headers['cache-control']).toBe('no-store');
    expect(r.body).toBe(FILES['index.html']);
    expect(server.url).toBe(`http://127.0.0.1:${server.port}/`);
  });

  it('serves a folder through its index.html, and redirects the address without its slash', async () => {
    expect((await raw(server.port, '/parts/CAP-A/')).body).toBe(FILES['parts/CAP-A/index.html']);
    const moved = await raw(server.port, '/parts/CAP-A?x=1');
    expect(moved.status).toBe(301);
    expect(moved.headers.location).toBe('/parts/CAP-A/?x=1');
    // A doubled slash must not become an address on another host (//host/ is protocol-relative).
    const doubled = await raw(server.port, '//parts/CAP-A');
    expect(doubled.headers.location).toBe('/parts/CAP-A/');
  });

  it.each([
    ['parts/CAP-A/figures.json', 'application/json; charset=utf-8'],
    ['parts/CAP-A/sweep.csv', 'text/csv; charset=utf-8'],
    ['parts/CAP-A/impedance.vl.json', 'application/json; charset=utf-8'],
    ['assets/folio.css', 'text/css; charset=utf-8'],
    ['assets/folio.js', 'text/javascript; charset=utf-8'],
    ['assets/mark.svg', 'image/svg+xml'],
    ['pdf/parts/CAP-A.pdf', 'application/pdf'],
    ['data.bin', 'application/octet-stream'],
  ])('serves %s as %s', async (path, type) => {
    const r = await raw(server.port, `/${path}`);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe(type);
    expect(r.headers['x-content-type-options']).toBe('nosniff');
    expect(r.body).toBe(FILES[path]);
    expect(contentType(path)).toBe(type);
  });

  it('answers 404 for a missing file and a missing folder', async () => {
    for (const path of ['/missing.html', '/parts/NOPE/', '/parts/CAP-A/index.html/extra']) {
      const r = await raw(server.port, path);
      expect(r.status, path).toBe(404);
      expect(r.headers['cache-control']).toBe('no-store');
    }
  });

  it.each([
    '/../package.json',
    '/%2e%2e/package.json',
    '/%2E%2E/package.json',
    '/.%2e/package.json',
    '/parts/..%2f..%2fpackage.json',
    '/parts/..%2F..%2Fpackage.json',
    '/parts/..%5c..%5cpackage.json',
    '/parts/../../package.json',
    '/parts/CAP-A/../../../package.json',
    '/./index.html',
  ])('refuses %s with 400 and nothing from outside', async (path) => {
    const r = await raw(server.port, path);
    expect(r.status).toBe(400);
    expect(r.body).not.toContain(SECRET);
  });

  it('refuses bad percent-encoding and a NUL', async () => {
    expect((await raw(server.port, '/%zz')).status).toBe(400);
    expect((await raw(server.port, '/index.html%00.txt')).status).toBe(400);
  });

  it('does not follow a link that leads out of the site', async () => {
    const r = await raw(server.port, '/link.json');
    expect(r.status).toBe(404);
    expect(r.body).not.toContain(SECRET);
  });

  it('answers HEAD with the headers of GET and no body', async () => {
    const r = await raw(server.port, '/parts/CAP-A/sweep.csv', 'HEAD');
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(Number(r.headers['content-length'])).toBe(Buffer.byteLength(FILES['parts/CAP-A/sweep.csv']));
    expect(r.body).toBe('');
  });

  it('refuses other methods with 405 and says which are allowed', async () => {
    for (const method of ['POST', 'PUT', 'DELETE']) {
      const r = await raw(server.port, '/index.html', method);
      expect(r.status).toBe(405);
      expect(r.headers.allow).toBe('GET, HEAD');
    }
  });

  it('serves whatever folder is at the root path now, as a build swaps it', async () => {
    const next = join(tmp, 'lib', '.next');
    mkdirSync(next);
    writeFileSync(join(next, 'index.html'), '<p>second build</p>');
    renameSync(site, join(tmp, 'lib', '.old'));
    renameSync(next, site);
    try {
      expect((await raw(server.port, '/')).body).toBe('<p>second build</p>');
    } finally {
      rmSync(site, { recursive: true });
      renameSync(join(tmp, 'lib', '.old'), site);
    }
    expect((await raw(server.port, '/')).body).toBe(FILES['index.html']);
  });

  it('answers 503 while the site folder does not exist yet', async () => {
    const empty = await startServer({ root: join(tmp, 'not-built'), port: 0 });
    try {
      const r = await raw(empty.port, '/');
      expect(r.status).toBe(503);
      expect(r.body).toContain('not been built yet');
    } finally {
      await empty.close();
    }
  });

  it('moves to the next free port when the asked one is taken, and says which it asked for', async () => {
    const second = await startServer({ root: site, port: server.port });
    try {
      expect(second.requestedPort).toBe(server.port);
      expect(second.port).toBeGreaterThan(server.port);
      expect(second.port).toBeLessThanOrEqual(server.port + 20);
      expect((await raw(second.port, '/')).status).toBe(200);
    } finally {
      await second.close();
    }
    await expect(startServer({ root: site, port: server.port, portAttempts: 1 })).rejects.toMatchObject({ code: 'EADDRINUSE' });
  });
});

describe('requestPath', () => {
  it('splits a path into decoded segments and notes a trailing slash', () => {
    expect(requestPath('/parts/CAP%20A/?q=1#top')).toEqual({ segments: ['parts', 'CAP A'], folder: true });
    expect(requestPath('/a//b')).toEqual({ segments: ['a', 'b'], folder: false });
    expect(requestPath('/')).toEqual({ segments: [], folder: true });
  });

  it('decodes only once: a double-encoded dot-dot is a plain (missing) name, not a step up', () => {
    expect(requestPath('/%252e%252e/x')).toEqual({ segments: ['%2e%2e', 'x'], folder: false });
  });

  it('refuses anything that is not an absolute path', () => {
    expect(requestPath('http://elsewhere/x')).toHaveProperty('refused');
    expect(requestPath('*')).toHaveProperty('refused');
  });
});

describe('contentType', () => {
  it('ignores the case of the extension', () => {
    expect(contentType('A.HTML')).toBe('text/html; charset=utf-8');
    expect(contentType('report.Pdf')).toBe('application/pdf');
  });
});
