// What the build needs from the chart layer: finished charts for a part and for a comparison. The build
// does not care whether they come from a cache, this thread or worker threads.

import type { PartAnalysis } from '../analysis/part-figures.js';
import type { PlanFigures } from '../analysis/plan-figures.js';
import type { ComparedAnalysis } from './chart-jobs.js';
import type { ChangeChartData } from '../charts/change-chart.js';
import type { MeasurementChartData } from '../charts/measurement-charts.js';
import type { DownloadPlace } from './part-downloads.js';

export interface ChartArtifact {
  /** File-name-safe key: "impedance", "phase", "plane", "admittance", "overlay". */
  key: string;
  title: string;
  /** Text alternative: what is plotted and the key values. */
  description: string;
  svg: string;
  /** The vega-lite spec with its data, offered as a download. */
  spec: object;
}

/** A chart as a page shows it: a part's charts come back without their spec, which is written beside the page. */
export type DrawnChart = Omit<ChartArtifact, 'spec'>;

export interface ChartMaker {
  /**
   * A part's charts; with `downloads`, its downloads and its charts' specs are written into that folder too,
   * in whichever thread draws them (part-downloads.ts), before the promise is resolved. With `svgFile`, their
   * SVGs may instead be written to that file as a chart file (chart-cache-entry.ts) and come back empty
   * (svg-spill.ts: `adopt` takes either).
   */
  partCharts(analysis: PartAnalysis, downloads?: DownloadPlace, svgFile?: string): Promise<DrawnChart[]>;
  comparisonChart(analyses: ComparedAnalysis[], title: string): Promise<ChartArtifact>;
  /** `inputsKey` names everything the plan's figures came from (file hashes), for caching. */
  railChart(figures: PlanFigures, inputsKey: string): Promise<ChartArtifact>;
  /** The load-step charts of a plan (voltage, then branch currents); none when it has no load step. */
  loadStepCharts(figures: PlanFigures, inputsKey: string): Promise<ChartArtifact[]>;
  /** A part's or a rail's |Z| at an earlier revision and now, on one chart. */
  changeChart(data: ChangeChartData): Promise<ChartArtifact>;
  /** A part against its `index`-th measurement (1-based): |Z|, phase and residual; `inputsKey` names the part and measurement files. */
  measurementCharts(data: MeasurementChartData, index: number, inputsKey: string): Promise<ChartArtifact[]>;
}
