// The version of an installed package, for keys that must change when it does: the chart spec table's
// (vega-specs.ts) and the build's code key (build/reuse.ts).

import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

const require = createRequire(import.meta.url);

/**
 * The version in `name`'s package.json: the nearest one above the module the package resolves to that names
 * it. Undefined when the package is not installed or no such package.json is found.
 */
export function installedVersion(name: string): string | undefined {
  let dir: string;
  try {
    dir = dirname(require.resolve(name));
  } catch {
    return undefined;
  }
  for (let i = 0; i < 6; i++, dir = dirname(dir)) {
    try {
      const found = JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as { name?: string; version?: string };
      if (found.name === name) return found.version ?? '?';
    } catch {
      // no package.json in this folder: the one above
    }
  }
  return undefined;
}
