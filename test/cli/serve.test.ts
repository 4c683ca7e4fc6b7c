// zfolio serve on the command line: help, misuse (exit 2), a whole session in-process (build, serve,
// rebuild line, stop), and a real process stopped by SIGINT and SIGTERM.

import { spawn } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { serveUntil } from '../../src/cli/commands/serve.js';
import type { CommandIO } from '../../src/cli/io.js';
import { GOOD_LIBRARY, run } from './fake-io.js';

const PACKAGE = fileURLToPath(new URL('../../', import.meta.url));

describe('zfolio serve: command line', () => {
  it('--help prints the usage and exits 0', async () => {
    const r = await run(['serve', '--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Usage: zfolio serve /);
    expect(r.out).toContain('--port N');
    expect(r.err).toBe('');
    expect((await run(['help', 'serve'])).out).toBe(r.out);
  });

  it.each(['--port abc', '--port 70000', '--port=-1', '--port 1.5', '--port='])('rejects "%s" with exit 2', async (line) => {
    const r = await run(['serve', ...line.split(' ')]);
    expect(r.code).toBe(2);
    expect(r.err).toContain('--port');
    expect(r.out).toBe('');
  });

  it('rejects arguments, unknown options and a missing library with exit 2', async () => {
    expect((await run(['serve', 'extra'])).code).toBe(2);
    const unknown = await run(['serve', '--prot', '80']);
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('unknown option "--prot"');
    expect(unknown.err).toContain('--port');
    expect((await run(['serve', '--library', '/no/such/folder'])).code).toBe(2);
  });

  it('rejects an address this machine does not have with exit 2', async () => {
    // 203.0.113.0/24 is TEST-NET-3 (RFC 5737): never a local address.
    const r = await run(['serve', '--library', GOOD_LIBRARY, '--host', '203.0.113.7', '--port', '0']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('cannot listen on 203.0.113.7 port 0');
  });

  it('lists serve in the main help', async () => {
    expect((await run(['--help'])).out).toMatch(/^ {2}serve +build, serve on this machine/m);
  });
});

describe('zfolio serve: a session', () => {
  let tmp: string;
  let lib: string;

  beforeAll(() => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-serve-cli-'));
    lib = join(tmp, 'lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
  });

  afterAll(() => rmSync(tmp, { recursive: true, force: true }));

  it('builds, names its address, prints one timed line per rebuild and stops when asked', async () => {
    let out = '';
    let err = '';
    const io: CommandIO = { cwd: tmp, env: {}, isTTY: false, out: (t) => (out += t), err: (t) => (err += t) };
    const stop = new AbortController();
    const session = serveUntil(['--library', 'lib', '--port', '0'], io, stop.signal);
    try {
      await vi.waitFor(() => expect(out).toContain('serving lib/_site at http://127.0.0.1:'), { timeout: 20_000, interval: 50 });
      expect(out).toMatch(/^built 5 parts, \d+ pages in [\d.]+ s: lib\/_site\/index.html$/m);
      expect(out).not.toContain('busy');
      const url = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out)![1];
      const index = await fetch(url);
      expect(index.status).toBe(200);
      expect(index.headers.get('cache-control')).toBe('no-store');
      await index.text();

      const file = join(lib, 'parts', 'resistor.yaml');
      writeFileSync(file, readFileSync(file, 'utf8').replace('4.7 kΩ test resistor', '4.7 kΩ renamed resistor'));
      await vi.waitFor(() => expect(out).toMatch(/^\d\d:\d\d:\d\d rebuilt 5 parts \(4 unchanged, carried over\), \d+ pages in [\d.]+ s after parts\/resistor\.yaml changed$/m), { timeout: 20_000, interval: 50 });

      writeFileSync(file, 'id: RES-TEST-4K7\nkind: resistor\ntitle: broken\nnominal: [1, 2]\n');
      await vi.waitFor(() => expect(err).toMatch(/^\d\d:\d\d:\d\d rebuild failed after parts\/resistor\.yaml changed: 1 error in the library; still serving the previous site$/m), { timeout: 20_000, interval: 50 });
      expect(err).toMatch(/^parts\/resistor\.yaml:4:10: /m);
      const page = await fetch(`${url}parts/RES-TEST-4K7/`);
      expect(await page.text()).toContain('4.7 kΩ renamed resistor');
    } finally {
      stop.abort();
    }
    expect(await session).toBe(0);
    expect(out.endsWith('stopping\n')).toBe(true);
  }, 60_000);
});

describe('zfolio serve: a library that starts broken', () => {
  let tmp: string;

  beforeAll(() => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-serve-broken-'));
    cpSync(GOOD_LIBRARY, join(tmp, 'lib'), { recursive: true });
  });

  afterAll(() => rmSync(tmp, { recursive: true, force: true }));

  it('lists the problems, serves nothing yet, and builds once the file is fixed', async () => {
    const file = join(tmp, 'lib', 'parts', 'inductor.yaml');
    const good = readFileSync(file, 'utf8');
    writeFileSync(file, good.replace(/^kind: .*$/m, 'kind: inductr'));
    let out = '';
    let err = '';
    const io: CommandIO = { cwd: tmp, env: {}, isTTY: false, out: (t) => (out += t), err: (t) => (err += t) };
    const stop = new AbortController();
    const session = serveUntil(['--library', 'lib', '--port', '0'], io, stop.signal);
    try {
      await vi.waitFor(() => expect(out).toContain('serving lib/_site at'), { timeout: 20_000, interval: 50 });
      expect(out).toContain('; nothing until the problems above are fixed');
      expect(err).toMatch(/^parts\/inductor\.yaml:\d+:\d+: /m);
      const url = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out)![1];
      expect((await fetch(url)).status).toBe(503);
      writeFileSync(file, good);
      await vi.waitFor(() => expect(out).toMatch(/rebuilt 5 parts, \d+ pages in [\d.]+ s after parts\/inductor\.yaml changed$/m), { timeout: 20_000, interval: 50 });
      expect((await fetch(url)).status).toBe(200);
    } finally {
      stop.abort();
    }
    expect(await session).toBe(0);
  }, 60_000);
});

