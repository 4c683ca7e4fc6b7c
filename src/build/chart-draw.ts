// Drawing a chart job (chart-jobs.ts), in a chart worker thread or, for a build that draws a few charts, in
// the build's own thread, which loads this module (and with it vega) only when it first draws one.

import { comparisonChart, renderComparisonChart } from '../charts/comparison-chart.js';
import { describeComparison } from '../present/chart-descriptions.js';
import { PART_CHART_KINDS, PART_CHARTS, renderPartCharts } from '../charts/part-charts.js';
import { precompileChart } from '../charts/render.js';
import { renderRailChart } from '../charts/rail-chart.js';
import { renderLoadStepCharts } from '../charts/load-step-chart.js';
import { renderChangeChart } from '../charts/change-chart.js';
import { MEASUREMENT_CHART_KINDS, renderMeasurementCharts } from '../charts/measurement-charts.js';
import type { ChartJob } from './chart-jobs.js';
import type { ChartArtifact } from './chart-maker.js';
import { writePartDownloads } from './part-downloads.js';

export async function renderChartJob(job: ChartJob): Promise<ChartArtifact[]> {
  if (job.type === 'part') {
    const charts = await renderPartCharts(job.input);
    const artifacts = PART_CHART_KINDS.map((key) => ({ key, ...charts[key] }));
    if (job.downloads) writePartDownloads(job.downloads);
    return artifacts;
  }
  if (job.type === 'measurement') {
    const charts = await renderMeasurementCharts(job.data);
    return MEASUREMENT_CHART_KINDS.map((kind) => ({ key: `${kind}-${job.index}`, ...charts[kind] }));
  }
  if (job.type === 'rail') return [{ key: 'rail', ...(await renderRailChart(job.data)) }];
  if (job.type === 'change') return [{ key: 'change', ...(await renderChangeChart(job.data)) }];
  if (job.type === 'load-step') {
    const charts = await renderLoadStepCharts(job.data);
    return [
      { key: 'load-step', ...charts.voltage },
      { key: 'load-share', ...charts.share },
    ];
  }
  const chart = await renderComparisonChart(job.inputs, describeComparison(job.inputs, job.title));
  return [{ key: 'overlay', ...chart }];
}

/**
 * The part charts' kinds and the comparison's compiled now, one kind a turn of the event loop: a chart worker
 * does it as it waits for its first job, which would compile them (a job that arrives meanwhile runs between
 * two kinds and compiles those it needs itself).
 */
export function precompilePartCharts(): void {
  const kinds = [...PART_CHART_KINDS.map((kind) => () => precompileChart(PART_CHARTS[kind])), () => precompileChart(comparisonChart)];
  const next = (i: number) => {
    if (i < kinds.length) setImmediate(() => (kinds[i](), next(i + 1)));
  };
  next(0);
}
