// zfolio build: library -> figures -> charts -> pages (-> PDFs), written to a staging folder and swapped in
// whole, so a failed build never leaves a half-written site.

import { basename, join, relative, resolve, sep } from 'node:path';
import { sortedDiagnostics } from '../model/diagnostics.js';
import { libraryMeasurements } from '../measure/part-measurements.js';
import { loadLibrary, type Library } from '../model/library.js';
import { railVerdicts } from '../analysis/review-checks.js';
import { reviewWarnings } from '../model/review-consistency.js';
import { assembleSite } from './assemble.js';
import type { BuildOptions, BuildResult } from './build-types.js';
import { stageClock, type BuildTimings, type StageTime } from './stage-clock.js';
import { libraryChartPool, type ChartPool } from './chart-pool.js';
import { renderPages } from './eleventy.js';
import { buildPageRuns, type PartPageRuns } from './part-page-runs.js';
import { writeSharedFiles } from './shared-files.js';
import { checkWritable, stageOutput, writeFileDeep } from './output.js';
import { FailedAfterSwap, guardOutput } from './output-guard.js';
import { lockSiteChecked } from './site-lock.js';
import type { PrintBrowser } from '../print/browser.js';
import { buildDate, printJobsFor } from '../print/print-jobs.js';
import { silentProgress, type Progress } from './progress.js';
import { codeKey, partKey, siteKey } from './reuse.js';
import { PartCache } from '../model/part-cache.js';
import { dropSiteRecord, readSiteRecord, recordDir, writeSiteRecord, type SiteRecord } from './site-record.js';
import { SiteUnits } from './carry-over.js';
import { currentVersion, SpareRefused } from './writable.js';
import { carriedParts, recordParts } from './part-record.js';
import { comparisonPageKey, listPages } from './page-keys.js';
import type { Part } from '../model/part.js';
import { keptPdfs, linkPdfs, pdfKeys, pdfLinksFor, pdfsIn, stampPdfs } from './pdf-reuse.js';
import { buildHistory, type BuildHistory } from './build-history.js';
import { addChanges } from '../pages/changes-page.js';
import { SvgSpill } from './svg-spill.js';
import { linkedCopyRecord } from './spare-copy.js';
import { removeTree } from './remove-tree.js';
import { earlyChartWorkers, PARTS_PER_WORKER_START, rebuildChartWorker, type StartedWorker } from './chart-workers.js';

export type { BuildOptions, BuildResult, PdfOptions } from './build-types.js';
export type { BuildTimings, StageTime } from './stage-clock.js';
export const DEFAULT_OUT_DIR = '_site';
/** Under the library; listed in .gitignore. */
export const CACHE_DIR = '.zfolio-cache';

export async function buildFolio(options: BuildOptions): Promise<BuildResult> {
  const started = { at: performance.now(), clock: stageClock(), libraryRoot: resolve(options.libraryRoot) };
  const outDir = resolve(started.libraryRoot, options.outDir ?? DEFAULT_OUT_DIR);
  // Before anything is read or written: a refused output leaves the disk exactly as it was.
  guardOutput(outDir, { libraryRoot: started.libraryRoot, cwd: options.cwd ?? process.cwd(), home: options.home });
  const cacheRoot = options.cache === false ? undefined : resolve(started.libraryRoot, options.cache ?? CACHE_DIR);
  // Units are carried over only when charts come from the cache-keyed pool. With a record of the version at the
  // site path, this build keeps that version as it is (the next one's spare): see checkWritable.
  const recordAt = cacheRoot && !options.charts ? recordDir(cacheRoot, outDir) : undefined;
  // One build of a site at a time (site-lock.ts): the record read and the output checked before the lock and under it.
  const { lock, checked: record } = lockSiteChecked(outDir, () => {
    const record = recordAt ? readSiteRecord(recordAt, outDir) : undefined;
    checkWritable(outDir, { keptAsSpare: record?.live !== undefined && currentVersion(outDir) === record.live.name });
    return record;
  });
  let early: StartedWorker[] = [];
  try {
    // A cold build of many parts starts its chart workers now, to load beside the reading; V8 tiers up later (chart-workers.ts).
    early = options.charts ? [] : earlyChartWorkers({ libraryRoot: started.libraryRoot, cacheRoot, recordDir: cacheRoot && recordDir(cacheRoot, outDir), workers: options.workers });
    return await loadAndBuild(options, outDir, { ...started, cacheRoot, early, recordAt, record });
  } finally {
    for (const w of early) void w.worker.terminate(); // those the chart pool did not take (errors, or few parts to draw)
    lock.release();
  }
}

