// Charts for a build: from the cache when the same input was drawn before, else from worker threads
// (one per core, each compiling every chart kind once), or in this thread for small libraries.
//
// The cache key covers everything a chart depends on: the renderer's own code (a fingerprint of the chart
// and folio modules' files), the part file's content hash, and the library's sweep and band settings; and
// the format of the entry (chart-cache-entry.ts).

import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Worker } from 'node:worker_threads';
import type { PartAnalysis } from '../analysis/part-figures.js';
import { codeKey } from './reuse.js';
import { sha256Hex } from '../model/sha256.js';
import { chartInput, comparisonInput, loadStepChartData, railChartData, withoutSpecs, type ChartJob, type ComparedAnalysis } from './chart-jobs.js';
import type { PlanFigures } from '../analysis/plan-figures.js';
import type { ChartArtifact, ChartMaker, DrawnChart } from './chart-maker.js';
import { CACHE_ENTRY_EXTENSION, CHART_FILE_FORMAT, placeChartFile, readCacheEntry, storeCharts, withoutSvgs } from './chart-cache-entry.js';
import type { WorkerJob } from './chart-worker.js';
import { partDownloads, writePartDownloads, type DownloadPlace } from './part-downloads.js';
import type { ChangeChartData } from '../charts/change-chart.js';
import type { MeasurementChartData } from '../charts/measurement-charts.js';
import type { FolioSettings } from '../model/settings.js';
import type { Part } from '../model/part.js';
import { defaultWorkerCount, startChartWorker, type StartedWorker } from './chart-workers.js';
import { countWritten, pruneCache, pruneDue } from './chart-cache-ledger.js';

export interface ChartPoolOptions {
  /** Folder for cached charts; none: no cache. */
  cacheDir?: string;
  /** Worker threads; 0 renders in this thread. Default: one per core, none for fewer than `minPartsForWorkers`. */
  workers?: number;
  /** The sweep and band settings, part of every key. */
  settingsKey: string;
  /** Workers started already (chart-workers.ts): the pool takes as many as it needs out of the list. */
  started?: StartedWorker[];
  /** When the cache is pruned to the entries a build used: every build (default), when its ledger says so, or now and a ledger kept (chart-cache-ledger.ts). */
  pruning?: 'every build' | 'when due' | 'now';
}

export interface ChartPoolStats {
  /** Requests (a part's charts, a comparison, a rail) drawn, and answered from the cache. */
  rendered: number;
  fromCache: number;
  /** Charts drawn, each counted (a part's request draws four). */
  drawn: number;
  /** Seconds the worker threads spent on jobs, summed over workers (from sending a job to its answer). */
  workerSeconds: number;
  /** Seconds this thread spent writing the downloads of parts whose charts came from the cache. */
  downloadSeconds: number;
}

/**
 * The charts with each SVG held as a one-byte string where its characters allow (all of them at most
 * U+00FF, as svg-finish.ts writes them). V8 keeps a string two bytes a character when it was built from
 * two-byte pieces, even if every character would fit in one, and a worker's message and JSON.parse keep
 * that form: a build holds every part's SVGs until its pages are rendered, 70 KB a part in two-byte form
 * (about 700 MB for 10,000 parts), half that in one-byte form. Latin-1 decoding always gives a one-byte string.
 */
export function compactCharts<T extends DrawnChart>(charts: T[]): T[] {
  return charts.map((c) => (/[^\u0000-\u00ff]/.test(c.svg) ? c : { ...c, svg: Buffer.from(c.svg, 'latin1').toString('latin1') }));
}

/** The modules that draw charts in this thread (and vega), loaded once: by the first chart drawn here, or before (zfolio serve). */
export const loadChartDrawing = () => import('./chart-draw.js');

/** A part file's content hash as source.ts makes it: 16 hex digits of its SHA-256. */
const CONTENT_HASH = /^[0-9a-f]{16}$/;

/** The chart pool of a library's build: its sweep, band and temperature settings are part of every key. */
export function libraryChartPool(settings: Pick<FolioSettings, 'sweep' | 'within' | 'temperature'>, options: Omit<ChartPoolOptions, 'settingsKey'>): ChartPool {
  const { sweep, within, temperature } = settings;
  // The operating temperatures set every part's and rail's spread envelope.
  return new ChartPool({ ...options, settingsKey: JSON.stringify({ sweep, within, temperature }) });
}

interface Pending {
  resolve(charts: DrawnChart[]): void;
  reject(error: Error): void;
  /** When the job was handed to a worker (performance.now()). */
  sentAt?: number;
}

