// One build at a time for a site path. Two builds of one site at once (a second terminal, `serve` rebuilding
// while `build` runs, a build started while a killed one's chain goes on) would both claim the spare, both
// swap, and each write a record describing what the other made. A build therefore takes a lock file in the
// site's holding folder (output.ts) before it reads anything of the last build, and removes it when it ends,
// however it ends; a build that finds the lock held refuses with one line (exit 2), naming who holds it.
//
// The lock file is made whole and then linked into place (link(2) fails when the name exists), so it is never
// seen half-written. It names the holder: process id, machine, when it started and, where /proc has it, the
// process's start time, so that a lock left by a killed build is taken over once its process is gone, also
// when a new process got the same id (as in containers, where ids start again at 1). A holder on another
// machine (a library on a shared drive) cannot be checked from here: the lock is then respected, and the
// message says which file to remove when no build is running there.

import { linkSync, mkdirSync, readFileSync, rmdirSync, rmSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { dirname, join } from 'node:path';
import { untilDone } from '../on-exit.js';
import { alive } from './output.js';
import { holdingDir, LOCK_NAME, lockDraftName, OutputRefused } from './output-guard.js';

export { LOCK_NAME } from './output-guard.js';

/** Who holds a lock, as its file says. */
export interface LockHolder {
  pid: number;
  host: string;
  /** ISO time. */
  started: string;
  /** The process's start time in clock ticks since boot (/proc/PID/stat), where the system has /proc. */
  since?: string;
}

export interface SiteLock {
  /** The lock file. */
  path: string;
  /** Remove the lock (and the holding folder, when the lock made it and nothing else is in it). Idempotent. */
  release(): void;
}

/** A process's start time in clock ticks since boot, from /proc (Linux); undefined elsewhere or when it is gone. */
export function processStart(pid: number): string | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (in parentheses) may hold spaces and parentheses: fields are counted after the last ')'.
    return stat.slice(stat.lastIndexOf(')') + 2).split(' ')[19];
  } catch {
    return undefined;
  }
}

function readHolder(path: string): LockHolder | undefined {
  try {
    const holder = JSON.parse(readFileSync(path, 'utf8')) as Partial<LockHolder>;
    if (!Number.isInteger(holder.pid) || typeof holder.host !== 'string' || typeof holder.started !== 'string') return undefined;
    return holder as LockHolder;
  } catch {
    return undefined;
  }
}

/** Whether the holder may still be building: true when it cannot be told (another machine). */
export function holderRunning(holder: LockHolder): boolean {
  if (holder.host !== hostname()) return true;
  if (!alive(holder.pid)) return false;
  // A live process with the holder's id: the holder only if it started when the holder did.
  const since = processStart(holder.pid);
  return holder.since === undefined || since === undefined || since === holder.since;
}

function busyMessage(sitePath: string, path: string, holder: LockHolder): string {
  const who = holder.host === hostname() ? `process ${holder.pid}` : `process ${holder.pid} on ${holder.host}`;
  return `will not write the site to ${sitePath}: another zfolio build is writing it (${who}, started ${holder.started}); wait for it to end, or if no build is running, remove ${path}`;
}

/**
 * Take the lock of the site at `sitePath` for this process, or throw OutputRefused naming its holder. A lock
 * whose holder is gone is taken over. `now` is the start time written in the lock.
 */
export function lockSite(sitePath: string, now: Date = new Date()): SiteLock {
  const holding = holdingDir(sitePath);
  const path = join(holding, LOCK_NAME);
  const own: LockHolder = { pid: process.pid, host: hostname(), started: now.toISOString() };
  const since = processStart(process.pid);
  if (since !== undefined) own.since = since;
  // Read first: a build refused because another holds the lock writes nothing.
  const held = readHolder(path);
  if (held && holderRunning(held)) throw new OutputRefused(busyMessage(sitePath, path, held));
  const draft = join(holding, lockDraftName(process.pid));
  const text = `${JSON.stringify(own)}\n`;
  let made: string | undefined;
  try {
    made = mkdirSync(holding, { recursive: true });
    writeFileSync(draft, text);
  } catch (error) {
    // Nothing can be written there: no lock is needed, and the build's own check (writable.ts) says why.
    if (UNWRITABLE.has((error as NodeJS.ErrnoException).code ?? '')) return { path, release: () => removeMade(holding, made) };
    throw error;
  }
  let released = false;
  let undo = () => {};
  const release = () => {
    if (released) return;
    released = true;
    undo();
    // Only a lock that still names this process is removed.
    if (readHolder(path)?.pid === process.pid) rmSync(path, { force: true });
    removeMade(holding, made);
  };
  try {
    for (let attempt = 0; ; attempt++) {
      if (place(draft, path, text)) {
        undo = untilDone(release);
        return { path, release };
      }
      const holder = readHolder(path);
      // An unreadable lock file was not written by a build (each is linked in whole): it is taken over as stale.
      if (holder && holderRunning(holder)) throw new OutputRefused(busyMessage(sitePath, path, holder));
      if (attempt >= 2) throw new OutputRefused(`will not write the site to ${sitePath}: its lock ${path} keeps changing; is another build starting?`);
      rmSync(path, { force: true });
    }
  } finally {
    rmSync(draft, { force: true });
  }
}

const UNWRITABLE = new Set(['EACCES', 'EPERM', 'EROFS']);

/**
 * Put the lock file at `path`: the whole draft linked there, or, on a file system without hard links (FAT,
 * some network drives), created exclusively and written. False when a lock is already there.
 */
function place(draft: string, path: string, text: string): boolean {
  try {
    linkSync(draft, path);
    return true;
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') return false;
    if (code !== 'EPERM' && code !== 'ENOTSUP' && code !== 'EOPNOTSUPP' && code !== 'ENOSYS') throw error;
  }
  try {
    writeFileSync(path, text, { flag: 'wx' });
    return true;
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw error;
  }
}

/** Remove the folders the lock made (the holding folder and any above it up to `made`), where empty. */
function removeMade(holding: string, made: string | undefined): void {
  if (made === undefined) return;
  for (let dir = holding; ; dir = dirname(dir)) {
    try {
      rmdirSync(dir);
    } catch {
      return; // not empty: versions of the site live there
    }
    if (dir === made || dirname(dir) === dir) return;
  }
}

/**
 * Run `check` (it may only read), take the lock, and run `check` again under it: the lock's holder may have
 * changed what it looked at. A refusal by the first check leaves the disk as it was; by the second, the lock
 * is given up before it is thrown.
 */
export function lockSiteChecked<T>(sitePath: string, check: () => T): { lock: SiteLock; checked: T } {
  check();
  const lock = lockSite(sitePath);
  try {
    return { lock, checked: check() };
  } catch (error) {
    lock.release();
    throw error;
  }
}
