// Putting a site in place: the site path is a link swapped in one rename, never empty; leftovers of killed
// builds go at the next build; a read-only output is refused before anything moves. The swap is checked on
// small hand-made sites in-process, then on real builds killed (SIGKILL) at each step and at random moments.

import { spawn, spawnSync } from 'node:child_process';
import { chmodSync, existsSync, lstatSync, mkdirSync, readdirSync, readFileSync, readlinkSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it } from 'vitest';
import { buildFolio } from '../../src/build/build.js';
import { checkWritable, removeLeftovers, stageOutput } from '../../src/build/output.js';
import { FailedAfterSwap, lockDraftName, MARKER_TEXT, OutputRefused, SITE_MARKER } from '../../src/build/output-guard.js';
import { diskSnapshot, filesUnder, REPO, sameInodes, siteVersions, tempDir } from '../site-helpers.js';

/** Stage a one-page site saying `text`, commit it and remove what is left over. */
async function publish(site: string, text: string): Promise<void> {
  const staging = stageOutput(site);
  writeFileSync(join(staging.dir, 'index.html'), text);
  staging.commit();
  await staging.removeLeftovers([]);
}

const holdingOf = (site: string) => join(site, '..', `.${site.split('/').pop()}.zfolio`);

/** The pid of a process that has ended. */
function deadPid(): number {
  return Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
}

describe('stageOutput', () => {
  it('makes the site path a relative link to a version in the holding folder, with the marker', async () => {
    const top = tempDir('swap');
    const site = join(top, 'site');
    await publish(site, 'one');
    expect(lstatSync(site).isSymbolicLink()).toBe(true);
    expect(readlinkSync(site)).toMatch(/^\.site\.zfolio\/site-\d+-[0-9a-f]{8}$/);
    expect(readFileSync(join(site, 'index.html'), 'utf8')).toBe('one');
    expect(readFileSync(join(site, SITE_MARKER), 'utf8')).toBe(MARKER_TEXT);
  });

  it('replaces the site and removes the version it replaced', async () => {
    const top = tempDir('swap');
    const site = join(top, 'site');
    await publish(site, 'one');
    await publish(site, 'two');
    expect(readFileSync(join(site, 'index.html'), 'utf8')).toBe('two');
    expect(readdirSync(holdingOf(site))).toEqual([readlinkSync(site).split('/')[1]]);
    expect(readdirSync(top).sort()).toEqual(['.site.zfolio', 'site']);
  });

  it('takes the place of an empty folder, and of a site written as a real folder', async () => {
    const top = tempDir('swap');
    const empty = join(top, 'empty');
    mkdirSync(empty);
    await publish(empty, 'new');
    expect(lstatSync(empty).isSymbolicLink()).toBe(true);
    const real = join(top, 'real');
    mkdirSync(join(real, 'parts'), { recursive: true });
    writeFileSync(join(real, SITE_MARKER), MARKER_TEXT);
    writeFileSync(join(real, 'parts', 'old.html'), 'old');
    await publish(real, 'new');
    expect(readFileSync(join(real, 'index.html'), 'utf8')).toBe('new');
    expect(existsSync(join(real, 'parts'))).toBe(false);
    expect(readdirSync(holdingOf(real))).toHaveLength(1);
  });

  it('abandoned, leaves the site and the disk as they were', async () => {
    const top = tempDir('swap');
    const site = join(top, 'site');
    await publish(site, 'one');
    const before = diskSnapshot(top);
    const staging = stageOutput(site);
    writeFileSync(join(staging.dir, 'index.html'), 'half');
    staging.abandon();
    expect(readFileSync(join(site, 'index.html'), 'utf8')).toBe('one');
    // The holding folder's own time changes (an entry came and went); nothing in it or beside it does.
    before.delete('.site.zfolio');
    const after = diskSnapshot(top);
    after.delete('.site.zfolio');
    expect(after).toEqual(before);
  });
});

