// zfolio check with measurements: a model that misses its measurement is a located warning (exit 0); a
// measurement file that cannot be read as one is an error (exit 1). Measurements are synthesised in the tests.

import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { measuredLibrary } from '../../measure/measured-library.js';
import { run } from '../fake-io.js';

describe('zfolio check with measurements', () => {
  it('counts the measurements of a sound library', async () => {
    const r = await run(['check', '--library', measuredLibrary()], '/');
    expect(r).toEqual({ code: 0, out: 'ok: 1 part, 1 measurement in 2 files, no errors\n', err: '' });
  });

  it('warns, at the part, when the model misses its measurement by more than folio.yaml allows', async () => {
    const r = await run(['check', '--library', measuredLibrary({ typed: '{esr: 60m, esl: 0.5n}' })], '/');
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/^parts\/cap\.yaml:7:5: warning: measurements\[0\]: the model misses measurements\/cap\.s2p by 1\.57 dB rms in \|Z\|/);
    const quiet = await run(['check', '--library', measuredLibrary({ typed: '{esr: 60m, esl: 0.5n}', extraSettings: 'measurements: {warn-above: 2 dB}\n' })], '/');
    expect(quiet.err).toBe('');
  });

  it('a measurement file that is not Touchstone: its located errors, exit 1', async () => {
    const r = await run(['check', '--library', measuredLibrary({ measurement: '[Version] 2.0\n# GHz S RI\n[Number of Ports] 2\n' })], '/');
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err).toBe('measurements/cap.s2p:3:20: no network data: the file ends before any frequency and its values\n1 error in the measurements\n');
  });

  it('a missing measurement file: an error at the part, exit 1', async () => {
    const r = await run(['check', '--library', measuredLibrary({ entry: '{file: measurements/none.s1p}' })], '/');
    expect(r.code).toBe(1);
    expect(r.err.split('\n')[0]).toBe('parts/cap.yaml:7:12: measurements[0].file: no file measurements/none.s1p in the library');
  });

  it('lists a broken measurement file beside an error in another part file, not only once that is fixed', async () => {
    const lib = measuredLibrary({ measurement: '[Version] 2.0\n# GHz S RI\n[Number of Ports] 2\n' });
    writeFileSync(join(lib, 'parts/other.yaml'), 'id: OTHER\nkind: capacitor\nnominal: 1u\nparasitics: {esr: 5m, esl: banana}\n');
    const r = await run(['check', '--library', lib], '/');
    expect(r.code).toBe(1);
    expect(r.err.split('\n')).toEqual([
      'measurements/cap.s2p:3:20: no network data: the file ends before any frequency and its values',
      'parts/other.yaml:4:28: parasitics.esl: expected an inductance in H (e.g. 0.45n or 0.45 nH), found "banana"',
      '2 errors in the library; nothing was done',
      '',
    ]);
  });

  it('build stops on the same error before writing anything', async () => {
    const lib = measuredLibrary({ measurement: '# GHz S RI R 50\n1 0.1\n' });
    const r = await run(['build', '--library', lib, '--out', join(lib, 'site')], '/');
    expect(r.code).toBe(1);
    expect(r.err.split('\n')[0]).toBe('measurements/cap.s2p:2:6: the file ends inside the values of frequency 1 GHz (line 2): found 1 of 8');
    expect(existsSync(join(lib, 'site'))).toBe(false);
  });
});
