// A synthetic shunt-thru measurement of an invented capacitor (100 nF, 18 mΩ ESR, 0.45 nH ESL, 1 GΩ leak),
// written as a Touchstone two-port file: 401 points from 100 kHz to 1 GHz, 0.05 dB and 0.3° of seeded noise
// on its impedance (test/measure/synthetic.ts). S21 of a shunt impedance is 2Z/(2Z + Z0) and S11 is
// −Z0/(2Z + Z0) (Pozar, Microwave Engineering, 4th ed., table 4.2), computed with complex.js.

import { Complex } from 'complex.js';
import { writeFileSync } from 'node:fs';
import { capacitor as C, inductor as L, parallel, resistor as R, series } from '../../src/circuit/element.js';
import { writeTouchstone } from '../../src/measure/touchstone-write.js';
import { logFrequencies, synthesise } from './synthetic.js';

export const CAPACITOR_TRUTH = { nominal: 100e-9, esr: 0.018, esl: 0.45e-9 };
const capacitorTree = series(R(CAPACITOR_TRUTH.esr), L(CAPACITOR_TRUTH.esl), parallel(C(CAPACITOR_TRUTH.nominal), R(1e9)));

/** Write the measurement to `path` (Z0 = 50 Ω, magnitude-angle, MHz) and return the path. */
export function capacitorShuntThruFile(path: string): string {
  const s = synthesise(capacitorTree, logFrequencies(1e5, 1e9, 401), { db: 0.05, deg: 0.3, seed: 21 });
  const re = new Float64Array(4 * 401);
  const im = new Float64Array(4 * 401);
  for (let k = 0; k < 401; k++) {
    const z = new Complex(s.re[k], s.im[k]);
    const d = z.mul(2).add(50);
    const s11 = new Complex(-50, 0).div(d);
    const s21 = z.mul(2).div(d);
    [s11, s21, s21, s11].forEach((v, i) => ((re[4 * k + i] = v.re), (im[4 * k + i] = v.im)));
  }
  writeFileSync(path, writeTouchstone({ version: 1, ports: 2, parameter: 'S', format: 'MA', unit: 'MHz', reference: 50, frequencies: s.frequencies, re, im, digits: 9, comments: ['synthetic test measurement'] }));
  return path;
}
