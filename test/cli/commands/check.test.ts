// zfolio check: every problem on stderr as file:line:col, exit 1; a summary on stdout and exit 0 when sound.

import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../../src/model/diagnostics.js';
import { loadLibrary, yamlFilesUnder } from '../../../src/model/library.js';
import { BAD_LIBRARY, GOOD_LIBRARY, run } from '../fake-io.js';

const RAIL_LIBRARY = fileURLToPath(new URL('../../fixtures/rail-library/', import.meta.url));
const DEMO_LIBRARY = fileURLToPath(new URL('../../../', import.meta.url));

describe('zfolio check', () => {
  it('passes the good library: exit 0, a one-line summary, nothing on stderr', async () => {
    // 5 part files and folio.yaml.
    expect(await run(['check', '--library', GOOD_LIBRARY], '/')).toEqual({ code: 0, out: 'ok: 5 parts in 6 files, no errors\n', err: '' });
  });

  it('counts the rail plans of a library that has some, and passes it with its warning on stderr', async () => {
    // 9 part files, 2 plan files and folio.yaml; the fixture has no comparisons or reviews, so none are named.
    const r = await run(['check', '--library', RAIL_LIBRARY], '/');
    expect(r.code).toBe(0);
    expect(r.out).toBe('ok: 9 parts, 2 rail plans in 12 files, no errors\n');
    expect(r.err).toMatch(/^plans\/vdd-weak\.yaml:\d+:\d+: warning: .*above the derating limit of 80%/);
  });

  it('counts everything the demo library holds: parts, comparisons, rail plans and reviews', async () => {
    const r = await run(['check', '--library', DEMO_LIBRARY], '/');
    expect(r.code).toBe(0);
    // The expected counts come from the files on disk, not from the loaded library.
    const files = (dir: string) => yamlFilesUnder(DEMO_LIBRARY, dir).length;
    const total = 1 + files('parts') + files('comparisons') + files('plans') + files('reviews');
    expect(files('comparisons')).toBeGreaterThanOrEqual(2);
    expect(files('reviews')).toBeGreaterThanOrEqual(1);
    const reviews = files('reviews') === 1 ? '1 review' : `${files('reviews')} reviews`;
    // Measurements are counted by the entries that name them: every demo measurement file is named once.
    const measurements = readdirSync(join(DEMO_LIBRARY, 'measurements')).length;
    expect(r.out).toBe(`ok: ${files('parts')} parts, ${files('comparisons')} comparisons, ${files('plans')} rail plans, ${reviews}, ${measurements} measurements in ${total} files, no errors\n`);
  });

  it('fails the bad-parts corpus: exit 1, every diagnostic on stderr, one a line, then the count', async () => {
    const r = await run(['check', '--library', BAD_LIBRARY], '/');
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    const lines = r.err.trimEnd().split('\n');
    const expected = loadLibrary(BAD_LIBRARY).diagnostics.map(formatDiagnostic);
    expect(expected.length).toBeGreaterThanOrEqual(40);
    expect(lines).toEqual([...expected, `${expected.length} errors in the library; nothing was done`]);
    // Problems from many files in the one run, each with its place.
    expect(new Set(expected.map((l) => l.split(':')[0])).size).toBeGreaterThanOrEqual(40);
    expect(lines).toContain('parts/07-near-miss-nominl.yaml:3:1: unknown field "nominl"; did you mean "nominal"?');
    expect(lines).toContain('folio.yaml:5:7: sweep.to: expected a frequency above the start of the sweep (from: 10 GHz), found 1 kHz');
  });

  it('takes no part names (2)', async () => {
    const r = await run(['check', 'CAP-TEST-100N']);
    expect(r.code).toBe(2);
    expect(r.err).toContain("Unexpected argument 'CAP-TEST-100N'");
  });
});
