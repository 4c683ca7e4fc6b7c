// Part charts kept on disk from the moment they are drawn until their page is rendered. A part page waits
// for a run of part pages (part-page-runs.ts), and every fresh part's page data is held until the index
// and comparisons are rendered, at the end; a part's four SVGs are about 35 KB of the 50 KB its page data takes: held in memory, a 10,000-part build
// held 350 MB of them at once. Spilled, each eleventy run reads back the SVGs of the pages it renders and
// lets them go when it ends (eleventy.ts). A page's file is a chart file (chart-cache-entry.ts), written by
// the thread that draws its charts (a hard link to their cache entry when there is one): `reserve` names it
// before the charts are asked for and `adopt` takes the page whose charts came back without SVGs. Charts this
// thread holds are written with `put`.

import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { PartPageData } from '../pages/site-data.js';
import { chartFileText, readChartFileSvgs } from './chart-cache-entry.js';

/** The spill's folder in the staging folder: a name no page or download has; removed once the pages are rendered. */
export const SPILL_FOLDER = '.zfolio-charts';

/** Loads the spilled charts of the pages about to be rendered, and lets them go again after. */
export interface PageCharts {
  load(pages: readonly PartPageData[]): void;
  unload(pages: readonly PartPageData[]): void;
}

export class SvgSpill implements PageCharts {
  /** The spill file of each page whose charts are on disk. */
  private readonly files = new WeakMap<PartPageData, string>();
  private count = 0;
  private readonly dir: string;

  /** In the build's staging folder (so a failed or killed build's spill goes with it), made at the first page. */
  constructor(stagingDir: string) {
    this.dir = join(stagingDir, SPILL_FOLDER);
  }

  /** Remove the spill (before the staging folder becomes the site). */
  remove(): void {
    rmSync(this.dir, { recursive: true, force: true });
  }

  /** A new file for a page's charts, for the thread that draws them to write (`adopt` takes the page). */
  reserve(): string {
    if (this.count === 0) mkdirSync(this.dir, { recursive: true });
    return join(this.dir, `${this.count++}`);
  }

  /**
   * A page whose charts were drawn into `file` (from `reserve`) and came back without SVGs; charts that came
   * back with theirs (a chart maker that writes no files) are written here.
   */
  adopt(page: PartPageData, file: string): void {
    if (page.charts.length === 0) return;
    if (page.charts.some((c) => c.svg !== '')) this.put(page);
    else this.files.set(page, file);
  }

  /** Write a page's part charts to disk and empty them in the page data. */
  put(page: PartPageData): void {
    if (page.charts.length === 0) return;
    const file = this.reserve();
    writeFileSync(file, chartFileText(page.charts));
    this.files.set(page, file);
    for (const chart of page.charts) chart.svg = '';
  }

  /** Read back the charts of the pages that were spilled (the others keep theirs). */
  load(pages: readonly PartPageData[]): void {
    for (const page of pages) {
      const file = this.files.get(page);
      if (!file) continue;
      const svgs = readChartFileSvgs(file);
      if (svgs.length !== page.charts.length) throw new Error(`${file}: ${svgs.length} charts, not the page's ${page.charts.length}`);
      page.charts.forEach((chart, i) => (chart.svg = svgs[i]));
    }
  }

  /** Empty again the charts that `load` read back. */
  unload(pages: readonly PartPageData[]): void {
    for (const page of pages) if (this.files.has(page)) for (const chart of page.charts) chart.svg = '';
  }
}
