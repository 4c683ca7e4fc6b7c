// Chart: several parts' |Z| overlaid on common log-log axes, one colour and dash pattern per part (overlay.ts),
// each part's self-resonance marked in its colour, the key listing the part ids in the order given.

import { describeComparison, type ChartText } from '../present/chart-descriptions.js';
import { AXIS_TITLE, KEY_TEXT } from '../present/chart-words.js';
import { MAX_DECADES, frequencyAxis, logValueAxis } from './axes.js';
import { curveRows, mergeCurve } from './curves.js';
import { frame, PLOT_WIDTH } from './frame.js';
import type { KeyItem } from './key.js';
import { overlayColor, overlayEncoding, overlayStyle } from './overlay.js';
import type { PartChartInput } from './part-marks.js';
import { renderChart, type ChartOutput, type Row } from './render.js';
import { positiveExtent } from './scales.js';
import { colouredPointLayer, curveLayer } from './spec-parts.js';
import { xyChart } from './xy-chart.js';

/** What a comparison draws of a part: its id, |Z| over its resolved sweep and its self-resonance (a PartChartInput fits). */
export type ComparisonPart = Pick<PartChartInput, 'part' | 'frequencies' | 'selfResonance'> & { columns: Pick<PartChartInput['columns'], 'magnitudeOhm'> };

/** The parts compared. */
export type ComparisonInput = readonly ComparisonPart[];

const FRAME = frame(PLOT_WIDTH, 300, 28, 42);
const LINE_WIDTH = 1.4;

export const comparisonChart = xyChart<ComparisonInput>({
  name: 'comparison',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: AXIS_TITLE.frequency },
  y: { name: 'y', field: 'v', scale: 'log', title: AXIS_TITLE.impedance },
  keyStyle: overlayEncoding(LINE_WIDTH),
  marks: (X, Y) => [curveLayer('curves', X, Y, overlayEncoding(LINE_WIDTH), 'p'), colouredPointLayer('points', X, Y, 40)],
  draw(parts) {
    const from = Math.min(...parts.map((p) => p.frequencies[0]));
    const to = Math.max(...parts.map((p) => p.frequencies[p.frequencies.length - 1]));
    const x = frequencyAxis(from, to, FRAME.width);
    const magnitudes = parts.map((p) => p.columns.magnitudeOhm);
    const y = logValueAxis(...positiveExtent(magnitudes, MAX_DECADES), FRAME.height, 'Ω');

    const curves: Row[] = [];
    const points: Row[] = [];
    parts.forEach((p, k) => {
      const srf = p.selfResonance;
      const exact = srf ? [{ f: srf.frequencyHz, v: srf.impedanceOhm }] : [];
      const curve = mergeCurve(p.frequencies, (i) => magnitudes[k][i], exact, true);
      curves.push(...curveRows(curve, x.map, y.map, 'z', { ...overlayStyle(k), p: k }));
      if (srf) points.push({ f: srf.frequencyHz, v: srf.impedanceOhm, color: overlayColor(k) });
    });
    const key: KeyItem[] = parts.map((p, k) => ({ kind: 'line', style: overlayStyle(k), text: p.part.id }));
    if (points.length > 0) key.push({ kind: 'point', color: '#6d6d6d', text: KEY_TEXT.selfResonance });
    return { x, y, datasets: { curves, points }, key, keyGrid: true };
  },
});

/** Render a comparison of parts (in the order given: the key lists them so). */
export function renderComparisonChart(parts: ComparisonInput, text?: ChartText): Promise<ChartOutput> {
  if (parts.length === 0) return Promise.reject(new Error('a comparison chart needs at least one part'));
  return renderChart(comparisonChart, parts, text ?? describeComparison(parts));
}
