// Helpers for tests that build folios: temporary folders, file trees and their hashes.

import { createHash } from 'node:crypto';
import { cpSync, lstatSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO = fileURLToPath(new URL('..', import.meta.url));

export function tempDir(stem: string): string {
  return mkdtempSync(join(tmpdir(), `zfolio-${stem}-`));
}

/** What a library folder holds that a build reads: its YAML and measurement files. */
export const LIBRARY_ENTRIES = ['folio.yaml', 'parts', 'comparisons', 'plans', 'reviews', 'measurements'];

/** A copy of a library folder (its YAML and measurement files; caches and built sites are left behind). */
export function copyLibrary(from: string, stem: string): string {
  const to = tempDir(stem);
  for (const entry of LIBRARY_ENTRIES) {
    try {
      cpSync(join(from, entry), join(to, entry), { recursive: true });
    } catch {
      // not every library has every folder
    }
  }
  return to;
}

/** Every file under `dir`, as sorted relative paths with forward slashes. */
export function filesUnder(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const path = join(d, name);
      if (statSync(path).isDirectory()) walk(path);
      else out.push(relative(dir, path).split(sep).join('/'));
    }
  };
  walk(dir);
  return out.sort();
}

/** SHA-256 of every file under `dir`, by relative path. */
export function treeHashes(dir: string): Map<string, string> {
  return new Map(filesUnder(dir).map((f) => [f, createHash('sha256').update(readFileSync(join(dir, f))).digest('hex')]));
}

export function read(dir: string, file: string): string {
  return readFileSync(join(dir, file), 'utf8');
}

/**
 * Everything on disk under `dir`, links not followed: each entry's kind, mode, size, mtime and inode, a
 * file's SHA-256 and a link's target. Two equal snapshots mean nothing under `dir` was written, moved,
 * touched or removed.
 */
export function diskSnapshot(dir: string): Map<string, string> {
  const out = new Map<string, string>();
  const walk = (d: string) => {
    for (const name of readdirSync(d).sort()) {
      const path = join(d, name);
      const s = lstatSync(path);
      const rel = relative(dir, path).split(sep).join('/');
      const stamp = `${s.mode} ${s.size} ${s.mtimeMs} ${s.ino}`;
      if (s.isSymbolicLink()) out.set(rel, `link ${stamp} -> ${readlinkSync(path)}`);
      else if (s.isDirectory()) {
        out.set(rel, `folder ${s.mode} ${s.mtimeMs} ${s.ino}`);
        walk(path);
      } else out.set(rel, `file ${stamp} ${createHash('sha256').update(readFileSync(path)).digest('hex')}`);
    }
  };
  walk(dir);
  return out;
}

/**
 * The site versions in the holding folder of `site` (a link into it), by name: the one the site path links
 * to, and the others. A build with a cache leaves the next one a spare there (src/build/spare-copy.ts).
 */
export function siteVersions(site: string): { live: string; others: string[] } {
  const holding = join(site, '..', `.${site.split(sep).pop()}.zfolio`);
  const live = readlinkSync(site).split('/').pop()!;
  return { live, others: readdirSync(holding).filter((n) => n.startsWith('site-') && n !== live).sort() };
}

/** Whether every file under `a` is the same file (device and inode) as under `b` at the same path, and neither has a file the other lacks. */
export function sameInodes(a: string, b: string): boolean {
  const files = filesUnder(a);
  if (JSON.stringify(files) !== JSON.stringify(filesUnder(b))) return false;
  return files.every((f) => {
    const x = statSync(join(a, f));
    const y = statSync(join(b, f));
    return x.ino === y.ino && x.dev === y.dev;
  });
}
