// A chart placed on its page: the page's record of it, and its download written beside the page.

import type { Part } from '../model/part.js';
import type { ChartArtifact, DrawnChart } from './chart-maker.js';
import type { ChartOnPage } from '../pages/site-data.js';
import { specFileName, writeChartSpec } from './part-downloads.js';
import { partSpecPath } from '../pages/spec-download.js';
import { drawsAdmittancePlane } from '../charts/plane-kind.js';
import { writeFileDeep } from './output.js';

/** A chart as its page shows it; its spec is (or was) written beside the page. */
export function chartOnPage(chart: DrawnChart): ChartOnPage {
  return { key: chart.key, title: chart.title, description: chart.description, svg: chart.svg, specFile: specFileName(chart) };
}

/** Time spent on parts of the work, in seconds (for benchmarks and a build's breakdown). */
export interface AssembleTimings {
  /** Analysing every part (sweeps, resonances, bands). */
  analyse: number;
  /**
   * Writing downloads on this thread: figures and chart specs of plans and comparisons, and a part's
   * downloads when its charts came from the cache (the chart workers write the others, part-downloads.ts).
   */
  downloads: number;
}

/** Write a file and add the time it took, text making included, to `timings.downloads`. */
export function timedWrite(timings: AssembleTimings | undefined, path: string, content: () => string): void {
  const started = performance.now();
  writeFileDeep(path, content());
  if (timings) timings.downloads += (performance.now() - started) / 1000;
}

/** Write a chart's spec beside its page (writeChartSpec) and say where it is, relative to the page. */
export function placeChart(chart: ChartArtifact, folder: string, timings?: AssembleTimings): ChartOnPage {
  const started = performance.now();
  writeChartSpec(chart, folder);
  if (timings) timings.downloads += (performance.now() - started) / 1000;
  return chartOnPage(chart);
}

/** A part chart on its page: its download is the site's shared spec that draws the sweep.csv beside it (spec-download.ts). */
export function partChartOnPage(part: Part): (chart: DrawnChart) => ChartOnPage {
  return (chart) => ({ ...chartOnPage(chart), specPath: partSpecPath(chart.key, drawsAdmittancePlane(part)) });
}
