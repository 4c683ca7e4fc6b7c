// The four charts of a part's datasheet page, rendered together from one analysis.

import { admittanceChart } from './admittance-chart.js';
import { describePartChart, type PartChartKind } from '../present/chart-descriptions.js';
import { impedanceChart } from './impedance-chart.js';
import type { PartChartInput } from './part-marks.js';
import { phaseChart } from './phase-chart.js';
import { planeChart } from './plane-chart.js';
import { partPlaneConstant } from './plane-scale.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText } from './render.js';

export type { PartChartInput } from './part-marks.js';
export type { PartChartKind } from '../present/chart-descriptions.js';

export type PartCharts = Record<PartChartKind, ChartOutput>;

/** A chart's title and description, written from the analysis (the complex plane's with its scale). */
function describe(kind: PartChartKind, input: PartChartInput): ChartText {
  return describePartChart(kind, input, kind === 'plane' ? partPlaneConstant(input) : undefined);
}

export const PART_CHARTS: Readonly<Record<PartChartKind, ChartDefinition<PartChartInput>>> = {
  impedance: impedanceChart,
  phase: phaseChart,
  plane: planeChart,
  admittance: admittanceChart,
};

export const PART_CHART_KINDS: readonly PartChartKind[] = ['impedance', 'phase', 'plane', 'admittance'];

/**
 * Render a part's charts (a `PartAnalysis` is a valid input). Titles and descriptions are written from the
 * analysis; `text` replaces any of them.
 */
export async function renderPartCharts(input: PartChartInput, text: Partial<Record<PartChartKind, ChartText>> = {}): Promise<PartCharts> {
  const outputs = await Promise.all(
    PART_CHART_KINDS.map((kind) => renderChart(PART_CHARTS[kind], input, text[kind] ?? describe(kind, input))),
  );
  return Object.fromEntries(PART_CHART_KINDS.map((kind, i) => [kind, outputs[i]])) as PartCharts;
}

/** One of a part's charts. */
export function renderPartChart(kind: PartChartKind, input: PartChartInput, text?: ChartText): Promise<ChartOutput> {
  return renderChart(PART_CHARTS[kind], input, text ?? describe(kind, input));
}
