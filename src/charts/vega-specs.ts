// Each chart kind's vega spec, compiled from its vega-lite spec once when zfolio itself is built rather than
// in every process that draws a chart. Compiling the part charts' four kinds took about 0.2 s of a one-edit
// rebuild of 1,000 parts (CPU profile, about a quarter of the build), and as much again in each chart worker
// of a cold build.
//
// `npm run build:ts` (and install) runs scripts/compile-chart-specs.mjs, which writes dist/charts/vega-specs.json
// from `chartSpecTable` (vega-compile.ts): each spec under a key made of vega-lite's version and the vega-lite
// spec's own JSON. A spec is looked up by the same key, so a table made by another version of vega-lite or of a
// chart's spec (the TypeScript sources under test, a dist/ older than its sources) is never used for it: the
// spec is compiled instead, as it always was. vega-lite itself is loaded only then (`loadCompiler`): loading it
// took about 55 ms of CPU in each process and chart worker that draws (after vega; five runs, load about 4),
// and its version is read from its package.json.

import { readFileSync } from 'node:fs';
import type { Spec as VegaSpec } from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import { sha256Hex } from '../model/sha256.js';
import { installedVersion } from './package-version.js';

/** Where the table is: beside this module in dist/ (there is none beside the TypeScript source). */
const TABLE = new URL('./vega-specs.json', import.meta.url);

/** The installed vega-lite's version (from its package.json: vega-lite itself is not loaded to read it). */
export const vegaLiteVersion: string = requiredVersion('vega-lite');

function requiredVersion(name: string): string {
  const found = installedVersion(name);
  if (found === undefined) throw new Error(`zfolio: cannot find ${name}’s package.json`);
  return found;
}

let table: Record<string, VegaSpec> | null | undefined;
let compiler: typeof import('./vega-compile.js') | undefined;

/** The key of a vega-lite spec: what its compiled vega spec depends on. */
export function specKey(spec: TopLevelSpec): string {
  return sha256Hex(`vega-lite ${vegaLiteVersion}\n${JSON.stringify(spec)}`);
}

/** Whether the table holds this vega-lite spec's vega spec. */
export function inSpecTable(spec: TopLevelSpec): boolean {
  return precompiled()?.[specKey(spec)] !== undefined;
}

/** Whether vega-lite is loaded to compile specs the table does not hold. */
export const compilerLoaded = () => compiler !== undefined;

/** Load vega-lite, for a spec the table does not hold. */
export async function loadCompiler(): Promise<void> {
  compiler ??= await import('./vega-compile.js');
}

/**
 * The vega spec of a chart kind's vega-lite spec: from the table when it holds this spec, else compiled by
 * vega-lite, which must be loaded first (`loadCompiler`).
 */
export function vegaSpecOf(spec: TopLevelSpec, name: string): VegaSpec {
  const found = precompiled()?.[specKey(spec)];
  // A copy: the table's object is shared by every kind, and what uses a spec may write into it.
  if (found) return structuredClone(found);
  if (!compiler) throw new Error(`chart "${name}": its spec is not in the table of compiled specs, and vega-lite is not loaded`);
  return compiler.compileSpec(spec, name);
}

/** How many specs this process compiled (tests check that a table hit compiles none). */
export const specCompiles = () => compiler?.specCompiles() ?? 0;

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
