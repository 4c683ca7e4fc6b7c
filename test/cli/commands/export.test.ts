// zfolio export: a part's model to stdout or into a folder, as .s1p or .subckt, and what it will not
// overwrite. The files' contents are checked against the model in test/measure/part-export.test.ts and
// test/measure/spice-write.test.ts; here: the command line, the names and the output safety.

import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readTouchstone } from '../../../src/measure/touchstone-read.js';
import { diskSnapshot, tempDir } from '../../site-helpers.js';
import { GOOD_LIBRARY, run } from '../fake-io.js';

const top = tempDir('export');
afterAll(() => rmSync(top, { recursive: true, force: true }));

describe('zfolio export', () => {
  it('one part to stdout as SPICE', async () => {
    const r = await run(['export', 'CAP-TEST-100N', '--format', 'spice']);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    expect(r.out.split('\n')[0]).toBe('* zfolio export');
    expect(r.out).toMatch(/^\.SUBCKT CAP-TEST-100N 1 2$/m);
    expect(r.out).toMatch(/^\.ENDS CAP-TEST-100N$/m);
  });

  it('one part to stdout as Touchstone, over the library sweep or the one given', async () => {
    const r = await run(['export', 'CAP-TEST-100N', '--format', 'touchstone', '--from', '1k', '--to', '1M', '--per-decade', '10']);
    expect(r.code).toBe(0);
    const read = readTouchstone(r.out, 'x.s1p');
    expect(read.ok).toBe(true);
    if (read.ok) expect([read.data.frequencies.length, read.data.frequencies[0], read.data.frequencies[30]]).toEqual([31, 1e3, 1e6]);
    expect(r.out).toContain('! one-port S-parameters of the model, reference 50 ohm, 1 kHz to 1 MHz, 10 points per decade\n');
  });

  it('several parts into a folder it makes, one file each, named by id', async () => {
    const out = join(top, 'models');
    const r = await run(['export', 'CAP-TEST-100N', 'IND-TEST-10U', '--format', 'touchstone', '--out', out]);
    expect(r.code).toBe(0);
    expect(r.out.trim().split('\n').map((l) => l.split('/').pop())).toEqual(['CAP-TEST-100N.s1p', 'IND-TEST-10U.s1p']);
    expect(readFileSync(join(out, 'IND-TEST-10U.s1p'), 'utf8').startsWith('! zfolio export\n! IND-TEST-10U: ')).toBe(true);
    // A second export replaces its own files.
    expect((await run(['export', 'CAP-TEST-100N', '--format', 'touchstone', '--out', out])).code).toBe(0);
  });

  it('will not replace a file zfolio did not export, nor write into a file; nothing changes on disk', async () => {
    const out = join(top, 'mixed');
    mkdirSync(out);
    writeFileSync(join(out, 'CAP-TEST-100N.subckt'), '* my own netlist\n');
    const before = diskSnapshot(top);
    const r = await run(['export', 'IND-TEST-10U', 'CAP-TEST-100N', '--format', 'spice', '--out', out]);
    expect(r.code).toBe(2);
    expect(r.err).toBe(`zfolio export: will not replace ${join(out, 'CAP-TEST-100N.subckt')}: it is not a file zfolio exported; move it or choose another --out\n`);
    expect(diskSnapshot(top)).toEqual(before);
    expect(existsSync(join(out, 'IND-TEST-10U.subckt'))).toBe(false);
    const file = join(top, 'a-file');
    writeFileSync(file, 'x');
    expect((await run(['export', 'CAP-TEST-100N', '--format', 'spice', '--out', file])).err).toBe(`zfolio export: will not write files to ${file}: it is not a folder; choose another --out\n`);
  });

  it.each([
    [['export', 'CAP-TEST-100N'], '--format is required: touchstone or spice'],
    [['export', 'CAP-TEST-100N', '--format', 'cir'], '--format: expected touchstone or spice, found "cir"'],
    [['export', '--format', 'spice'], 'name at least one part id or file to export'],
    [['export', 'CAP-TEST-100N', 'IND-TEST-10U', '--format', 'spice'], '2 parts named: give --out DIR to write one file each (without --out, export prints one part)'],
    [['export', 'CAP-TEST-10N', '--format', 'spice'], 'no part with id or file "CAP-TEST-10N"; did you mean CAP-TEST-100N?'],
  ])('misuse %j: exit 2', async (argv, message) => {
    const r = await run(argv, GOOD_LIBRARY);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')[0]).toBe(`zfolio export: ${message}`);
  });
});
