// zfolio fit end to end, as a librarian uses it: a measurement file (synthesised here with complex.js and
// seeded noise, test/measure/synthetic.ts; written as Touchstone), `zfolio fit`, the printed YAML pasted
// into a part file, and the library read back: the part's model must match the invented truth within the
// tolerances of test/measure/fit.test.ts. S21 of a shunt impedance is 2Z/(2Z + Z0) (Pozar, Microwave
// Engineering, 4th ed., table 4.2).

import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../../src/model/library.js';
import { tempDir } from '../../site-helpers.js';
import { CAPACITOR_TRUTH, capacitorShuntThruFile } from '../../measure/shunt-thru.js';
import { run } from '../fake-io.js';

const dir = tempDir('fit');
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const TRUTH = CAPACITOR_TRUTH;
const shuntThruFile = (name: string) => capacitorShuntThruFile(join(dir, name));

describe('zfolio fit', () => {
  const file = shuntThruFile('cap.s2p');

  it('prints the parameters, EPR left out with why, the residuals and a YAML block', async () => {
    const r = await run(['fit', 'cap.s2p', '--kind', 'capacitor'], dir);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const lines = r.out.split('\n');
    expect(lines[0]).toBe('cap.s2p: capacitor, shunt-thru fixture (S21, part to ground between the ports; Z0 = 50 Ω), chosen by default: give --fixture to change it');
    expect(lines[1]).toBe('fitted 401 points from 100 kHz to 1 GHz');
    expect(r.out).toMatch(/^ {2}nominal {2}\d+(\.\d+)? nF +± [\d.]+% \(one standard error\)$/m);
    expect(r.out).toMatch(/^ {2}epr {6}left out: /m);
    expect(r.out).toMatch(/^residual over the fitted range: \|Z\| rms 0\.0\d+ dB, max 0\.\d+ dB; phase rms 0\.[23]\d*°$/m);
    expect(r.out).toContain('\nPaste into the part file:\nnominal: ');
  });

  it('the YAML block, pasted into a part file, gives back the invented capacitor', async () => {
    const r = await run(['fit', 'cap.s2p', '--kind', 'capacitor'], dir);
    const yaml = r.out.split('Paste into the part file:\n')[1];
    const lib = join(dir, 'lib');
    mkdirSync(join(lib, 'parts'), { recursive: true });
    writeFileSync(join(lib, 'parts', 'fitted.yaml'), `id: FITTED\nkind: capacitor\ntitle: fitted from a synthetic measurement\n${yaml}`);
    const { library, diagnostics } = loadLibrary(lib);
    expect(diagnostics).toEqual([]);
    const part = library!.partsById.get('FITTED')!;
    // Four significant digits in the block; the fit itself within 0.1% (C), 1% (ESR), 0.2% (ESL) at this noise.
    expect(Math.abs(part.nominal! / TRUTH.nominal - 1)).toBeLessThan(0.0015);
    expect(Math.abs(part.parameters.esr / TRUTH.esr - 1)).toBeLessThan(0.011);
    expect(Math.abs(part.parameters.esl / TRUTH.esl - 1)).toBeLessThan(0.0025);
    expect(part.parameters.epr).toBeUndefined();
  });

  it('--json: kind, fixture, points, parameters by the part format names in SI, residual', async () => {
    const r = await run(['fit', file, '--kind', 'capacitor', '--json', '--from', '1M'], dir);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['file', 'kind', 'fixture', 'referenceOhm', 'points', 'fromHz', 'toHz', 'parameters', 'standardErrors', 'leftOut', 'residual']);
    expect([j.kind, j.fixture, j.file]).toEqual(['capacitor', 'shunt-thru', 'cap.s2p']);
    expect(j.fromHz).toBeGreaterThanOrEqual(1e6);
    expect(j.points).toBe(301);
    expect(Object.keys(j.parameters).sort()).toEqual(['esl', 'esr', 'nominal']);
    expect(Object.keys(j.residual)).toEqual(['rmsDb', 'maxDb', 'rmsDeg']);
    expect(j.leftOut[0]).toMatchObject({ parameter: 'epr' });
  });

  it('a named fixture that does not fit the file is a located error, exit 1', async () => {
    const r = await run(['fit', 'cap.s2p', '--kind', 'capacitor', '--fixture', 'reflection'], dir);
    expect(r.code).toBe(1);
    expect(r.err).toBe('cap.s2p:1:1: a reflection measurement needs a 1-port file, found 2 ports; a two-port file is a shunt-thru or series-thru measurement\n');
  });

  it('a bad file lists its located errors, exit 1', async () => {
    writeFileSync(join(dir, 'bad.s1p'), '# MHz Z RI\n1 10 x\n2 10\n');
    const r = await run(['fit', 'bad.s1p', '--kind', 'inductor'], dir);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err).toBe('bad.s1p:2:6: expected a number, found "x"\nbad.s1p:3:5: the file ends inside the values of frequency 2 MHz (line 3): found 1 of 2\n');
  });

  it('a missing file, a folder', async () => {
    expect((await run(['fit', 'nothing.s1p', '--kind', 'bead'], dir)).err).toBe('nothing.s1p:1:1: no such file\n');
    expect((await run(['fit', '.', '--kind', 'bead'], dir)).err).toMatch(/:1:1: expected a Touchstone file, found a folder\n$/);
  });

  it.each([
    [['fit', 'cap.s2p'], '--kind is required: one of capacitor, inductor, resistor, bead'],
    [['fit', 'cap.s2p', '--kind', 'capacitr'], '--kind: expected one of capacitor, inductor, resistor, bead, found "capacitr"; did you mean capacitor?'],
    [['fit', 'cap.s2p', '--kind', 'bead', '--fixture', 'shunt'], '--fixture: expected one of reflection, shunt-thru, series-thru, found "shunt"'],
    [['fit', '--kind', 'bead'], 'fit takes exactly one measurement file, found 0'],
    [['fit', 'cap.s2p', '--kind', 'bead', '--from', '1G', '--to', '1M'], '--to must be above --from'],
    [['fit', 'cap.s2p', '--kind', 'bead', '--from', '100m'], '--from: expected a frequency in Hz (e.g. 10M or 10 MHz), found "100m": MHz or mHz? write 100M or 100 MHz for megahertz, or 100 mHz if millihertz is meant'],
  ])('misuse %j: exit 2', async (argv, message) => {
    const r = await run(argv, dir);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')[0]).toBe(`zfolio fit: ${message}`);
  });
});
