// The installed entry point, end to end: a real process running bin/zfolio.js over the compiled dist/.

import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { GOOD_LIBRARY } from './fake-io.js';
import { copyLibrary } from '../site-helpers.js';
import { compileDist, distIsCurrent } from '../setup/compiled.js';

const PACKAGE = fileURLToPath(new URL('../../', import.meta.url));

describe('bin/zfolio.js', () => {
  beforeAll(() => {
    // dist/ is compiled from the sources under test before the run (test/setup/global.ts), as `npm ci` does,
    // so a stale dist/ cannot pass for them; compileDist is a no-op when every compiled file is current.
    compileDist();
    expect(distIsCurrent()).toBe(true);
    expect(existsSync(`${PACKAGE}dist/cli/main.js`)).toBe(true);
  }, 120_000);

  it('check --library on the good library prints the summary and exits 0', () => {
    const r = spawnSync(process.execPath, ['bin/zfolio.js', 'check', '--library', GOOD_LIBRARY], { cwd: PACKAGE, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.stdout).toBe('ok: 5 parts in 6 files, no errors\n');
    expect(r.status).toBe(0);
  });

  it('build works from any folder: the templates come from the package, not the current folder', () => {
    const library = copyLibrary(GOOD_LIBRARY, 'bin-build');
    const r = spawnSync(process.execPath, [`${PACKAGE}bin/zfolio.js`, 'build', '--workers', '0'], { cwd: library, encoding: 'utf8' });
    expect(r.stderr).not.toMatch(/internal error/);
    expect(r.stdout).toMatch(/^built 5 parts, \d+ pages in [\d.]+ s: _site\/index.html\n$/);
    expect(r.status).toBe(0);
    expect(existsSync(join(library, '_site', 'index.html'))).toBe(true);
  }, 120_000);
});
