// Which folders a build may replace. A build throws the old site away, so it must never take a folder that
// is not a site zfolio wrote: every site carries a marker file, and a build replaces only a folder holding
// that marker, an empty folder, or a link it made itself. Some places are refused even then: the file
// system's root, the home folder, the library and every folder holding it, and the current folder and every
// folder holding it (a shell left standing in a deleted folder, or a checkout gone, are not worth a site).

import { lstatSync, readdirSync, readFileSync, readlinkSync, realpathSync } from 'node:fs';
import { homedir } from 'node:os';
import { basename, dirname, isAbsolute, join, parse, relative, resolve } from 'node:path';

/** The marker file at the top of every site zfolio writes. */
export const SITE_MARKER = '.zfolio-site';
/** Its first line, by which zfolio recognises its own sites. */
const MARKER_HEAD = 'zfolio site';
export const MARKER_TEXT = `${MARKER_HEAD}\nThis folder was written by zfolio; the next build replaces it whole. Do not keep other files here.\n`;

/** A build, serve or print that would replace or write somewhere it must not; the command exits 2. */
export class OutputRefused extends Error {}

/**
 * A build that failed after it put its new site in place (writing its record, making the next build's spare):
 * the site at `sitePath` is the new one, whole; the error it failed with is the cause.
 */
export class FailedAfterSwap extends Error {
  constructor(
    readonly sitePath: string,
    cause: unknown,
  ) {
    const what = (cause instanceof Error ? cause.message : String(cause)).split('\n', 1)[0];
    super(`the new site is in place at ${sitePath}, but the build failed after putting it there: ${what}`, { cause });
  }

  /** The line said after the cause's own (src/cli/main.ts). */
  get inPlace(): string {
    return `the new site is in place at ${this.sitePath} all the same; the next build may make more of it again`;
  }
}

export interface GuardContext {
  libraryRoot: string;
  /** The folder the command runs in. */
  cwd: string;
  /** The user's home folder (default: the system's idea of it). */
  home?: string;
}

/** The folder (beside the site path) holding the site's versions; see output.ts. */
export function holdingName(siteName: string): string {
  return `.${siteName}.zfolio`;
}

/** The holding folder's path, for the site path `sitePath`. */
export const holdingDir = (sitePath: string) => join(dirname(sitePath), holdingName(basename(sitePath)));

/** The lock file's name in the holding folder (site-lock.ts). */
export const LOCK_NAME = 'build.lock';

/**
 * A draft of the lock, written whole before it is linked into place, named by its process: one a killed build
 * left is removed as a leftover (output.ts).
 */
export const lockDraftName = (pid: number) => `${LOCK_NAME}.${pid}.${Math.random().toString(16).slice(2)}`;
export const LOCK_DRAFT = /^build\.lock\.(\d+)\.[0-9a-f]+$/;

/** A link at the site path that zfolio made: it points at one of the versions in the holding folder. */
export function isOwnLink(sitePath: string, target: string): boolean {
  const [folder, version, ...rest] = target.split(/[/\\]/);
  return rest.length === 0 && folder === holdingName(basename(sitePath)) && /^site-\d+-[0-9a-f]+$/.test(version ?? '');
}

export function hasSiteMarker(dir: string): boolean {
  try {
    return readFileSync(join(dir, SITE_MARKER), 'utf8').split('\n', 1)[0] === MARKER_HEAD;
  } catch {
    return false;
  }
}

/** The path with every existing folder on the way resolved (links, `..`), the rest appended as written. */
function canonical(path: string): string {
  const abs = resolve(path);
  const tail: string[] = [];
  let head = abs;
  for (;;) {
    try {
      return join(realpathSync.native(head), ...tail.reverse());
    } catch {
      const up = dirname(head);
      if (up === head) return abs;
      tail.push(basename(head));
      head = up;
    }
  }
}

/** `outer` is `inner` or a folder that holds it. */
function holds(outer: string, inner: string): boolean {
  const rel = relative(outer, inner);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/**
 * Throws OutputRefused, with a one-line reason, unless a site may be written at `sitePath`. Reads only:
 * nothing on disk changes, whatever the answer.
 */
export function guardOutput(sitePath: string, context: GuardContext): void {
  const abs = resolve(sitePath);
  // The site path itself is judged as an entry (a link there is replaced, not followed); where it sits is
  // judged with every folder above it resolved.
  const where = join(canonical(dirname(abs)), basename(abs));
  const refuse = (why: string): never => {
    throw new OutputRefused(`will not write the site to ${abs}: ${why}`);
  };
  const library = canonical(context.libraryRoot);
  const cwd = canonical(context.cwd);
  const home = canonical(context.home ?? homedir());

  if (parse(where).root === where) refuse('it is the root of the file system');
  if (where === library) refuse('it is the library folder; choose another --out');
  if (holds(where, library)) refuse(`it holds the library (${library}); choose another --out`);
  if (where === home) refuse('it is your home folder; choose another --out');
  if (where === cwd) refuse('it is the current folder; choose another --out');
  if (holds(where, cwd)) refuse(`it holds the current folder (${cwd}); choose another --out`);

  let entry;
  try {
    entry = lstatSync(abs);
  } catch {
    return; // nothing there yet
  }
  if (entry.isSymbolicLink()) {
    if (!isOwnLink(abs, readlinkSync(abs))) refuse('it is a symbolic link zfolio did not make; remove it or choose another --out');
    return;
  }
  if (!entry.isDirectory()) refuse('it is a file, not a folder; choose another --out');
  let names: string[];
  try {
    names = readdirSync(abs);
  } catch (error) {
    return refuse(`cannot read it (${(error as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  if (names.length === 0 || hasSiteMarker(abs)) return;
  refuse(`it holds files zfolio did not write (no ${SITE_MARKER} marker); zfolio replaces only a site it built or an empty folder: empty or remove it, or choose another --out`);
}
