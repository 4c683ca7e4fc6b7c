// zfolio build: library -> figures -> charts -> pages, written to a staging folder and swapped in whole.

import { cpSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { analysePart, type PartAnalysis } from '../analysis/part-figures.js';
import { partSummary } from '../analysis/summary.js';
import { sweepCsv } from '../analysis/sweep-table.js';
import type { Diagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import { renderPages, TEMPLATES_DIR } from './eleventy.js';
import { stageOutput, writeFileDeep } from './output.js';
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

export interface BuildOptions {
  libraryRoot: string;
  /** Default: _site under the library. */
  outDir?: string;
  progress?: Progress;
  charts: ChartMaker;
}

export interface BuildResult {
  ok: boolean;
  diagnostics: Diagnostic[];
  outDir: string;
  parts: number;
  pages: number;
  seconds: number;
  library?: Library;
}

export const DEFAULT_OUT_DIR = '_site';

/** Pretty JSON with a final newline: downloads are read by people too. */
const json = (value: unknown) => JSON.stringify(value, null, 2) + '\n';

export async function buildFolio(options: BuildOptions): Promise<BuildResult> {
  const started = performance.now();
  const progress = options.progress ?? silentProgress;
  const libraryRoot = resolve(options.libraryRoot);
  const outDir = resolve(libraryRoot, options.outDir ?? DEFAULT_OUT_DIR);
  const { library, diagnostics } = loadLibrary(libraryRoot);
  const result: BuildResult = { ok: false, diagnostics, outDir, parts: 0, pages: 0, seconds: 0 };
  if (!library) return result;
  result.library = library;

  const analyses = library.parts.map((p) => analysePart(p, library.settings.sweep, library.settings.within));
  const byId = new Map(analyses.map((a) => [a.part.id, a]));

  const staging = stageOutput(outDir);
  try {
    progress.stage('charts', analyses.length);
    const pages: PartPageData[] = [];
    for (const a of analyses) {
      const charts = await options.charts.partCharts(a);
      const folder = join(staging.dir, 'parts', a.part.id);
      writeFileDeep(join(folder, 'sweep.csv'), sweepCsv(a));
      writeFileDeep(join(folder, 'figures.json'), json(partSummary(a)));
      pages.push(partPageData(a, charts.map((c) => placeChart(c, folder))));
      progress.tick();
    }
    const pagesById = new Map(pages.map((p) => [p.id, p]));

    const comparisons = await comparisonPages(library, byId, pagesById, staging.dir, options.charts);
    const folio: FolioData = { ...folioHeader(library), parts: pages, comparisons, plans: [], reviews: [] };

    progress.stage('pages', 1);
    const written = await renderPages(staging.dir, folio);
    progress.tick();
    cpSync(join(TEMPLATES_DIR, 'assets'), join(staging.dir, 'assets'), { recursive: true });
    staging.commit();
    Object.assign(result, { ok: true, parts: pages.length, pages: written, seconds: (performance.now() - started) / 1000 });
    return result;
  } catch (error) {
    staging.abandon();
    throw error;
  }
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
