// serveFolio end to end on a copy of the small test library: the built site is served, an edited part
// is rebuilt and served, a broken part keeps the previous site up and reports where it is broken.
// Waits poll with a deadline; nothing sleeps blindly.

import { request } from 'node:http';
import { cpSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { oneAtATime, serveFolio, type BuildReport, type FolioServer } from '../../src/serve/serve.js';

const GOOD_LIBRARY = fileURLToPath(new URL('../fixtures/good-library/', import.meta.url));
const PART_ID = 'CAP-TEST-100N';
const PART_FILE = 'parts/capacitor.yaml';
const SECRET = 'OUTSIDE-THE-SITE-c41e';

function get(port: number, path: string, method = 'GET'): Promise<{ status: number; type?: string; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path, method, agent: false }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, type: res.headers['content-type'], body }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('serveFolio', () => {
  let tmp: string;
  let lib: string;
  let folio: FolioServer;
  const reports: BuildReport[] = [];
  let original: string;

  beforeAll(async () => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-serve-'));
    lib = join(tmp, 'lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
    writeFileSync(join(lib, 'package.json'), `{"secret": "${SECRET}"}`);
    original = readFileSync(join(lib, PART_FILE), 'utf8');
    // Templates are not watched here: other work on them must not start builds in this test.
    folio = await serveFolio({ libraryRoot: lib, port: 0, host: '127.0.0.1', watchTemplates: false, onBuild: (r) => reports.push(r) });
  }, 60_000);

  afterAll(async () => {
    await folio?.close();
    rmSync(tmp, { recursive: true, force: true });
  });

  const partPage = () => get(folio.port, `/parts/${PART_ID}/`);

  it('builds once before it answers, and serves the index and a part page as HTML', async () => {
    expect(folio.first.round).toBe(0);
    expect(folio.first.result?.ok).toBe(true);
    expect(folio.first.result?.parts).toBe(5);
    expect(folio.outDir).toBe(join(lib, '_site'));
    const index = await get(folio.port, '/');
    expect(index.status).toBe(200);
    expect(index.type).toBe('text/html; charset=utf-8');
    expect(index.body).toContain(PART_ID);
    const page = await partPage();
    expect(page.status).toBe(200);
    expect(page.type).toBe('text/html; charset=utf-8');
    expect(page.body).toContain('100 nF test capacitor (invented)');
  });

  it('serves the downloads beside a part page with their types, and 404 for what is not there', async () => {
    const csv = await get(folio.port, `/parts/${PART_ID}/sweep.csv`);
    expect([csv.status, csv.type]).toEqual([200, 'text/csv; charset=utf-8']);
    const json = await get(folio.port, `/parts/${PART_ID}/figures.json`);
    expect([json.status, json.type]).toEqual([200, 'application/json; charset=utf-8']);
    expect(JSON.parse(json.body)).toMatchObject({ id: PART_ID });
    const css = await get(folio.port, '/assets/folio.css');
    expect([css.status, css.type]).toEqual([200, 'text/css; charset=utf-8']);
    expect((await get(folio.port, '/parts/NO-SUCH-PART/')).status).toBe(404);
  });

  it('answers HEAD without a body', async () => {
    const head = await get(folio.port, `/parts/${PART_ID}/`, 'HEAD');
    expect([head.status, head.type, head.body]).toEqual([200, 'text/html; charset=utf-8', '']);
  });

  it.each(['/../package.json', '/%2e%2e/package.json', '/parts/..%2f..%2fpackage.json'])('refuses %s', async (path) => {
    const r = await get(folio.port, path);
    expect(r.status).toBe(400);
    expect(r.body).not.toContain(SECRET);
  });

  it('rebuilds when a part file changes and serves the new title within seconds', async () => {
    writeFileSync(join(lib, PART_FILE), original.replace('title: 100 nF test capacitor (invented)', 'title: Renamed test capacitor (invented)'));
    await vi.waitFor(async () => expect((await partPage()).body).toContain('Renamed test capacitor (invented)'), { timeout: 20_000, interval: 100 });
    await folio.idle();
    const rebuild = reports.find((r) => r.round > 0 && r.changed.includes(PART_FILE));
    expect(rebuild?.result?.ok).toBe(true);
    expect(rebuild?.error).toBeUndefined();
  }, 30_000);

  it('keeps serving the previous site when a rebuild fails, and reports file:line:col', async () => {
    const before = reports.length;
    // `nominal` must be a quantity; the loader names the file, line and column.
    writeFileSync(join(lib, PART_FILE), original.replace('title: 100 nF test capacitor (invented)', 'title: Broken (invented)').replace('nominal: 100 nF', 'nominal: lots'));
    await vi.waitFor(() => expect(reports.slice(before).some((r) => r.result && !r.result.ok)).toBe(true), { timeout: 20_000, interval: 50 });
    await folio.idle();
    const failed = reports.slice(before).find((r) => r.result && !r.result.ok)!;
    const problem = failed.result!.diagnostics.find((d) => d.severity === 'error');
    expect(problem).toMatchObject({ file: PART_FILE, line: 5, column: 10 });
    expect(folio.latest()).toBe(failed);
    const page = await partPage();
    expect(page.status).toBe(200);
    expect(page.body).toContain('Renamed test capacitor (invented)');
    expect(page.body).not.toContain('Broken (invented)');
  }, 30_000);

  it('recovers on the next good save', async () => {
    writeFileSync(join(lib, PART_FILE), original);
    await vi.waitFor(async () => expect((await partPage()).body).toContain('100 nF test capacitor (invented)'), { timeout: 20_000, interval: 100 });
    await folio.idle();
    expect(folio.latest().result?.ok).toBe(true);
    // No build overlapped another: each version of the site was put in place, kept as the next build's
    // spare (the one the current site replaced) or removed, so the current one and at most that one are left.
    const versions = readdirSync(join(lib, '._site.zfolio'));
    expect(versions).toContain(readlinkSync(join(lib, '_site')).split('/')[1]);
    expect(versions.length).toBeLessThanOrEqual(2);
    expect(versions.every((v) => /^site-\d+-[0-9a-f]+$/.test(v))).toBe(true);
  }, 30_000);
});

describe('oneAtATime', () => {
  it('never runs two tasks at once and folds requests made during a run into one more run', async () => {
    const runs: string[][] = [];
    let active = 0;
    let most = 0;
    const releases: Array<() => void> = [];
    const queue = oneAtATime(async (changed) => {
      runs.push(changed);
      most = Math.max(most, ++active);
      await new Promise<void>((resolve) => releases.push(resolve));
      active--;
    });
    queue.request(['a.yaml']);
    queue.request(['c.yaml']);
    queue.request(['b.yaml', 'c.yaml']);
    expect(runs).toEqual([['a.yaml']]);
    releases[0]();
    await vi.waitFor(() => expect(runs.length).toBe(2));
    expect(runs[1]).toEqual(['b.yaml', 'c.yaml']);
    releases[1]();
    await queue.idle();
    expect(runs.length).toBe(2);
    expect(most).toBe(1);
  });

  it('runs again after a failed task, and drops the waiting request when stopped', async () => {
    const runs: string[][] = [];
    let release = () => {};
    const queue = oneAtATime(async (changed) => {
      runs.push(changed);
      if (changed[0] === 'bad') throw new Error('failed');
      await new Promise<void>((resolve) => (release = resolve));
    });
    queue.request(['bad']);
    await queue.idle();
    queue.request(['good']);
    queue.request(['waiting']);
    queue.stop();
    release();
    await queue.idle();
    queue.request(['after stop']);
    expect(runs).toEqual([['bad'], ['good']]);
  });
});
