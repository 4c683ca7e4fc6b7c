// Fitting against synthetic measurements made in the test (test/measure/synthetic.ts: complex.js on element
// trees written here, seeded Gaussian noise). Noiseless data must give the parameters back to 1e-6; noisy
// data (0.05 dB rms on |Z|, 0.3° rms on phase, 801 points — a careful analyser measurement, common
// practice) within four of their own standard errors and within the tolerances stated below, and the
// residual must come out as the noise put in. A parameter the sweep cannot show is left out, with why.

import { describe, expect, it } from 'vitest';
import { capacitor as C, inductor as L, parallel, resistor as R, series, type Element } from '../../src/circuit/element.js';
import { fitImpedance, type FitResult } from '../../src/measure/fit.js';
import type { FitKind } from '../../src/measure/fit-models.js';
import { logFrequencies, synthesise } from './synthetic.js';

interface Case {
  kind: FitKind;
  truth: Record<string, number>;
  build: (p: Record<string, number>) => Element;
  fromHz: number;
  toHz: number;
  /** Largest relative error allowed with the stated noise, per parameter. */
  tolerance: Record<string, number>;
}

// Invented values, typical of each kind; each sweep shows every parameter.
const CASES: Case[] = [
  {
    kind: 'capacitor',
    truth: { nominal: 100e-9, esr: 0.018, esl: 0.45e-9, epr: 1e7 },
    build: (p) => series(R(p.esr), L(p.esl), parallel(C(p.nominal), R(p.epr))),
    fromHz: 10,
    toHz: 1e9,
    tolerance: { nominal: 0.001, esr: 0.01, esl: 0.002, epr: 0.3 },
  },
  {
    kind: 'inductor',
    truth: { nominal: 10e-6, dcr: 0.05, cp: 5e-12, rp: 20e3 },
    build: (p) => parallel(series(R(p.dcr), L(p.nominal)), C(p.cp), R(p.rp)),
    fromHz: 1e3,
    toHz: 1e9,
    tolerance: { nominal: 0.001, dcr: 0.01, cp: 0.002, rp: 0.01 },
  },
  {
    kind: 'resistor',
    truth: { nominal: 10, ls: 2e-9, cp: 0.2e-12 },
    build: (p) => parallel(series(R(p.nominal), L(p.ls)), C(p.cp)),
    fromHz: 1e3,
    toHz: 1e10,
    tolerance: { nominal: 0.001, ls: 0.005, cp: 0.005 },
  },
  {
    kind: 'bead',
    truth: { rdc: 0.05, r: 600, l: 1.2e-6, c: 1.5e-12 },
    build: (p) => series(R(p.rdc), parallel(R(p.r), L(p.l), C(p.c))),
    fromHz: 1e5,
    toHz: 3e9,
    tolerance: { rdc: 0.1, r: 0.003, l: 0.002, c: 0.002 },
  },
];

function fitted(c: Case, points: number, noise?: { db: number; deg: number; seed: number }, window = {}): FitResult {
  const outcome = fitImpedance(c.kind, synthesise(c.build(c.truth), logFrequencies(c.fromHz, c.toHz, points), noise), window);
  if (!outcome.ok) throw new Error(outcome.message);
  return outcome.fit;
}

describe.each(CASES)('$kind', (c) => {
  it('noiseless data give every parameter back to 1e-6', () => {
    const fit = fitted(c, 401);
    expect(fit.leftOut).toEqual([]);
    expect(Object.keys(fit.parameters).sort()).toEqual(Object.keys(c.truth).sort());
    for (const [name, value] of Object.entries(c.truth)) expect(Math.abs(fit.parameters[name] / value - 1)).toBeLessThan(1e-6);
    expect(fit.residual.rmsDb).toBeLessThan(1e-6);
  });

  it.each([1, 2, 3, 4, 5])('noisy data (seed %i): within 4 standard errors and the stated tolerance; residual as the noise', (seed) => {
    const fit = fitted(c, 801, { db: 0.05, deg: 0.3, seed });
    expect(fit.leftOut).toEqual([]);
    for (const [name, value] of Object.entries(c.truth)) {
      const error = Math.log(fit.parameters[name] / value);
      expect(Math.abs(error)).toBeLessThanOrEqual(4 * fit.standardErrors[name]);
      expect(Math.abs(error)).toBeLessThanOrEqual(c.tolerance[name]);
    }
    // rms of 801 normal samples is within ±10% of σ with probability > 0.999 (χ² with 801 degrees of freedom).
    expect(fit.residual.rmsDb).toBeGreaterThan(0.045);
    expect(fit.residual.rmsDb).toBeLessThan(0.055);
    expect(fit.residual.rmsDeg).toBeGreaterThan(0.27);
    expect(fit.residual.rmsDeg).toBeLessThan(0.33);
    // The largest of 801 normal samples lies below 4.5σ with probability 0.997.
    expect(fit.residual.maxDb).toBeLessThan(0.05 * 4.5);
  });
});