export class ChartPool implements ChartMaker {
  readonly stats: ChartPoolStats = { rendered: 0, fromCache: 0, drawn: 0, workerSeconds: 0, downloadSeconds: 0 };
  // Everything that turns a part file into charts besides the file: all of zfolio's code and the rendering
  // packages' versions, so a changed analysis or renderer never serves a stale chart.
  private readonly fingerprint = codeKey();
  private readonly workers: Worker[] = [];
  private readonly idle: Worker[] = [];
  /** Jobs waiting for a worker; a job is made from its `make` when it is next (see `prepare`). */
  private readonly queue: { id: number; make: () => ChartJob; job?: ChartJob; cacheFile?: string; slim: boolean; svgFile?: string }[] = [];
  private readonly pending = new Map<number, Pending>();
  private readonly usedKeys = new Set<string>();
  private nextId = 0;
  private preparing = false;
  /** Whether this build prunes the cache, and so keys what it carries over (keepPartCharts, keepComparisonChart). */
  readonly prunes: boolean;
  private closed = false;

  constructor(private readonly options: ChartPoolOptions) {
    const count = options.workers ?? defaultWorkerCount();
    for (let i = 0; i < count; i++) this.startWorker(options.started?.shift());
    if (options.cacheDir) mkdirSync(options.cacheDir, { recursive: true });
    this.prunes = options.cacheDir !== undefined && (options.pruning !== 'when due' || pruneDue(options.cacheDir));
  }

  async partCharts(a: PartAnalysis, downloads?: DownloadPlace, svgFile?: string): Promise<DrawnChart[]> {
    const key = this.partKey(a.part.source.hash);
    // The job is made (and the part analysed) only when a worker is about to take it; the worker that draws
    // the charts writes the downloads and the SVGs' file and answers without the specs (and the SVGs). Charts
    // from the cache have their downloads written here, and their entry linked as the SVGs' file.
    const found = this.fromCache(key);
    if (!found.charts) {
      return this.drawn(this.run(() => ({ type: 'part', input: chartInput(a), ...(downloads ? { downloads: partDownloads(a, downloads) } : {}) }), found.file, true, svgFile));
    }
    if (downloads) {
      const started = performance.now();
      writePartDownloads(partDownloads(a, downloads));
      this.stats.downloadSeconds += (performance.now() - started) / 1000;
    }
    if (!svgFile) return compactCharts(found.charts);
    placeChartFile(found.file!, found.charts, svgFile);
    return withoutSvgs(found.charts);
  }

  /** Keep a part's cached charts through this build's pruning without reading them (its page is reused). */
  keepPartCharts(a: Pick<PartAnalysis, 'part'>): void {
    if (this.prunes) this.usedKeys.add(this.partKey(a.part.source.hash));
  }

  /** Keep a comparison's cached chart through this build's pruning without reading it (its page is kept). */
  keepComparisonChart(parts: readonly Pick<Part, 'source'>[], title: string): void {
    if (this.prunes) this.usedKeys.add(this.comparisonKey(parts, title));
  }

  private comparisonKey(parts: readonly Pick<Part, 'source'>[], title: string): string {
    return this.key('comparison', title, ...parts.map((p) => p.source.hash));
  }

  async comparisonChart(analyses: ComparedAnalysis[], title: string): Promise<ChartArtifact> {
    const key = this.comparisonKey(analyses.map((a) => a.part), title);
    const [chart] = await this.cached(key, () => ({ type: 'comparison', inputs: analyses.map(comparisonInput), title }));
    return chart;
  }

  async railChart(figures: PlanFigures, inputsKey: string): Promise<ChartArtifact> {
    const key = this.key('rail', inputsKey);
    const [chart] = await this.cached(key, () => ({ type: 'rail', data: railChartData(figures) }));
    return chart;
  }

  async loadStepCharts(figures: PlanFigures, inputsKey: string): Promise<ChartArtifact[]> {
    const data = loadStepChartData(figures);
    if (!data) return [];
    return this.cached(this.key('load-step', inputsKey), () => ({ type: 'load-step', data }));
  }

  async changeChart(data: ChangeChartData): Promise<ChartArtifact> {
    // The data holds both revisions' curves, which come from files of two revisions and two settings: the
    // key is the data itself.
    const key = this.key('change', sha256Hex(JSON.stringify(data)));
    const [chart] = await this.cached(key, () => ({ type: 'change', data }));
    return chart;
  }

  async measurementCharts(data: MeasurementChartData, index: number, inputsKey: string): Promise<ChartArtifact[]> {
    return this.cached(this.key('measurement', String(index), inputsKey), () => ({ type: 'measurement', data, index }));
  }

