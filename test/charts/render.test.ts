import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { impedanceChart } from '../../src/charts/impedance-chart.js';
import { frame } from '../../src/charts/frame.js';
import { PART_CHART_KINDS, renderPartChart, renderPartCharts } from '../../src/charts/part-charts.js';
import { renderRailChart } from '../../src/charts/rail-chart.js';
import { chartStats, lastSceneBounds, renderChart, resetChartCache, type ChartDefinition } from '../../src/charts/render.js';
import { ALL_PARTS, analysed, capacitorPart, demoRail, inductorPart } from './fixtures.js';
import { freshSvg } from './fresh-render.js';
import { svgTags, svgTexts } from './svg-text.js';

const sha = (s: string) => createHash('sha256').update(s).digest('hex');
const parts = ALL_PARTS.map((p) => analysed(p));

describe('compile once, render many', () => {
  it('compiles and parses a chart kind once for 50 charts', async () => {
    // The counts are the process's: other test files of this fork may have compiled the kind before (and
    // reset the cache, see vega-specs.test.ts), so the test counts what its own charts add.
    resetChartCache();
    const start = chartStats().impedance ?? { compiles: 0, renders: 0 };
    await renderPartChart('impedance', parts[0]);
    const before = chartStats().impedance;
    expect(before.compiles - start.compiles).toBe(1);
    for (let k = 0; k < 50; k++) await renderPartChart('impedance', parts[k % parts.length]);
    const after = chartStats().impedance;
    expect(after.compiles).toBe(before.compiles);
    expect(after.renders - before.renders).toBe(50);
    // The counter does count: a reset forces one more compile.
    resetChartCache();
    await renderPartChart('impedance', parts[0]);
    expect(chartStats().impedance.compiles).toBe(after.compiles + 1);
  });
});

describe('determinism', () => {
  it('gives the same bytes for the same input, whatever was drawn before', async () => {
    const first = await renderPartCharts(parts[0]);
    for (const p of parts.slice(1)) await renderPartCharts(p);
    await renderComparisonChart(parts);
    const again = await renderPartCharts(parts[0]);
    for (const kind of PART_CHART_KINDS) expect(again[kind].svg).toBe(first[kind].svg);
  });

  it('gives the same bytes when renders of one kind run concurrently', async () => {
    const sequential = [];
    for (const p of parts) sequential.push((await renderPartChart('plane', p)).svg);
    const concurrent = await Promise.all(parts.map((p) => renderPartChart('plane', p)));
    expect(concurrent.map((c) => c.svg)).toEqual(sequential);
  });

  it('gives the same bytes in a separate process', async () => {
    const here = await renderPartCharts(analysed(capacitorPart));
    const script = fileURLToPath(new URL('./render-once.ts', import.meta.url));
    const out = execFileSync(process.execPath, ['--import', 'tsx', script], { encoding: 'utf8', timeout: 60_000 });
    const there = JSON.parse(out) as Record<string, string>;
    for (const kind of PART_CHART_KINDS) expect(there[kind], kind).toBe(sha(here[kind].svg));
  });
});

describe('the spec handed out for download', () => {
  it('draws the same picture when compiled and rendered afresh by vega-lite and vega', async () => {
    const out = await renderPartChart('impedance', parts[1]);
    expect(JSON.stringify(out.spec)).not.toMatch(/https?:/);
    expect(await freshSvg(out)).toBe(out.svg);
  });
});

