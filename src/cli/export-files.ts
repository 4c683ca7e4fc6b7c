// Writing exported model files into a folder: like print, export adds files to any folder, but replaces a
// file already there only when zfolio wrote it (its first line is zfolio's export mark). Every target is
// checked before the first is written; each is written beside its target and renamed over it, so a reader
// never sees half a file.

import { closeSync, mkdirSync, openSync, readSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { OutputRefused } from '../build/output-guard.js';

/** First lines by which zfolio knows an exported file as its own. */
export const EXPORT_MARKS = ['! zfolio export', '* zfolio export'];

function kind(path: string): 'folder' | 'file' | 'other' | 'none' {
  try {
    const s = statSync(path);
    return s.isDirectory() ? 'folder' : s.isFile() ? 'file' : 'other';
  } catch {
    return 'none';
  }
}

/** Whether the file at `path` begins with one of zfolio's export marks. */
export function exportedByZfolio(path: string): boolean {
  let fd: number | undefined;
  try {
    fd = openSync(path, 'r');
    const head = Buffer.alloc(64);
    const read = readSync(fd, head, 0, head.length, 0);
    const first = head.subarray(0, read).toString('utf8').split(/\r?\n/)[0];
    return EXPORT_MARKS.includes(first);
  } catch {
    return false;
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}

/** Refuse (OutputRefused, exit 2) unless every name can be written in `outDir`. */
export function guardExportFolder(outDir: string, names: readonly string[]): void {
  const folder = kind(outDir);
  if (folder === 'none') return;
  if (folder !== 'folder') throw new OutputRefused(`will not write files to ${outDir}: it is not a folder; choose another --out`);
  for (const name of names) {
    const target = join(outDir, name);
    const found = kind(target);
    if (found === 'none') continue;
    if (found !== 'file' || !exportedByZfolio(target)) throw new OutputRefused(`will not replace ${target}: it is not a file zfolio exported; move it or choose another --out`);
  }
}

/** Write `content` to `outDir/name` by a rename over the target. */
export function writeExport(outDir: string, name: string, content: string): string {
  mkdirSync(outDir, { recursive: true });
  const target = join(outDir, name);
  const temp = join(outDir, `.${basename(target)}.${process.pid}.tmp`);
  try {
    writeFileSync(temp, content);
    renameSync(temp, target);
  } finally {
    rmSync(temp, { force: true });
  }
  return target;
}
