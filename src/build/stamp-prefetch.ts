// The stamps a rebuild needs of every part, taken in a worker thread while this one reads the records.
//
// A rebuild after one edit looks at every part twice on disk: the part file's stamp (part-cache.ts: is it
// the file read before?) and, with a spare version, the spare's page of the part (unit-stamp.ts: was the
// page edited by hand since?). At 10,000 parts those 20,000 stat calls were about a tenth of the rebuild,
// all on this thread. A worker takes them (listing the library's part folders and the spare's part and
// comparison folders itself) while this thread reads the part cache's heads and the spare's record, which
// need no stamp, and answers the part files' stamps first, then the pages' while this thread reads the
// library. A stamp the worker did not take (a file it did not list, or the worker failed) is taken here as
// before. Taken earlier than before, each is still taken before the file it stamps is read or kept, which is
// what a stamp promises. One-edit rebuilds of 10,000 parts, alternated with the code before (5 each, load
// 14 to 17): 1.25 s of this thread's CPU against 1.44 s, 0.1 s more CPU in all (the worker's start).
//
// The worker is a script of its own: it loads no module of zfolio's (nor, in the tests, the TypeScript loader).

import { basename, dirname, join } from 'node:path';
import { Worker } from 'node:worker_threads';
import type { PartCache } from '../model/part-cache.js';
import { holdingName } from './output-guard.js';
import type { SiteRecord } from './site-record.js';

/**
 * Fewer units than this in the spare version (about as many parts), and the stat calls cost less than a
 * thread's start: at 1,000 parts the worker added 0.1 s of CPU and this thread waited for its first answer
 * (one-edit rebuilds, load 14).
 */
export const UNITS_PER_PREFETCH = 3000;

/** What the worker answers. */
export interface Stamps {
  /** Part file stamps (part-cache.ts: size, mtime, ctime, inode, device) by library-relative path. */
  parts: ReadonlyMap<string, number[]>;
  /** The spare's folder units' pages (size, mtime, inode), by unit ("parts/ID"); a unit without a page is absent. */
  sparePages: ReadonlyMap<string, number[]>;
}

const SCRIPT = `
const { parentPort, workerData } = require('node:worker_threads');
const { readdirSync, statSync } = require('node:fs');
const YAML = /\\.ya?ml$/i;
const files = [], fileStamps = [];
const walk = (dir, rel) => {
  let entries;
  try { entries = readdirSync(dir, { withFileTypes: true }); } catch { return; }
  for (const e of entries) {
    if (e.name.startsWith('.')) continue;
    const path = rel + '/' + e.name;
    if (e.isDirectory()) walk(dir + '/' + e.name, path);
    else if (e.isFile() && YAML.test(e.name)) {
      const s = statSync(dir + '/' + e.name, { throwIfNoEntry: false });
      if (s) { files.push(path); fileStamps.push(s.size, s.mtimeMs, s.ctimeMs, s.ino, s.dev); }
    }
  }
};
walk(workerData.library + '/parts', 'parts');
const a = Float64Array.from(fileStamps);
parentPort.postMessage({ names: files, values: a }, [a.buffer]);
const units = [], pages = [];
for (const folder of workerData.unitFolders) {
  let entries;
  try { entries = readdirSync(workerData.spare + '/' + folder, { withFileTypes: true }); } catch { continue; }
  for (const e of entries) {
    if (!e.isDirectory()) continue;
    const s = statSync(workerData.spare + '/' + folder + '/' + e.name + '/index.html', { throwIfNoEntry: false });
    if (s && s.isFile()) { units.push(folder + '/' + e.name); pages.push(s.size, s.mtimeMs, s.ino); }
  }
}
const b = Float64Array.from(pages);
parentPort.postMessage({ names: units, values: b }, [b.buffer]);
`;

/** One of the worker's two answers: names, and their numbers in a row. */
interface Answer {
  names: string[];
  values: Float64Array;
}

/** Grouped by `width` numbers an entry. */
function byName(names: readonly string[], values: Float64Array, width: number): Map<string, number[]> {
  const map = new Map<string, number[]>();
  names.forEach((name, i) => map.set(name, Array.from(values.subarray(i * width, (i + 1) * width))));
  return map;
}

/**
 * Start taking the stamps of the library's part files, then of the pages of the spare version's part and
 * comparison folders (`spareDir`, as it is named before this build claims it: a rename keeps every stamp),
 * so that the part files' are had first. A promise gives undefined when the worker failed before its answer;
 * the caller then stats as before.
 */
export function prefetchStamps(libraryRoot: string, spareDir: string): { parts: Promise<Stamps['parts'] | undefined>; sparePages: Promise<Stamps['sparePages'] | undefined> } {
  const answers: ((found: Map<string, number[]> | undefined) => void)[] = [];
  const parts = new Promise<Map<string, number[]> | undefined>((resolve) => answers.push(resolve));
  const sparePages = new Promise<Map<string, number[]> | undefined>((resolve) => answers.push(resolve));
  const widths = [5, 3];
  let worker: Worker;
  try {
    worker = new Worker(SCRIPT, { eval: true, workerData: { library: libraryRoot, spare: spareDir, unitFolders: ['parts', 'comparisons'] } });
  } catch {
    for (const answer of answers) answer(undefined);
    return { parts, sparePages };
  }
  let received = 0;
  worker.on('message', (answer: Answer) => {
    answers[received](byName(answer.names, answer.values, widths[received]));
    if (++received === answers.length) void worker.terminate();
  });
  const fail = () => {
    for (const answer of answers) answer(undefined);
  };
  worker.once('error', fail);
  worker.once('exit', fail);
  return { parts, sparePages };
}

/**
 * The stamps being taken for a rebuild with a spare version (the version before the site path's, which it
 * updates) of at least UNITS_PER_PREFETCH units, or as `wanted` says; none for any other build.
 */
export function stampsFor(libraryRoot: string, outDir: string, record: SiteRecord | undefined, wanted?: boolean): ReturnType<typeof prefetchStamps> | undefined {
  return record?.spare && (wanted ?? record.spare.estimatedUnits() >= UNITS_PER_PREFETCH) ? prefetchStamps(libraryRoot, join(dirname(outDir), holdingName(basename(outDir)), record.spare.name)) : undefined;
}

/**
 * Read the part cache's heads and the spare's record while the part files are stamped, then hand their
 * stamps to the cache; the spare's pages are stamped while this thread reads the library.
 */
export async function readWhileStamping(stamps: ReturnType<typeof prefetchStamps>, partCache: PartCache | undefined, record: SiteRecord | undefined): Promise<void> {
  partCache?.readHeads();
  record?.spare?.readAll();
  const parts = await stamps.parts;
  if (parts) partCache?.useStamps(parts);
}
