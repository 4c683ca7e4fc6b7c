// Starting the chart worker threads (chart-worker.ts), for the chart pool or, on a cold build of many parts,
// before the library is read.
//
// A worker's start (loading vega, vega-lite and the chart modules) took 2.3 to 3.3 s of a 1,000-part build's
// CPU profile before its first job. Started by the chart pool, that comes after the library is read and
// checked, while one core idles; started first, it runs beside the reading.

import { existsSync, readdirSync, type Dirent } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { LEDGER_FILE } from './chart-cache-ledger.js';
import { slowerTierUp } from './tier-up.js';

const HERE = dirname(fileURLToPath(import.meta.url));
const RUNNING_TYPESCRIPT = import.meta.url.endsWith('.ts');

/** Below this many parts to draw (not carried over), starting worker threads costs more than it saves. */
export const PARTS_PER_WORKER_START = 40;

/** Worker threads when none are asked for: one per core, at most four. */
export const defaultWorkerCount = () => Math.min(availableParallelism(), 4);

/**
 * A chart worker's young generation: 96 MB (32 MB semi-spaces) instead of V8's 48. A worker allocates
 * much that dies within a part (rows, scene items, strings), and the larger young generation copies less of
 * it: one worker drawing 430 parts took 9.2 to 9.5 s of process CPU against 10.3 to 10.8 s with the
 * default (three pairs run side by side, load 14 to 18), and 8.0 and 8.8 s against 8.9 and 9.3 s with
 * 192 MB (two pairs).
 */
export const WORKER_LIMITS = { maxYoungGenerationSizeMb: 96 };

/** A started worker, and the error it failed with before anyone listened (its start failed). */
export interface StartedWorker {
  worker: Worker;
  failure?: Error;
}

/**
 * Under TypeScript (tests, development) a worker must register tsx itself: Node 20 applies neither the
 * parent's loader nor an --import in execArgv to a worker's entry file. The dev dependency tsx is then
 * present by definition.
 */
function typescriptWorker(file: string): Worker {
  const boot = `import('tsx/esm/api').then((tsx) => { tsx.register(); return import(${JSON.stringify(pathToFileURL(file).href)}); })`;
  return new Worker(boot, { eval: true, resourceLimits: WORKER_LIMITS });
}

export function startChartWorker(): StartedWorker {
  // Before the worker's isolate is made, which reads V8's flags then (tier-up.ts).
  slowerTierUp();
  const worker = RUNNING_TYPESCRIPT ? typescriptWorker(join(HERE, 'chart-worker.ts')) : new Worker(join(HERE, 'chart-worker.js'), { resourceLimits: WORKER_LIMITS });
  const started: StartedWorker = { worker };
  // Until the pool listens: an error here would otherwise end the process.
  worker.once('error', (error) => (started.failure = error));
  return started;
}

export interface EarlyStart {
  libraryRoot: string;
  /** The build's cache folder, none without a cache. */
  cacheRoot?: string;
  /** Where the record of the last build of this output folder would be (site-record.ts), none without a cache. */
  recordDir?: string;
  /** --workers. */
  workers?: number;
}

/**
 * The chart workers of a build that will draw every part of a library of many, started now: only when
 * nothing of a last build can be used (no record of one for this output folder, no chart in the cache)
 * and the library has at least PARTS_PER_WORKER_START part files. Any other build starts its workers once
 * it knows how many parts it draws (a rebuild after an edit draws one, and starts none). The chart pool
 * takes these over; the caller stops those it did not take.
 *
 * A build calls this as it starts, so V8's interrupt budget is raised here first for every build, whether it
 * starts workers now, later or never (tier-up.ts: a rebuild after one edit took about a tenth less CPU too).
 */
export function earlyChartWorkers(start: EarlyStart): StartedWorker[] {
  slowerTierUp();
  if (start.workers === 0) return [];
  if (start.recordDir && existsSync(start.recordDir)) return [];
  if (start.cacheRoot && !noCachedCharts(join(start.cacheRoot, 'charts'))) return [];
  if (!atLeastYamlFiles(join(start.libraryRoot, 'parts'), PARTS_PER_WORKER_START)) return [];
  return Array.from({ length: start.workers ?? defaultWorkerCount() }, startChartWorker);
}

/**
 * A rebuild of a library of at least this many part files starts one chart worker as it reads the first part
 * file not in the part cache (an edited part, whose charts are drawn again), so that the worker loads vega
 * beside the rest of the reading and the keying of 10,000 unchanged parts, which take longer than that load.
 * With fewer parts there is too little of that work, and the build waits for its worker: at 1,000 parts a
 * worker started as the build began made a one-edit rebuild 0.21 s slower. At 10,000 parts, started as the
 * edited part was read, it made it 0.12 s faster (ten alternated pairs, t = -3.9), though the reading and
 * keying beside it took 0.1 s longer. The worker is ready about 0.3 s after it starts (vega-runtime.ts), before
 * the build asks for its first chart, and compiles the chart kinds while it waits (chart-worker.ts); drawing
 * charts of invented parts then, or the edited part's before the keying, gained nothing (DEVELOPERS.md).
 */
export const REBUILD_WORKER_PARTS = 5000;

/**
 * For a rebuild that found a part to read afresh among `partFiles` part files: one chart worker started into
 * `early` (see REBUILD_WORKER_PARTS), unless the process is `warm`. A process that has built before (the
 * rebuilds of zfolio serve) reads and keys 10,000 unchanged parts with its code compiled, too soon for a
 * worker's start, and draws the few charts of an edit with that code too. One process building 10,000 parts
 * six times, the first part file edited before each (four processes each way, alternated): the third to sixth
 * builds took 0.45 to 0.78 s (mean 0.58) drawn here against 0.64 to 0.96 s (mean 0.79) with a worker started
 * for each; the second, which loads the chart code into this thread, 0.97 against 0.88 s.
 */
export function rebuildChartWorker(early: StartedWorker[], partFiles: number, options: { workers?: number; warm?: boolean } = {}): void {
  if (early.length > 0 || options.workers === 0 || options.warm || partFiles < REBUILD_WORKER_PARTS) return;
  early.push(startChartWorker());
}

/** Whether the chart cache holds no entry (its ledger alone does not count, chart-cache-ledger.ts). */
function noCachedCharts(dir: string): boolean {
  try {
    return readdirSync(dir).every((name) => name === LEDGER_FILE);
  } catch {
    return true;
  }
}

/** Whether `dir` holds at least `count` YAML files at any depth (stops counting there; unreadable folders hold none). */
function atLeastYamlFiles(dir: string, count: number): boolean {
  let found = 0;
  const folders = [dir];
  while (folders.length > 0 && found < count) {
    const folder = folders.pop()!;
    let entries: Dirent[];
    try {
      entries = readdirSync(folder, { withFileTypes: true });
    } catch {
      continue;
    }
    for (const e of entries) {
      if (e.name.startsWith('.')) continue;
      if (e.isDirectory()) folders.push(join(folder, e.name));
      else if (/\.ya?ml$/i.test(e.name)) found++;
    }
  }
  return found >= count;
}
