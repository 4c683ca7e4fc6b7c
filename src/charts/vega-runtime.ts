// vega as the one script its package ships (build/vega.js: vega, its own packages and the d3 modules they
// use, in one file) rather than its ES module entry, which loads 269 modules one by one (d3-geo-projection
// alone 109, for map projections no chart here uses). In a fresh process Node took 250 to 310 ms to load
// that entry, and about 120 ms for the script, in every build that draws a chart (a rebuild after one edit
// draws its part's charts on the main thread) and in every chart worker before its first chart.
//
// The script is a UMD wrapper, which gives its API to CommonJS; the package says its .js files are ES
// modules, as which the script would only set a global, so it is compiled here as the body of a CommonJS
// function. It is the same release of the same code; test/charts/vega-runtime.test.ts holds it to the entry.

import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { compileFunction } from 'node:vm';
import type * as Vega from 'vega';

function loadVega(): typeof Vega {
  const file = join(dirname(createRequire(import.meta.url).resolve('vega')), 'vega.js');
  const body = compileFunction(readFileSync(file, 'utf8'), ['exports', 'module'], { filename: file });
  const module = { exports: {} };
  body.call(module.exports, module.exports, module);
  return module.exports as typeof Vega;
}

/** vega's API, from its single-file build (beside the module entry the package exports). */
export const vega = loadVega();