describe('every chart as an SVG document', () => {
  const all = async () => {
    const outs = [];
    for (const p of parts) outs.push(...Object.values(await renderPartCharts(p)));
    outs.push(await renderComparisonChart(parts), await renderRailChart(demoRail()));
    return outs;
  };

  it('is an accessible, self-contained, inert image', async () => {
    for (const out of await all()) {
      const root = /^<svg [^>]*>/.exec(out.svg)![0];
      expect(root).toMatch(/ role="img"/);
      // Drawn for the width it prints at: the text column (640) or half of it (332), frame.ts.
      expect(root).toMatch(/ viewBox="0 0 (640|332) \d+(\.\d+)?"/);
      expect(out.svg).toMatch(/<title id="[^"]+">[^<]+<\/title><desc id="[^"]+">[^<]+<\/desc>/);
      expect(out.title.length).toBeGreaterThan(10);
      expect(out.description.length).toBeGreaterThan(80);
      // The only URL is the SVG namespace.
      expect(out.svg.match(/https?:\/\/[^"]*/g)).toEqual(['http://www.w3.org/2000/svg']);
      expect(out.svg).not.toMatch(/<script|<image|<foreignObject|<style|href=| on\w+=| style=| class=|@import/i);
      // Every id is defined once.
      const ids = [...out.svg.matchAll(/ id="([^"]+)"/g)].map((m) => m[1]);
      expect(new Set(ids).size).toBe(ids.length);
      for (const m of out.svg.matchAll(/url\(#([^)]+)\)/g)) expect(ids).toContain(m[1]);
    }
  });

  it('draws nothing outside its viewBox', async () => {
    for (const p of parts) {
      const charts = await renderPartCharts(p);
      for (const kind of PART_CHART_KINDS) {
        await renderPartChart(kind, p);
        const [, , w, h] = /viewBox="([^"]+)"/.exec(charts[kind].svg)![1].split(' ').map(Number);
        const b = lastSceneBounds(kind)!;
        expect(b.x1, `${p.part.id} ${kind}`).toBeGreaterThanOrEqual(0);
        expect(b.y1, `${p.part.id} ${kind}`).toBeGreaterThanOrEqual(0);
        expect(b.x2, `${p.part.id} ${kind}`).toBeLessThanOrEqual(w);
        expect(b.y2, `${p.part.id} ${kind}`).toBeLessThanOrEqual(h);
      }
    }
  });
});

describe('escaping text from library files', () => {
  const evil = `<script>"&'`;

  it('writes ids, labels, titles and descriptions as text, never as markup', async () => {
    const part = { ...analysed(inductorPart), part: { ...inductorPart, id: evil, title: evil } };
    const charts = [
      ...Object.values(await renderPartCharts(part, { impedance: { title: `Z of ${evil}`, description: `about ${evil}` } })),
      await renderComparisonChart([part, parts[0]]),
      await renderRailChart({ ...demoRail(), rail: evil, branches: [{ label: evil, ohm: demoRail().totalOhm }] }),
    ];
    for (const c of charts) {
      expect(c.svg).not.toContain('<script');
      expect(c.svg).not.toMatch(/"&'/);
      for (const tag of svgTags(c.svg)) expect(tag).not.toContain('script');
    }
    expect(charts[0].svg).toContain('<title id="' + /<title id="([^"]+)"/.exec(charts[0].svg)![1] + '">Z of &lt;script&gt;&quot;&amp;&#39;</title>');
    expect(svgTexts(charts[4].svg)).toContain(evil); // the comparison's key, read back as text
    expect(svgTexts(charts[5].svg)).toContain(evil); // the rail's branch key
    expect(charts[5].description).toContain(evil); // descriptions are plain text; the SVG escapes them
  });
});

describe('chart definitions', () => {
  it('turns a vega-lite warning into an error, so a broken spec cannot ship', async () => {
    const broken: ChartDefinition<null> = {
      name: 'broken-test',
      frame: frame(100, 100),
      spec: () => ({ data: { name: 'd' }, mark: 'line', encoding: { x: { field: 'a', type: 'quantitative', scale: { type: 'log', zero: true } } } }) as never,
      bind: () => ({ datasets: {}, params: {} }),
    };
    await expect(async () => renderChart(broken, null, { title: 't', description: 'd' })).rejects.toThrow(/vega-lite warns/);
  });

  it('refuses data for a source the spec does not have', async () => {
    const def = { ...impedanceChart, bind: (i: (typeof parts)[number]) => ({ ...impedanceChart.bind(i), datasets: { nonsense: [] } }) };
    await expect(async () => renderChart(def, parts[0], { title: 't', description: 'd' })).rejects.toThrow(/no data source nonsense/);
  });
});
