// The finished SVG written from vega's scene graph (src/charts/svg-scene.ts) against the reference it
// replaces: vega's own SVG string (`view.toSVG()`, vega-scenegraph's string renderer) put through finishSvg.
// Every chart kind is drawn both ways, the reference also in a View of its own (fresh-render.ts), and the
// bytes must be the same; hand-made vega specs cover marks the charts do not use and the cases the writer
// leaves to the reference.

import type { Spec } from 'vega';
import { vega } from '../../src/charts/vega-runtime.js';
import { describe, expect, it } from 'vitest';
import { analyseLoadStep } from '../../src/analysis/load-step.js';
import { capacitor, inductor, resistor, series } from '../../src/circuit/element.js';
import { renderChangeChart, type ChangeCurve } from '../../src/charts/change-chart.js';
import { renderComparisonChart } from '../../src/charts/comparison-chart.js';
import { renderLoadStepCharts } from '../../src/charts/load-step-chart.js';
import { loadStepChartInput } from '../../src/charts/load-step-data.js';
import { renderMeasurementCharts } from '../../src/charts/measurement-charts.js';
import { PART_CHART_KINDS, renderPartChart } from '../../src/charts/part-charts.js';
import { renderRailChart } from '../../src/charts/rail-chart.js';
import { finishFromVegaSvg, type ChartOutput } from '../../src/charts/render.js';
import { finishSvg } from '../../src/charts/svg-finish.js';
import { sceneSvg } from '../../src/charts/svg-scene.js';
import { ALL_PARTS, analysed, demoRail } from './fixtures.js';
import { freshSvg } from './fresh-render.js';

/** Draws a chart by the scene writer, then by vega's string in the same View: both outputs and how each was written. */
async function bothWays(draw: () => Promise<ChartOutput[]>): Promise<{ scene: ChartOutput[]; vega: ChartOutput[]; byScene: number; byVega: number }> {
  const s0 = finishFromVegaSvg(false);
  const scene = await draw();
  const s1 = finishFromVegaSvg(true);
  const vegaOut = await draw().finally(() => finishFromVegaSvg(false));
  const s2 = finishFromVegaSvg();
  expect(s2.scene - s1.scene, 'the reference was written by vega’s string').toBe(0);
  return { scene, vega: vegaOut, byScene: s1.scene - s0.scene, byVega: s2.vega - s1.vega };
}

async function expectSame(draw: () => Promise<ChartOutput[]>) {
  const { scene, vega: reference, byScene, byVega } = await bothWays(draw);
  expect(byScene, 'every chart written from the scene').toBe(scene.length);
  expect(byVega).toBe(scene.length);
  for (let k = 0; k < scene.length; k++) {
    expect(scene[k].svg.length).toBeGreaterThan(1000);
    expect(scene[k].svg).toBe(reference[k].svg);
    // And as vega draws the handed-out spec in a new View.
    expect(scene[k].svg).toBe(await freshSvg(scene[k]));
  }
}

/** |Z| of a series R-L-C on a log sweep (the textbook series model: Alexander & Sadiku, ch. 14). */
function seriesRlc(esr: number, esl: number, c: number): ChangeCurve {
  const frequencies = Array.from({ length: 301 }, (_, i) => 1e3 * 10 ** (i / 50));
  const ohm = frequencies.map((f) => Math.hypot(esr, 2 * Math.PI * f * esl - 1 / (2 * Math.PI * f * c)));
  return { frequencies, ohm, marks: [{ frequencyHz: 1 / (2 * Math.PI * Math.sqrt(esl * c)), impedanceOhm: esr }] };
}

