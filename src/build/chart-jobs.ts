// Chart work as plain, cloneable jobs, so the same job can run in this thread or a worker thread
// (chart-draw.ts draws one). Only types of the chart modules are imported here: making jobs loads no vega.

import type { PartAnalysis } from '../analysis/part-figures.js';
import type { ComparisonPart } from '../charts/comparison-chart.js';
import type { ChartColumns, PartChartInput } from '../charts/part-marks.js';
import type { RailChartData } from '../charts/rail-chart.js';
import { loadStepChartInput, type LoadStepChartData } from '../charts/load-step-data.js';
import type { ChangeChartData } from '../charts/change-chart.js';
import type { PlanFigures } from '../analysis/plan-figures.js';
import type { ChartArtifact, DrawnChart } from './chart-maker.js';
import type { PartDownloads } from './part-downloads.js';
import type { MeasurementChartData } from '../charts/measurement-charts.js';

export type ChartJob =
  /** With `downloads`, the part's downloads are written once its charts are drawn (part-downloads.ts). */
  | { type: 'part'; input: PartChartInput; downloads?: PartDownloads }
  | { type: 'comparison'; inputs: ComparisonPart[]; title: string }
  | { type: 'rail'; data: RailChartData }
  | { type: 'load-step'; data: LoadStepChartData }
  | { type: 'change'; data: ChangeChartData }
  | { type: 'measurement'; data: MeasurementChartData; index: number };

/** The columns a part's charts read, the arrays themselves. */
function chartColumns(columns: ChartColumns): ChartColumns {
  const { resistanceOhm, reactanceOhm, magnitudeOhm, phaseDeg, conductanceS, susceptanceS } = columns;
  return { resistanceOhm, reactanceOhm, magnitudeOhm, phaseDeg, conductanceS, susceptanceS };
}

/** The part of an analysis the charts read: typed arrays and plain objects only (no YAML nodes). */
export function chartInput(a: PartAnalysis): PartChartInput {
  const { part } = a;
  return {
    part: { id: part.id, title: part.title, kind: part.kind, behavesAs: part.behavesAs, network: part.network, nominal: part.nominal, ratedAtHz: part.ratedAtHz },
    // The resolved sweep: curves pass through every narrow peak and notch the figures name.
    frequencies: a.resolved.frequencies,
    z: { re: a.resolved.z.re, im: a.resolved.z.im },
    // Only the columns the charts read: the job is copied to a worker thread.
    columns: chartColumns(a.resolvedColumns),
    resonances: a.resonances,
    selfResonance: a.selfResonance,
    usableBand: a.usableBand,
    within: a.within,
    spread: a.corners ? { frequencies: a.frequencies, min: a.corners.envelope.min, max: a.corners.envelope.max, corners: a.corners.corners } : null,
  };
}

/**
 * What a comparison needs of an analysed part (ComparedAnalysis): a build keeps only this of each part once
 * its folder is written, so a library's sweeps are not all held at once.
 */
export type ComparedAnalysis = Pick<PartAnalysis, 'part' | 'selfResonance'> & {
  resolved: Pick<PartAnalysis['resolved'], 'frequencies'>;
  resolvedColumns: Pick<PartAnalysis['resolvedColumns'], 'magnitudeOhm'>;
};

/** The part of an analysis a comparison chart reads. */
export function comparisonInput(a: ComparedAnalysis): ComparisonPart {
  const { part } = a;
  return {
    part: { id: part.id, title: part.title, kind: part.kind, behavesAs: part.behavesAs, network: part.network, nominal: part.nominal, ratedAtHz: part.ratedAtHz },
    frequencies: a.resolved.frequencies,
    columns: { magnitudeOhm: a.resolvedColumns.magnitudeOhm },
    selfResonance: a.selfResonance,
  };
}

/** Only what a comparison reads of an analysis, copied out of it so the rest can go. */
export function comparedAnalysis(a: ComparedAnalysis): ComparedAnalysis {
  return { part: a.part, selfResonance: a.selfResonance, resolved: { frequencies: a.resolved.frequencies }, resolvedColumns: { magnitudeOhm: a.resolvedColumns.magnitudeOhm } };
}

/**
 * Charts without their specs: what a part's page needs of its charts, and all its cache entry keeps (a spec
 * holds the chart's data, several times the SVG's size, and storing it was a tenth of a chart worker's time).
 */
export function withoutSpecs(charts: readonly ChartArtifact[]): DrawnChart[] {
  return charts.map(({ spec: _, ...drawn }) => drawn);
}

/** What the rail chart draws of an analysed plan. */
export function railChartData(f: PlanFigures): RailChartData {
  return {
    rail: f.rail,
    frequencies: f.frequenciesHz,
    totalOhm: f.impedanceOhm,
    target: f.targetOhm,
    branches: f.branches.map((b) => ({ label: b.label, ohm: b.impedanceOhm })),
    peaks: f.peaks.map((p) => ({ frequencyHz: p.frequencyHz, impedanceOhm: p.impedanceOhm })),
    band: { ...f.band },
    envelope: f.corners?.envelope ? { minOhm: f.corners.envelope.minOhm, maxOhm: f.corners.envelope.maxOhm, corners: f.corners.evaluated } : null,
  };
}

/** What the load-step charts draw of an analysed plan; null when it has no load step. */
export function loadStepChartData(f: PlanFigures): LoadStepChartData | null {
  const t = f.transient;
  if (!t || !t.resolved) return null;
  return loadStepChartInput(f.rail, t, f.branches.map((b) => b.label));
}
