// Reusing the last build's part folders. A part's folder (its page, sweep CSV, figures and chart specs) is a
// function of the part file, the library's settings, the site-wide header its page shows, and the code and
// templates that made it. When all of those hash the same as in the last build, and the folder in the last
// site is still the one that build wrote, its files are hard-linked into the new site instead of being drawn,
// written and rendered again. The links are made after the build has written everything else, so nothing is
// ever written through them into the old site: a failed build still leaves it intact, and the new site is
// swapped in whole as before.
//
// A record of the last build sits in the cache folder: for each part, its key, its files' size, mtime and
// inode (so a folder edited, replaced or removed since is built afresh rather than carried over), and its
// page data (so the index and comparisons can list a carried-over part without analysing it again).

import { createHash } from 'node:crypto';
import { constants, copyFileSync, existsSync, linkSync, lstatSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import { measurementInputs } from '../model/measurement-entry.js';
import { PACKAGE_ROOT, VERSION } from '../version.js';
import type { RecordedPage } from './assemble.js';
import type { PartPageData } from '../pages/site-data.js';
import type { PdfStamp } from './pdf-reuse.js';

/** [file name, size, mtimeMs, inode] of a file in a part folder. */
type FileStamp = [string, number, number, number];

interface PartRecord {
  key: string;
  files: FileStamp[];
  /** Its page data, when it survives JSON unchanged (finite numbers, no -0). */
  page?: RecordedPage;
}

export interface BuildRecord {
  format: 1;
  outDir: string;
  parts: Record<string, PartRecord>;
  /** The PDFs in the site, by site-relative path (pdf-reuse.ts). */
  pdfs?: Record<string, PdfStamp>;
}

const SOURCE_DIR = dirname(dirname(fileURLToPath(import.meta.url)));

/** Packages whose output lands in the pages, by version (their code is not hashed file by file). */
const RENDERING_PACKAGES = ['@11ty/eleventy', 'nunjucks', 'vega', 'vega-lite', 'vega-scenegraph', 'markdown-it'];

function packageVersion(name: string): string {
  try {
    let dir = dirname(fileURLToPath(import.meta.resolve(name)));
    for (let i = 0; i < 6; i++, dir = dirname(dir)) {
      try {
        const pkg = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as { name?: string; version?: string };
        if (pkg.name === name) return pkg.version ?? '?';
      } catch {
        // no package.json at this level
      }
    }
  } catch {
    // not installed: a version of its own, so the key still differs from one made with it
  }
  return 'absent';
}

function hashTree(hash: ReturnType<typeof createHash>, dir: string, base: string): void {
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) hashTree(hash, path, `${base}${entry.name}/`);
    else if (entry.isFile()) hash.update(`${base}${entry.name}\n`).update(readFileSync(path));
  }
}

let codeKeyMemo: string | undefined;

/**
 * A hash of everything that turns a library into pages besides the library itself: zfolio's own code (every
 * source file, whichever layer), its templates and eleventy configuration, the versions of the packages
 * that render, and Node's version.
 */
export function codeKey(): string {
  if (codeKeyMemo) return codeKeyMemo;
  const hash = createHash('sha256').update(`zfolio ${VERSION}\nnode ${process.version}\n`);
  for (const name of RENDERING_PACKAGES) hash.update(`${name} ${packageVersion(name)}\n`);
  hashTree(hash, SOURCE_DIR, 'src/');
  hashTree(hash, join(PACKAGE_ROOT, 'templates'), 'templates/');
  try {
    hash.update('.eleventy.js\n').update(readFileSync(join(PACKAGE_ROOT, '.eleventy.js')));
  } catch {
    hash.update('no .eleventy.js\n');
  }
  codeKeyMemo = hash.digest('hex');
  return codeKeyMemo;
}

/**
 * What every part folder of this build shares: the code, the library's settings, and what the page frame
 * shows from the rest of the library (title, owner, version, which sections the navigation links to).
 */
export function siteKey(library: Library): string {
  return createHash('sha256')
    .update(codeKey())
    .update(JSON.stringify(library.settings))
    .update(JSON.stringify({ plans: library.plans.length > 0, reviews: library.reviews.length > 0 }))
    .digest('hex');
}

/**
 * The key of one part's folder: the shared key, the part file's path and content hash, its measurement
 * files' paths and hashes, and whether its page links a PDF.
 */
export function partKey(site: string, part: Part, linksPdf: boolean): string {
  return createHash('sha256').update(`${site}\n${part.source.path}\n${part.source.hash}\n${measurementInputs(part.measurements)}\n${linksPdf ? 'pdf' : 'no pdf'}`).digest('hex').slice(0, 32);
}

export function recordFile(cacheRoot: string, outDir: string): string {
  return join(cacheRoot, 'builds', `${createHash('sha256').update(outDir).digest('hex').slice(0, 16)}.json`);
}

export function readRecord(file: string, outDir: string): BuildRecord | undefined {
  try {
    const record = JSON.parse(readFileSync(file, 'utf8')) as BuildRecord;
    return record.format === 1 && record.outDir === outDir && record.parts && typeof record.parts === 'object' ? record : undefined;
  } catch {
    return undefined;
  }
}

/** Forget the last build (before the site it describes is replaced). */
export function dropRecord(file: string): void {
  rmSync(file, { force: true });
}

