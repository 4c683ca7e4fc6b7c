import { describe, expect, it } from 'vitest';
import { decodeEiaDielectric } from '../../src/units/eia-dielectric.js';

// EIA-198-1 ("Ceramic Dielectric Capacitors Classes I, II, III and IV"), the class 2/3 table: first letter
// the lowest temperature, digit the highest, last letter the largest change of capacitance over the range.
// The expected values are written here from the table as the trade reproduces it (from memory), one row
// per letter and digit, independent of the decoder's own tables.
const LOW: Record<string, number> = { X: -55, Y: -30, Z: 10 };
const HIGH: Record<string, number> = { '2': 45, '4': 65, '5': 85, '6': 105, '7': 125, '8': 150, '9': 200 };
const CHANGE: Record<string, [number, number]> = {
  A: [-1, 1],
  B: [-1.5, 1.5],
  C: [-2.2, 2.2],
  D: [-3.3, 3.3],
  E: [-4.7, 4.7],
  F: [-7.5, 7.5],
  P: [-10, 10],
  R: [-15, 15],
  S: [-22, 22],
  T: [-33, 22],
  U: [-56, 22],
  V: [-82, 22],
};

describe('EIA-198 class 2 codes', () => {
  const rows = Object.keys(LOW).flatMap((l) => Object.keys(HIGH).flatMap((d) => Object.keys(CHANGE).map((c) => `${l}${d}${c}`)));
  it(`decodes every one of the ${rows.length} combinations of letter, digit and letter`, () => {
    expect(rows).toHaveLength(3 * 7 * 12);
    for (const code of rows) {
      const decoded = decodeEiaDielectric(code);
      expect(decoded.ok, code).toBe(true);
      if (!decoded.ok || decoded.dielectric.class !== 2) throw new Error(code);
      const [l, d, c] = code;
      expect(decoded.dielectric.fromC, code).toBe(LOW[l]);
      expect(decoded.dielectric.toC, code).toBe(HIGH[d]);
      expect(-decoded.dielectric.minus * 100, code).toBeCloseTo(CHANGE[c][0], 12);
      expect(decoded.dielectric.plus * 100, code).toBeCloseTo(CHANGE[c][1], 12);
    }
  });

  it('the codes of the trade read as their datasheets state them', () => {
    expect(decodeEiaDielectric('X7R')).toEqual({ ok: true, dielectric: { class: 2, code: 'X7R', fromC: -55, toC: 125, minus: 0.15, plus: 0.15 } });
    expect(decodeEiaDielectric('X5R')).toMatchObject({ ok: true, dielectric: { fromC: -55, toC: 85, minus: 0.15 } });
    expect(decodeEiaDielectric('Y5V')).toMatchObject({ ok: true, dielectric: { fromC: -30, toC: 85, minus: 0.82, plus: 0.22 } });
    expect(decodeEiaDielectric('Z5U')).toMatchObject({ ok: true, dielectric: { fromC: 10, toC: 85, minus: 0.56, plus: 0.22 } });
  });

  it.each(['X3R', 'X1R', 'X0R', 'X7Q', 'X7G', 'Y9W', 'W7R'])('refuses %s with what each place may hold', (code) => {
    const decoded = decodeEiaDielectric(code);
    expect(decoded.ok).toBe(false);
    if (!decoded.ok) expect(decoded.message).toContain(`"${code}"`);
  });
});

// EIA-198-1 class 1 table: first letter the significant figure of the coefficient (ppm/K), digit its
// multiplier (0–4: −1, −10, −100, −1000, −10000; 5–9: +1 … +10000), last letter its tolerance (from memory).
const FIGURE: Record<string, number> = { C: 0, B: 0.3, L: 0.8, A: 0.9, M: 1, P: 1.5, R: 2.2, S: 3.3, T: 4.7, V: 5.6, U: 7.5 };
const MULTIPLIER = [-1, -10, -100, -1000, -10000, 1, 10, 100, 1000, 10000];
const TOLERANCE: Record<string, number> = { G: 30, H: 60, J: 120, K: 250, L: 500, M: 1000, N: 2500 };

describe('EIA-198 class 1 codes', () => {
  it('decodes every letter, digit and tolerance letter', () => {
    let n = 0;
    for (const [letter, figure] of Object.entries(FIGURE)) {
      MULTIPLIER.forEach((multiplier, digit) => {
        for (const [tol, ppm] of Object.entries(TOLERANCE)) {
          const code = `${letter}${digit}${tol}`;
          const decoded = decodeEiaDielectric(code);
          if (!decoded.ok || decoded.dielectric.class !== 1) throw new Error(`${code} not decoded as class 1`);
          // Relative 1e-12: the decoder builds the coefficient as a decimal literal, the test multiplies.
          expect(decoded.dielectric.coefficientPerK, code).toBeCloseTo(figure * multiplier * 1e-6, 15);
          expect(decoded.dielectric.tolerancePerK, code).toBeCloseTo(ppm * 1e-6, 15);
          expect([decoded.dielectric.fromC, decoded.dielectric.toC]).toEqual([-55, 125]);
          n++;
        }
      });
    }
    expect(n).toBe(11 * 10 * 7);
  });

  it('C0G (and its older name NP0) is 0 ± 30 ppm/K; U2J is −750 ± 120 ppm/K', () => {
    expect(decodeEiaDielectric('C0G')).toMatchObject({ ok: true, dielectric: { class: 1, coefficientPerK: 0, tolerancePerK: 30e-6 } });
    expect(decodeEiaDielectric('NP0')).toMatchObject({ ok: true, dielectric: { class: 1, code: 'NP0', tolerancePerK: 30e-6 } });
    expect(decodeEiaDielectric('U2J')).toMatchObject({ ok: true, dielectric: { coefficientPerK: -750e-6, tolerancePerK: 120e-6 } });
    expect(decodeEiaDielectric('P2H')).toMatchObject({ ok: true, dielectric: { coefficientPerK: -150e-6, tolerancePerK: 60e-6 } });
  });

  it.each(['C0F', 'C0P', 'D0G', 'CAG'])('refuses %s', (code) => {
    expect(decodeEiaDielectric(code).ok).toBe(false);
  });
});
