// Previewing a folio: build it, serve the output folder, and build again whenever an input changes.
// Builds never overlap: changes that arrive during a build queue exactly one more. A build that fails
// (a bad part file, a broken template) leaves the previous site in place, and it goes on being served.

import { join, resolve } from 'node:path';
import { buildFolio, CACHE_DIR, DEFAULT_OUT_DIR, type BuildResult } from '../build/build.js';
import { warmChartDrawing } from '../build/chart-warm-up.js';
import { TEMPLATES_DIR } from '../build/eleventy.js';
import { guardOutput, holdingDir } from '../build/output-guard.js';
import { silentProgress, type Progress } from '../build/progress.js';
import { startServer, type StaticServer } from './static-server.js';
import { watchLibrary, type LibraryWatcher } from './watch.js';

export interface ServeOptions {
  libraryRoot: string;
  /** Default: _site under the library; refused as a build refuses it (output-guard.ts). */
  outDir?: string;
  /** As for a build: the current folder and the home folder, which the site may not replace. */
  cwd?: string;
  home?: string;
  /** Default 8080 (or the next free port); 0 lets the system choose. */
  port?: number;
  /** Default 127.0.0.1. */
  host?: string;
  /** Chart worker threads, as for a build. */
  workers?: number;
  /** Also rebuild when a file under the package's templates/ changes. Default true. */
  watchTemplates?: boolean;
  debounceMs?: number;
  /** Progress of the first build (rebuilds are reported by onBuild only). */
  progress?: Progress;
  /** After every build, the first one included. */
  onBuild?(report: BuildReport): void;
  /** A folder that could not be watched. */
  onWatchError?(error: Error): void;
}

export interface BuildReport {
  /** 0 for the first build, then 1, 2, ... */
  round: number;
  /** The inputs whose change started this build (empty for the first). */
  changed: string[];
  /** When the build ended. */
  at: Date;
  /** The build's result, ok or not; absent when the build threw. */
  result?: BuildResult;
  /** What went wrong when the build threw (a template error, a full disk). */
  error?: Error;
}

export interface FolioServer {
  url: string;
  port: number;
  requestedPort: number;
  outDir: string;
  /** The first build's report. */
  first: BuildReport;
  /** The last finished build's report. */
  latest(): BuildReport;
  /** Resolves once no build is running and none is waiting. */
  idle(): Promise<void>;
  /** Stop watching and serving; waits for a running build to finish so no staging folder is left. */
  close(): Promise<void>;
}

/** Runs one task at a time; requests during a run fold into one more run, with their changes merged. */
export function oneAtATime(task: (changed: string[]) => Promise<void>) {
  let running: Promise<void> | undefined;
  let waiting: Set<string> | undefined;
  let stopped = false;
  const start = (changed: string[]) => {
    running = task(changed)
      .catch(() => {})
      .finally(() => {
        running = undefined;
        if (waiting && !stopped) {
          const next = [...waiting].sort();
          waiting = undefined;
          start(next);
        }
      });
  };
  return {
    request(changed: string[]) {
      if (stopped) return;
      if (!running) return start(changed);
      waiting ??= new Set();
      for (const c of changed) waiting.add(c);
    },
    get busy() {
      return running !== undefined;
    },
    async idle() {
      while (running) await running;
    },
    /** Take no more requests and drop the waiting one. */
    stop() {
      stopped = true;
      waiting = undefined;
    },
  };
}

export async function serveFolio(options: ServeOptions): Promise<FolioServer> {
  const libraryRoot = resolve(options.libraryRoot);
  const outDir = resolve(libraryRoot, options.outDir ?? DEFAULT_OUT_DIR);
  const { cwd, home } = options;
  // An output folder that may not be replaced is refused before anything else happens.
  guardOutput(outDir, { libraryRoot, cwd: cwd ?? process.cwd(), home });
  // Listen first: a port or host that cannot work is reported before the build's time is spent.
  const server: StaticServer = await startServer({ root: outDir, port: options.port, host: options.host });

  let round = 0;
  let first: BuildReport | undefined;
  let latest: BuildReport | undefined;
  const buildOnce = async (changed: string[]) => {
    const report: BuildReport = { round: round++, changed, at: new Date() };
    const progress = report.round === 0 ? (options.progress ?? silentProgress) : silentProgress;
    try {
      // After the first build this process's code is compiled, and a rebuild draws its few charts itself.
      report.result = await buildFolio({ libraryRoot, outDir, cwd, home, workers: options.workers, progress, warm: report.round > 0 });
    } catch (error) {
      report.error = error instanceof Error ? error : new Error(String(error));
    }
    report.at = new Date();
    first ??= report;
    latest = report;
    options.onBuild?.(report);
    // The rebuilds draw an edit's charts in this thread (warm, above): their code is loaded and run once now,
    // before the first edit, rather than by it (chart-warm-up.ts).
    if (report.round === 0) void warmChartDrawing().catch(() => {});
  };
  const queue = oneAtATime(buildOnce);

  let watcher: LibraryWatcher | undefined;
  try {
    // Watch before the first build, so an edit made while it runs is not missed.
    watcher = watchLibrary({
      libraryRoot,
      templatesDir: options.watchTemplates === false ? undefined : TEMPLATES_DIR,
      ignore: [outDir, holdingDir(outDir), join(libraryRoot, CACHE_DIR)],
      debounceMs: options.debounceMs,
      onChange: (changed) => queue.request(changed),
      onError: options.onWatchError,
    });
    queue.request([]);
    await queue.idle();
  } catch (error) {
    watcher?.close();
    await server.close();
    throw error;
  }
  let closing: Promise<void> | undefined;
  return {
    url: server.url,
    port: server.port,
    requestedPort: server.requestedPort,
    outDir,
    first: first!,
    latest: () => latest!,
    idle: () => queue.idle(),
    close: () =>
      (closing ??= (async () => {
        watcher!.close();
        queue.stop();
        await server.close();
        await queue.idle();
      })()),
  };
}