describe('removeLeftovers', () => {
  it('removes versions, links and lock drafts of builds that are gone, and the staging and previous folders of older zfolio', async () => {
    const top = tempDir('leftovers');
    const site = join(top, 'site');
    await publish(site, 'one');
    const dead = deadPid();
    const holding = holdingOf(site);
    mkdirSync(join(holding, `site-${dead}-0badc0de`, 'parts'), { recursive: true });
    writeFileSync(join(holding, `site-${dead}-0badc0de`, 'parts', 'x.html'), 'x');
    writeFileSync(join(holding, `link-${dead}-0badc0de`), '');
    // The draft of a lock that a build killed as it took the lock left (site-lock.ts).
    writeFileSync(join(holding, lockDraftName(dead)), '{}\n');
    mkdirSync(join(top, `.site.staging-${dead}`));
    mkdirSync(join(top, `.site.previous-${dead}`));
    // A build still running (this test's parent process) keeps its version and its lock draft; names zfolio
    // does not make stay, and so does a version of a gone build named to be kept (a recorded spare).
    mkdirSync(join(holding, `site-${process.ppid}-00c0ffee`));
    const running = lockDraftName(process.ppid);
    writeFileSync(join(holding, running), '{}\n');
    mkdirSync(join(holding, `site-${dead}-5a5a5a5a`));
    mkdirSync(join(holding, 'notes'));
    mkdirSync(join(top, '.site.staging-other'));
    await removeLeftovers(site, [undefined, `site-${dead}-5a5a5a5a`]);
    expect(readdirSync(holding).sort()).toEqual([readlinkSync(site).split('/')[1], 'notes', `site-${process.ppid}-00c0ffee`, running, `site-${dead}-5a5a5a5a`].sort());
    expect(readdirSync(top).sort()).toEqual(['.site.staging-other', '.site.zfolio', 'site']);
    expect(readFileSync(join(site, 'index.html'), 'utf8')).toBe('one');
  });
});

describe('a read-only output', () => {
  const modes: [string, number][] = [];
  const unlockAll = () => {
    for (const [path, mode] of modes.splice(0)) chmodSync(path, mode);
  };
  afterEach(unlockAll);
  const lock = (path: string) => {
    modes.push([path, lstatSync(path).mode & 0o7777]);
    chmodSync(path, 0o555);
  };
  const refusal = (site: string) => {
    try {
      checkWritable(site);
    } catch (error) {
      expect(error).toBeInstanceOf(OutputRefused);
      return (error as Error).message;
    }
    return 'writable';
  };

  it('is refused, naming the read-only folder: the parent, the site, a folder inside it', async () => {
    const top = tempDir('readonly');
    const site = join(top, 'out', 'site');
    mkdirSync(join(top, 'out'));
    await publish(site, 'one');
    mkdirSync(join(site, 'parts'));
    expect(refusal(site)).toBe('writable');
    lock(join(top, 'out'));
    expect(refusal(site)).toBe(`cannot write the site to ${site}: ${join(top, 'out')} is read-only; make it writable or choose another --out`);
    expect(refusal(join(top, 'out', 'new', 'deeper'))).toMatch(/: .*out is read-only/);
    unlockAll();
    lock(site); // chmod follows the link to the version it points at
    expect(refusal(site)).toMatch(new RegExp(`: ${site} is read-only`));
    unlockAll();
    lock(join(site, 'parts'));
    expect(refusal(site)).toMatch(/\/parts is read-only/);
    unlockAll();
    // Deeper: below a folder that holds a folder (a folder's link count counts the folders in it).
    mkdirSync(join(site, 'parts', 'P-1', 'deeper'), { recursive: true });
    writeFileSync(join(site, 'parts', 'P-1', 'index.html'), 'p');
    expect(refusal(site)).toBe('writable');
    lock(join(site, 'parts', 'P-1', 'deeper'));
    expect(refusal(site)).toMatch(/\/parts\/P-1\/deeper is read-only/);
  });

  it('stops a build before anything moves: exit-2 error, the disk as it was', async () => {
    const top = tempDir('readonly-build');
    const library = join(top, 'lib');
    mkdirSync(join(library, 'parts'), { recursive: true });
    writeFileSync(join(library, 'parts', 'c.yaml'), readFileSync(join(REPO, 'test/fixtures/good-library/parts/capacitor.yaml')));
    const site = join(top, 'site');
    await publish(site, 'one');
    lock(readlinkSync(site).startsWith('.') ? join(top, readlinkSync(site)) : site);
    const before = diskSnapshot(top);
    await expect(buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 })).rejects.toThrow(OutputRefused);
    expect(diskSnapshot(top)).toEqual(before);
  });
});