describe('standard errors', () => {
  it('match the scatter of fits over 40 noise draws (capacitor, 201 points), within ±35%', () => {
    const c = CASES[0];
    const errors: Record<string, number[]> = {};
    const reported: Record<string, number[]> = {};
    for (let seed = 100; seed < 140; seed++) {
      const fit = fitted(c, 201, { db: 0.05, deg: 0.3, seed });
      for (const name of Object.keys(c.truth)) {
        (errors[name] ??= []).push(Math.log(fit.parameters[name] / c.truth[name]));
        (reported[name] ??= []).push(fit.standardErrors[name]);
      }
    }
    for (const name of Object.keys(c.truth)) {
      const spread = Math.sqrt(errors[name].reduce((s, e) => s + e * e, 0) / errors[name].length);
      const typical = reported[name].reduce((s, e) => s + e, 0) / reported[name].length;
      // The sample rms of 40 draws scatters by about 1/√80 ≈ 11%; ±35% is three of those.
      expect(spread / typical).toBeGreaterThan(0.65);
      expect(spread / typical).toBeLessThan(1.35);
    }
  });
});

describe('parameters the data cannot determine', () => {
  it('EPR from a sweep that starts at 1 MHz is left out: no effect there, strongest at the low end', () => {
    const fit = fitted(CASES[0], 301, undefined, { fromHz: 1e6 });
    expect(fit.fromHz).toBeGreaterThanOrEqual(1e6);
    expect(Object.keys(fit.parameters).sort()).toEqual(['esl', 'esr', 'nominal']);
    expect(fit.leftOut.map((l) => [l.name, l.why, l.strongest])).toEqual([['epr', 'no-effect', 'low-end']]);
    // Left out, the rest still come back: EPR's effect at 1 MHz is 1/(ωC·EPR) = 1.6e-4 of Z.
    for (const name of ['nominal', 'esr', 'esl']) expect(Math.abs(fit.parameters[name] / CASES[0].truth[name] - 1)).toBeLessThan(1e-3);
  });

  it("an inductor's Cp and Rp from a sweep ending two decades below its resonance", () => {
    const fit = fitted(CASES[1], 301, { db: 0.05, deg: 0.3, seed: 9 }, { toHz: 2e5 });
    expect(fit.parameters.nominal / 10e-6).toBeCloseTo(1, 2);
    expect(fit.leftOut.map((l) => l.name).sort()).toEqual(['cp', 'rp']);
    expect(fit.leftOut.every((l) => l.strongest === 'high-end')).toBe(true);
  });

  it('a 1 kΩ resistor with 1 nH and 0.2 pF: Ls and Cp act together (Y ≈ 1/R + jω(Cp − Ls/R²)), so with noise Ls is left out and Cp takes Cp − Ls/R²', () => {
    const c: Case = { ...CASES[2], truth: { nominal: 1e3, ls: 1e-9, cp: 0.2e-12 } };
    const fit = fitted(c, 801, { db: 0.05, deg: 0.3, seed: 1 });
    expect(fit.leftOut.map((l) => l.name)).toEqual(['ls']);
    const effective = 0.2e-12 - 1e-9 / 1e6;
    expect(Math.abs(Math.log(fit.parameters.cp / effective))).toBeLessThan(4 * fit.standardErrors.cp);
  });
});

describe('what fitImpedance refuses', () => {
  it('too few points in the range', () => {
    const outcome = fitImpedance('capacitor', synthesise(CASES[0].build(CASES[0].truth), logFrequencies(1e3, 1e6, 20)), { fromHz: 1e5, toHz: 2e5 });
    // Points at 10^(3 + 3k/19) Hz: k = 13, 14 lie between 100 kHz and 200 kHz.
    expect(outcome).toEqual({ ok: false, message: '2 usable points in the range; a capacitor fit needs at least 6' });
  });
});
