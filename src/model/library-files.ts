// The file side of loading a library: which files are library files, and reading one safely. Every path is
// checked for its kind before it is opened (a named pipe would block a read forever, a folder cannot be
// read), symbolic links are followed only to places inside the library, and a file's size is bounded, so
// no entry of the library folder can hang, crash or make zfolio print a file that is not the library's.

import { closeSync, constants, fstatSync, lstatSync, openSync, readdirSync, readSync, realpathSync, statSync, type Dirent, type Stats } from 'node:fs';
import { join, relative, sep } from 'node:path';
import type { DiagnosticList, SourcePosition } from './diagnostics.js';
import { MAX_FILE_BYTES } from './yaml-limits.js';

const YAML_FILE = /\.ya?ml$/i;

/** A problem with the file as a whole: reported at its first character. */
const atFile = (path: string): SourcePosition => ({ file: path, line: 1, column: 1 });

/** What a non-regular entry is, in words: "a folder", "a named pipe" … */
export function kindOf(stats: Stats): string {
  if (stats.isDirectory()) return 'a folder';
  if (stats.isFIFO()) return 'a named pipe';
  if (stats.isSocket()) return 'a socket';
  if (stats.isCharacterDevice() || stats.isBlockDevice()) return 'a device';
  if (stats.isSymbolicLink()) return 'a symbolic link';
  return 'a file';
}

function isInside(realRoot: string, real: string): boolean {
  return real === realRoot || real.startsWith(realRoot.endsWith(sep) ? realRoot : realRoot + sep);
}

/** The entry's own stats, or those of what a symbolic link inside the library points at; a message otherwise. */
function resolveEntry(root: string, path: string): { stats: Stats; real: string } | { problem: string } | undefined {
  const absolute = join(root, path);
  let own: Stats;
  try {
    own = lstatSync(absolute);
  } catch {
    return undefined;
  }
  if (!own.isSymbolicLink()) {
    if (!own.isDirectory()) return { stats: own, real: absolute };
    try {
      return { stats: own, real: realpathSync(absolute) };
    } catch {
      return { stats: own, real: absolute };
    }
  }
  let real: string;
  let realRoot: string;
  try {
    real = realpathSync(absolute);
    realRoot = realpathSync(root);
  } catch {
    return { problem: 'a symbolic link to nothing (its target does not exist); remove it or point it at a file in the library' };
  }
  if (!isInside(realRoot, real)) {
    return { problem: 'a symbolic link to a place outside the library folder; zfolio follows links only within the library, so copy the file in instead' };
  }
  try {
    return { stats: statSync(real), real };
  } catch {
    return { problem: 'a symbolic link whose target cannot be read' };
  }
}

export type FolderState = 'absent' | 'folder' | 'wrong';

/** Whether `name` (parts, plans …) is a folder of the library; anything else at that name is an error. */
export function libraryFolder(root: string, name: string, diagnostics: DiagnosticList): FolderState {
  const entry = resolveEntry(root, name);
  if (entry === undefined) return 'absent';
  if ('problem' in entry) {
    diagnostics.error(atFile(name), `${name}: ${entry.problem}`);
    return 'wrong';
  }
  if (entry.stats.isDirectory()) return 'folder';
  diagnostics.error(atFile(name), `${name} is ${kindOf(entry.stats)}; expected a folder holding the library's ${name} as YAML files`);
  return 'wrong';
}

/** Whether a library file (folio.yaml) exists at all, as any kind of entry, even a broken link. */
export function entryExists(root: string, path: string): boolean {
  try {
    lstatSync(join(root, path));
    return true;
  } catch {
    return false;
  }
}

/**
 * YAML files under the folder `dir` at any depth, as library-relative paths with forward slashes, sorted.
 * Hidden entries are skipped; a folder named like a YAML file, a pipe, device or socket with a YAML name, and
 * a symbolic link leading out of the library are errors; other pipes and devices are warnings.
 */