/** The versions the record of the library's site names (its default cache); none when there is no record. */
function recordOf(library: string): { live?: { name: string }; spare?: { name: string } } | undefined {
  const builds = join(library, '.zfolio-cache', 'builds');
  const [dir] = readdirSync(builds);
  const root = join(builds, dir, 'root.json');
  return existsSync(root) ? JSON.parse(readFileSync(root, 'utf8')) : undefined;
}

const recordedSpare = (library: string) => recordOf(library)?.spare?.name;

const SCRIPT = fileURLToPath(new URL('./scripts/build-until.mjs', import.meta.url));
const GOOD = join(REPO, 'test/fixtures/good-library');

/** A copy of the good library whose capacitor's title says `title`. */
function libraryTitled(library: string, title: string): void {
  mkdirSync(join(library, 'parts'), { recursive: true });
  for (const name of readdirSync(join(GOOD, 'parts'))) {
    const text = readFileSync(join(GOOD, 'parts', name), 'utf8');
    writeFileSync(join(library, 'parts', name), name === 'capacitor.yaml' ? text.replace(/^title: .*$/m, `title: ${title}`) : text);
  }
  writeFileSync(join(library, 'folio.yaml'), readFileSync(join(GOOD, 'folio.yaml')));
}

describe('a build killed at each step of the swap', () => {
  // The reference: every file a complete site of the good library holds.
  let complete: string[];
  const capPage = (site: string) => readFileSync(join(site, 'parts', 'CAP-TEST-100N', 'index.html'), 'utf8');

  it.each([
    ['staged', 'old', 'dropped'],
    ['linked', 'old', 'dropped'],
    ['swapped', 'new', 'dropped'],
    ['recorded', 'new', 'kept'],
    ['cleaned', 'new', 'kept'],
  ])('killed when %s, leaves a complete site (the %s one) and its record %s; the next build removes what it left', async (step, which, record) => {
    const top = tempDir(`kill-${step}`);
    const library = join(top, 'lib');
    libraryTitled(library, 'Old title');
    const site = join(library, '_site');
    expect((await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 })).ok).toBe(true);
    complete ??= filesUnder(site);
    expect(complete).toContain('parts/CAP-TEST-100N/index.html');

    libraryTitled(library, 'New title');
    const killed = spawnSync(process.execPath, [SCRIPT, library, site, step], { cwd: REPO, encoding: 'utf8' });
    expect(killed.signal).toBe('SIGKILL');
    expect(filesUnder(site)).toEqual(complete);
    expect(capPage(site)).toContain(which === 'old' ? 'Old title' : 'New title');
    const previous = readlinkSync(site).split('/')[1];
    // Dropped before the swap; written after it, before the versions left over are removed (seconds at
    // 10,000 parts), so that a build stopped then leaves the next one its record and spare.
    expect(recordOf(library)?.live?.name).toBe(record === 'kept' ? previous : undefined);

    libraryTitled(library, 'Third title');
    const next = await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 });
    expect(next.ok).toBe(true);
    expect(capPage(site)).toContain('Third title');
    // What the killed build left is gone: one spare stays, the one the record names.
    const { live, others } = siteVersions(site);
    expect(readdirSync(holdingOf(site)).sort()).toEqual([live, ...others].sort());
    expect(others).toHaveLength(1);
    expect(recordedSpare(library)).toBe(others[0]);
    const linkedCopy = sameInodes(join(holdingOf(site), live), join(holdingOf(site), others[0]));
    // Without a record, the version this build replaced is described by none: it goes too, and the spare is
    // a linked copy of the new site. (The killed build ran the compiled code, this one the sources: their
    // code keys differ, so no part is carried over either way.)
    if (record === 'dropped') expect(others).not.toContain(previous);
    expect(others[0] === previous || linkedCopy).toBe(true);
    expect(readdirSync(library).sort()).toEqual(['._site.zfolio', '.zfolio-cache', '_site', 'folio.yaml', 'parts']);
  }, 300_000);
});

