// zfolio check: every problem on stderr as file:line:col, exit 1; a summary on stdout and exit 0 when sound.

import { describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../../src/model/diagnostics.js';
import { loadLibrary } from '../../../src/model/library.js';
import { BAD_LIBRARY, GOOD_LIBRARY, run } from '../fake-io.js';

describe('zfolio check', () => {
  it('passes the good library: exit 0, a one-line summary, nothing on stderr', async () => {
    // 5 part files and folio.yaml.
    expect(await run(['check', '--library', GOOD_LIBRARY], '/')).toEqual({ code: 0, out: 'ok: 5 parts in 6 files, no errors\n', err: '' });
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
