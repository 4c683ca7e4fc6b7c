// A full garbage collection on request: between eleventy runs of part pages, where a build knows a large
// amount of memory has just become garbage, and in a chart worker whose heap has grown past a bound
// (COLLECT_ABOVE_BYTES, chart-worker.ts).
//
// V8 collects only when its heap has grown, and lets it grow while the process has memory to spare, so a
// long build's threads held hundreds of megabytes of garbage each: the main heap of a 10,000-part build
// grew by about a run's worth with every run of part pages (to 1,152 MB), and a chart worker's heap by the
// parts it had drawn (about 110 MB after 100 parts, 200 MB after 500). Replacing each worker after 200
// parts instead cost its start again each time (loading the chart modules, compiling every spec): a
// 1,000-part build took 59 s of CPU against 41 s. A heap limit (resourceLimits) made the collector run far
// more often: 64 MB doubled a 200-part build's CPU.

import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

let gc: (() => void) | undefined;

/** Collect this thread's garbage now. */
export function collectGarbage(): void {
  if (!gc) {
    // The flag makes `gc` a global of contexts made after it is set; the one made here hands it over.
    setFlagsFromString('--expose-gc');
    gc = runInNewContext('gc') as () => void;
  }
  gc();
}
