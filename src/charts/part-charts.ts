// The four charts of a part's datasheet page, rendered together from one analysis.

import { admittanceChart } from './admittance-chart.js';
import { admittanceCircleChart } from './admittance-circle-chart.js';
import { halfPowerFrequencies } from '../analysis/half-power.js';
import { describeAdmittanceCircle, describePartChart, type PartChartKind } from '../present/chart-descriptions.js';
import { impedanceChart } from './impedance-chart.js';
import type { PartChartInput } from './part-marks.js';
import { phaseChart } from './phase-chart.js';
import { planeChart } from './plane-chart.js';
import { partPlaneConstant } from './plane-scale.js';
import { drawsAdmittancePlane } from './plane-kind.js';
import { renderChart, type ChartDefinition, type ChartOutput, type ChartText } from './render.js';
import { rowLayouts } from './chart-definition.js';

export type { PartChartInput } from './part-marks.js';
export type { PartChartKind } from '../present/chart-descriptions.js';

export type PartCharts = Record<PartChartKind, ChartOutput>;

/**
 * A capacitor's complex plane is drawn as its admittance circle (admittance-circle-chart.ts says why): its
 * impedance path, with a constant ESR, would be a vertical line. Other kinds keep the impedance plane.
 */
function drawsAdmittanceCircle(input: PartChartInput): boolean {
  return drawsAdmittancePlane(input.part);
}

/** The chart definition of one of a part's charts. */
export function chartOf(kind: PartChartKind, input: PartChartInput): ChartDefinition<PartChartInput> {
  return kind === 'plane' && drawsAdmittanceCircle(input) ? admittanceCircleChart : PART_CHARTS[kind];
}

/** A chart's title and description, written from the analysis (the complex plane's with its scale). */
function describe(kind: PartChartKind, input: PartChartInput): ChartText {
  if (kind === 'plane' && drawsAdmittanceCircle(input)) {
    const srf = input.selfResonance;
    return describeAdmittanceCircle(input, srf ? halfPowerFrequencies({ frequencies: input.frequencies, z: input.z, network: input.part.network }, srf.frequencyHz) : null);
  }
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
  // The page sets the charts two to a row, in this order.
  const defs = PART_CHART_KINDS.map((kind) => chartOf(kind, input));
  const layouts = rowLayouts(defs, input);
  const outputs = await Promise.all(PART_CHART_KINDS.map((kind, i) => renderChart(defs[i], input, text[kind] ?? describe(kind, input), layouts[i])));
  return Object.fromEntries(PART_CHART_KINDS.map((kind, i) => [kind, outputs[i]])) as PartCharts;
}

/** One of a part's charts, as renderPartCharts draws it. */
export function renderPartChart(kind: PartChartKind, input: PartChartInput, text?: ChartText): Promise<ChartOutput> {
  const defs = PART_CHART_KINDS.map((k) => chartOf(k, input));
  const i = PART_CHART_KINDS.indexOf(kind);
  return renderChart(defs[i], input, text ?? describe(kind, input), rowLayouts(defs, input)[i]);
}
