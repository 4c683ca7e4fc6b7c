// zfolio as a real process (bin/zfolio.js over dist/, which test/setup/global.ts compiles from the sources
// under test before the run when it is stale): a reader that closes the pipe ends every command quietly
// with 0; Ctrl+C or TERM ends a build with 1 and one line, its staging folder removed, its Chromium stopped;
// a Chromium that does not start is one line, not a fault.

import { execFileSync, spawn } from 'node:child_process';
import { cpSync, existsSync, readdirSync, readFileSync, readlinkSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it, vi } from 'vitest';
import { tempDir } from '../site-helpers.js';
import { GOOD_LIBRARY, run } from './fake-io.js';

const PACKAGE = fileURLToPath(new URL('../../', import.meta.url));
const BIN = join(PACKAGE, 'bin', 'zfolio.js');

/** Start `zfolio ...argv` in a process of its own. */
function start(argv: string[]) {
  const child = spawn(process.execPath, [BIN, ...argv], {
    cwd: PACKAGE,
    env: { ...process.env, CI: '1', ZFOLIO_DEBUG: '' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let err = '';
  child.stderr.on('data', (chunk) => (err += chunk));
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((done) => child.on('exit', (code, signal) => done({ code, signal })));
  return { child, exit, err: () => err };
}

/** A progress line of a build (progress.ts): its stages' names, with a count or an ellipsis. */
const PROGRESS_LINE = /^(parts|pages|removing old versions of the site|copying the site for the next build \(hard links\))(…| \d+\/\d+)$/;

describe('a reader that stops reading', () => {
  // The pipe is closed before the command writes a byte, so every write it makes fails with EPIPE.
  it.each([
    ['sweep', ['sweep', 'CAP-TEST-100N', '--csv', '--library', GOOD_LIBRARY]],
    ['sweep as text', ['sweep', 'CAP-TEST-100N', '--library', GOOD_LIBRARY]],
    ['figures', ['figures', '--json', '--library', GOOD_LIBRARY]],
    ['check', ['check', '--library', GOOD_LIBRARY]],
    ['plan (whose rail misses its target: 3 when read to the end)', ['plan', '--library', join(PACKAGE, 'test/fixtures/rail-library')]],
    ['help', ['help', 'sweep']],
  ])('ends %s quietly with 0', async (_name, argv) => {
    const { child, exit, err } = start(argv);
    child.stdout.destroy();
    expect(await exit).toEqual({ code: 0, signal: null });
    expect(err()).not.toMatch(/EPIPE|Error|at /);
  }, 60_000);
});

describe('a build stopped by a signal', () => {
  it.each(['SIGINT', 'SIGTERM'] as const)('%s: exit 1, one line, the old site in place and no staging folder left', async (signal) => {
    const lib = join(tempDir('signal'), 'lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
    expect((await run(['build', '--library', lib, '--workers', '0'], lib)).code).toBe(0);
    const before = readFileSync(join(lib, '_site', 'index.html'), 'utf8');
    const build = start(['build', '--library', lib, '--workers', '0']);
    // Stopped once it is drawing the parts' charts: past loading, before the swap.
    await vi.waitFor(() => expect(build.err()).toMatch(/parts \d/), { timeout: 120_000, interval: 20 });
    build.child.kill(signal);
    expect(await build.exit).toEqual({ code: 1, signal: null });
    expect(build.err().trimEnd().split('\n').pop()).toBe(`zfolio build: stopped by ${signal}`);
    expect(readFileSync(join(lib, '_site', 'index.html'), 'utf8')).toBe(before);
    expect(readdirSync(join(lib, '._site.zfolio'))).toEqual([readlinkSync(join(lib, '_site')).split('/')[1]]);
  }, 240_000);

  it('while printing: its Chromium is stopped too', async () => {
    const lib = join(tempDir('signal-pdf'), 'lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
    const build = start(['build', '--library', lib, '--workers', '0', '--pdf']);
    await vi.waitFor(() => expect(build.err()).toMatch(/pdf \d/), { timeout: 120_000, interval: 20 });
    const browsers = execFileSync('ps', ['-o', 'pid=', '--ppid', String(build.child.pid)], { encoding: 'utf8' }).split('\n').map(Number).filter(Boolean);
    expect(browsers.length).toBeGreaterThan(0);
    build.child.kill('SIGINT');
    expect(await build.exit).toEqual({ code: 1, signal: null });
    const running = (pid: number) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    await vi.waitFor(() => expect(browsers.filter(running)).toEqual([]), { timeout: 5_000, interval: 50 });
    // Nothing was ever put in place, and nothing is left behind: not even the holding folder the build made.
    expect(existsSync(join(lib, '_site'))).toBe(false);
    expect(existsSync(join(lib, '._site.zfolio'))).toBe(false);
  }, 240_000);
});

describe('a Chromium that does not start', () => {
  it('build --pdf: the site without PDF links, one line, exit 1', async () => {
    const lib = join(tempDir('chrome-true'), 'lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
    const r = await run(['build', '--library', lib, '--workers', '0', '--pdf', '--chrome', '/bin/true'], lib);
    expect(r.code).toBe(1);
    expect(r.err.trimEnd().split('\n').filter((l) => !PROGRESS_LINE.test(l))).toEqual([
      'zfolio build: the site was written, but no PDFs. /bin/true did not start as Chromium (it exited at once with status 0); give a working one with --chrome PATH or ZFOLIO_CHROME=PATH',
    ]);
    expect(readFileSync(join(lib, '_site', 'parts', 'CAP-TEST-100N', 'index.html'), 'utf8')).not.toContain('.pdf');
  }, 60_000);

  it('print: one line, exit 1', async () => {
    // A copy: print draws the part's charts first and keeps them in the library's chart cache, which must
    // not be written into the repository's fixtures.
    const lib = tempDir('chrome-false-lib');
    cpSync(GOOD_LIBRARY, lib, { recursive: true });
    const out = tempDir('chrome-false');
    const r = await run(['print', 'CAP-TEST-100N', '--out', out, '--chrome', '/bin/false'], lib);
    expect(r.code).toBe(1);
    expect(r.err.trimEnd().split('\n').filter((l) => !PROGRESS_LINE.test(l))).toEqual([
      'zfolio print: /bin/false did not start as Chromium (it exited at once with status 1); give a working one with --chrome PATH or ZFOLIO_CHROME=PATH',
    ]);
    expect(readdirSync(out)).toEqual([]);
  }, 60_000);
});
