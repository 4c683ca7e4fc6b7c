// The folio site (issue: the folio): a generated 1,000-part library built cold, against eleventy's floor,
// per chart, and rebuilt after one part file changes, each as a ratio to its goal or baseline measured in
// this run, with the build's own breakdown and the cores it kept busy. Every part is generated and invented.
// ZFOLIO_BENCH_PARTS=N builds N parts instead (for a quick look; the goals are for 1,000).

import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { buildFolio, type BuildResult } from '../src/build/build.js';
import { renderPages } from '../src/build/eleventy.js';
import { comparisonIndex } from '../src/pages/comparison-index.js';
import type { ChartOnPage, FolioData } from '../src/pages/site-data.js';
import { treeHashes } from '../test/site-helpers.js';
import { writeGeneratedLibrary } from './generate.js';
import type { BenchSection } from './measure.js';

const PARTS = Number(process.env.ZFOLIO_BENCH_PARTS ?? 1000);
const COLD_GOAL_S = 60;
const REBUILD_GOAL_S = 3;
const CORES = availableParallelism();

const s = (seconds: number) => `${seconds.toFixed(seconds < 10 ? 2 : 1)} s`;
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');
const count = (n: number) => n.toLocaleString('en-US');

/** The same page data with every chart's inline SVG emptied: what eleventy writes when charts cost nothing. */
function withoutSvg(folio: FolioData): FolioData {
  const bare = (c: ChartOnPage): ChartOnPage => ({ ...c, svg: '' });
  const partPages = folio.partPages.map((p) => ({ ...p, charts: p.charts.map(bare) }));
  const byId = new Map(partPages.map((p) => [p.id, p]));
  const comparisons = folio.comparisons.map((c) => ({ ...c, chart: c.chart && bare(c.chart) }));
  const rendered = new Set(folio.comparisonPages.map((c) => c.slug));
  return {
    ...folio,
    partPages,
    comparisons,
    comparisonPages: comparisons.filter((c) => rendered.has(c.slug)),
    ...comparisonIndex(comparisons),
    plans: folio.plans.map((p) => ({ ...p, chart: p.chart && bare(p.chart) })),
    reviews: folio.reviews.map((r) => ({ ...r, parts: r.parts.map((p) => byId.get(p.id) ?? p) })),
  };
}

async function timed<T>(fn: () => Promise<T>): Promise<[T, number]> {
  const started = performance.now();
  const value = await fn();
  return [value, (performance.now() - started) / 1000];
}

function breakdown(r: BuildResult): string {
  const t = r.timings;
  const charts = t.assemble.seconds - t.assemble.analyse;
  return [
    `load+check ${s(t.load.seconds)}`,
    `analyse ${s(t.assemble.analyse)}`,
    `charts+downloads ${s(charts)} (of which writing downloads, on the main thread beside the chart workers: ${s(t.assemble.downloads)})`,
    `eleventy pages, assets, links to carried-over folders ${s(t.pages.seconds)}`,
    `swap+record ${s(t.swap.seconds)}`,
  ].join(' | ');
}

