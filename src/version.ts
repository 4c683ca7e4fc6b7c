// Where the zfolio package lives and its version, so pages and PDFs can name the tool that made them.

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

function readPackageJson(dir: string): { name?: string; version?: string } | undefined {
  try {
    return JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8'));
  } catch {
    return undefined;
  }
}

/** The package folder (holds templates/ and schema/): the nearest ancestor with zfolio's package.json. */
export const PACKAGE_ROOT: string = (() => {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (let i = 0; i < 4; i++, dir = dirname(dir)) {
    if (readPackageJson(dir)?.name === 'zfolio') return dir;
  }
  throw new Error('zfolio: cannot find its own package.json');
})();

export const VERSION: string = readPackageJson(PACKAGE_ROOT)?.version ?? '0.0.0';
