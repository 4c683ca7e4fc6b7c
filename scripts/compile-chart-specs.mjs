// Writes dist/charts/vega-specs.json: every chart kind's vega spec, compiled from its vega-lite spec once
// here instead of in every process that draws charts (src/charts/vega-specs.ts). Run after tsc, by
// `npm run build:ts` and on install.

import { writeFileSync } from 'node:fs';
import { chartKindsSpecTable } from '../dist/charts/chart-kinds.js';

const table = chartKindsSpecTable();
writeFileSync(new URL('../dist/charts/vega-specs.json', import.meta.url), JSON.stringify(table));
