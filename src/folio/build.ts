// zfolio build: library -> figures -> charts -> pages, written to a staging folder and swapped in whole.

import { cpSync } from 'node:fs';
import { join, relative, resolve, sep } from 'node:path';
import type { PaperSize } from '../model/settings.js';
import { chromeHint, findChrome } from './browser.js';
import { printJobs, type PrintedFile, type PrintJob } from './print.js';
import { analysePart, type PartAnalysis } from '../analysis/part-figures.js';
import { partSummary } from '../analysis/summary.js';
import { sweepCsv } from '../analysis/sweep-table.js';
import type { Diagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import { renderPages, TEMPLATES_DIR } from './eleventy.js';
import { stageOutput, writeFileDeep } from './output.js';
import { escapeJsonMarkup } from './escape.js';
import { silentProgress, type Progress } from './progress.js';
import {
  automaticComparisons,
  comparisonSlug,
  folioHeader,
  partPageData,
  selectionText,
  type ChartOnPage,
  type ComparisonPageData,
  type FolioData,
  type PartPageData,
} from './site-data.js';
import type { ChartArtifact, ChartMaker } from './chart-maker.js';
import { ChartPool } from './chart-pool.js';

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

/**
 * Pretty JSON with a final newline (downloads are read by people too), with <, > and & written as \u
 * escapes: the same data when parsed, and inert if a file is ever sniffed or pasted as HTML.
 */
const json = (value: unknown) => escapeJsonMarkup(JSON.stringify(value, null, 2)) + '\n';

export async function buildFolio(options: BuildOptions): Promise<BuildResult> {
  const started = performance.now();
  const progress = options.progress ?? silentProgress;
  const libraryRoot = resolve(options.libraryRoot);
  const outDir = resolve(libraryRoot, options.outDir ?? DEFAULT_OUT_DIR);
  const { library, diagnostics } = loadLibrary(libraryRoot);
  const result: BuildResult = { ok: false, diagnostics, outDir, parts: 0, pages: 0, seconds: 0, pdfs: [] };
  if (!library) return result;
  result.library = library;

  const analyses = library.parts.map((p) => analysePart(p, library.settings.sweep, library.settings.within));
  const byId = new Map(analyses.map((a) => [a.part.id, a]));

  const pool = options.charts ? undefined : chartPoolFor(library, options.workers, options.cache);
  const charts = options.charts ?? pool!;
  const staging = stageOutput(outDir);
  try {
    progress.stage('charts', analyses.length);
    // All requests at once: the pool spreads them over its workers and answers from its cache.
    const pages: PartPageData[] = await Promise.all(
      analyses.map(async (a) => {
        const drawn = await charts.partCharts(a);
        const folder = join(staging.dir, 'parts', a.part.id);
        writeFileDeep(join(folder, 'sweep.csv'), sweepCsv(a));
        writeFileDeep(join(folder, 'figures.json'), json(partSummary(a)));
        progress.tick();
        const page = partPageData(a, drawn.map((c) => placeChart(c, folder)));
        if (options.pdf) page.pdfFile = partPdfPath(a.part.id);
        return page;
      }),
    );
    const pagesById = new Map(pages.map((p) => [p.id, p]));

    const comparisons = await comparisonPages(library, byId, pagesById, staging.dir, charts);
    await pool?.close();
    const folio: FolioData = { ...folioHeader(library), parts: pages, comparisons, plans: [], reviews: [] };

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
        const jobs = partPrintJobs(library, pages, staging.dir, date);
        const printed = await printJobs(chrome.path, jobs, paper, date, progress);
        result.pdfs = printed.map((p) => ({ ...p, pdfFile: relative(staging.dir, p.pdfFile).split(sep).join('/') }));
      }
    }
    staging.commit();
    Object.assign(result, { ok: true, parts: pages.length, pages: written, seconds: (performance.now() - started) / 1000 });
    return result;
  } catch (error) {
    staging.abandon();
    await pool?.close();
    throw error;
  }
}

export function partPdfPath(id: string): string {
  return `pdf/parts/${id}.pdf`;
}

/** $SOURCE_DATE_EPOCH (seconds) when set, as reproducible-build tools expect; else now. */
export function buildDate(env: Readonly<Record<string, string | undefined>>): Date {
  const epoch = Number(env.SOURCE_DATE_EPOCH);
  return env.SOURCE_DATE_EPOCH && Number.isFinite(epoch) ? new Date(epoch * 1000) : new Date();
}

function partPrintJobs(library: Library, pages: PartPageData[], siteDir: string, date: Date): PrintJob[] {
  const day = date.toISOString().slice(0, 10);
  return pages.map((p) => ({
    htmlFile: join(siteDir, 'parts', p.id, 'index.html'),
    pdfFile: join(siteDir, partPdfPath(p.id)),
    meta: {
      title: `${p.id} — ${p.title}`,
      subject: `Impedance datasheet of ${p.id} (${p.text.kindLabel.toLowerCase()}), from ${library.settings.title}`,
      keywords: [p.kind, ...p.tagsText.split(', ').filter(Boolean)],
    },
    furniture: { headLeft: library.settings.title, headRight: p.id, footLeft: `built ${day} · ${p.sourceFile} · sha256:${p.sourceHash}` },
    pack: false,
  }));
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

/** Write a chart's spec beside its page and say where it is, relative to the page. */
function placeChart(chart: ChartArtifact, folder: string): ChartOnPage {
  const specFile = `${chart.key}.vl.json`;
  writeFileDeep(join(folder, specFile), json(chart.spec));
  return { key: chart.key, title: chart.title, description: chart.description, svg: chart.svg, specFile };
}

async function comparisonPages(
  library: Library,
  byId: ReadonlyMap<string, PartAnalysis>,
  pagesById: ReadonlyMap<string, PartPageData>,
  siteDir: string,
  charts: ChartMaker,
): Promise<ComparisonPageData[]> {
  const out: ComparisonPageData[] = [];
  const add = async (slug: string, page: Omit<ComparisonPageData, 'slug' | 'parts' | 'chart'>, partIds: string[]) => {
    const analyses = partIds.map((id) => byId.get(id)!);
    const folder = join(siteDir, 'comparisons', slug);
    const chart = analyses.length > 0 ? placeChart(await charts.comparisonChart(analyses, page.title), folder) : undefined;
    out.push({ slug, ...page, parts: partIds.map((id) => pagesById.get(id)!), chart });
  };
  for (const c of library.comparisons) {
    await add(comparisonSlug(c), { title: c.title, description: c.description, automatic: false, selection: selectionText(c), sourceFile: c.source.path }, c.parts.map((p) => p.id));
  }
  for (const auto of automaticComparisons(library)) {
    await add(`all-${auto.kind}`, { title: auto.title, automatic: true, selection: `every ${auto.kind} in the library` }, auto.parts.map((p) => p.id));
  }
  return out;
}