describe('a chart written from the scene graph is the chart vega’s SVG string finishes to', () => {
  it('for every part chart of every kind of part, one after another in the same Views', async () => {
    const parts = ALL_PARTS.map((p) => analysed(p));
    for (const p of parts) await expectSame(() => Promise.all(PART_CHART_KINDS.map((kind) => renderPartChart(kind, p))));
  });

  it('for comparison, rail, change, load-step and measurement charts', async () => {
    const parts = ALL_PARTS.map((p) => analysed(p));
    await expectSame(async () => [await renderComparisonChart(parts), await renderComparisonChart(parts.slice(0, 2))]);
    await expectSame(async () => [await renderRailChart(demoRail())]);
    await expectSame(async () => [
      await renderChangeChart({ subject: 'TC-100N', kind: 'part', since: 'v1', before: seriesRlc(0.02, 0.3e-9, 100e-9), after: seriesRlc(0.02, 0.6e-9, 100e-9), markName: 'SRF' }),
    ]);
    const branches = [
      { kind: 'regulator' as const, label: 'regulator', element: series(resistor(2e-3), inductor(12e-9)), count: 1 },
      { kind: 'capacitor' as const, label: '8 × small', element: series(resistor(20e-3), inductor(0.4e-9), capacitor(1e-6)), count: 8 },
    ];
    const step = analyseLoadStep({ voltageV: 1, target: { kind: 'ripple', ripple: 0.03, stepA: 2 }, band: { fromHz: 1e5, toHz: 5e7 }, riseS: undefined, durationS: undefined }, branches)!;
    await expectSame(async () => Object.values(await renderLoadStepCharts(loadStepChartInput('VDD_X', step, branches.map((b) => b.label)))));
    const n = 61;
    const frequencies = Float64Array.from({ length: n }, (_, k) => 1e3 * 10 ** (k / 10));
    const model = { re: new Float64Array(n).fill(0.02), im: Float64Array.from(frequencies, (f) => -1 / (2 * Math.PI * f * 100e-9)) };
    const measured = { re: model.re.map((r) => r * 1.1), im: model.im.map((x) => x * 1.05) };
    const data = { partId: 'DEMO-C', file: 'measurements/demo.s2p', fixture: 'shunt-thru' as const, frequencies, measured, model, errorDb: new Float64Array(n).fill(-0.8), errorDeg: new Float64Array(n).fill(-3), residual: { rmsDb: 0.8, maxDb: 0.8, rmsDeg: 3 } };
    await expectSame(async () => Object.values(await renderMeasurementCharts(data)));
  });
});

/** A vega spec's View after its run, and both writers' SVG of it. */
async function written(spec: object, underlay = '') {
  const view = new vega.View(vega.parse(spec as Spec), { renderer: 'none' });
  await view.runAsync();
  const text = { title: 'T & <t>', description: 'D Ω' };
  const size = { width: 200, height: 120 };
  const scene = sceneSvg(view, text, size, underlay);
  const raw = await view.toSVG();
  view.finalize();
  let reference: string;
  try {
    reference = finishSvg(raw, text, size, underlay);
  } catch (e) {
    reference = `refused: ${(e as Error).message}`;
  }
  return { scene, reference };
}

const plain = (marks: object[], extra: object = {}) => ({ width: 160, height: 80, padding: { left: 30, top: 20, right: 10, bottom: 20 }, autosize: 'none', marks, ...extra });

describe('marks and text the charts do not use yet', () => {
  it('rects, rounded and clipped groups, symbols, arcs, areas, dashed and solid rules, rotated and multi-line text', async () => {
    const { scene, reference } = await written(
      plain([
        { type: 'rect', encode: { enter: { x: { value: 3.14159 }, y: { value: 2 }, width: { value: 40.05 }, height: { value: 20 }, fill: { value: '#123456' }, opacity: { value: 0.5 } } } },
        {
          type: 'group',
          clip: true,
          encode: { enter: { x: { value: 50 }, y: { value: 10 }, width: { value: 60 }, height: { value: 40 }, cornerRadius: { value: 4 }, fill: { value: '#eeeeee' }, stroke: { value: '#333' } } },
          marks: [{ type: 'symbol', encode: { enter: { x: { value: 10 }, y: { value: 10 }, shape: { value: 'diamond' }, size: { value: 60 }, fill: { value: 'red' } } } }],
        },
        { type: 'group', clip: true, encode: { enter: { x: { value: 0 }, y: { value: 0 }, width: { value: 60 }, height: { value: 40 } } }, marks: [{ type: 'arc', encode: { enter: { x: { value: 20 }, y: { value: 20 }, innerRadius: { value: 5 }, outerRadius: { value: 15 }, startAngle: { value: 0 }, endAngle: { value: 2 }, fill: { value: 'blue' } } } }] },
        { type: 'rule', from: { data: 'rows' }, encode: { enter: { x: { field: 'x' }, y: { value: 0 }, y2: { value: 80 }, stroke: { value: '#000' }, strokeWidth: { value: 0.5 } } } },
        { type: 'rule', from: { data: 'rows' }, encode: { enter: { y: { field: 'x' }, x: { value: 0 }, x2: { value: 80 }, stroke: { value: '#999' }, strokeDash: { value: [2, 2] } } } },
        { type: 'area', from: { data: 'rows' }, encode: { enter: { x: { field: 'x' }, y: { value: 60 }, y2: { field: 'x' }, fill: { value: '#abcdef' }, fillOpacity: { value: 0.333333 } } } },
        { type: 'text', encode: { enter: { x: { value: 80 }, y: { value: 40 }, angle: { value: -90 }, text: { value: 'R < 1 & "Ω" \t' }, font: { value: 'Serif A' }, fontWeight: { value: 'bold' } } } },
        { type: 'text', encode: { enter: { x: { value: 100 }, y: { value: 60 }, dx: { value: 2.123 }, text: { value: ['two', 'lines'] }, font: { value: 'Serif A' }, align: { value: 'center' } } } },
      ], { data: [{ name: 'rows', values: [{ x: 10.55555 }, { x: 33.3 }, { x: 70 }] }] }),
    );
    expect(scene).toBeDefined();
    expect(scene).toBe(reference);
    expect(scene).toContain('font-family="Serif A"');
  });

  it('an underlay goes first in the plot of a frame group, as finishSvg puts it', async () => {
    const spec = plain([
      { type: 'group', encode: { enter: { width: { signal: 'width' }, height: { signal: 'height' } } }, marks: [{ type: 'rule', encode: { enter: { x: { value: 0 }, x2: { value: 10 }, y: { value: 5 }, stroke: { value: '#000' } } } }] },
    ]);
    // A vega-lite chart's root group is a frame: the spec's own marks are in one group item at (0,0).
    const underlay = '<path d="M0,30.04H80" stroke="#ececec" stroke-width="0.6" opacity="1"/><path d=""/>';
    const { scene, reference } = await written(spec, underlay);
    expect(scene).toBeDefined();
    expect(scene).toBe(reference);
    expect(scene).toContain('<path d="M0,30H80" stroke="#ececec" stroke-width="0.6"/>');
  });
});

