// Assembling the site's data: every part, comparison, rail plan and review analysed, its charts drawn and its
// downloads written into the site folder, and the page data the templates read.

import { join } from 'node:path';
import { analysePart, type PartAnalysis } from '../analysis/part-figures.js';
import { DeferredAnalysis } from './deferred-analysis.js';
import { analysePlan, planFiguresWithoutCurves } from '../analysis/plan-figures.js';
import type { PartMeasurement } from '../measure/part-measurements.js';
import { measurementInputs } from '../model/measurement-entry.js';
import { measurementChartData, measurementPageData, type MeasurementPageData } from '../pages/measurement-page.js';
import { comparisonKey } from '../model/comparison.js';
import type { Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import type { Plan } from '../model/plan.js';
import type { ChartArtifact, ChartMaker } from './chart-maker.js';
import type { BuildWork, CarriedPart, RecordedPage, UnitKeys } from './carried.js';

export type { BuildWork, CarriedPart, RecordedPage, UnitKeys } from './carried.js';
import { comparedAnalysis, type ComparedAnalysis } from './chart-jobs.js';
import { selectionText } from '../present/part-words.js';
import { libraryRevision } from '../history/library-revision.js';
import { comparisonSlug } from '../present/slugs.js';
import { comparisonIndex } from '../pages/comparison-index.js';
import { partList } from '../pages/part-list.js';
import { listedPart, type ListedPart } from '../pages/listed-part.js';
import { partPdfPath, reviewPdfPath } from '../pages/site-paths.js';
import { planPageData, type PlanPageData } from '../pages/plan-page.js';
import type { PartFamily } from '../pages/families.js';
import { cachedFamilies } from './family-cache.js';
import { codeKey } from './reuse.js';
import type { Progress } from './progress.js';
import { reviewPageData, type ReviewPageData } from '../pages/review-page.js';
import {
  automaticComparisons,
  folioHeader,
  partPageData,
  type ChartOnPage,
  type ComparisonPageData,
  type FolioData,
  type PartPageData,
} from '../pages/site-data.js';

export { jsonFile } from './part-downloads.js';
import { jsonFile } from './part-downloads.js';
import type { SvgSpill } from './svg-spill.js';
import type { PartPageRuns } from './part-page-runs.js';
import { chartOnPage, partChartOnPage, placeChart, timedWrite, type AssembleTimings } from './chart-placing.js';

export type { AssembleTimings } from './chart-placing.js';

export interface AssembleOptions {
  library: Library;
  siteDir: string;
  charts: ChartMaker;
  progress: Progress;
  /** Which parts (by id) and reviews (by slug) link to their PDF. */
  pdfLinks: PdfLinks;
  /**
   * Parts whose folders (page, downloads) are carried over whole from the last build: nothing is drawn or
   * written for them; their charts are read from the chart maker only where another page shows them. With
   * the data the last build recorded for them (the same, by the key it was carried over with), they are
   * not even analysed unless a page that is rendered needs more of them.
   */
  carried?: ReadonlyMap<string, CarriedPart>;
  /**
   * The key of each unit of the site that is rendered from other parts' data (a comparison folder), and
   * whether the last site's copy of it with that key can be kept; default: nothing is kept.
   */
  units?: UnitKeys;
  /** Each measured part against its measurements (src/measure/part-measurements.ts), by part id. */
  measurements?: ReadonlyMap<string, readonly PartMeasurement[]>;
  /** Filled in when given. */
  timings?: AssembleTimings;
  /** Filled in when given: what the build had to do. */
  work?: BuildWork;
  /**
   * Where the charts of the part pages to render wait on disk until their eleventy run (svg-spill.ts); by
   * default they are held in the page data. A part a review shows keeps its charts (its review renders them too).
   */
  spill?: SvgSpill;
  /** Given each fresh part's page as soon as its data is complete, and flushed once every part's is (part-page-runs.ts). */
  partPages?: Pick<PartPageRuns, 'add' | 'flush' | 'prepare'>;
  /** Where the library's part families are kept from build to build (family-cache.ts); by default they are made afresh. */
  familiesFile?: string;
}

export interface PdfLinks {
  part(id: string): boolean;
  review(slug: string): boolean;
}

export async function assembleSite({ library, siteDir, charts, progress, pdfLinks, carried = new Map(), units = NOTHING_KEPT, measurements = new Map(), timings, work, spill, partPages: pageRuns, familiesFile }: AssembleOptions): Promise<FolioData> {
  const analyse = (part: Part) => {
    const started = performance.now();
    if (work) work.partsAnalysed++;
    const a = analysePart(part, library.settings.sweep, library.settings.within, library.settings.temperature);
    if (timings) timings.analyse += (performance.now() - started) / 1000;
    return a;
  };
  // A part's analysis is made (deferred) only when something asks for it: of 10,000 parts carried over, the
  // few on a comparison drawn again. What the comparisons read of a part whose folder is written is kept
  // alone, so the build holds a few whole analyses at a time (those the chart workers are drawing).
  const deferred = new Map<string, PartAnalysis>();
  const analysisOf = (part: Part) => {
    let a = deferred.get(part.id);
    if (!a) deferred.set(part.id, (a = new DeferredAnalysis(part, analyse)));
    return a;
  };
  const compared = new Map<string, ComparedAnalysis>();
  const comparedOf = (id: string): ComparedAnalysis => compared.get(id) ?? analysisOf(library.partsById.get(id)!);
  // Review packs print whole datasheets, charts included.
  const shownElsewhere = new Set(library.reviews.flatMap((r) => r.parts.map((p) => p.id)));

  // A step a part: its charts drawn (or taken from the cache), its downloads written, its page data made.
  progress.stage('parts', library.parts.length);
  const pageOf = async (part: Part): Promise<PartPageData> => {
    const a = analysisOf(part);
    let page: PartPageData;
    const recorded = carried.get(part.id);
    if (recorded) {
      const drawn = (await charts.partCharts(a)).map(partChartOnPage(part));
      const full: PartPageData = recorded.page ? { ...recorded.page, charts: drawn, measurements: [] } : partPageData(a, drawn);
      full.measurements = await measurementSections(part, measurements.get(part.id), library, charts);
      page = full;
    } else {
      if (work) work.partFolders++;
      const folder = join(siteDir, 'parts', part.id);
      // The thread that draws the charts writes the part's downloads (part-downloads.ts), and its SVGs into the
      // spill unless a review shows them too (svg-spill.ts).
      const svgFile = shownElsewhere.has(part.id) ? undefined : spill?.reserve();
      const drawn = await charts.partCharts(a, { folder, sweep: library.settings.sweep }, svgFile);
      const full = partPageData(a, drawn.map(partChartOnPage(part)));
      full.measurements = await measurementSections(part, measurements.get(part.id), library, charts, (c) => placeChart(c, folder, timings));
      if (svgFile) spill!.adopt(full, svgFile);
      page = full;
      compared.set(part.id, comparedAnalysis(a));
      deferred.delete(part.id);
    }
    progress.tick();
    if (pdfLinks.part(part.id)) page.pdfFile = partPdfPath(part.id);
    if (!recorded) pageRuns?.add(page as PartPageData);
    return page;
  };
  // A part whose folder is kept and that no page rendered here shows more of than a list does is listed as
  // recorded, here and now; the others are asked for all at once: the chart maker spreads them over its
  // workers and answers from its cache.
  const pages: (PartPageData | ListedPart)[] = new Array(library.parts.length);
  const waiting: Promise<void>[] = [];
  const pageMade = new Map<string, Promise<void>>();
  library.parts.forEach((part, i) => {
    const recorded = carried.get(part.id);
    if (recorded && !shownElsewhere.has(part.id)) {
      pages[i] = recorded.listed ?? listedPart(partPageData(analysisOf(part), []));
      progress.tick();
    } else {
      const made = pageOf(part).then((page) => void (pages[i] = page));
      waiting.push(made);
      pageMade.set(part.id, made);
    }
  });
  // A comparison asks for its chart once its parts' pages are made, and so reads what is kept of each
  // (comparedAnalysis): asked at once, a cold build of 10,000 parts held every part's whole analysis (2 GB).
  const comparedWhenMade = async (ids: readonly string[]) => {
    const pending = ids.flatMap((id) => pageMade.get(id) ?? []);
    if (pending.length > 0) await Promise.all(pending);
    return ids.map(comparedOf);
  };
  const listed = Promise.all(waiting).then(() => {
    pageRuns?.flush();
    return new Map(pages.map((p) => [p.id, p]));
  });
  // The comparisons are keyed while the chart workers draw the parts (a rebuild after one edit of 10,000 parts
  // had this thread wait for them, then key 903 comparisons); each asks for its chart as comparedWhenMade says.
  const families = familiesFile ? cachedFamilies(library.parts, library.partsById, codeKey(), familiesFile) : automaticComparisons(library);
  const comparing = comparisonPages(library, families, comparedWhenMade, listed, siteDir, charts, units, timings, work);
  // The next run of part pages starts meanwhile too, when a part's folder is made afresh.
  if (carried.size < library.parts.length) pageRuns?.prepare();
  const [listedById, { pages: comparisons, byKey, rendered }] = await Promise.all([listed, comparing]);
  // Full page data, for part pages and review packs.
  const fullById = new Map(pages.filter((p): p is PartPageData => 'charts' in p).map((p) => [p.id, p]));
  const plans = await Promise.all(library.plans.map((plan) => planPage(plan, library, siteDir, charts, timings)));
  const reviews = library.reviews.map((r) => {
    const page = reviewPageData(r, library, { parts: fullById, comparisons: byKey, plans: new Map(plans.map((p) => [p.rail, p])) });
    if (pdfLinks.review(page.slug)) page.pdfFile = reviewPdfPath(page.slug);
    page.revision = libraryRevision(library.root, page.sources.map((x) => x.file));
    return page;
  });
  // Carried-over parts keep the page the last build wrote; only the others are rendered.
  const partPages = [...fullById.values()].filter((p) => !carried.has(p.id));
  const list = partList(pages);
  return { ...folioHeader(library), parts: pages, partList: list, partPages, comparisons, comparisonPages: rendered, indexPages: list.pages, ...comparisonIndex(comparisons), plans, reviews };
}

const NOTHING_KEPT: UnitKeys = { comparison: () => '', kept: () => false };

/** A part's measurement sections, their charts placed beside the page by `place` (or only drawn). */
async function measurementSections(part: Part, found: readonly PartMeasurement[] | undefined, library: Library, charts: ChartMaker, place: (c: ChartArtifact) => ChartOnPage = chartOnPage): Promise<MeasurementPageData[]> {
  if (!found) return [];
  return Promise.all(
    found.map(async (m, i) => {
      const index = i + 1;
      const inputs = `${part.source.path} ${part.source.hash}\n${measurementInputs([m.entry])}\n${m.fixture}`;
      const drawn = await charts.measurementCharts(measurementChartData(part, m), index, inputs);
      return measurementPageData(part, m, index, library.settings.measurementWarnDb, drawn.map(place));
    }),
  );
}

async function planPage(plan: Plan, library: Library, siteDir: string, charts: ChartMaker, timings?: AssembleTimings): Promise<PlanPageData> {
  const figures = analysePlan(plan, library.settings.sweep.perDecade, plan.placements, plan.warnings, { operating: library.settings.temperature });
  const inputs = [plan.source.hash, ...plan.placements.map((p) => p.part.source.hash)].join(',');
  const page = planPageData(figures, plan.source.hash, plan.notes, undefined);
  const folder = join(siteDir, 'plans', page.slug);
  page.chart = placeChart(await charts.railChart(figures, inputs), folder, timings);
  if (page.loadStep) page.loadStep.charts = (await charts.loadStepCharts(figures, inputs)).map((c) => placeChart(c, folder, timings));
  timedWrite(timings, join(folder, 'figures.json'), () => jsonFile(planFiguresWithoutCurves(figures)));
  return page;
}

async function comparisonPages(
  library: Library,
  families: readonly PartFamily[],
  comparedOf: (ids: readonly string[]) => Promise<ComparedAnalysis[]>,
  listed: Promise<ReadonlyMap<string, ListedPart>>,
  siteDir: string,
  charts: ChartMaker,
  units: UnitKeys,
  timings?: AssembleTimings,
  work?: BuildWork,
): Promise<{ pages: ComparisonPageData[]; byKey: Map<string, ComparisonPageData>; rendered: ComparisonPageData[] }> {
  const pages: ComparisonPageData[] = [];
  const rendered: ComparisonPageData[] = [];
  const byKey = new Map<string, ComparisonPageData>();
  const slugs = new Set<string>();
  // A review pack prints the comparisons it names, chart and all.
  const inReviews = new Set(library.reviews.flatMap((r) => r.comparisons.map(comparisonKey)));
  // Pages listed in order, charts asked for all at once (one by one, one worker drew them while one idled).
  const drawing: Promise<void>[] = [];
  const partsOf: [ComparisonPageData, string[]][] = [];
  const add = (wanted: string, page: Omit<ComparisonPageData, 'slug' | 'parts' | 'chart'>, partIds: string[], reviewed = false) => {
    // Two files whose names differ only in characters a folder name cannot hold get distinct folders.
    let slug = wanted;
    for (let n = 2; slugs.has(slug); n++) slug = `${wanted}-${n}`;
    slugs.add(slug);
    const fields = { slug, ...page };
    // Its parts are listed once every part's page data is made (below).
    const data: ComparisonPageData = { ...fields, parts: [] };
    partsOf.push([data, partIds]);
    const kept = units.kept(`comparisons/${slug}`, units.comparison(fields, partIds));
    if (partIds.length > 0 && (!kept || reviewed)) {
      // The folder's path is made only for a page written here (903 families of the generated 10,000 parts, nearly all kept after an edit).
      drawing.push(comparedOf(partIds).then((analyses) => charts.comparisonChart(analyses, page.title)).then((chart) => void (data.chart = kept ? chartOnPage(chart) : placeChart(chart, join(siteDir, 'comparisons', slug), timings))));
    } else if (partIds.length > 0) {
      // The page is kept (with its chart); the chart stays in the cache unread.
      units.keepChart?.(partIds.map((id) => library.partsById.get(id)!), page.title);
    }
    if (!kept) {
      rendered.push(data);
      if (work) work.comparisons++;
    }
    pages.push(data);
    return data;
  };
  for (const c of library.comparisons) {
    const data = add(comparisonSlug(c), { title: c.title, description: c.description, automatic: false, selection: selectionText(c), sourceFile: c.source.path }, c.parts.map((p) => p.id), inReviews.has(comparisonKey(c)));
    byKey.set(comparisonKey(c), data);
  }
  for (const f of families) {
    const family = { kind: f.kind, packageText: f.packageText, valuesText: f.valuesText, subsetText: f.subsetText };
    add(f.slug, { title: f.title, automatic: true, selection: f.selection, family }, f.parts.map((p) => p.id));
  }
  const [listedById] = await Promise.all([listed, ...drawing]);
  for (const [data, ids] of partsOf) data.parts = ids.map((id) => listedById.get(id)!);
  return { pages, byKey, rendered };
}