describe('a build that fails after its swap', () => {
  it.each(['swapped', 'recorded'])('at %s, leaves the new site in place, whole', async (step) => {
    const top = tempDir(`fail-${step}`);
    const library = join(top, 'lib');
    libraryTitled(library, 'Old title');
    const site = join(library, '_site');
    expect((await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 })).ok).toBe(true);
    const complete = filesUnder(site);
    // Without a record the build writes its own staging folder, which the swap makes the site.
    rmSync(join(library, '.zfolio-cache', 'builds'), { recursive: true });
    libraryTitled(library, 'New title');
    const failing = (at: string) => {
      if (at === step) throw new Error(`failed at ${at}`);
    };
    const failure = await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0, onSwapStep: failing }).then(
      () => undefined,
      (error: unknown) => error,
    );
    // Inside the swap the error is the build's own; after it, it says the new site is in place (FailedAfterSwap).
    const cause = failure instanceof FailedAfterSwap ? failure.cause : failure;
    expect((cause as Error).message).toBe(`failed at ${step}`);
    expect(failure instanceof FailedAfterSwap).toBe(step === 'recorded');
    if (failure instanceof FailedAfterSwap) expect(failure.message).toBe(`the new site is in place at ${site}, but the build failed after putting it there: failed at recorded`);
    expect(filesUnder(site)).toEqual(complete);
    expect(readFileSync(join(site, 'parts', 'CAP-TEST-100N', 'index.html'), 'utf8')).toContain('New title');
  }, 120_000);
});

describe('builds killed at random moments', () => {
  it('always leave a complete site at the site path', async () => {
    const top = tempDir('kill-random');
    const library = join(top, 'lib');
    libraryTitled(library, 'Title 0');
    const site = join(library, '_site');
    expect((await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 })).ok).toBe(true);
    const complete = filesUnder(site);
    // Fixed delays spread over a build's life in its own process (start-up, load, charts, pages, swap).
    for (const [round, delayMs] of [700, 1500, 2300, 3100].entries()) {
      libraryTitled(library, `Title ${round + 1}`);
      const child = spawn(process.execPath, [SCRIPT, library, site], { cwd: REPO, stdio: 'ignore' });
      const ended = new Promise((done) => child.on('exit', done));
      await new Promise((done) => setTimeout(done, delayMs));
      child.kill('SIGKILL');
      await ended;
      expect(filesUnder(site), `killed after ${delayMs} ms`).toEqual(complete);
    }
    const previous = readlinkSync(site).split('/')[1];
    expect((await buildFolio({ libraryRoot: library, outDir: site, cwd: library, workers: 0 })).ok).toBe(true);
    // One spare is left, the one the record names: the version replaced (when a record described it and this
    // build remade at most half the units) or a linked copy of the new site; what killed builds left is gone.
    const { live, others } = siteVersions(site);
    expect(readdirSync(holdingOf(site)).sort()).toEqual([live, ...others].sort());
    expect(others).toHaveLength(1);
    expect(recordedSpare(library)).toBe(others[0]);
    expect(others[0] === previous || sameInodes(join(holdingOf(site), live), join(holdingOf(site), others[0]))).toBe(true);
  }, 300_000);
});
