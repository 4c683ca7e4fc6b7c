// A worker thread that renders charts: each worker compiles every chart kind once and reuses it for every
// part it is sent. Messages: {id, job} in, {id, charts} or {id, error} out.

import { parentPort } from 'node:worker_threads';
import { renderChartJob, type ChartJob } from './chart-jobs.js';

if (!parentPort) throw new Error('chart-worker.ts runs as a worker thread only');
const port = parentPort;

port.on('message', (message: { id: number; job: ChartJob }) => {
  renderChartJob(message.job).then(
    (charts) => port.postMessage({ id: message.id, charts }),
    (error: unknown) => port.postMessage({ id: message.id, error: error instanceof Error ? error.stack ?? error.message : String(error) }),
  );
});
