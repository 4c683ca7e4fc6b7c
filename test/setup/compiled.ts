// dist/, the compiled command line that bin/zfolio.js runs: compiled from the sources under test when any
// compiled file is missing or older than its source (right after `npm ci` it is current, and nothing runs).

import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { filesUnder, REPO } from '../site-helpers.js';

/** Whether dist/ holds a compiled file, newer than its source, for every source file. */
export function distIsCurrent(): boolean {
  return filesUnder(join(REPO, 'src'))
    .filter((f) => f.endsWith('.ts') && !f.endsWith('.d.ts'))
    .every((f) => {
      const built = join(REPO, 'dist', f.replace(/\.ts$/, '.js'));
      return existsSync(built) && statSync(built).mtimeMs >= statSync(join(REPO, 'src', f)).mtimeMs;
    });
}

/** Compile dist/ unless it is current, as `npm ci` does; a compile error stops the run with tsc's words. */
export function compileDist(): void {
  if (distIsCurrent()) return;
  const tsc = spawnSync(process.execPath, [join(REPO, 'node_modules/typescript/bin/tsc'), '-p', 'tsconfig.build.json'], { cwd: REPO, encoding: 'utf8' });
  if (tsc.status !== 0 || !distIsCurrent()) throw new Error(`compiling dist/ failed:\n${tsc.stdout}${tsc.stderr}`);
}
