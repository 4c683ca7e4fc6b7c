// Chart: one part's or one rail's |Z| as it was at an earlier revision and as it is now, overlaid on common
// log-log axes — the earlier curve grey and dashed, the current one solid — with the marks that matter (a
// part's self-resonance, a rail's worst point) on each and, for a rail, its target before and now.
// Input is plain data, so the history code and the charts only share this interface.

import { formatEng } from '../units/format.js';
import { frameForKey, layoutKey, type KeyItem } from './key.js';
import { FONT_SIZE, PLOT_WIDTH, TARGET_LINE, frame, type SeriesStyle } from './palette.js';
import { curveRows, frequencyAxis, mergeCurve, Y_TICK_SPACING } from './part-data.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText, type Row } from './render.js';
import { describeChange } from '../present/change-chart-descriptions.js';
import { logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import { axisBinding, axisParams, bandLayers, curveLayer, frameLayer, gridLayers, keyLayers, position, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { textWidth } from './text-width.js';
import { CHART_CONFIG } from './theme.js';

/** One revision's curve: |Z| at ascending frequencies, and the points to mark on it (SRF, worst point). */
export interface ChangeCurve {
  frequencies: ArrayLike<number>;
  ohm: ArrayLike<number>;
  marks: readonly { frequencyHz: number; impedanceOhm: number }[];
}

/** What the chart draws; SI base units. */
export interface ChangeChartData {
  /** The part id or rail name. */
  subject: string;
  /** 'part' or 'rail', for the words. */
  kind: 'part' | 'rail';
  /** The earlier revision, as the user named it. */
  since: string;
  /** Null when the subject did not exist then (or does not now). */
  before: ChangeCurve | null;
  after: ChangeCurve | null;
  /** A rail's target impedance before and now, Ω. */
  target?: { before: number | null; after: number | null };
  /** A rail's band now, shaded. */
  band?: { fromHz: number; toHz: number } | null;
  /** What the mark on each curve is: "SRF" or "worst point". */
  markName: string;
}

const BEFORE: SeriesStyle = { color: '#8a8a8a', dash: [6, 3], width: 1.5 };
const NOW: SeriesStyle = { color: '#1f3d73', dash: [], width: 1.8 };
const TARGET_BEFORE: SeriesStyle = { color: TARGET_LINE.color, dash: [2, 3], width: 1.1 };
const SERIES: SeriesScale = { keys: ['before', 'now', 'target-before', 'target'], styles: [BEFORE, NOW, TARGET_BEFORE, TARGET_LINE] };
const FRAME = frame(PLOT_WIDTH, 260, 28, 42);
const MAX_DECADES = 12;
const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'log', 'Impedance |Z|');

export const changeChart: ChartDefinition<ChangeChartData> = {
  name: 'change',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        ...bandLayers(X),
        curveLayer('curves', X, Y, seriesEncoding(SERIES)),
        {
          data: { name: 'marks' },
          mark: { type: 'point', shape: 'circle', size: 44, filled: true, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true },
          encoding: { x: X, y: Y, color: { field: 'color', type: 'nominal', scale: null } },
        },
        frameLayer(),
        ...keyLayers(seriesEncoding(SERIES)),
      ],
    } as never;
  },
  bind(data) {
    const curves = [data.before, data.after].filter((c): c is ChangeCurve => c !== null && c.frequencies.length > 1);
    const from = Math.min(...curves.map((c) => c.frequencies[0]));
    const to = Math.max(...curves.map((c) => c.frequencies[c.frequencies.length - 1]));
    const fa = frequencyAxis(from, to, FRAME.width);
    const targets = [data.target?.before, data.target?.after].filter((t): t is number => typeof t === 'number' && t > 0);
    const yDomain = paddedLogDomain(...positiveExtent([...curves.map((c) => c.ohm), targets], MAX_DECADES));
    const yMap = logAxis(yDomain, FRAME.height);
    const ya = axisBinding('y', yDomain, logTicks(yDomain, FRAME.height, 'Ω', Y_TICK_SPACING));

    const rows: Row[] = [];
    const marks: Row[] = [];
    const items: KeyItem[] = [];
    const addCurve = (curve: ChangeCurve | null, series: 'before' | 'now', text: string) => {
      if (!curve) return;
      const f = Float64Array.from(curve.frequencies);
      const extra = curve.marks.map((m) => ({ f: m.frequencyHz, v: m.impedanceOhm }));
      rows.push(...curveRows(mergeCurve(f, (i) => curve.ohm[i], extra, true), fa.map, yMap, series));
      for (const m of curve.marks) marks.push({ f: m.frequencyHz, v: m.impedanceOhm, color: (series === 'now' ? NOW : BEFORE).color });
      items.push({ kind: 'line', style: { s: series }, text });
    };
    addCurve(data.before, 'before', `at ${data.since}`);
    addCurve(data.after, 'now', 'now');
    const flat = (series: string, ohm: number) => {
      rows.push({ f: from, v: ohm, s: series, i: rows.length }, { f: to, v: ohm, s: series, i: rows.length + 1 });
    };
    const t = data.target;
    if (t && t.after !== null && t.before !== null && t.after !== t.before) {
      flat('target-before', t.before);
      items.push({ kind: 'line', style: { s: 'target-before' }, text: `target at ${data.since} ${formatEng(t.before, 'Ω')}` });
    }
    const targetNow = t?.after ?? t?.before ?? null;
    if (targetNow !== null && targetNow !== undefined) {
      flat('target', targetNow);
      items.push({ kind: 'line', style: { s: 'target' }, text: `target ${t?.after === null ? `at ${data.since} ` : ''}${formatEng(targetNow, 'Ω')}` });
    }
    if (marks.length > 0) items.push({ kind: 'point', color: '#6d6d6d', text: data.markName });
    if (data.band) items.push({ kind: 'band', text: `band ${formatEng(data.band.fromHz, 'Hz')} – ${formatEng(data.band.toHz, 'Hz')}` });
    const widest = Math.max(...items.map((it) => textWidth(it.text, FONT_SIZE.legend))) + 26 + 5 + 18;
    const key = layoutKey(items, FRAME.width, Math.max(1, Math.min(4, Math.floor(FRAME.width / widest))));
    return {
      frame: frameForKey(FRAME, key),
      params: { ...fa.params, ...ya.params },
      datasets: {
        ...fa.datasets,
        ...ya.datasets,
        band: data.band ? [{ f: data.band.fromHz, f2: data.band.toHz }] : [],
        bandEdges: data.band ? [{ f: data.band.fromHz }, { f: data.band.toHz }] : [],
        curves: rows,
        marks,
        ...key.datasets,
      },
    };
  },
};

export function renderChangeChart(data: ChangeChartData, text?: ChartText): Promise<ChartOutput> {
  if (!data.before && !data.after) return Promise.reject(new Error('a change chart needs a curve before or after'));
  return renderChart(changeChart, data, text ?? describeChange(data));
}
