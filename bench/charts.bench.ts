// Chart rendering (issue: the folio site): time per chart of each kind, the first chart of a kind (which
// compiles the vega-lite spec and parses it) against the steady state (the parsed View reused with new
// data), and a timed run of many parts' four charts, projected to a 1,000-part build.

import { analysePart, type PartAnalysis } from '../src/analysis/part-figures.js';
import { renderComparisonChart } from '../src/charts/comparison-chart.js';
import { PART_CHART_KINDS, renderPartChart, renderPartCharts } from '../src/charts/part-charts.js';
import { resetChartCache } from '../src/charts/render.js';
import { loadLibrary } from '../src/model/library.js';
import { writeGeneratedLibrary } from './generate.js';
import { measureAsync, type BenchSection } from './measure.js';

const BUILD_BUDGET_S = 60;
const CORES = 2;
const TIMED_PARTS = 200;

function analysedParts(count: number): PartAnalysis[] {
  const { library } = loadLibrary(writeGeneratedLibrary(count, 7));
  if (!library) throw new Error('generated library failed to load');
  return library.parts.map((p) => analysePart(p, library.settings.sweep, library.settings.within));
}

const ms = (s: number) => `${(s * 1000).toFixed(1)} ms`;

export const chartsBench: BenchSection = {
  name: 'charts',
  async run() {
    const lines: string[] = [];
    const parts = analysedParts(TIMED_PARTS);
    let k = 0;
    const next = () => parts[k++ % parts.length];

    lines.push(`per chart, ${parts[0].frequencies.length}-point sweeps, one core: first chart of a kind (compile + parse + render) vs steady state (View reused):`);
    for (const kind of PART_CHART_KINDS) {
      resetChartCache();
      const t0 = process.hrtime.bigint();
      await renderPartChart(kind, next());
      const first = Number(process.hrtime.bigint() - t0) / 1e9;
      const steady = await measureAsync(() => renderPartChart(kind, next()).then(() => undefined), 40, 1);
      lines.push(`  ${kind.padEnd(11)} first ${ms(first).padStart(9)}  steady ${ms(steady.secondsPerRun).padStart(8)}  first/steady ${(first / steady.secondsPerRun).toFixed(1)}×`);
    }
    const group = parts.slice(0, 6);
    const firstCmp = await (async () => {
      const t0 = process.hrtime.bigint();
      await renderComparisonChart(group);
      return Number(process.hrtime.bigint() - t0) / 1e9;
    })();
    const cmp = await measureAsync(() => renderComparisonChart(group).then(() => undefined), 10, 0.5);
    lines.push(`  comparison (6 parts) first ${ms(firstCmp)}  steady ${ms(cmp.secondsPerRun)}  first/steady ${(firstCmp / cmp.secondsPerRun).toFixed(1)}×`);

    // A timed run: every part's four charts, in order, as a build would do on one core.
    const t0 = process.hrtime.bigint();
    for (const p of parts) await renderPartCharts(p);
    const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
    const perPart = seconds / parts.length;
    const projected = (perPart * 1000) / CORES;
    lines.push(`${parts.length} parts × 4 charts on one core: ${seconds.toFixed(2)} s, ${ms(perPart / 4)} per chart`);
    lines.push(
      `  projected 1,000-part build, charts only, ${CORES} cores: ${projected.toFixed(1)} s = ${(projected / BUILD_BUDGET_S).toFixed(2)} of the ${BUILD_BUDGET_S} s budget`,
    );
    return lines;
  },
};
