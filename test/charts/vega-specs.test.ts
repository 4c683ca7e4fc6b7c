// The table of compiled chart specs (src/charts/vega-specs.ts): each entry is vega-lite's own compile of
// the kind's spec, a chart drawn from the table is the chart drawn from a fresh compile byte for byte, a
// spec the table does not hold under its key is compiled as before, and dist/ holds the table for the
// sources under test (the test setup compiles dist/ as `npm run build:ts` does).

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { compile, version } from 'vega-lite';
import { afterAll, describe, expect, it } from 'vitest';
import { CHART_KINDS, chartKindsSpecTable } from '../../src/charts/chart-kinds.js';
import { renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { PART_CHART_KINDS, renderPartCharts } from '../../src/charts/part-charts.js';
import { renderRailChart } from '../../src/charts/rail-chart.js';
import { drawnSpec, resetChartCache } from '../../src/charts/render.js';
import { specCompiles, specKey, useSpecTable, vegaLiteVersion } from '../../src/charts/vega-specs.js';
import { REPO } from '../site-helpers.js';
import { ALL_PARTS, analysed, demoRail } from './fixtures.js';

const parts = ALL_PARTS.map((p) => analysed(p));
const table = chartKindsSpecTable();

/** Every SVG of the five fixture parts' charts, a comparison and a rail chart, drawn from fresh Views. */
async function drawAll(): Promise<string[]> {
  resetChartCache();
  const svgs: string[] = [];
  for (const p of parts) {
    const charts = await renderPartCharts(p);
    for (const kind of PART_CHART_KINDS) svgs.push(charts[kind].svg);
  }
  svgs.push((await renderComparisonChart(parts)).svg, (await renderRailChart(demoRail())).svg);
  return svgs;
}

afterAll(() => {
  useSpecTable(null);
  resetChartCache();
});

describe('the table of compiled chart specs', () => {
  it('is keyed by the version vega-lite itself reports, read without loading it', () => {
    expect(vegaLiteVersion).toBe(version);
    expect(vegaLiteVersion).toMatch(/^\d+\.\d+\.\d+/);
  });

  it('holds, for every chart kind, what vega-lite compiles from the spec vega draws', () => {
    expect(Object.keys(table)).toHaveLength(CHART_KINDS.length);
    for (const def of CHART_KINDS) {
      const { drawn } = drawnSpec(def);
      // vega-lite's compile called here directly: the reference the table must equal.
      expect(table[specKey(drawn)], def.name).toEqual(compile(drawn).spec);
    }
  });

  it('draws every chart byte for byte as a fresh compile does, compiling nothing', async () => {
    useSpecTable(null);
    const compiledHere = await drawAll();
    useSpecTable(table);
    const before = specCompiles();
    const fromTable = await drawAll();
    expect(specCompiles()).toBe(before);
    expect(fromTable).toEqual(compiledHere);
  });

  it('compiles a spec the table does not hold under its key (another spec or another vega-lite)', async () => {
    // The same entries under keys that match no spec: as a table made for other sources would be.
    useSpecTable(Object.fromEntries(Object.entries(table).map(([key, spec]) => [`other-${key}`, spec])));
    const before = specCompiles();
    const svgs = await drawAll();
    // Four part-chart kinds, the capacitor's admittance circle, the comparison and the rail chart.
    expect(specCompiles() - before).toBe(7);
    useSpecTable(null);
    expect(svgs).toEqual(await drawAll());
  });

  it('is in dist/ for the sources under test, as `npm run build:ts` writes it', () => {
    const built = JSON.parse(readFileSync(join(REPO, 'dist', 'charts', 'vega-specs.json'), 'utf8')) as unknown;
    expect(built).toEqual(table);
  });
});
