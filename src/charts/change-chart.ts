// Chart: one part's or one rail's |Z| as it was at an earlier revision and as it is now, overlaid on common
// log-log axes — the earlier curve grey and dashed, the current one solid — with the marks that matter (a
// part's self-resonance, a rail's worst point) on each and, for a rail, its target before and now.
// Input is plain data, so the history code and the charts only share this interface.

import type { ChartText } from '../present/chart-descriptions.js';
import { describeChange } from '../present/change-chart-descriptions.js';
import { AXIS_TITLE, KEY_TEXT, bandKeyText, changeKey } from '../present/chart-words.js';
import { MAX_DECADES, frequencyAxis, logValueAxis } from './axes.js';
import { curveRows, mergeCurve } from './curves.js';
import { frame, PLOT_WIDTH } from './frame.js';
import type { KeyItem } from './key.js';
import { TARGET_LINE, type SeriesStyle } from './palette.js';
import { bandWithin, rangeBand } from './part-marks.js';
import { renderChart, type ChartOutput, type Row } from './render.js';
import { positiveExtent } from './scales.js';
import { colouredPointLayer, curveLayer, seriesEncoding, type SeriesScale } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

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

export const changeChart = xyChart<ChangeChartData>({
  name: 'change',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.impedance },
  keyStyle: seriesEncoding(SERIES),
  band: true,
  marks: (X, Y) => [curveLayer('curves', X, Y, seriesEncoding(SERIES)), colouredPointLayer('marks', X, Y, 44)],
  draw(data) {
    const curves = [data.before, data.after].filter((c): c is ChangeCurve => c !== null && c.frequencies.length > 1);
    const from = Math.min(...curves.map((c) => c.frequencies[0]));
    const to = Math.max(...curves.map((c) => c.frequencies[c.frequencies.length - 1]));
    const x = frequencyAxis(from, to, FRAME.width);
    const targets = [data.target?.before, data.target?.after].filter((t): t is number => typeof t === 'number' && t > 0);
    const y = logValueAxis(...positiveExtent([...curves.map((c) => c.ohm), targets], MAX_DECADES), FRAME.height, 'Ω');

    const rows: Row[] = [];
    const marks: Row[] = [];
    const key: KeyItem[] = [];
    const addCurve = (curve: ChangeCurve | null, series: 'before' | 'now', text: string) => {
      if (!curve) return;
      const f = Float64Array.from(curve.frequencies);
      const extra = curve.marks.map((m) => ({ f: m.frequencyHz, v: m.impedanceOhm }));
      rows.push(...curveRows(mergeCurve(f, (i) => curve.ohm[i], extra, true), x.map, y.map, series));
      for (const m of curve.marks) marks.push({ f: m.frequencyHz, v: m.impedanceOhm, color: (series === 'now' ? NOW : BEFORE).color });
      key.push({ kind: 'line', style: { s: series }, text });
    };
    addCurve(data.before, 'before', changeKey.before(data.since));
    addCurve(data.after, 'now', KEY_TEXT.now);
    const flat = (series: string, ohm: number) => {
      rows.push({ f: from, v: ohm, s: series, i: rows.length }, { f: to, v: ohm, s: series, i: rows.length + 1 });
    };
    const t = data.target;
    if (t && t.after !== null && t.before !== null && t.after !== t.before) {
      flat('target-before', t.before);
      key.push({ kind: 'line', style: { s: 'target-before' }, text: changeKey.targetBefore(data.since, t.before) });
    }
    const targetNow = t?.after ?? t?.before ?? null;
    if (targetNow !== null && targetNow !== undefined) {
      flat('target', targetNow);
      key.push({ kind: 'line', style: { s: 'target' }, text: changeKey.target(targetNow, t?.after === null ? data.since : undefined) });
    }
    if (marks.length > 0) key.push({ kind: 'point', color: '#6d6d6d', text: data.markName });
    // A rail's curves span exactly its band: no shading then, it would tint the whole plot.
    const band = bandWithin(data.band, from, to);
    if (band) key.push({ kind: 'band', text: bandKeyText(band) });
    return { x, y, band: rangeBand(band), datasets: { curves: rows, marks }, key, keyGrid: true };
  },
});

export function renderChangeChart(data: ChangeChartData, text?: ChartText): Promise<ChartOutput> {
  if (!data.before && !data.after) return Promise.reject(new Error('a change chart needs a curve before or after'));
  return renderChart(changeChart, data, text ?? describeChange(data));
}