describe('what the scene writer leaves to vega’s string', () => {
  const text = (font: string, t = 'x') => ({ type: 'text', encode: { enter: { x: { value: 5 }, y: { value: 5 }, text: { value: t }, font: { value: font } } } });
  it('texts in two font families, a gradient, a link, text holding "@" or "url(#"', async () => {
    const refused: string[] = [];
    for (const spec of [
      plain([text('A'), text('B')]),
      plain([{ type: 'rect', encode: { enter: { x: { value: 0 }, y: { value: 0 }, width: { value: 9 }, height: { value: 9 }, fill: { value: { gradient: 'linear', stops: [{ offset: 0, color: 'red' }, { offset: 1, color: 'blue' }] } } } } }]),
      plain([{ type: 'rect', encode: { enter: { x: { value: 0 }, y: { value: 0 }, width: { value: 9 }, height: { value: 9 }, fill: { value: 'red' }, href: { value: 'https://example.org/' } } } }]),
      plain([text('A', 'a @1@ b')]),
      plain([text('A', 'see url(#clip1)')]),
    ]) {
      const { scene, reference } = await written(spec);
      expect(scene).toBeUndefined();
      refused.push(reference.startsWith('<svg') ? 'written' : reference);
    }
    // finishSvg writes them, but for the link, which it refuses (svg-finish.ts: assertInert).
    expect(refused).toEqual(['written', 'written', 'refused: chart SVG holds an active or external reference: <a', 'written', 'written']);
  });

  it('an underlay with no plot to go in, or of anything but paths', async () => {
    // A chart with no marks: its root group's content is empty, and finishSvg refuses to place an underlay.
    const view = new vega.View(vega.parse(plain([]) as Spec), { renderer: 'none' });
    await view.runAsync();
    const underlay = '<path d="M0,0H1" stroke="#000"/>';
    expect(sceneSvg(view, { title: 'T', description: 'D' }, { width: 200, height: 120 }, underlay)).toBeUndefined();
    const raw = await view.toSVG();
    expect(() => finishSvg(raw, { title: 'T', description: 'D' }, { width: 200, height: 120 }, underlay)).toThrow(/no plot/);
    view.finalize();
    // An underlay of anything but paths (finishSvg would write it as it is).
    const marked = new vega.View(vega.parse(plain([text('A')]) as Spec), { renderer: 'none' });
    await marked.runAsync();
    expect(sceneSvg(marked, { title: 'T', description: 'D' }, { width: 200, height: 120 }, `<g>${underlay}</g>`)).toBeUndefined();
    expect(finishSvg(await marked.toSVG(), { title: 'T', description: 'D' }, { width: 200, height: 120 }, `<g>${underlay}</g>`)).toContain(`<g>${underlay}</g>`);
    marked.finalize();
  });
});
