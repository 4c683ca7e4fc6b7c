// Starting values read off noiseless synthetic sweeps (complex.js, test/measure/synthetic.ts): the reactance
// crossing against the closed-form resonance f = 1/(2π√(LC)) (Alexander & Sadiku, Fundamentals of Electric
// Circuits, 6th ed., §14.5) and each start within a factor of two of the truth where the sweep shows it.

import { describe, expect, it } from 'vitest';
import { capacitor as C, inductor as L, parallel, resistor as R, series } from '../../src/circuit/element.js';
import { reactanceCrossing, startingValues } from '../../src/measure/fit-start.js';
import { logFrequencies, synthesise } from './synthetic.js';

const within2 = (got: number, truth: number) => expect(Math.abs(Math.log(got / truth))).toBeLessThan(Math.LN2);

describe('reactanceCrossing', () => {
  it("a capacitor's series resonance, to the sweep's resolution", () => {
    const s = synthesise(series(R(0.018), L(0.45e-9), C(100e-9)), logFrequencies(1e3, 1e9, 601));
    const srf = 1 / (2 * Math.PI * Math.sqrt(0.45e-9 * 100e-9));
    // 100 points a decade: interpolation in ln f is good to far better than the 2.3% step.
    expect(Math.abs(reactanceCrossing(s, true)! / srf - 1)).toBeLessThan(1e-3);
    expect(reactanceCrossing(s, false)).toBeUndefined();
  });
});

describe('startingValues', () => {
  it('capacitor: C, ESR, ESL within a factor of two', () => {
    const [start] = startingValues('capacitor', synthesise(series(R(0.018), L(0.45e-9), parallel(C(100e-9), R(1e7))), logFrequencies(10, 1e9, 401)));
    within2(start[0], 100e-9);
    within2(start[1], 0.018);
    within2(start[2], 0.45e-9);
  });
  it('inductor: L, DCR, Cp, Rp within a factor of two', () => {
    const [start] = startingValues('inductor', synthesise(parallel(series(R(0.05), L(10e-6)), C(5e-12), R(20e3)), logFrequencies(1e3, 1e9, 401)));
    [10e-6, 0.05, 5e-12, 20e3].forEach((v, i) => within2(start[i], v));
  });
  it('bead: Rdc, R, L, C within a factor of two', () => {
    const [start] = startingValues('bead', synthesise(series(R(0.05), parallel(R(600), L(1.2e-6), C(1.5e-12))), logFrequencies(1e5, 3e9, 401)));
    [0.05, 600, 1.2e-6, 1.5e-12].forEach((v, i) => within2(start[i], v));
  });
  it('resistor: R within a factor of two; Ls from an inductive top, Cp from a capacitive one', () => {
    const [inductive] = startingValues('resistor', synthesise(parallel(series(R(10), L(2e-9)), C(0.02e-12)), logFrequencies(1e3, 1e9, 401)));
    within2(inductive[0], 10);
    within2(inductive[1], 2e-9);
    const [capacitive] = startingValues('resistor', synthesise(parallel(R(1e3), C(0.2e-12)), logFrequencies(1e3, 1e8, 401)));
    within2(capacitive[2], 0.2e-12);
  });
});
