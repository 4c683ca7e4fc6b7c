// A chart maker that draws nothing (blank SVGs, no part charts), for tests of what a build does around its
// charts: pages, runs, indexes. Builds with it skip vega entirely.

import type { ChartArtifact, ChartMaker } from '../../src/build/chart-maker.js';

const blank = (key: string, title: string): ChartArtifact => ({ key, title, description: title, svg: '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"></svg>', spec: {} });

export const noCharts: ChartMaker = {
  partCharts: async () => [],
  comparisonChart: async (_, title) => blank('overlay', title),
  railChart: async () => blank('rail', 'rail'),
  loadStepCharts: async () => [],
  changeChart: async () => blank('change', 'change'),
  measurementCharts: async () => [],
};
