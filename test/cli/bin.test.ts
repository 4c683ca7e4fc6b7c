// The installed entry point, end to end: a real process running bin/zfolio.js over the compiled dist/.

import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { GOOD_LIBRARY } from './fake-io.js';

const PACKAGE = fileURLToPath(new URL('../../', import.meta.url));

describe('bin/zfolio.js', () => {
  beforeAll(() => {
    // `npm run build:ts` writes dist/; build it once if it is missing. tsc still emits when some other
    // file has a type error, so only the presence of the output is checked.
    if (!existsSync(`${PACKAGE}dist/cli/main.js`)) {
      spawnSync(process.execPath, [`${PACKAGE}node_modules/typescript/bin/tsc`, '-p', 'tsconfig.build.json'], { cwd: PACKAGE, stdio: 'ignore' });
    }
    expect(existsSync(`${PACKAGE}dist/cli/main.js`)).toBe(true);
  });

  it('check --library on the good library prints the summary and exits 0', () => {
    const r = spawnSync(process.execPath, ['bin/zfolio.js', 'check', '--library', GOOD_LIBRARY], { cwd: PACKAGE, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.stdout).toBe('ok: 5 parts in 6 files, no errors\n');
    expect(r.status).toBe(0);
  });
});
