// dist/, the compiled command line that bin/zfolio.js runs: compiled from the sources under test when any
// compiled file is missing or older than its source (right after `npm ci` it is current, and nothing runs),
// with the table of compiled chart specs that `npm run build:ts` writes after tsc (src/charts/vega-specs.ts).

import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { filesUnder, REPO } from '../site-helpers.js';

const SPEC_TABLE = join(REPO, 'dist', 'charts', 'vega-specs.json');

/**
 * Whether dist/ holds a compiled file, newer than its source, for every source file, and a table of chart
 * specs no older than any compiled chart module.
 */
export function distIsCurrent(): boolean {
  const sources = filesUnder(join(REPO, 'src')).filter((f) => f.endsWith('.ts') && !f.endsWith('.d.ts'));
  const built = (f: string) => join(REPO, 'dist', f.replace(/\.ts$/, '.js'));
  const compiled = sources.every((f) => existsSync(built(f)) && statSync(built(f)).mtimeMs >= statSync(join(REPO, 'src', f)).mtimeMs);
  if (!compiled || !existsSync(SPEC_TABLE)) return false;
  const table = statSync(SPEC_TABLE).mtimeMs;
  return sources.filter((f) => f.startsWith('charts')).every((f) => statSync(built(f)).mtimeMs <= table);
}

/** Compile dist/ unless it is current, as `npm ci` does; a compile error stops the run with tsc's words. */
export function compileDist(): void {
  if (distIsCurrent()) return;
  const tsc = spawnSync(process.execPath, [join(REPO, 'node_modules/typescript/bin/tsc'), '-p', 'tsconfig.build.json'], { cwd: REPO, encoding: 'utf8' });
  if (tsc.status !== 0) throw new Error(`compiling dist/ failed:\n${tsc.stdout}${tsc.stderr}`);
  const specs = spawnSync(process.execPath, [join(REPO, 'scripts/compile-chart-specs.mjs')], { cwd: REPO, encoding: 'utf8' });
  if (specs.status !== 0 || !distIsCurrent()) throw new Error(`compiling dist/ failed:\n${specs.stdout}${specs.stderr}`);
}
