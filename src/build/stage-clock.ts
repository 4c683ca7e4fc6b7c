// How long each stage of a build took, in wall-clock and CPU seconds.

import type { AssembleTimings } from './assemble.js';

/** Wall-clock seconds and CPU seconds of the whole process (every thread) spent in one stage. */
export interface StageTime {
  seconds: number;
  cpuSeconds: number;
}

export interface BuildTimings {
  /** Reading and checking the library; finding what the last build left that can be reused. */
  load: StageTime;
  /** Analyses, charts and downloads: the site's data. */
  assemble: StageTime & AssembleTimings;
  /** Eleventy rendering and writing the pages, the static assets, and linking the carried-over part folders. */
  pages: StageTime;
  pdf: StageTime;
  /** Putting the new site in place of the old, and recording what it holds. */
  swap: StageTime;
}

export function stageClock(): () => StageTime {
  const wall = performance.now();
  const cpu = process.cpuUsage();
  return () => {
    const used = process.cpuUsage(cpu);
    return { seconds: (performance.now() - wall) / 1000, cpuSeconds: (used.user + used.system) / 1e6 };
  };
}

