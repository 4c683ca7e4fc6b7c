// zfolio build: library -> figures -> charts -> pages (-> PDFs), written to a staging folder and swapped in
// whole, so a failed build never leaves a half-written site.

import { cpSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import type { Diagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import type { PaperSize } from '../model/settings.js';
import { assembleSite } from './assemble.js';
import { chromeHint, findChrome } from './browser.js';
import type { ChartMaker } from './chart-maker.js';
import { ChartPool } from './chart-pool.js';
import { renderPages, TEMPLATES_DIR } from './eleventy.js';
import { stageOutput } from './output.js';
import { printJobs, type PrintedFile } from './print.js';
import { buildDate, printJobsFor, type PrintSelection } from './print-jobs.js';
import { silentProgress, type Progress } from './progress.js';

export interface BuildOptions {
  libraryRoot: string;
  /** Default: _site under the library. */
  outDir?: string;
  progress?: Progress;
  /** Where charts come from; default: a ChartPool with the library's cache (see chartPoolFor). */
  charts?: ChartMaker;
  /** Worker threads for charts (default: one per core for larger libraries, none for small ones). */
  workers?: number;
  /** Print PDFs too. */
  pdf?: PdfOptions;
  /** Chart cache folder; false for none. Default: .zfolio-cache/charts under the library. */
  cache?: string | false;
}

export interface PdfOptions {
  /** --chrome PATH. */
  chrome?: string;
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
  /** PDFs written (site-relative paths) with their page counts. */
  pdfs: PrintedFile[];
  /** Set when PDFs were asked for but could not be made (the HTML site was still written). */
  pdfProblem?: string;
}

export const DEFAULT_OUT_DIR = '_site';
/** Under the library; listed in .gitignore. */
export const CACHE_DIR = '.zfolio-cache';

export async function buildFolio(options: BuildOptions): Promise<BuildResult> {
  const started = performance.now();
  const progress = options.progress ?? silentProgress;
  const libraryRoot = resolve(options.libraryRoot);
  const outDir = resolve(libraryRoot, options.outDir ?? DEFAULT_OUT_DIR);
  const { library, diagnostics } = loadLibrary(libraryRoot);
  const result: BuildResult = { ok: false, diagnostics, outDir, parts: 0, pages: 0, seconds: 0, pdfs: [] };
  if (!library) return result;
  result.library = library;

  const pool = options.charts ? undefined : chartPoolFor(library, options.workers, options.cache);
  const staging = stageOutput(outDir);
  try {
    const folio = await assembleSite({ library, siteDir: staging.dir, charts: options.charts ?? pool!, progress, withPdfs: Boolean(options.pdf) });
    await pool?.close();
    progress.stage('pages', 1);
    const written = await renderPages(staging.dir, folio);
    progress.tick();
    cpSync(join(TEMPLATES_DIR, 'assets'), join(staging.dir, 'assets'), { recursive: true });

    if (options.pdf) {
      const chrome = findChrome(options.pdf.chrome, options.pdf.env);
      if ('problem' in chrome) result.pdfProblem = chromeHint(chrome.problem);
      else {
        const paper = options.pdf.paper ?? library.settings.paper;
        const date = options.pdf.date ?? buildDate(options.pdf.env);
        const printed = await printJobs(chrome.path, printJobsFor(library, folio, staging.dir, date, options.pdf.select), paper, date, progress);
        result.pdfs = printed.map((p) => ({ ...p, pdfFile: relative(staging.dir, p.pdfFile).split(sep).join('/') }));
      }
    }
    staging.commit();
    Object.assign(result, { ok: true, parts: folio.parts.length, pages: written, seconds: (performance.now() - started) / 1000 });
    return result;
  } catch (error) {
    staging.abandon();
    await pool?.close();
    throw error;
  }
}

/** Below this many parts, starting worker threads costs more than it saves. */
const PARTS_PER_WORKER_START = 40;

export function chartPoolFor(library: Library, workers?: number, cache?: string | false): ChartPool {
  const { sweep, within } = library.settings;
  return new ChartPool({
    cacheDir: cache === false ? undefined : (cache ?? join(library.root, CACHE_DIR, 'charts')),
    workers: workers ?? (library.parts.length < PARTS_PER_WORKER_START ? 0 : undefined),
    settingsKey: JSON.stringify({ sweep, within }),
  });
}
