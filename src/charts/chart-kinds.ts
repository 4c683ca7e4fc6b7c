// Every chart kind zfolio draws, for the table of compiled specs made when zfolio is built (vega-specs.ts)
// and the tests that check it covers them all.

import { admittanceCircleChart } from './admittance-circle-chart.js';
import { changeChart } from './change-chart.js';
import { comparisonChart } from './comparison-chart.js';
import { loadShareChart, loadStepChart } from './load-step-chart.js';
import { MEASUREMENT_CHARTS } from './measurement-charts.js';
import { PART_CHARTS } from './part-charts.js';
import { railChart } from './rail-chart.js';
import { drawnSpec, type ChartDefinition } from './render.js';
import { chartSpecTable } from './vega-compile.js';

export const CHART_KINDS: readonly ChartDefinition<never>[] = [
  ...Object.values(PART_CHARTS),
  admittanceCircleChart,
  comparisonChart,
  railChart,
  loadStepChart,
  loadShareChart,
  changeChart,
  ...Object.values(MEASUREMENT_CHARTS),
] as ChartDefinition<never>[];

/** The table of every kind's compiled spec, as dist/charts/vega-specs.json holds it. */
export const chartKindsSpecTable = () => chartSpecTable(CHART_KINDS.map((def) => ({ name: def.name, spec: drawnSpec(def).drawn })));
