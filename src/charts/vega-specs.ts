// Each chart kind's vega spec, compiled from its vega-lite spec once when zfolio itself is built rather than
// in every process that draws a chart. Compiling the part charts' four kinds took about 0.2 s of a one-edit
// rebuild of 1,000 parts (CPU profile, about a quarter of the build), and as much again in each chart worker
// of a cold build.
//
// `npm run build:ts` (and install) runs scripts/compile-chart-specs.mjs, which writes dist/charts/vega-specs.json
// from `chartSpecTable`: each spec under a key made of vega-lite's version and the vega-lite spec's own JSON.
// A spec is looked up by the same key, so a table made by another version of vega-lite or of a chart's spec
// (the TypeScript sources under test, a dist/ older than its sources) is never used for it: the spec is
// compiled here instead, as it always was.

import { readFileSync } from 'node:fs';
import type { Spec as VegaSpec } from 'vega';
import { compile, version as vegaLiteVersion, type TopLevelSpec } from 'vega-lite';
import { sha256Hex } from '../model/sha256.js';

/** Where the table is: beside this module in dist/ (there is none beside the TypeScript source). */
const TABLE = new URL('./vega-specs.json', import.meta.url);

let table: Record<string, VegaSpec> | null | undefined;
let compiles = 0;

/** The key of a vega-lite spec: what its compiled vega spec depends on. */
export function specKey(spec: TopLevelSpec): string {
  return sha256Hex(`vega-lite ${vegaLiteVersion}\n${JSON.stringify(spec)}`);
}

/** vega-lite's compile of `spec`; a warning is a defect in a chart definition (the chart tests find it). */
export function compileSpec(spec: TopLevelSpec, name: string): VegaSpec {
  const warnings: string[] = [];
  const vg = compile(spec, { logger: collectingLogger(warnings) }).spec as VegaSpec;
  if (warnings.length > 0) throw new Error(`chart "${name}": vega-lite warns: ${warnings.join('; ')}`);
  compiles++;
  return vg;
}

/** The vega spec of a chart kind's vega-lite spec: from the table when it holds this spec, else compiled. */
export function vegaSpecOf(spec: TopLevelSpec, name: string): VegaSpec {
  const found = precompiled()?.[specKey(spec)];
  // A copy: the table's object is shared by every kind, and what uses a spec may write into it.
  return found ? structuredClone(found) : compileSpec(spec, name);
}

/** How many specs this process compiled (tests check that a table hit compiles none). */
export const specCompiles = () => compiles;

/** The table for these vega-lite specs (a chart kind's, as drawn: render.ts `drawnSpec`), keys sorted. */
export function chartSpecTable(specs: readonly { name: string; spec: TopLevelSpec }[]): Record<string, VegaSpec> {
  const entries = specs.map((s) => [specKey(s.spec), compileSpec(s.spec, s.name)] as const);
  return Object.fromEntries(entries.sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)));
}

/** Use `from` as the table instead of the file (null: none), for tests. */
export function useSpecTable(from: Record<string, VegaSpec> | null): void {
  table = from;
}

function precompiled(): Record<string, VegaSpec> | null {
  if (table === undefined) {
    try {
      table = JSON.parse(readFileSync(TABLE, 'utf8')) as Record<string, VegaSpec>;
    } catch {
      table = null;
    }
  }
  return table;
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