  /** Stop the workers and, when this build prunes, drop the cache entries it did not use; else count those it wrote. */
  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
    this.workers.length = 0;
    const dir = this.options.cacheDir;
    if (this.closed || !dir || !existsSync(dir)) return;
    this.closed = true;
    const ledger = this.options.pruning === 'when due' || this.options.pruning === 'now';
    if (this.prunes) pruneCache(dir, this.usedKeys, ledger);
    else if (ledger) countWritten(dir, this.stats.rendered);
  }

  private key(...parts: string[]): string {
    return sha256Hex([this.fingerprint, `chart file ${CHART_FILE_FORMAT}`, this.options.settingsKey, ...parts].join('\n')).slice(0, 32);
  }

  /** The first half of every part's charts' key: what they share, hashed once a build (see partKey). */
  private partKeyPrefix?: string;

  /**
   * A part's charts' key: 16 hex digits of a hash of what every part's shares (the code, the entry format,
   * the settings), then the part file's content hash, 16 hex digits of SHA-256 already (source.ts). A rebuild
   * that prunes keys every part it carries over, to keep its charts through the pruning: 10,000 hashes of the
   * whole text otherwise. A content hash of another form (none a library gives) is hashed with the rest, as other keys are.
   */
  private partKey(contentHash: string): string {
    if (!CONTENT_HASH.test(contentHash)) return this.key('part', contentHash);
    this.partKeyPrefix ??= this.key('part').slice(0, 16);
    return this.partKeyPrefix + contentHash;
  }

  /**
   * A request's charts from the cache and their entry's file, or the file they are to be written to when
   * drawn; `T` says whether its entries hold specs (a part's do not, withoutSpecs).
   */
  private fromCache<T extends DrawnChart>(key: string): { charts?: T[]; file?: string } {
    this.usedKeys.add(key);
    const file = this.options.cacheDir ? join(this.options.cacheDir, `${key}${CACHE_ENTRY_EXTENSION}`) : undefined;
    if (file && existsSync(file)) {
      try {
        const charts = readCacheEntry<T>(file);
        this.stats.fromCache++;
        // Not compacted here: a part's SVGs read to be linked to their page's file are let go at once.
        return { charts, file };
      } catch {
        // A damaged entry is drawn again and rewritten.
      }
    }
    return { file };
  }

  private async drawn<T extends DrawnChart>(render: Promise<T[]>): Promise<T[]> {
    const charts = compactCharts(await render);
    this.stats.rendered++;
    this.stats.drawn += charts.length;
    return charts;
  }

  /** Charts with their specs (a comparison's, a rail's …), from the cache or drawn and stored in it. */
  private cached(key: string, make: () => ChartJob): Promise<ChartArtifact[]> {
    const found = this.fromCache<ChartArtifact>(key);
    if (found.charts) return Promise.resolve(compactCharts(found.charts));
    // A worker answers with the specs unless asked to leave them out (slim), so the answer is whole here.
    return this.drawn(this.run(make, found.file, false) as Promise<ChartArtifact[]>);
  }

  /**
   * A job for a worker, which stores its charts in `cacheFile` and `svgFile` (answering without SVGs when
   * given one) and, when `slim`, answers without their specs. It is given as a function and made only shortly
   * before a worker takes it: a part's job holds its whole analysis, and a library's thousands of requests
   * arrive at once.
   */
  private run(make: () => ChartJob, cacheFile: string | undefined, slim: boolean, svgFile?: string): Promise<DrawnChart[]> {
    if (this.workers.length === 0) {
      // Drawn here: the drawing modules (and vega) are loaded now, by a build that draws a chart at all.
      return loadChartDrawing().then(({ renderChartJob }) => renderChartJob(make())).then((charts) => {
        const answer = slim ? withoutSpecs(charts) : charts;
        storeCharts(answer, cacheFile, svgFile);
        return svgFile ? withoutSvgs(answer) : answer;
      });
    }
    return new Promise((resolve, reject) => {
      const id = this.nextId++;
      this.pending.set(id, { resolve, reject });
      this.queue.push({ id, make, cacheFile, slim, svgFile });
      this.dispatch();
    });
  }

  private dispatch(): void {
    while (this.idle.length > 0 && this.queue.length > 0) {
      const worker = this.idle.pop()!;
      const next = this.queue.shift()!;
      const pending = this.pending.get(next.id);
      if (pending) pending.sentAt = performance.now();
      const message: WorkerJob = { id: next.id, job: next.job ?? next.make(), cacheFile: next.cacheFile, slim: next.slim, svgFile: next.svgFile };
      worker.postMessage(message);
    }
    // The next few jobs are made while the workers draw, so a worker that finishes finds one ready.
    if (this.queue.length > 0 && !this.preparing) {
      this.preparing = true;
      setImmediate(() => {
        this.preparing = false;
        for (let i = 0; i < Math.min(this.queue.length, this.workers.length); i++) this.queue[i].job ??= this.queue[i].make();
      });
    }
  }

  private startWorker(started?: StartedWorker): void {
    if (started?.failure) void started.worker.terminate();
    const { worker } = started && !started.failure ? started : startChartWorker();
    worker.on('message', (message: { id: number; charts?: DrawnChart[]; error?: string }) => {
      const pending = this.pending.get(message.id);
      this.pending.delete(message.id);
      if (pending?.sentAt !== undefined) this.stats.workerSeconds += (performance.now() - pending.sentAt) / 1000;
      this.idle.push(worker);
      this.dispatch();
      if (!pending) return;
      if (message.error !== undefined) pending.reject(new Error(`chart worker: ${message.error}`));
      else pending.resolve(message.charts!);
    });
    worker.on('error', (error) => {
      for (const p of this.pending.values()) p.reject(error);
      this.pending.clear();
    });
    this.workers.push(worker);
    this.idle.push(worker);
  }
}
