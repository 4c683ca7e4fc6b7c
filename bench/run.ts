// `npm run bench`: every benchmark section, each printing figures and ratios measured in this run.
// Usage: npm run bench [-- SECTION ...]; opt-in sections (long) run only when named: scale.

import { chartsBench } from './charts.bench.js';
import { cornersBench } from './corners.bench.js';
import { diffBench } from './diff.bench.js';
import { engineBench } from './engine.bench.js';
import { pdfBench } from './pdf.bench.js';
import { railBench } from './rail.bench.js';
import { scaleBench } from './scale.bench.js';
import { siteBench } from './site.bench.js';
import { suggestBench } from './suggest.bench.js';
import { touchstoneBench } from './touchstone.bench.js';
import { transientBench } from './transient.bench.js';
import type { BenchSection } from './measure.js';

const SECTIONS: BenchSection[] = [engineBench, chartsBench, railBench, cornersBench, suggestBench, transientBench, touchstoneBench, diffBench, siteBench, pdfBench];

/** Run only when asked for by name: a 10,000-part library takes many minutes. */
const OPT_IN: BenchSection[] = [scaleBench];

const wanted = process.argv.slice(2);
for (const section of [...SECTIONS, ...OPT_IN]) {
  if (wanted.length > 0 ? !wanted.includes(section.name) : OPT_IN.includes(section)) continue;
  console.log(`== ${section.name}`);
  for (const line of await section.run()) console.log(line);
}
