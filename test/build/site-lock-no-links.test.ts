// The site lock (src/build/site-lock.ts) on a file system without hard links (FAT, some network drives), where
// link(2) fails with EPERM and the lock file is created exclusively instead (O_EXCL, flag 'wx'). The machines
// the suite runs on have hard links everywhere, so link(2) is made to fail here: every `linkSync` of node:fs
// throws EPERM, as Linux's vfat driver answers (common practice: vfat has no hard links; the errno is from memory
// of link(2)'s man page, "EPERM: the file system containing oldpath and newpath does not support the creation of
// hard links"). The lock must still keep a second holder out, take over a dead holder's lock, be removed on
// release, and lose a race: a rival's lock made between this build's look and its create is not written over.

import { spawn, spawnSync } from 'node:child_process';
import fs, { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { syncBuiltinESMExports } from 'node:module';
import { afterEach, beforeEach, describe, expect, it, onTestFinished } from 'vitest';
import { OutputRefused } from '../../src/build/output-guard.js';
import { LOCK_NAME, lockSite } from '../../src/build/site-lock.js';
import { tempDir } from '../site-helpers.js';

/** Link attempts, and a lock another build writes at the link's target just before it fails (a race). */
const links = { attempts: 0, rival: undefined as string | undefined };
const realLink = fs.linkSync;

// The suite's files share their fork's modules (vitest.config.ts), so node:fs is not mocked: its linkSync is
// replaced for the tests of this file and the live bindings of `import { linkSync } from 'node:fs'` follow it
// (Node's module.syncBuiltinESMExports), then it is put back.
beforeEach(() => {
  fs.linkSync = (_from, to) => {
    links.attempts++;
    if (links.rival !== undefined) fs.writeFileSync(to, links.rival);
    throw Object.assign(new Error('EPERM: operation not permitted, link'), { code: 'EPERM', errno: -1, syscall: 'link' });
  };
  syncBuiltinESMExports();
});
afterEach(() => {
  fs.linkSync = realLink;
  syncBuiltinESMExports();
  links.rival = undefined;
});

const holdingOf = (root: string) => join(root, '._site.zfolio');

/** What taking the lock of `site` threw (undefined when it was taken: it is then let go). */
function refusal(site: string): Error | undefined {
  try {
    lockSite(site).release();
    return undefined;
  } catch (error) {
    return error as Error;
  }
}

describe('the site lock without hard links', () => {
  it('is made by an exclusive create, keeps a second holder out, and goes on release with the folder it made', () => {
    const root = tempDir('lock-nolinks');
    const site = join(root, '_site');
    const before = links.attempts;
    const lock = lockSite(site, new Date('2026-12-03T10:00:00.000Z'));
    expect(links.attempts).toBeGreaterThan(before); // the link was tried, and failed
    const written = JSON.parse(readFileSync(lock.path, 'utf8'));
    expect(written).toMatchObject({ pid: process.pid, host: hostname(), started: '2026-12-03T10:00:00.000Z' });
    // No draft is left beside it.
    expect(readdirSync(holdingOf(root))).toEqual([LOCK_NAME]);

    const refused = refusal(site);
    expect(refused).toBeInstanceOf(OutputRefused);
    expect(refused?.message).toBe(
      `will not write the site to ${site}: another zfolio build is writing it (process ${process.pid}, started 2026-12-03T10:00:00.000Z); wait for it to end, or if no build is running, remove ${lock.path}`,
    );
    // The refused attempt left the holder's file as it was.
    expect(JSON.parse(readFileSync(lock.path, 'utf8'))).toEqual(written);

    lock.release();
    expect(existsSync(holdingOf(root))).toBe(false);
    const again = lockSite(site);
    expect(existsSync(again.path)).toBe(true);
    again.release();
    expect(existsSync(again.path)).toBe(false);
  });

  it("takes over a lock whose holder has ended, and writes its own holder into it", () => {
    const root = tempDir('lock-nolinks-stale');
    const site = join(root, '_site');
    const dead = Number(spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' }).stdout);
    mkdirSync(holdingOf(root), { recursive: true });
    // A folder of the site's versions is there too: release removes only the lock.
    mkdirSync(join(holdingOf(root), 'site-1-0000'));
    writeFileSync(join(holdingOf(root), LOCK_NAME), `${JSON.stringify({ pid: dead, host: hostname(), started: '2026-01-01T00:00:00.000Z' })}\n`);
    const lock = lockSite(site);
    expect(JSON.parse(readFileSync(lock.path, 'utf8')).pid).toBe(process.pid);
    lock.release();
    expect(readdirSync(holdingOf(root))).toEqual(['site-1-0000']);
  });

  it('loses a race to a build that made the lock between its look and its create: refused, the rival\'s lock left as it was', () => {
    const root = tempDir('lock-nolinks-race');
    const site = join(root, '_site');
    const rival = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)'], { stdio: 'ignore' });
    onTestFinished(() => {
      rival.kill();
    });
    const text = `${JSON.stringify({ pid: rival.pid, host: hostname(), started: '2026-12-03T09:00:00.000Z' })}\n`;
    links.rival = text;
    const refused = refusal(site);
    expect(refused).toBeInstanceOf(OutputRefused);
    expect(refused?.message).toContain(`(process ${rival.pid}, started 2026-12-03T09:00:00.000Z)`);
    expect(readFileSync(join(holdingOf(root), LOCK_NAME), 'utf8')).toBe(text);
    expect(readdirSync(holdingOf(root))).toEqual([LOCK_NAME]);
  });
});
