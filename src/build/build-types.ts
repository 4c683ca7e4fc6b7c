// What a build is asked for (BuildOptions) and what it answers (BuildResult): see build.ts.

import type { Diagnostic } from '../model/diagnostics.js';
import type { PartMeasurement } from '../measure/part-measurements.js';
import type { Library } from '../model/library.js';
import type { PaperSize } from '../model/settings.js';
import type { BuildWork } from './assemble.js';
import type { BuildTimings } from './stage-clock.js';
import type { ChartMaker } from './chart-maker.js';
import type { ChartPoolStats } from './chart-pool.js';
import type { SwapStep } from './output.js';
import type { FolioData } from '../pages/site-data.js';
import type { PrintedFile } from '../print/print.js';
import type { PrintBrowser } from '../print/browser.js';
import type { PrintSelection } from '../print/print-jobs.js';
import type { Progress } from './progress.js';

export interface BuildOptions {
  libraryRoot: string;
  /** Default: _site under the library. Must be a site zfolio wrote, an empty folder or absent (see output-guard.ts). */
  outDir?: string;
  /** The command's current folder, which the site may not replace (default: the process's). */
  cwd?: string;
  /** The home folder, which the site may not replace (default: the system's). */
  home?: string;
  progress?: Progress;
  /** Where charts come from; default: a ChartPool with the library's cache (see libraryChartPool). */
  charts?: ChartMaker;
  /** Worker threads for charts (default: one per core when many parts need drawing, none for a few). */
  workers?: number;
  /**
   * The process has built before (zfolio serve after its first build): a rebuild of a large library draws
   * its few charts in this thread instead of starting a worker for them (rebuildChartWorker, chart-workers.ts).
   */
  warm?: boolean;
  /** Part pages each eleventy run renders (default PART_PAGES_PER_RUN; see eleventy.ts). */
  partPagesPerRun?: number;
  /** Print PDFs too. */
  pdf?: PdfOptions;
  /**
   * Cache folder: drawn charts (charts/) and a record of the last build of each output folder (builds/), so
   * that a rebuild draws, writes and renders only what changed. False for none (every build starts from
   * nothing). Default: .zfolio-cache under the library.
   */
  cache?: string | false;
  /**
   * Whether a build that leaves no spare version for the next one (it had no record of the site it replaced)
   * makes one by hard links (spare-copy.ts). Default true; false for a site built once and thrown away.
   */
  spareCopy?: boolean;
  /** A git revision: the site gets a "Changes since REV" page. */
  since?: string;
  /** Called at each step of putting the new site in place (tests stop the process there). */
  onSwapStep?(step: SwapStep): void;
}

export interface PdfOptions {
  /** --chrome PATH. */
  chrome?: string;
  /** A running browser to print with instead of starting one (left running); `chrome` is then not used. */
  browser?: PrintBrowser;
  env: Readonly<Record<string, string | undefined>>;
  /** Default: folio.yaml's paper. */
  paper?: PaperSize;
  /** Printed in every footer; default: $SOURCE_DATE_EPOCH if set, else now. */
  date?: Date;
  /** Only these parts and reviews (default: all). */
  select?: PrintSelection;
}

export interface BuildResult {
  ok: boolean;
  diagnostics: Diagnostic[];
  outDir: string;
  parts: number;
  pages: number;
  seconds: number;
  library?: Library;
  /** Each measured part against its measurements, when the library loaded. */
  measurements?: ReadonlyMap<string, readonly PartMeasurement[]>;
  /** The data the pages were rendered from (a carried-over part's charts are left out: its page was not rendered). */
  folio?: FolioData;
  /** PDFs written (site-relative paths) with their page counts. */
  pdfs: PrintedFile[];
  /** Set when PDFs were asked for but could not be made (the HTML site was still written). */
  pdfProblem?: string;
  /** Parts whose folders were carried over unchanged from the last build. */
  reused: number;
  /** Units of the site (part and comparison folders, index pages, row scripts) left as the spare version had them. */
  unitsKept: number;
  /** Units hard-linked from the last site. */
  unitsLinked: number;
  /** What the build had to do (counts), in proportion to what changed. */
  work: BuildWork;
  /** Without printing: PDFs of the last build kept because their inputs are unchanged. */
  keptPdfs: number;
  /** Without printing: PDFs of the last build that were not kept (site-relative paths). */
  removedPdfs: string[];
  /** The chart pool's counts (absent when charts came from a given chart maker). */
  charts?: ChartPoolStats;
  timings: BuildTimings;
}