async function loadAndBuild(options: BuildOptions, outDir: string, { at: started, clock, libraryRoot, cacheRoot, early, recordAt, record }: { at: number; clock: () => StageTime; libraryRoot: string; cacheRoot?: string; early: StartedWorker[]; recordAt?: string; record?: SiteRecord }): Promise<BuildResult> {
  const progress = options.progress ?? silentProgress;
  const zero = { seconds: 0, cpuSeconds: 0 };
  const timings: BuildTimings = { load: zero, assemble: { ...zero, analyse: 0, downloads: 0 }, pages: zero, pdf: zero, swap: zero };
  // Part files unchanged since the last build are taken from the cache, not read and parsed again.
  const partCache = cacheRoot === undefined ? undefined : new PartCache(libraryRoot, join(cacheRoot, 'parts'), codeKey());
  const firstRead = options.charts ? undefined : (partFiles: number) => rebuildChartWorker(early, partFiles, options);
  const { library, diagnostics } = loadLibrary(libraryRoot, { partCache, firstRead });
  partCache?.save();
  const work = { filesParsed: partCache?.counts.parsed ?? library?.parts.length ?? 0, partsAnalysed: 0, partFolders: 0, comparisons: 0, listFiles: 0, pagesRendered: 0 };
  const result: BuildResult = { ok: false, diagnostics, outDir, parts: 0, pages: 0, seconds: 0, pdfs: [], reused: 0, unitsKept: 0, unitsLinked: 0, work, keptPdfs: 0, removedPdfs: [], timings };
  if (!library) return result;
  result.library = library;
  // Warnings that need the analysis: a review that accepts a rail failing its target.
  diagnostics.push(...reviewWarnings(library.reviews, () => railVerdicts(library)));
  // The revisions compared with: read from git before anything is written (see build-history.ts).
  const history = buildHistory(library, options.since);
  diagnostics.push(...history.diagnostics);
  if (history.diagnostics.some((d) => d.severity === 'error')) return result;
  // Measurement files read and compared with their parts' models: an unreadable one stops the build here.
  const measured = libraryMeasurements(library.parts, library.settings.measurementWarnDb);
  diagnostics.push(...sortedDiagnostics(measured.diagnostics));
  result.measurements = measured.byPart;
  if (measured.diagnostics.some((d) => d.severity === 'error')) return result;

  // Chromium first (unless one is given): one that is missing or will not start is known before the build's
  // time is spent, and the pages then link only the PDFs there are (kept ones, as a build without --pdf). The
  // browser driver is loaded only to print: it and the PDF library are most of a build's start-up otherwise.
  const chrome = options.pdf && !options.pdf.browser ? await (await import('../print/browser.js')).chromeForPrinting(options.pdf.chrome, options.pdf.env) : undefined;
  if (chrome && 'problem' in chrome) result.pdfProblem = chrome.problem;
  const own = chrome && 'browser' in chrome ? chrome.browser : undefined;
  const browser = options.pdf?.browser ?? own;
  try {
    return await buildWith(options, library, outDir, browser, result, { started, progress, clock, history, early, cacheRoot, recordAt, record });
  } finally {
    await own?.close();
  }
}

interface Running {
  history: BuildHistory;
  early: StartedWorker[];
  cacheRoot?: string;
  record?: SiteRecord;
  recordAt?: string;
  started: number;
  progress: Progress;
  clock: () => StageTime;
}

