// What the load-step charts (load-step-chart.ts) draw of a rail's load step: plain data, made where the
// plan is analysed and drawn wherever the charts are (a chart worker thread, say).

import type { LoadStepFigures } from '../analysis/load-step.js';
import type { DescribedLoadStep } from '../present/plan-chart-descriptions.js';

/** What the load-step charts draw; SI units (s, V, A/A): what their descriptions read, and the voltage. */
export interface LoadStepChartData extends DescribedLoadStep {
  /** The rail's deviation at each time, V. */
  voltageV: ArrayLike<number>;
}

/** What the charts draw of a rail's load step, its branches named by `labels` (in the analysis's order). */
export function loadStepChartInput(rail: string, t: LoadStepFigures, labels: readonly string[]): LoadStepChartData {
  return {
    rail,
    timesS: t.curves.timesS,
    voltageV: t.curves.voltageV,
    budgetV: t.budgetV,
    finalV: t.finalV,
    riseS: t.riseS,
    stepA: t.stepA,
    droop: { atS: t.atS, droopV: t.droopV },
    settleS: t.settleS,
    branches: labels.map((label, i) => ({ label, share: t.curves.shares[i] })),
  };
}
