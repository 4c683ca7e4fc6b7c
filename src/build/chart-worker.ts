// A worker thread that renders charts: each worker compiles every chart kind once and reuses it for every
// part it is sent. Messages: WorkerJob in, {id, charts} or {id, error} out.

import { parentPort } from 'node:worker_threads';
import { renderChartJob, type ChartJob } from './chart-jobs.js';
import { writeCacheEntry } from './chart-cache-entry.js';

if (!parentPort) throw new Error('chart-worker.ts runs as a worker thread only');
const port = parentPort;

/**
 * A job, with the cache file its charts are stored in (written here: the specs it holds need not be copied
 * to the thread that sent the job), and whether the answer may leave out the specs (`slim`: a part whose
 * downloads this worker wrote, whose page needs only the SVG and the words).
 */
export interface WorkerJob {
  id: number;
  job: ChartJob;
  cacheFile?: string;
  slim?: boolean;
}

port.on('message', (message: WorkerJob) => {
  renderChartJob(message.job).then(
    (charts) => {
      if (message.cacheFile) writeCacheEntry(message.cacheFile, charts);
      port.postMessage({ id: message.id, charts: message.slim ? charts.map(({ spec: _, ...drawn }) => drawn) : charts });
    },
    (error: unknown) => port.postMessage({ id: message.id, error: error instanceof Error ? error.stack ?? error.message : String(error) }),
  );
});
