// Assembling the site's data: every part, comparison, rail plan and review analysed, its charts drawn and its
// downloads written into the site folder, and the page data the templates read.

import { join } from 'node:path';
import { analysePart, type PartAnalysis } from '../analysis/part-figures.js';
import { analysePlan, planFiguresWithoutCurves } from '../analysis/plan-figures.js';
import { partSummary } from '../analysis/summary.js';
import { sweepCsv } from '../analysis/sweep-table.js';
import { comparisonKey } from '../model/comparison.js';
import type { Library } from '../model/library.js';
import type { Plan } from '../model/plan.js';
import type { ChartArtifact, ChartMaker } from './chart-maker.js';
import { escapeJsonMarkup } from './escape.js';
import { writeFileDeep } from './output.js';
import { planPageData, type PlanPageData } from './plan-page.js';
import type { Progress } from './progress.js';
import { reviewPageData, type ReviewPageData } from './review-page.js';
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

/**
 * Pretty JSON with a final newline (downloads are read by people too), with <, > and & written as \u
 * escapes: the same data when parsed, and inert if a file is ever sniffed or pasted as HTML.
 */
export const jsonFile = (value: unknown) => escapeJsonMarkup(JSON.stringify(value, null, 2)) + '\n';

/** Where PDFs go in the site, when they are built. */
export const partPdfPath = (id: string) => `pdf/parts/${id}.pdf`;
export const reviewPdfPath = (slug: string) => `pdf/reviews/${slug}.pdf`;

/** Write a chart's spec beside its page and say where it is, relative to the page. */
function placeChart(chart: ChartArtifact, folder: string): ChartOnPage {
  const specFile = `${chart.key}.vl.json`;
  writeFileDeep(join(folder, specFile), jsonFile(chart.spec));
  return { key: chart.key, title: chart.title, description: chart.description, svg: chart.svg, specFile };
}

export interface AssembleOptions {
  library: Library;
  siteDir: string;
  charts: ChartMaker;
  progress: Progress;
  /** Link each part and review to its PDF. */
  withPdfs: boolean;
}

export async function assembleSite({ library, siteDir, charts, progress, withPdfs }: AssembleOptions): Promise<FolioData> {
  const analyses = library.parts.map((p) => analysePart(p, library.settings.sweep, library.settings.within));
  const byId = new Map(analyses.map((a) => [a.part.id, a]));

  progress.stage('charts', analyses.length);
  // All requests at once: the chart maker spreads them over its workers and answers from its cache.
  const parts: PartPageData[] = await Promise.all(
    analyses.map(async (a) => {
      const drawn = await charts.partCharts(a);
      const folder = join(siteDir, 'parts', a.part.id);
      writeFileDeep(join(folder, 'sweep.csv'), sweepCsv(a));
      writeFileDeep(join(folder, 'figures.json'), jsonFile(partSummary(a)));
      progress.tick();
      const page = partPageData(a, drawn.map((c) => placeChart(c, folder)));
      if (withPdfs) page.pdfFile = partPdfPath(a.part.id);
      return page;
    }),
  );
  const partsById = new Map(parts.map((p) => [p.id, p]));

  const { pages: comparisons, byKey } = await comparisonPages(library, byId, partsById, siteDir, charts);
  const plans = await Promise.all(library.plans.map((plan) => planPage(plan, library, siteDir, charts)));
  const reviews = library.reviews.map((r) => {
    const page = reviewPageData(r, library, { parts: partsById, comparisons: byKey, plans: new Map(plans.map((p) => [p.rail, p])) });
    if (withPdfs) page.pdfFile = reviewPdfPath(page.slug);
    return page;
  });
  return { ...folioHeader(library), parts, comparisons, plans, reviews };
}

async function planPage(plan: Plan, library: Library, siteDir: string, charts: ChartMaker): Promise<PlanPageData> {
  const figures = analysePlan(plan, library.settings.sweep.perDecade);
  const inputs = [plan.source.hash, ...plan.placements.map((p) => p.part.source.hash)].join(',');
  const page = planPageData(figures, plan.source.hash, plan.notes, undefined);
  const folder = join(siteDir, 'plans', page.slug);
  page.chart = placeChart(await charts.railChart(figures, inputs), folder);
  writeFileDeep(join(folder, 'figures.json'), jsonFile(planFiguresWithoutCurves(figures)));
  return page;
}

async function comparisonPages(
  library: Library,
  byId: ReadonlyMap<string, PartAnalysis>,
  pagesById: ReadonlyMap<string, PartPageData>,
  siteDir: string,
  charts: ChartMaker,
): Promise<{ pages: ComparisonPageData[]; byKey: Map<string, ComparisonPageData> }> {
  const pages: ComparisonPageData[] = [];
  const byKey = new Map<string, ComparisonPageData>();
  const slugs = new Set<string>();
  const add = async (wanted: string, page: Omit<ComparisonPageData, 'slug' | 'parts' | 'chart'>, partIds: string[]) => {
    // Two files whose names differ only in characters a folder name cannot hold get distinct folders.
    let slug = wanted;
    for (let n = 2; slugs.has(slug); n++) slug = `${wanted}-${n}`;
    slugs.add(slug);
    const analyses = partIds.map((id) => byId.get(id)!);
    const folder = join(siteDir, 'comparisons', slug);
    const chart = analyses.length > 0 ? placeChart(await charts.comparisonChart(analyses, page.title), folder) : undefined;
    const data: ComparisonPageData = { slug, ...page, parts: partIds.map((id) => pagesById.get(id)!), chart };
    pages.push(data);
    return data;
  };
  for (const c of library.comparisons) {
    const data = await add(comparisonSlug(c), { title: c.title, description: c.description, automatic: false, selection: selectionText(c), sourceFile: c.source.path }, c.parts.map((p) => p.id));
    byKey.set(comparisonKey(c), data);
  }
  for (const auto of automaticComparisons(library)) {
    await add(`all-${auto.kind}`, { title: auto.title, automatic: true, selection: `every ${auto.kind} in the library` }, auto.parts.map((p) => p.id));
  }
  return { pages, byKey };
}
