// The README's console examples other than `zfolio diff` (test/cli/readme-diff.test.ts): each command run as
// the README shows it prints the README's lines, so the documentation cannot drift from the tool.
//
// - `zfolio figures ORV-C-0402-100N-X7R` on the demo library (the repository root);
// - `zfolio fit cap.s2p --kind capacitor` on the synthetic measurement the README describes (100 nF, 18 mΩ,
//   0.45 nH; 0.05 dB and 0.3° of seeded noise; 401 points from 100 kHz to 1 GHz), made as
//   test/cli/commands/fit.test.ts makes it (test/measure/shunt-thru.ts).

import { readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, expect, it } from 'vitest';
import { tempDir } from '../site-helpers.js';
import { capacitorShuntThruFile } from '../measure/shunt-thru.js';
import { run } from './fake-io.js';

const DEMO = fileURLToPath(new URL('../../', import.meta.url));
const dir = tempDir('readme-examples');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The lines the README's console block shows under `$ command` (a trailing `# comment` on it dropped). */
function readmeOutput(command: string): string[] {
  const readme = readFileSync(join(DEMO, 'README.md'), 'utf8');
  for (const block of readme.split('```console\n').slice(1)) {
    const lines = block.slice(0, block.indexOf('```')).trimEnd().split('\n');
    const at = lines.findIndex((l) => l.replace(/\s+#.*$/, '') === `$ ${command}`);
    if (at >= 0) return lines.slice(at + 1);
  }
  throw new Error(`no README example runs ${command}`);
}

it('zfolio figures on the demo library prints what the README shows', async () => {
  const r = await run(['figures', 'ORV-C-0402-100N-X7R'], DEMO);
  expect(r.err).toBe('');
  expect(r.code).toBe(0);
  expect(r.out.trimEnd().split('\n')).toEqual(readmeOutput('npx zfolio figures ORV-C-0402-100N-X7R'));
});

it('zfolio fit on the README\'s synthetic capacitor prints what the README shows', async () => {
  capacitorShuntThruFile(join(dir, 'cap.s2p'));
  const r = await run(['fit', 'cap.s2p', '--kind', 'capacitor'], dir);
  expect(r.err).toBe('');
  expect(r.code).toBe(0);
  expect(r.out.trimEnd().split('\n')).toEqual(readmeOutput('npx zfolio fit cap.s2p --kind capacitor'));
});
