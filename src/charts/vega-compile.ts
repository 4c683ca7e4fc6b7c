// vega-lite's compile of a chart kind's spec: loaded by a process only when the table of compiled specs
// (vega-specs.ts) does not hold a spec it draws, and by the script that writes that table when zfolio is built.

import type { Spec as VegaSpec } from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { specKey } from './vega-specs.js';

let compiles = 0;

/** vega-lite's compile of `spec`; a warning is a defect in a chart definition (the chart tests find it). */
export function compileSpec(spec: TopLevelSpec, name: string): VegaSpec {
  const warnings: string[] = [];
  const vg = compile(spec, { logger: collectingLogger(warnings) }).spec as VegaSpec;
  if (warnings.length > 0) throw new Error(`chart "${name}": vega-lite warns: ${warnings.join('; ')}`);
  compiles++;
  return vg;
}

/** How many specs this process compiled. */
export const specCompiles = () => compiles;

/** The table for these vega-lite specs (a chart kind's, as drawn: render.ts `drawnSpec`), keys sorted. */
export function chartSpecTable(specs: readonly { name: string; spec: TopLevelSpec }[]): Record<string, VegaSpec> {
  const entries = specs.map((s) => [specKey(s.spec), compileSpec(s.spec, s.name)] as const);
  return Object.fromEntries(entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
}

function collectingLogger(into: string[]) {
  const logger = {
    level: () => logger,
    error: (...args: unknown[]) => void into.push(args.join(' ')),
    warn: (...args: unknown[]) => void into.push(args.join(' ')),
    info: () => logger,
    debug: () => logger,
  };
  return logger as never;
}