/** A part's page data as JSON that reads back the same, or undefined (a number JSON cannot keep). */
function recordedPage(page: PartPageData | undefined): RecordedPage | undefined {
  if (!page) return undefined;
  const { charts: _charts, pdfFile: _pdfFile, measurements: _measurements, ...rest } = page;
  let faithful = true;
  JSON.stringify(rest, (_key, value: unknown) => {
    if (typeof value === 'number' && (!Number.isFinite(value) || Object.is(value, -0))) faithful = false;
    return value;
  });
  return faithful ? rest : undefined;
}

/**
 * Write the record of the site now in `outDir`: each part's key, files and page data. `unchanged` holds parts
 * whose files are the very ones the last record lists (linked, not rewritten), whose stamps are copied over.
 */
export function writeRecord(
  file: string,
  outDir: string,
  keys: ReadonlyMap<string, string>,
  pages: ReadonlyMap<string, PartPageData> = new Map(),
  last?: BuildRecord,
  unchanged: ReadonlySet<string> = new Set(),
  pdfs: Record<string, PdfStamp> = {},
): void {
  const parts: Record<string, PartRecord> = {};
  for (const [id, key] of keys) {
    let files = unchanged.has(id) ? last?.parts[id]?.files : undefined;
    if (!files) {
      const folder = join(outDir, 'parts', id);
      files = [];
      for (const name of readdirSync(folder).sort()) {
        const s = lstatSync(join(folder, name));
        if (s.isFile()) files.push([name, s.size, s.mtimeMs, s.ino]);
      }
    }
    parts[id] = { key, files, page: recordedPage(pages.get(id)) };
  }
  const record: BuildRecord = { format: 1, outDir, parts, pdfs };
  mkdirSync(dirname(file), { recursive: true });
  const temp = `${file}.${process.pid}.tmp`;
  writeFileSync(temp, JSON.stringify(record));
  renameSync(temp, file);
  pruneRecords(dirname(file));
}

/** Records of other output folders: the latest few are kept, so switching between two does not rebuild all. */
const RECORDS_KEPT = 8;

/** The output folder a record describes, read from its head (records are written with it as second key). */
function recordedOutDir(file: string): string | undefined {
  try {
    const head = readFileSync(file).subarray(0, 8192).toString('utf8');
    const match = /^\{"format":1,"outDir":("(?:[^"\\]|\\.)*")/.exec(head);
    return match ? (JSON.parse(match[1]) as string) : undefined;
  } catch {
    return undefined;
  }
}

/** Drop records of output folders that are gone (a scratch folder of `zfolio print`, say), and all but the latest few. */
function pruneRecords(dir: string): void {
  const records = readdirSync(dir)
    .filter((name) => name.endsWith('.json'))
    .map((name) => ({ name, mtimeMs: statSync(join(dir, name)).mtimeMs }))
    .sort((a, b) => b.mtimeMs - a.mtimeMs || (a.name < b.name ? -1 : 1));
  records.forEach(({ name }, i) => {
    const outDir = recordedOutDir(join(dir, name));
    if (i >= RECORDS_KEPT || outDir === undefined || !existsSync(outDir)) rmSync(join(dir, name), { force: true });
  });
}

/** True when the last site's folder for `id` holds exactly the files the record lists, unchanged since. */
function folderUnchanged(outDir: string, id: string, entry: PartRecord): boolean {
  const folder = join(outDir, 'parts', id);
  try {
    const names = readdirSync(folder);
    if (names.length !== entry.files.length) return false;
    return entry.files.every(([name, size, mtimeMs, ino]) => {
      const s = statSync(join(folder, name));
      return s.isFile() && s.size === size && s.mtimeMs === mtimeMs && s.ino === ino;
    });
  } catch {
    return false;
  }
}

/**
 * The parts whose folders in the last site (in `outDir`) can be carried over (same key, files untouched),
 * with the page data recorded for them.
 */
export function reusableParts(record: BuildRecord | undefined, keys: ReadonlyMap<string, string>, outDir: string): Map<string, RecordedPage | undefined> {
  const parts = new Map<string, RecordedPage | undefined>();
  if (!record) return parts;
  for (const [id, key] of keys) {
    const entry = record.parts[id];
    if (entry && entry.key === key && folderUnchanged(outDir, id, entry)) parts.set(id, entry.page);
  }
  return parts;
}

/**
 * Link the recorded files of the parts `ids` from the last site into `stagingDir`. Called once the build has
 * written everything else, so no later write can go through a link into the last site; a file the build did
 * write there anyway is kept as written. Returns the parts whose every file is now a link to the recorded one.
 */
export function linkPartFolders(record: BuildRecord | undefined, ids: Iterable<string>, outDir: string, stagingDir: string): Set<string> {
  const linked = new Set<string>();
  for (const id of ids) {
    const from = join(outDir, 'parts', id);
    const to = join(stagingDir, 'parts', id);
    mkdirSync(to, { recursive: true });
    let allLinked = true;
    for (const [name] of record?.parts[id]?.files ?? []) {
      try {
        linkSync(join(from, name), join(to, name));
      } catch (error) {
        allLinked = false;
        if ((error as NodeJS.ErrnoException).code === 'EEXIST') continue;
        // A file system without hard links (or across devices): a copy gives the same bytes.
        copyFileSync(join(from, name), join(to, name), constants.COPYFILE_EXCL);
      }
    }
    if (allLinked) linked.add(id);
  }
  return linked;
}
