// A worker thread that renders charts: each worker compiles every chart kind once and reuses it for every
// part it is sent. Messages: WorkerJob in, {id, charts} or {id, error} out.

import { parentPort } from 'node:worker_threads';
import { renderChartJob, withoutSpecs, type ChartJob } from './chart-jobs.js';
import { writeCacheEntry } from './chart-cache-entry.js';
import { collectGarbage } from './collect-garbage.js';

if (!parentPort) throw new Error('chart-worker.ts runs as a worker thread only');
const port = parentPort;

/**
 * A job, with the cache file its charts are stored in (written here: the specs it holds need not be copied
 * to the thread that sent the job), and whether the answer and the cache entry may leave out the specs
 * (`slim`: a part's charts, whose page needs only the SVG and the words and offers the site's shared specs).
 */
export interface WorkerJob {
  id: number;
  job: ChartJob;
  cacheFile?: string;
  slim?: boolean;
}

/** Jobs between two full garbage collections of this worker (collect-garbage.ts says why). */
const JOBS_BETWEEN_COLLECTIONS = 100;
let jobs = 0;

port.on('message', (message: WorkerJob) => {
  renderChartJob(message.job).then(
    (charts) => {
      const answer = message.slim ? withoutSpecs(charts) : charts;
      if (message.cacheFile) writeCacheEntry(message.cacheFile, answer);
      port.postMessage({ id: message.id, charts: answer });
      if (++jobs % JOBS_BETWEEN_COLLECTIONS === 0) collectGarbage();
    },
    (error: unknown) => port.postMessage({ id: message.id, error: error instanceof Error ? error.stack ?? error.message : String(error) }),
  );
});
