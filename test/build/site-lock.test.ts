// One build of a site at a time (src/build/site-lock.ts). A build held in the middle of its swap in another
// process keeps a second build of the same site out (exit 2 from the command line, one line naming the
// holder, nothing on disk changed); the first then completes and the next build goes through. A lock whose
// holder is gone (a killed build, a new process with a reused id) is taken over; one held on another machine
// is respected. Builds draw their charts in this thread (workers 0), on the suite's good library of invented
// parts. Process start times are read from /proc, which the Linux machines these tests run on have.

import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it, onTestFinished } from 'vitest';
import { buildFolio } from '../../src/build/build.js';
import { OutputRefused } from '../../src/build/output-guard.js';
import { LOCK_NAME, lockSite, processStart, type LockHolder } from '../../src/build/site-lock.js';
import { runExitTasks } from '../../src/on-exit.js';
import { copyLibrary, diskSnapshot, REPO, sameInodes, siteVersions, tempDir } from '../site-helpers.js';
import { run } from '../cli/fake-io.js';

const GOOD = join(REPO, 'test/fixtures/good-library');
const SCRIPT = fileURLToPath(new URL('./scripts/build-until.mjs', import.meta.url));

const lockOf = (root: string) => join(root, '._site.zfolio', LOCK_NAME);
const build = (root: string) => buildFolio({ libraryRoot: root, outDir: join(root, '_site'), cwd: root, workers: 0 });

/** A lock file as a build writes it, held by `holder`. */
function writeLock(root: string, holder: Partial<LockHolder>): void {
  mkdirSync(join(root, '._site.zfolio'), { recursive: true });
  writeFileSync(lockOf(root), `${JSON.stringify({ host: hostname(), started: '2026-01-01T00:00:00.000Z', ...holder })}\n`);
}

/** The pid of a process that has ended. */
function deadPid(): number {
  return Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
}

/** A process that sleeps until killed. */
function sleeper() {
  return spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
}

describe('a build of a site another build is writing', () => {
  it('is refused with exit 2 and one line naming the holder, the disk untouched; the first completes, then the next goes through', async () => {
    const root = copyLibrary(GOOD, 'lock-two');
    const site = join(root, '_site');
    expect((await build(root)).ok).toBe(true);
    writeFileSync(join(root, 'parts', 'capacitor.yaml'), readFileSync(join(root, 'parts', 'capacitor.yaml'), 'utf8').replace(/^title: .*$/m, 'title: Held build (invented)'));

    const child = spawn(process.execPath, [SCRIPT, root, site, 'staged', 'pause'], { cwd: REPO, stdio: ['pipe', 'pipe', 'inherit'] });
    let said = '';
    child.stdout.on('data', (chunk) => (said += chunk));
    const ended = new Promise<number | null>((done) => child.on('exit', done));
    // However this test ends, the held build is let go (its stdin closed) rather than left waiting.
    onTestFinished(() => {
      child.stdin.end();
    });
    await new Promise<void>((done, fail) => {
      const poll = setInterval(() => {
        if (said.includes('paused')) done(clearInterval(poll));
        if (child.exitCode !== null) fail(new Error(`the held build ended early: ${said}`));
      }, 20);
    });

    // The held build has written its new version and not yet put it in place.
    const before = diskSnapshot(root);
    const holder = JSON.parse(readFileSync(lockOf(root), 'utf8')) as LockHolder;
    expect(holder.pid).toBe(child.pid);
    expect(holder.since).toBe(processStart(child.pid!));
    await expect(build(root)).rejects.toThrow(OutputRefused);
    const cli = await run(['build', '--library', root, '--workers', '0'], root);
    expect(cli.code).toBe(2);
    expect(cli.out).toBe('');
    expect(cli.err).toBe(
      `zfolio build: will not write the site to ${site}: another zfolio build is writing it (process ${child.pid}, started ${holder.started}); wait for it to end, or if no build is running, remove ${lockOf(root)}\n`,
    );
    expect(diskSnapshot(root)).toEqual(before);

    child.stdin.write('\n');
    expect(await ended).toBe(0);
    expect(said).toBe('paused\nbuilt\n');
    expect(readFileSync(join(site, 'parts', 'CAP-TEST-100N', 'index.html'), 'utf8')).toContain('Held build (invented)');
    expect(existsSync(lockOf(root))).toBe(false);
    expect((await build(root)).ok).toBe(true);
    expect(readdirSync(join(root, '._site.zfolio')).every((name) => /^site-\d+-[0-9a-f]+$/.test(name))).toBe(true);
  }, 120_000);

  it('in the same process (a rebuild started while one runs) is refused too', async () => {
    const root = copyLibrary(GOOD, 'lock-same');
    let second: Promise<unknown> | undefined;
    // Its outcome is taken at once (a rejection left unhandled until the first ends would fail the run).
    const first = await buildFolio({
      libraryRoot: root,
      outDir: join(root, '_site'),
      cwd: root,
      workers: 0,
      onSwapStep: (step) => {
        if (step === 'staged') second = build(root).then(() => 'built', (error: unknown) => error);
      },
    });
    expect(first.ok).toBe(true);
    const refusal = await second;
    expect(refusal).toBeInstanceOf(OutputRefused);
    expect((refusal as Error).message).toContain(`another zfolio build is writing it (process ${process.pid},`);
    expect(existsSync(lockOf(root))).toBe(false);
  }, 60_000);

  it('on another machine is respected: refused, naming the machine; once its lock is removed the build goes through', async () => {
    const root = copyLibrary(GOOD, 'lock-host');
    writeLock(root, { pid: process.pid, host: 'bench-7.invalid' });
    const before = diskSnapshot(root);
    await expect(build(root)).rejects.toThrow(`(process ${process.pid} on bench-7.invalid, started 2026-01-01T00:00:00.000Z)`);
    expect(diskSnapshot(root)).toEqual(before);
    rmSync(lockOf(root));
    expect((await build(root)).ok).toBe(true);
    expect(existsSync(lockOf(root))).toBe(false);
  }, 60_000);
});