export const siteBench: BenchSection = {
  name: 'site',
  async run() {
    const lines: string[] = [];
    lines.push(`load average before: ${load()} (${CORES} cores; other work on the machine slows every figure below)`);
    const root = writeGeneratedLibrary(PARTS, 1);
    const outDir = join(root, '_site');
    // One capacitor, edited and edited back: each edit is "a rebuild after changing one part file".
    const target = join(root, 'parts', 'group-0', 'gen-0.yaml');
    const original = readFileSync(target, 'utf8');
    const edited = original.replace(/esr: [^,}]+/, 'esr: 0.0123');
    if (edited === original) throw new Error('site bench: the part to edit has no esr');

    try {
      // (a) Cold: a new library, an empty chart cache, no previous site; default workers.
      const cold = await buildFolio({ libraryRoot: root, outDir });
      if (!cold.ok || !cold.folio || !cold.charts) throw new Error(`site bench: the cold build failed: ${cold.diagnostics[0]?.message}`);
      const pages = cold.pages;
      const drawn = cold.charts.drawn;
      const chartSeconds = cold.timings.assemble.seconds - cold.timings.assemble.analyse;
      lines.push(`(a) cold build of ${count(PARTS)} generated parts (${count(pages)} pages, ${count(drawn)} charts), empty chart cache, default workers: ${s(cold.seconds)} = ${(cold.seconds / COLD_GOAL_S).toFixed(2)} of the ${COLD_GOAL_S} s goal`);
      lines.push(`    ${breakdown(cold)}`);

      // (e) Cores: CPU time of every thread over wall time while charts were drawn, and the workers' share.
      const a = cold.timings.assemble;
      const workers = Math.min(CORES, 4);
      lines.push(
        `(e) while charts were drawn: ${s(a.cpuSeconds)} CPU in ${s(a.seconds)} = ${(a.cpuSeconds / a.seconds).toFixed(2)} of ${CORES} cores busy (all threads of the build); ` +
          `the ${workers} chart workers were on a job ${((cold.charts.workerSeconds / (chartSeconds * workers)) * 100).toFixed(0)}% of that time`,
      );

      // (c) Per chart: the charts stage shared out, and the workers' own time per chart.
      lines.push(
        `(c) per chart: ${(((chartSeconds / drawn) * 1000)).toFixed(2)} ms of build time (charts stage / charts drawn, ${workers} workers), ` +
          `${((cold.charts.workerSeconds / drawn) * 1000).toFixed(2)} ms of one worker's time; ${((cold.timings.assemble.cpuSeconds / drawn) * 1000).toFixed(2)} ms CPU (the stage's CPU of all threads / charts)`,
      );

      // (b) Eleventy's floor: the same templates and page data, with each chart's inline SVG an empty string
      // (every page, table and link still written), rendered now into a scratch folder; and the same with the
      // charts, for the cost of carrying them.
      const scratch = join(root, '_floor');
      const [floorPages, floor] = await timed(() => renderPages(join(scratch, 'bare'), withoutSvg(cold.folio!)));
      const [, withCharts] = await timed(() => renderPages(join(scratch, 'charts'), cold.folio!));
      rmSync(scratch, { recursive: true, force: true });
      lines.push(
        `(b) eleventy's floor (same templates and page data, every chart's inline SVG emptied): ${count(floorPages)} pages in ${s(floor)}; ` +
          `the cold build is ${(cold.seconds / floor).toFixed(1)}× the floor; eleventy with the charts inline ${s(withCharts)} = ${(withCharts / floor).toFixed(2)}× the floor`,
      );

      // (d) Rebuilds with a warm cache and the previous site in place.
      const coldHashes = treeHashes(outDir);
      const rebuilds: [string, BuildResult][] = [];
      for (const [label, text] of [
        ['one capacitor\'s ESR edited', edited],
        ['the edit undone', original],
      ] as const) {
        writeFileSync(target, text);
        const r = await buildFolio({ libraryRoot: root, outDir });
        if (!r.ok) throw new Error('site bench: a rebuild failed');
        rebuilds.push([label, r]);
      }
      const unchanged = await buildFolio({ libraryRoot: root, outDir });
      for (const [label, r] of rebuilds) {
        lines.push(
          `(d) rebuild, ${label}: ${s(r.seconds)} = ${(r.seconds / REBUILD_GOAL_S).toFixed(2)} of the ${REBUILD_GOAL_S} s goal ` +
            `(${count(r.reused)} part folders carried over, ${r.charts?.drawn ?? 0} charts drawn); ${(r.seconds / cold.seconds).toFixed(3)} of the cold build`,
        );
        lines.push(`    ${breakdown(r)}`);
      }
      lines.push(`    nothing changed: ${s(unchanged.seconds)} = ${(unchanged.seconds / REBUILD_GOAL_S).toFixed(2)} of the goal`);
      // The edit undone, the site must be the cold build's, byte for byte.
      const after = treeHashes(outDir);
      const differing = [...new Set([...coldHashes.keys(), ...after.keys()])].filter((f) => coldHashes.get(f) !== after.get(f));
      lines.push(`    after the edit and its undoing, the rebuilt site is ${differing.length === 0 ? 'byte-identical to' : `NOT identical to (${differing.length} files differ, e.g. ${differing.slice(0, 3).join(', ')})`} the cold build (${count(after.size)} files)`);
      lines.push(`load average after: ${load()}`);
      return lines;
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  },
};