describe('zfolio serve: a real process', () => {
  let tmp: string;

  beforeAll(() => {
    tmp = mkdtempSync(join(tmpdir(), 'zfolio-serve-proc-'));
    cpSync(GOOD_LIBRARY, join(tmp, 'lib'), { recursive: true });
  });

  afterAll(() => rmSync(tmp, { recursive: true, force: true }));

  it.each(['SIGINT', 'SIGTERM'] as const)('stops cleanly on %s: exit 0, port closed, no staging folder left', async (signal) => {
    // The installed entry point over dist/, which test/setup/global.ts compiles from the sources under test
    // when it is stale: the process starts without compiling the sources (in it and in its chart workers).
    const child = spawn(process.execPath, [join(PACKAGE, 'bin', 'zfolio.js'), 'serve', '--library', join(tmp, 'lib'), '--port', '0'], {
      cwd: PACKAGE,
      env: { ...process.env, CI: '1' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (chunk) => (out += chunk));
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    try {
      await vi.waitFor(() => expect(out).toContain('press Ctrl+C to stop'), { timeout: 90_000, interval: 50 });
      const url = /at (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out)![1];
      expect((await fetch(url)).status).toBe(200);
      child.kill(signal);
      expect(await exited).toBe(0);
      expect(out.endsWith('stopping\n')).toBe(true);
      await expect(fetch(url)).rejects.toThrow();
      expect(existsSync(join(tmp, 'lib', '_site', 'index.html'))).toBe(true);
      expect(readFileSync(join(tmp, 'lib', '_site', 'index.html'), 'utf8')).toContain('CAP-TEST-100N');
      // The current version, and at most the one it replaced (kept as the next build's spare): no staging folder.
      const versions = readdirSync(join(tmp, 'lib', '._site.zfolio'));
      const current = readlinkSync(join(tmp, 'lib', '_site')).split('/')[1];
      expect(versions).toContain(current);
      expect(versions.length).toBeLessThanOrEqual(2);
      const recordRoots = readdirSync(join(tmp, 'lib', '.zfolio-cache', 'builds')).map((d) => JSON.parse(readFileSync(join(tmp, 'lib', '.zfolio-cache', 'builds', d, 'root.json'), 'utf8')) as { live?: { name: string }; spare?: { name: string } });
      expect(versions.filter((v) => v !== current)).toEqual(recordRoots.flatMap((r) => (r.spare ? [r.spare.name] : [])).filter((v) => versions.includes(v)));
    } finally {
      if (child.exitCode === null) child.kill('SIGKILL');
    }
  }, 150_000);
});