describe('a lock whose holder is gone', () => {
  it('left by a killed build: taken over, and removed when the build ends', async () => {
    const root = copyLibrary(GOOD, 'lock-dead');
    writeLock(root, { pid: deadPid() });
    const result = await build(root);
    expect(result.ok).toBe(true);
    expect(existsSync(lockOf(root))).toBe(false);
    // The holding folder keeps the new site and its spare, a linked copy of it (spare-copy.ts).
    const { live, others } = siteVersions(join(root, '_site'));
    expect(readdirSync(join(root, '._site.zfolio')).sort()).toEqual([live, ...others].sort());
    expect(others).toHaveLength(1);
    expect(sameInodes(join(root, '._site.zfolio', live), join(root, '._site.zfolio', others[0]))).toBe(true);
  }, 60_000);

  it('held by a live process that got the same id later (another start time): taken over; with the same start time: respected', async () => {
    const child = sleeper();
    try {
      await new Promise((done) => child.on('spawn', done));
      const since = processStart(child.pid!);
      expect(since).toMatch(/^\d+$/);
      const root = copyLibrary(GOOD, 'lock-reused');
      writeLock(root, { pid: child.pid, since });
      await expect(build(root)).rejects.toThrow(`another zfolio build is writing it (process ${child.pid},`);
      writeLock(root, { pid: child.pid, since: String(Number(since) + 1) });
      expect((await build(root)).ok).toBe(true);
      expect(existsSync(lockOf(root))).toBe(false);
    } finally {
      child.kill();
    }
  }, 60_000);

  it('a file that is not a lock a build wrote (not JSON): taken over', async () => {
    const root = copyLibrary(GOOD, 'lock-junk');
    mkdirSync(join(root, '._site.zfolio'));
    writeFileSync(lockOf(root), 'half a lo');
    expect((await build(root)).ok).toBe(true);
    expect(existsSync(lockOf(root))).toBe(false);
  }, 60_000);
});

describe('the lock itself', () => {
  it('is given up when the build fails, and a holding folder it made goes with it', async () => {
    const root = copyLibrary(GOOD, 'lock-failed');
    writeFileSync(join(root, 'parts', 'broken.yaml'), 'id: [unclosed\n');
    const result = await build(root);
    expect(result.ok).toBe(false);
    expect(result.diagnostics.some((d) => d.severity === 'error' && d.file === 'parts/broken.yaml')).toBe(true);
    expect(existsSync(join(root, '._site.zfolio'))).toBe(false);
    expect(existsSync(join(root, '_site'))).toBe(false);
  }, 60_000);

  it('is removed by the exit tasks of a process stopped by a signal (see on-exit.ts), and only its own', () => {
    const top = tempDir('lock-exit');
    const site = join(top, 'out', '_site');
    const lock = lockSite(site, new Date(Date.UTC(2026, 11, 3, 9, 30)));
    expect(JSON.parse(readFileSync(lock.path, 'utf8'))).toEqual({ pid: process.pid, host: hostname(), started: '2026-12-03T09:30:00.000Z', since: processStart(process.pid) });
    expect(() => lockSite(site)).toThrow(OutputRefused);
    runExitTasks();
    // The lock and the folders it made (out/ and the holding folder) are gone.
    expect(readdirSync(top)).toEqual([]);
    lock.release();
    expect(readdirSync(top)).toEqual([]);
  });
});
