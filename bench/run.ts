// `npm run bench`: every benchmark section, each printing figures and ratios measured in this run.
// Usage: npm run bench [-- SECTION ...]

import { chartsBench } from './charts.bench.js';
import { cornersBench } from './corners.bench.js';
import { diffBench } from './diff.bench.js';
import { engineBench } from './engine.bench.js';
import { pdfBench } from './pdf.bench.js';
import { railBench } from './rail.bench.js';
import { siteBench } from './site.bench.js';
import { suggestBench } from './suggest.bench.js';
import { touchstoneBench } from './touchstone.bench.js';
import { transientBench } from './transient.bench.js';
import type { BenchSection } from './measure.js';

const SECTIONS: BenchSection[] = [engineBench, chartsBench, railBench, cornersBench, suggestBench, transientBench, touchstoneBench, diffBench, siteBench, pdfBench];

const wanted = process.argv.slice(2);
for (const section of SECTIONS) {
  if (wanted.length > 0 && !wanted.includes(section.name)) continue;
  console.log(`== ${section.name}`);
  for (const line of await section.run()) console.log(line);
}