async function buildWith(options: BuildOptions, library: Library, outDir: string, browser: PrintBrowser | undefined, result: BuildResult, run: Running): Promise<BuildResult> {
  const { progress, cacheRoot, recordAt, record } = run;
  const { timings, work } = result;
  let clock = run.clock;
  const site = siteKey(library);
  // PDFs: printed afresh with a browser; without one, the last site's are kept where their inputs are unchanged.
  // Made only when there are PDFs to keep or to record: every part's key is a hash, 10,000 of them in a large library.
  let pdfKeysMade: Map<string, string> | undefined;
  const keys = () => (pdfKeysMade ??= pdfKeys(library, site, (slug) => run.history.reviews.get(slug)?.revision.commit ?? ''));
  const earlier = browser ? [] : pdfsIn(outDir);
  const kept = browser || !record || Object.keys(record.pdfs).length === 0 ? new Set<string>() : keptPdfs(record.pdfs, keys(), outDir);
  const pdfLinks = pdfLinksFor(Boolean(browser), kept);
  const staging = stageOutput(outDir, { onStep: options.onSwapStep });
  let pool: ChartPool | undefined, pageRuns: PartPageRuns | undefined;
  try {
    const units = new SiteUnits(recordAt ? record : undefined, record?.spare && staging.claim(record.spare.name), outDir);
    const { partKeys, carried } = carriedParts(library.parts, recordAt ? units : undefined, (part, id) => partKey(site, part, pdfLinks.part(id)));
    const partKeyOf = (id: string) => partKeys.get(id) ?? '';
    const fresh = library.parts.length - carried.size;
    pool = options.charts ? undefined : libraryChartPool(library.settings, { cacheDir: cacheRoot && join(cacheRoot, 'charts'), workers: options.workers ?? (fresh < PARTS_PER_WORKER_START ? run.early.length : undefined), started: run.early, pruning: fresh * 2 > library.parts.length ? 'now' : 'when due' });
    // Only a build that prunes the chart cache keys what it carries over (chart-cache-ledger.ts). One that draws
    // or reads the charts of most parts prunes now: after an upgrade (a new code key, every chart drawn again)
    // the next build, an edit, would otherwise remove the old charts (at 10,000 parts it took 3.8 s, not 1.3 s).
    if (pool?.prunes) for (const id of carried.keys()) pool.keepPartCharts({ part: library.partsById.get(id)! });
    timings.load = clock();

    clock = stageClock();
    const unitKeys = {
      comparison: (fields: Parameters<typeof comparisonPageKey>[1], partIds: readonly string[]) => comparisonPageKey(site, fields, partIds, partKeyOf),
      kept: (unit: string, key: string) => Boolean(recordAt) && units.kept(unit, key),
      keepChart: pool?.prunes ? (parts: readonly Part[], title: string) => pool?.keepComparisonChart(parts, title) : undefined,
    };
    const spill = new SvgSpill(staging.dir);
    pageRuns = buildPageRuns(staging.dir, library, spill, options.partPagesPerRun);
    const folio = await assembleSite({ library, siteDir: staging.dir, charts: options.charts ?? pool!, progress, pdfLinks, carried, units: unitKeys, measurements: result.measurements, timings: timings.assemble, work, spill, partPages: pageRuns, familiesFile: cacheRoot && join(cacheRoot, 'families.json') });
    await addChanges(folio, run.history, options.charts ?? pool!, staging.dir);
    // The workers stop (some 30 ms each) while the index and the pages are made; a failure is met below.
    const closing = pool?.close();
    closing?.catch(() => {});
    work.listFiles = listPages(folio, site, partKeyOf, unitKeys.kept, staging.dir, writeFileDeep);
    Object.assign(timings.assemble, clock());

    clock = stageClock();
    progress.stage('pages', 1);
    const written = (await pageRuns.done()) + (await renderPages(staging.dir, { ...folio, partPages: [] }, options.partPagesPerRun, spill));
    spill.remove();
    work.pagesRendered = written;
    progress.tick();
    writeSharedFiles(staging.dir);
    await closing;
    timings.pages = clock();

    if (browser && options.pdf) {
      clock = stageClock();
      // Printing reads the whole site: it is made first (the spare updated, or the live site's units linked).
      units.assemble(staging.dir);
      const paper = options.pdf.paper ?? library.settings.paper;
      const date = options.pdf.date ?? buildDate(options.pdf.env);
      const siteDir = units.target(staging.dir);
      const { printJobs } = await import('../print/print.js');
      const printed = await printJobs(browser, printJobsFor(library, folio, siteDir, date, options.pdf.select), paper, date, progress);
      result.pdfs = printed.map((p) => ({ ...p, pdfFile: relative(siteDir, p.pdfFile).split(sep).join('/') }));
      timings.pdf = clock();
    }

    clock = stageClock();
    if (!browser) {
      // Links into the last site come last, so that nothing is written through them into it.
      linkPdfs(kept, outDir, staging.dir);
      units.assemble(staging.dir);
    }
    const target = units.target(staging.dir);
    recordParts(units, library, folio, carried);
    // The record is dropped before the swap and written after it, so it never describes a site not in place.
    if (recordAt) dropSiteRecord(recordAt);
    // The version replaced is kept as the next build's spare only where that saves it work (keepsReplaced).
    const { replaced } = staging.commit({ version: target, keepReplaced: Boolean(recordAt) && units.keepsReplaced() });
    // From here the new site is in place: a failure says so (the CLI prints both lines).
    try {
      let spareCopy: string | undefined;
      if (recordAt) {
        const printed = browser ? result.pdfs.map((p) => p.pdfFile) : [...kept];
        const pdfs = stampPdfs(printed, printed.length > 0 ? keys() : new Map(), outDir);
        const next = units.nextRecord(target, replaced, pdfs);
        writeSiteRecord(recordAt, next);
        options.onSwapStep?.('recorded');
        // Without a spare the next build would make one from nothing: made now instead (spare-copy.ts).
        const copying = !next.spare && next.live && options.spareCopy !== false;
        if (copying) progress.stage('copying the site for the next build (hard links)', 1);
        const copy = copying ? staging.linkedSpare() : undefined;
        if (copying) progress.tick();
        const spare = copy && linkedCopyRecord(next.live!, copy, basename(copy));
        if (spare) writeSiteRecord(recordAt, { ...next, spare });
        else if (copy) removeTree(copy);
        spareCopy = spare ? basename(copy!) : undefined;
      }
      // Last, once the record describes the new site: a build stopped while it removes the old versions (seconds
      // at 10,000 parts) leaves them to the next, which still has its record and spare.
      let removing = false;
      await staging.removeLeftovers([replaced, spareCopy], () => {
        removing = true;
        progress.stage('removing old versions of the site', 1);
      });
      if (removing) progress.tick();
    } catch (error) {
      throw new FailedAfterSwap(outDir, error);
    }
    timings.swap = clock();
    const from = units.counts();
    Object.assign(result, {
      ok: true,
      parts: folio.parts.length,
      pages: written + carried.size + (folio.comparisons.length - folio.comparisonPages.length) + (folio.partList.pages.length - folio.indexPages.length),
      reused: carried.size,
      unitsKept: from.spare,
      unitsLinked: from.live,
      keptPdfs: kept.size,
      removedPdfs: earlier.filter((p) => !kept.has(p)),
      charts: pool?.stats,
      folio,
      seconds: (performance.now() - run.started) / 1000,
    });
    return result;
  } catch (error) {
    // The workers and a run of part pages stop first: they write into the staging folder.
    await pool?.close();
    await pageRuns?.settle();
    if (error instanceof SpareRefused) staging.release();
    staging.abandon();
    throw error;
  }
}