export function yamlFilesUnder(root: string, dir: string, diagnostics?: DiagnosticList): string[] {
  const out: string[] = [];
  // Real paths of the folders read, so a link back to one of them is not read twice (or for ever).
  const seen = new Set<string>();
  try {
    seen.add(realpathSync(join(root, dir)));
  } catch {
    return out;
  }
  // Paths are built by joining names onto the folder's library-relative path (readdir never gives "." or
  // "..", and hidden names are skipped), rather than through path.relative for every entry.
  const folders = [relative(root, join(root, dir)).split(sep).join('/')];
  while (folders.length > 0) {
    const folder = folders.pop()!;
    let entries: Dirent[];
    try {
      entries = readdirSync(join(root, folder), { withFileTypes: true });
    } catch {
      diagnostics?.error(atFile(folder), `${folder}: the folder cannot be read (no permission?)`);
      continue;
    }
    for (const dirent of entries) {
      const name = dirent.name;
      if (name.startsWith('.')) continue;
      const path = folder ? `${folder}/${name}` : name;
      const yamlName = YAML_FILE.test(name);
      // A regular file is known as one from the listing itself (its type comes with the name): no lstat for
      // it, which in a library of thousands of parts is most of the walk. Everything else (folders, links,
      // and entries whose type the file system does not report) is looked at as before.
      if (dirent.isFile()) {
        if (yamlName) out.push(path);
        continue;
      }
      const entry = resolveEntry(root, path);
      if (entry === undefined) continue;
      if ('problem' in entry) {
        if (yamlName) diagnostics?.error(atFile(path), entry.problem);
        else diagnostics?.warning(atFile(path), `skipped: ${entry.problem}`);
        continue;
      }
      const { stats, real } = entry;
      if (stats.isDirectory()) {
        if (yamlName) diagnostics?.error(atFile(path), `a folder named like a YAML file; expected a file here (rename the folder)`);
        else if (seen.has(real)) diagnostics?.warning(atFile(path), 'skipped: a symbolic link to a folder that is already read');
        else {
          seen.add(real);
          folders.push(path);
        }
      } else if (stats.isFile()) {
        if (yamlName) out.push(path);
      } else if (yamlName) diagnostics?.error(atFile(path), `${kindOf(stats)}, not a file; a library file must be a regular file`);
      else diagnostics?.warning(atFile(path), `skipped: ${kindOf(stats)} in the library folder`);
    }
  }
  return out.sort();
}

/**
 * The text of a library file, or undefined with a message: the kind of entry is checked before it is opened,
 * the size is bounded by MAX_FILE_BYTES, and the bytes must be UTF-8.
 */
export function readLibraryFile(root: string, path: string, diagnostics: DiagnosticList): string | undefined {
  const entry = resolveEntry(root, path);
  if (entry === undefined) {
    diagnostics.error(atFile(path), 'the file cannot be found');
    return undefined;
  }
  if ('problem' in entry) {
    diagnostics.error(atFile(path), entry.problem);
    return undefined;
  }
  if (!entry.stats.isFile()) {
    diagnostics.error(atFile(path), `${path} is ${kindOf(entry.stats)}; expected a YAML file`);
    return undefined;
  }
  return readTextFile(entry.real, path, diagnostics);
}

/**
 * The text of a file named outside the library (a plan file given on the command line): the same checks of
 * kind, size and encoding, with `shown` as the path messages print.
 */
export function readTextFile(absolute: string, shown: string, diagnostics: DiagnosticList): string | undefined {
  const path = shown;
  let bytes: Buffer;
  try {
    bytes = readRegularFile(absolute, path);
  } catch (error) {
    diagnostics.error(atFile(path), error instanceof FileProblem ? error.message : `the file cannot be read (${codeOf(error)})`);
    return undefined;
  }
  const bad = firstInvalidUtf8(bytes);
  if (bad >= 0) {
    diagnostics.error(bytePosition(path, bytes, bad), 'the file is not UTF-8 text (an invalid byte here); save it as UTF-8');
    return undefined;
  }
  return bytes.toString('utf8');
}

