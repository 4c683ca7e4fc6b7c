// Helpers for tests that build folios: temporary folders, file trees and their hashes.

import { createHash } from 'node:crypto';
import { cpSync, mkdtempSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

export const REPO = fileURLToPath(new URL('../..', import.meta.url));

export function tempDir(stem: string): string {
  return mkdtempSync(join(tmpdir(), `zfolio-${stem}-`));
}

/** A copy of a library folder (YAML only matters; caches and built sites are left behind). */
export function copyLibrary(from: string, stem: string): string {
  const to = tempDir(stem);
  for (const entry of ['folio.yaml', 'parts', 'comparisons', 'plans', 'reviews']) {
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
