// Part pages rendered while the charts of other parts are still being drawn.
//
// A part page reads only its own part and the site header (eleventy.ts, renderPartPages), so it can be
// rendered as soon as its charts are drawn. Rendered after every chart instead, the part pages were a tail of
// the build on this thread alone, one core idle (a 1,000-part build's CPU profile: 6 of its last 7.4 s).
// Here each page is handed over when its data is complete; a run of part pages starts once MIN_PART_PAGES_PER_RUN
// wait and no run is going, and takes every page waiting, up to a full run (PART_PAGES_PER_RUN). Pages that
// arrive during a run wait for the next. Once every part's page is in (`flush`), what waits is rendered
// whatever its number, while the comparisons' charts are drawn.

import type { Library } from '../model/library.js';
import { folioHeader, type PartPageData } from '../pages/site-data.js';
import { collectGarbage } from './collect-garbage.js';
import { PART_PAGES_PER_RUN, preparePartPages, renderPartPages, type PreparedPartPages } from './eleventy.js';
import type { PageCharts } from './svg-spill.js';

/**
 * Part pages that start a run before every part's page is in. A run costs about a new eleventy's start on top
 * of its pages; fewer than this and the start is a large share.
 */
export const MIN_PART_PAGES_PER_RUN = 100;

export interface PartPageRunsOptions {
  /** Render one run of part pages; resolves to the count of pages written. */
  render(pages: PartPageData[]): Promise<number>;
  /** Start a run before its pages are known (see `prepare`); given to it, it renders them as `render` would. */
  prepare?(): PreparedPartPages;
  /** At most this many pages a run (default PART_PAGES_PER_RUN). */
  perRun?: number;
  /** A run starts once this many pages wait (default MIN_PART_PAGES_PER_RUN, at most `perRun`). */
  minRun?: number;
  /** Called each time another `perRun` pages have been rendered and more are to come (default collectGarbage, collect-garbage.ts). */
  collect?: () => void;
}

export class PartPageRuns {
  /** Pages written, and runs made, so far. */
  written = 0;
  runs = 0;
  private readonly waiting: PartPageData[] = [];
  private readonly perRun: number;
  private readonly minRun: number;
  private running?: Promise<void>;
  private failed?: { error: unknown };
  /** Every page is in (flush), or the build is being abandoned (settle). */
  private allIn = false;
  private stopped = false;
  private sinceCollection = 0;
  /** The next run, started ahead (prepare). */
  private prepared?: PreparedPartPages;

  constructor(private readonly options: PartPageRunsOptions) {
    this.perRun = Math.max(1, options.perRun ?? PART_PAGES_PER_RUN);
    this.minRun = Math.min(this.perRun, Math.max(1, options.minRun ?? MIN_PART_PAGES_PER_RUN));
  }

  /** A part page whose data (charts included) is complete. */
  add(page: PartPageData): void {
    this.waiting.push(page);
    this.next();
  }

  /**
   * Start the next run now, before its pages are in: called while the build's thread would wait for the chart
   * workers (a rebuild after one edit waits for its part's charts), so that the run's start is not added
   * after them. Does nothing when a run is started ahead already, or without the `prepare` option.
   */
  prepare(): void {
    if (!this.stopped) this.prepared ??= this.options.prepare?.();
  }

  /** Every part page is in: what waits is rendered, however few. */
  flush(): void {
    this.allIn = true;
    this.next();
  }

  /** Wait until every page handed over is rendered; resolves to the pages written, or throws a run's error. */
  async done(): Promise<number> {
    this.flush();
    while (this.running) await this.running;
    if (this.failed) throw this.failed.error;
    return this.written;
  }

  /** Start no more runs and wait for the one going, whatever its outcome (before the staging folder is removed). */
  async settle(): Promise<void> {
    this.stopped = true;
    while (this.running) await this.running;
  }

  private next(): void {
    if (this.running || this.failed || this.stopped || this.waiting.length === 0) return;
    if (!this.allIn && this.waiting.length < this.minRun) return;
    const pages = this.waiting.splice(0, this.perRun);
    const render = this.prepared ?? ((p: PartPageData[]) => this.options.render(p));
    this.prepared = undefined;
    this.running = render(pages).then(
      (written) => {
        this.written += written;
        this.runs++;
        this.sinceCollection += pages.length;
        // What the run let go of is collected before the pages to come pile up on it (collect-garbage.ts).
        if (this.sinceCollection >= this.perRun && !(this.allIn && this.waiting.length === 0)) {
          this.sinceCollection = 0;
          (this.options.collect ?? collectGarbage)();
        }
      },
      (error: unknown) => {
        this.failed = { error };
      },
    ).then(() => {
      this.running = undefined;
      this.next();
    });
  }
}

/** The part page runs of a build of `library` into `siteDir`, with its spilled charts (svg-spill.ts). */
export function buildPageRuns(siteDir: string, library: Library, charts: PageCharts, perRun?: number): PartPageRuns {
  const header = folioHeader(library);
  return new PartPageRuns({ render: (pages) => renderPartPages(siteDir, header, pages, charts), prepare: () => preparePartPages(siteDir, header, charts), perRun });
}
