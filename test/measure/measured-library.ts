// A small library with a measured part, made in a temporary folder for tests: a capacitor whose shunt-thru
// measurement is synthesised here (complex.js on the element tree, test/measure/synthetic.ts; S21 of a
// shunt impedance 2Z/(2Z + Z0), Pozar, Microwave Engineering, 4th ed., table 4.2). Invented values.

import { Complex } from 'complex.js';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { capacitor as C, inductor as L, parallel, resistor as R, series, type Element } from '../../src/circuit/element.js';
import { writeTouchstone } from '../../src/measure/touchstone-write.js';
import { tempDir } from '../site-helpers.js';
import { logFrequencies, synthesise } from './synthetic.js';

/** The measured capacitor as it really is (the "truth" the measurement is made of). */
export const MEASURED_TRUTH = { nominal: 100e-9, esr: 0.02, esl: 0.5e-9 };
export const measuredTree: Element = series(R(MEASURED_TRUTH.esr), L(MEASURED_TRUTH.esl), C(MEASURED_TRUTH.nominal));

/** A two-port shunt-thru Touchstone text of `tree`, 1 kHz to 1 GHz, with the given noise. */
export function shuntThruText(tree: Element, points = 241, noise?: { db: number; deg: number; seed: number }): string {
  const s = synthesise(tree, logFrequencies(1e3, 1e9, points), noise);
  const re = new Float64Array(4 * points);
  const im = new Float64Array(4 * points);
  for (let k = 0; k < points; k++) {
    const z = new Complex(s.re[k], s.im[k]);
    const d = z.mul(2).add(50);
    const s11 = new Complex(-50, 0).div(d);
    const s21 = z.mul(2).div(d);
    [s11, s21, s21, s11].forEach((v, i) => ((re[4 * k + i] = v.re), (im[4 * k + i] = v.im)));
  }
  return writeTouchstone({ version: 1, ports: 2, parameter: 'S', format: 'RI', unit: 'Hz', reference: 50, frequencies: s.frequencies, re, im, comments: ['synthetic measurement made by a test'] });
}

/**
 * A library folder: folio.yaml (with `extraSettings`), parts/cap.yaml typed with `typed` parasitics and
 * the measurement entry `entry`, and measurements/cap.s2p measured from MEASURED_TRUTH.
 */
export function measuredLibrary(options: { typed?: string; entry?: string; extraSettings?: string; measurement?: string } = {}): string {
  const root = tempDir('measured');
  mkdirSync(join(root, 'parts'));
  mkdirSync(join(root, 'measurements'));
  writeFileSync(join(root, 'folio.yaml'), `title: Measured test library (invented)\nsweep: {from: 1k, to: 1G, per-decade: 20}\n${options.extraSettings ?? ''}`);
  writeFileSync(
    join(root, 'parts', 'cap.yaml'),
    `id: CAP-M\nkind: capacitor\ntitle: 100 nF test capacitor\nnominal: 100n\nparasitics: ${options.typed ?? '{esr: 20m, esl: 0.5n}'}\nmeasurements:\n  - ${options.entry ?? '{file: measurements/cap.s2p, fixture: shunt-thru, note: synthetic, date: 2026-01-15}'}\n`,
  );
  writeFileSync(join(root, 'measurements', 'cap.s2p'), options.measurement ?? shuntThruText(measuredTree));
  return root;
}
