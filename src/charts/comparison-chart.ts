// Chart: several parts' |Z| overlaid on common log-log axes, one colour and dash pattern per part (overlay.ts),
// each part's self-resonance marked in its colour, the key listing the part ids in the order given.

import { describeComparison } from '../present/chart-descriptions.js';
import { frameForKey, layoutKey, type KeyItem } from './key.js';
import { overlayColor, overlayEncoding, overlayStyle } from './overlay.js';
import { FONT_SIZE, PLOT_WIDTH, frame } from './palette.js';
import { curveRows, frequencyAxis, mergeCurve, Y_TICK_SPACING, type PartChartInput } from './part-data.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText, type Row } from './render.js';
import { logAxis, logTicks, paddedLogDomain, positiveExtent } from './scales.js';
import { axisBinding, axisParams, curveLayer, frameLayer, gridLayers, keyLayers, position } from './spec-parts.js';
import { textWidth } from './text-width.js';
import { CHART_CONFIG } from './theme.js';

/** The parts compared; any PartAnalysis fits. */
export type ComparisonInput = readonly PartChartInput[];

const FRAME = frame(PLOT_WIDTH, 300, 28, 42);
const LINE_WIDTH = 1.4;
const MAX_DECADES = 12;
const X = position('f', 'f', 'log', 'Frequency');
const Y = position('v', 'y', 'log', 'Impedance |Z|');

export const comparisonChart: ChartDefinition<ComparisonInput> = {
  name: 'comparison',
  frame: FRAME,
  spec() {
    return {
      config: CHART_CONFIG,
      params: [...axisParams('f'), ...axisParams('y')],
      layer: [
        ...gridLayers('f', 'x', X),
        ...gridLayers('y', 'y', Y),
        curveLayer('curves', X, Y, overlayEncoding(LINE_WIDTH), 'p'),
        {
          data: { name: 'points' },
          mark: { type: 'point', shape: 'circle', size: 40, filled: true, stroke: '#ffffff', strokeWidth: 1, opacity: 1, clip: true },
          encoding: { x: X, y: Y, color: { field: 'color', type: 'nominal', scale: null } },
        },
        frameLayer(),
        ...keyLayers(overlayEncoding(LINE_WIDTH)),
      ],
    } as never;
  },
  bind(parts) {
    const from = Math.min(...parts.map((p) => p.frequencies[0]));
    const to = Math.max(...parts.map((p) => p.frequencies[p.frequencies.length - 1]));
    const fa = frequencyAxis(from, to, FRAME.width);
    const magnitudes = parts.map((p) => Float64Array.from(p.frequencies, (_, i) => Math.hypot(p.z.re[i], p.z.im[i])));
    const yDomain = paddedLogDomain(...positiveExtent(magnitudes, MAX_DECADES));
    const yMap = logAxis(yDomain, FRAME.height);
    const ya = axisBinding('y', yDomain, logTicks(yDomain, FRAME.height, 'Ω', Y_TICK_SPACING));

    const curves: Row[] = [];
    const points: Row[] = [];
    parts.forEach((p, k) => {
      const srf = p.selfResonance;
      const exact = srf ? [{ f: srf.frequencyHz, v: srf.impedanceOhm }] : [];
      const curve = mergeCurve(p.frequencies, (i) => magnitudes[k][i], exact, true);
      curves.push(...curveRows(curve, fa.map, yMap, 'z', { ...overlayStyle(k), p: k }));
      if (srf) points.push({ f: srf.frequencyHz, v: srf.impedanceOhm, color: overlayColor(k) });
    });

    const items: KeyItem[] = parts.map((p, k) => ({ kind: 'line', style: overlayStyle(k), text: p.part.id }));
    if (points.length > 0) items.push({ kind: 'point', color: '#6d6d6d', text: 'self-resonance (SRF)' });
    const widest = Math.max(...items.map((it) => textWidth(it.text, FONT_SIZE.legend))) + 26 + 5 + 18;
    const columns = Math.max(1, Math.min(4, Math.floor(FRAME.width / widest)));
    const key = layoutKey(items, FRAME.width, columns);
    return {
      frame: frameForKey(FRAME, key),
      params: { ...fa.params, ...ya.params },
      datasets: { ...fa.datasets, ...ya.datasets, curves, points, ...key.datasets },
    };
  },
};

/** Render a comparison of parts (in the order given: the key lists them so). */
export function renderComparisonChart(parts: ComparisonInput, text?: ChartText): Promise<ChartOutput> {
  if (parts.length === 0) return Promise.reject(new Error('a comparison chart needs at least one part'));
  return renderChart(comparisonChart, parts, text ?? describeComparison(parts));
}