/**
 * The text of a data file the library names (a measurement), or what is wrong with it in words: checked like
 * a library file (kind before opening, links only inside the library, UTF-8), up to `maxBytes`.
 */
export function readDataFile(root: string, path: string, maxBytes: number, what: string): { text: string } | { problem: string } {
  const entry = resolveEntry(root, path);
  if (entry === undefined) return { problem: `no file ${path} in the library` };
  if ('problem' in entry) return { problem: `${path} is ${entry.problem}` };
  if (!entry.stats.isFile()) return { problem: `${path} is ${kindOf(entry.stats)}; expected ${what}` };
  let bytes: Buffer;
  try {
    bytes = readRegularFile(entry.real, path, maxBytes, what);
  } catch (error) {
    return { problem: error instanceof FileProblem ? error.message : `${path} cannot be read (${codeOf(error)})` };
  }
  if (firstInvalidUtf8(bytes) >= 0) return { problem: `${path} is not text (it holds a byte that is not UTF-8); expected ${what}` };
  return { text: bytes.toString('utf8') };
}

class FileProblem extends Error {}

function readRegularFile(absolute: string, path: string, maxBytes = MAX_FILE_BYTES, what = 'a YAML file'): Buffer {
  // O_NONBLOCK: should the entry have become a pipe since it was checked, opening it still returns at once.
  const fd = openSync(absolute, constants.O_RDONLY | constants.O_NONBLOCK);
  try {
    const stats = fstatSync(fd);
    if (!stats.isFile()) throw new FileProblem(`${path} is ${kindOf(stats)}; expected ${what}`);
    if (stats.size > maxBytes) {
      const which = maxBytes === MAX_FILE_BYTES ? 'a library file' : what;
      throw new FileProblem(`${maxBytes === MAX_FILE_BYTES ? 'the file' : path} is ${(stats.size / 1048576).toFixed(1)} MB; ${which} may be at most ${maxBytes / 1048576} MB`);
    }
    const buffer = Buffer.alloc(stats.size);
    let filled = 0;
    while (filled < buffer.length) {
      const n = readSync(fd, buffer, filled, buffer.length - filled, filled);
      if (n === 0) break;
      filled += n;
    }
    return buffer.subarray(0, filled);
  } finally {
    closeSync(fd);
  }
}

function codeOf(error: unknown): string {
  const code = (error as { code?: unknown })?.code;
  if (code === 'EACCES' || code === 'EPERM') return 'no permission';
  return typeof code === 'string' ? code : 'an unknown error';
}

/** Byte offset of the first byte that is not part of a well-formed UTF-8 sequence, or -1. */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) [need, min] = [1, 0x80];
    else if (b >= 0xe0 && b <= 0xef) [need, min] = [2, 0x800];
    else if (b >= 0xf0 && b <= 0xf4) [need, min] = [3, 0x10000];
    else return i;
    let code = b & (0x3f >> need);
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      code = (code << 6) | (c & 0x3f);
    }
    // Overlong forms, UTF-16 surrogates and code points above U+10FFFF are not UTF-8.
    if (code < min || (code >= 0xd800 && code <= 0xdfff) || code > 0x10ffff) return i;
    i += need + 1;
  }
  return -1;
}

function bytePosition(file: string, bytes: Buffer, offset: number): SourcePosition {
  const lineStart = offset === 0 ? 0 : bytes.lastIndexOf(0x0a, offset - 1) + 1;
  let line = 1;
  for (let i = bytes.indexOf(0x0a); i >= 0 && i < offset; i = bytes.indexOf(0x0a, i + 1)) line++;
  const column = [...bytes.subarray(lineStart, offset).toString('utf8')].length + 1;
  return { file, line, column };
}
