// A worker thread that renders charts: each worker compiles every chart kind once and reuses it for every
// part it is sent. Messages: WorkerJob in, {id, charts} or {id, error} out.
//
// It asks for a full collection only once its heap holds more than COLLECT_ABOVE_BYTES: what it keeps is
// small since vega lets go of the items that leave a chart (cleaning-view.ts), but V8 lets the garbage
// grow while memory is plentiful. One every 100 parts threw away optimized code that named objects which had
// died (V8's "weak objects" deoptimization), and V8's background threads optimized it again after each
// (most of their time was the optimizing compiler, perf): one worker drawing 430 parts took 4.0 to 4.4 s of
// those threads beside its own 7.1 to 8.4 s, and 2.7 to 2.9 s beside 6.8 to 8.0 s without the collections
// and with cleaning-view.ts (three pairs run side by side, load 7 to 10). With none at all, a cold build of
// 10,000 parts peaked at 1,622 and 1,713 MB of RSS (the goal is under 1.5 GB), and at 1,228 MB with one every
// 100 parts.

import { getHeapStatistics } from 'node:v8';
import { parentPort } from 'node:worker_threads';
import { collectGarbage } from './collect-garbage.js';
import { withoutSpecs, type ChartJob } from './chart-jobs.js';
import { precompilePartCharts, renderChartJob } from './chart-draw.js';
import { storeCharts, withoutSvgs } from './chart-cache-entry.js';

if (!parentPort) throw new Error('chart-worker.ts runs as a worker thread only');
const port = parentPort;

/**
 * A job, with the cache file its charts are stored in (written here: the specs it holds need not be copied
 * to the thread that sent the job), whether the answer and the cache entry may leave out the specs
 * (`slim`: a part's charts, whose page needs only the SVG and the words and offers the site's shared specs),
 * and the file the SVGs wait in until their page is rendered (`svgFile`, svg-spill.ts: the answer then
 * holds no SVG).
 */
export interface WorkerJob {
  id: number;
  job: ChartJob;
  cacheFile?: string;
  slim?: boolean;
  svgFile?: string;
}

/** Heap in use above which a worker collects its garbage after a job (collect-garbage.ts). */
export const COLLECT_ABOVE_BYTES = 256 * 2 ** 20;

const failed = (id: number, error: unknown) => port.postMessage({ id, error: error instanceof Error ? error.stack ?? error.message : String(error) });

port.on('message', (message: WorkerJob) => {
  renderChartJob(message.job).then(
    (charts) => {
      const answer = message.slim ? withoutSpecs(charts) : charts;
      try {
        storeCharts(answer, message.cacheFile, message.svgFile);
      } catch (error) {
        failed(message.id, error);
        return;
      }
      port.postMessage({ id: message.id, charts: message.svgFile ? withoutSvgs(answer) : answer });
      if (getHeapStatistics().used_heap_size > COLLECT_ABOVE_BYTES) collectGarbage();
    },
    (error: unknown) => failed(message.id, error),
  );
});

// The kinds a part's and a comparison's charts use, compiled while no job has come yet: a rebuild's worker
// has about 90 ms between loading and its first job, and the first charts took 170 to 210 ms with the
// compiling, 30 to 50 without (DEVELOPERS.md).
precompilePartCharts();
