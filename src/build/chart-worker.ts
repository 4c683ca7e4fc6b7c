// A worker thread that renders charts: each worker compiles every chart kind once and reuses it for every
// part it is sent. Messages: WorkerJob in, {id, charts} or {id, error} out.

import { parentPort } from 'node:worker_threads';
import { withoutSpecs, type ChartJob } from './chart-jobs.js';
import { renderChartJob } from './chart-draw.js';
import { storeCharts, withoutSvgs } from './chart-cache-entry.js';
import { collectGarbage } from './collect-garbage.js';

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

/** Jobs between two full garbage collections of this worker (collect-garbage.ts says why). */
const JOBS_BETWEEN_COLLECTIONS = 100;
let jobs = 0;

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
      if (++jobs % JOBS_BETWEEN_COLLECTIONS === 0) collectGarbage();
    },
    (error: unknown) => failed(message.id, error),
  );
});
