// Part charts kept on disk from the moment they are drawn until their page is rendered. A part page waits
// for a run of part pages (part-page-runs.ts), and every fresh part's page data is held until the index
// and comparisons are rendered, at the end; a part's four SVGs are about 35 KB of the 50 KB its page data takes: held in memory, a 10,000-part build
// held 350 MB of them at once. Spilled, each eleventy run reads back the SVGs of the pages it renders and
// lets them go when it ends (eleventy.ts).

import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { PartPageData } from '../pages/site-data.js';

/** The spill's folder in the staging folder: a name no page or download has; removed once the pages are rendered. */
export const SPILL_FOLDER = '.zfolio-charts';

/** Between two SVGs in a spill file: XML allows no NUL character, so none is inside one. */
const SEPARATOR = '\0';

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

  /** Write a page's part charts to disk and empty them in the page data. */
  put(page: PartPageData): void {
    if (page.charts.length === 0) return;
    if (this.count === 0) mkdirSync(this.dir, { recursive: true });
    const file = join(this.dir, `${this.count++}`);
    writeFileSync(file, page.charts.map((c) => c.svg).join(SEPARATOR));
    this.files.set(page, file);
    for (const chart of page.charts) chart.svg = '';
  }

  /** Read back the charts of the pages that were spilled (the others keep theirs). */
  load(pages: readonly PartPageData[]): void {
    for (const page of pages) {
      const file = this.files.get(page);
      if (!file) continue;
      const svgs = readFileSync(file, 'utf8').split(SEPARATOR);
      page.charts.forEach((chart, i) => (chart.svg = svgs[i]));
    }
  }

  /** Empty again the charts that `load` read back. */
  unload(pages: readonly PartPageData[]): void {
    for (const page of pages) if (this.files.has(page)) for (const chart of page.charts) chart.svg = '';
  }
}
