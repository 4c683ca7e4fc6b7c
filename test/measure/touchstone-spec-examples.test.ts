// The worked examples of the Touchstone File Format Specification 2.0 (IBIS Open Forum, 2009), as kept in
// scikit-rf's test folder (BSD-3, copied unchanged into test/fixtures/touchstone/spec with its notice):
// each must read as the README beside them says. Values are compared to the numbers the README states,
// converted here with the textbook polar form x = m·(cos θ + j sin θ).

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parameterAt, type NetworkData } from '../../src/measure/network-data.js';
import { readTouchstone } from '../../src/measure/touchstone-read.js';

const SPEC = fileURLToPath(new URL('../fixtures/touchstone/spec/', import.meta.url));

function read(name: string) {
  return readTouchstone(readFileSync(SPEC + name, 'utf8'), name);
}

function data(name: string): NetworkData {
  const r = read(name);
  if (!r.ok) throw new Error(r.errors.map((e) => `${e.file}:${e.line}:${e.column}: ${e.message}`).join('\n'));
  return r.data;
}

const polar = (m: number, deg: number): [number, number] => [m * Math.cos((deg * Math.PI) / 180), m * Math.sin((deg * Math.PI) / 180)];

/** |a − b| ≤ 1e-12·(1 + |b|): the conversions are a product and a cosine, exact to rounding. */
function expectComplex(actual: [number, number], expected: [number, number]): void {
  const scale = 1 + Math.hypot(...expected);
  expect(Math.hypot(actual[0] - expected[0], actual[1] - expected[1])).toBeLessThanOrEqual(1e-12 * scale);
}

const EX5_MAG = [
  [0.6, 0.4, 0.42, 0.53],
  [0.4, 0.6, 0.53, 0.42],
  [0.42, 0.53, 0.6, 0.4],
  [0.53, 0.42, 0.4, 0.6],
];
const EX5_ANG = [
  [161.24, -42.2, -66.58, -79.34],
  [-42.2, 161.2, -79.34, -66.58],
  [-66.58, -79.34, 161.24, -42.2],
  [-79.34, -66.58, -42.2, 161.24],
];

function expectEx5Matrix(d: NetworkData, k: number): void {
  for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) expectComplex(parameterAt(d, k, i, j), polar(EX5_MAG[i][j], EX5_ANG[i][j]));
}

describe('Touchstone 2.0 specification examples', () => {
  it('example 1 (header only, no data) is a located error, not a crash', () => {
    const r = read('ex_1.ts');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.errors.map((e) => `${e.line}:${e.column}: ${e.message}`)).toEqual(['5:20: no network data: the file ends before any frequency and its values']);
  });

  it('example 2: 1-port Z, MA, MHz, reference 50 by default: Z11 = (10 + k)∠10k° Ω at k MHz', () => {
    const d = data('ex_2.ts');
    expect(d.version).toBe(2);
    expect(d.ports).toBe(1);
    expect(d.parameter).toBe('Z');
    expect(d.reference).toEqual([50]);
    expect(Array.from(d.frequencies)).toEqual([1e6, 2e6, 3e6, 4e6, 5e6]);
    for (let k = 1; k <= 5; k++) expectComplex(parameterAt(d, k - 1, 0, 0), polar(10 + k, 10 * k));
  });

  it('example 3: 2-port S in the 21_12 order: S11 = 111, S12 = 112, S21 = 121, S22 = 122 at 1 GHz', () => {
    const d = data('ex_3.ts');
    expect(Array.from(d.frequencies)).toEqual([1e9, 2e9]);
    for (const [k, lead] of [[0, 100], [1, 200]]) {
      expectComplex(parameterAt(d, k, 0, 0), [lead + 11, 0]);
      expectComplex(parameterAt(d, k, 0, 1), [lead + 12, 0]);
      expectComplex(parameterAt(d, k, 1, 0), [lead + 21, 0]);
      expectComplex(parameterAt(d, k, 1, 1), [lead + 22, 0]);
    }
  });

  it('example 4: 4-port, [Reference] on its own line: Sij = 10i + j; references 50, 75, 0.01, 0.01 Ω', () => {
    const d = data('ex_4.ts');
    expect(d.ports).toBe(4);
    expect(d.reference).toEqual([50, 75, 0.01, 0.01]);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) expectComplex(parameterAt(d, 0, i, j), [10 * (i + 1) + (j + 1), 0]);
  });

  it('example 5: full 4-port matrix at 5 and 6 GHz', () => {
    const d = data('ex_5.ts');
    expect(Array.from(d.frequencies)).toEqual([5e9, 6e9]);
    expect(d.reference).toEqual([50, 75, 0.01, 0.01]);
    expectEx5Matrix(d, 0);
    expectEx5Matrix(d, 1);
  });

  it('example 6: the lower half of the same matrix, [Reference] over two lines, reads identical to example 5', () => {
    const lower = data('ex_6.ts');
    const full = data('ex_5.ts');
    expect(lower.reference).toEqual([50, 75, 0.01, 0.01]);
    // Example 6 gives S22 at 161.20° as its own row; example 5 has the same in its full matrix.
    expect(Array.from(lower.re)).toEqual(Array.from(full.re));
    expect(Array.from(lower.im)).toEqual(Array.from(full.im));
  });

  it('example 7: version 2.0 Z data are in ohms whatever [Reference] says (20 Ω here)', () => {
    const d = data('ex_7.ts');
    expect(d.reference).toEqual([20]);
    const expected = [[74.25, -4], [60, -22], [53.025, -45], [30, -62], [0.75, -89]];
    expected.forEach(([m, a], k) => expectComplex(parameterAt(d, k, 0, 0), polar(m, a)));
    expect(Array.from(d.frequencies)).toEqual([1e8, 2e8, 3e8, 4e8, 5e8]);
  });

  it('example 8: 1-port S, MA, MHz, R 50: S11 = 0.894∠−12.136° at 2 MHz', () => {
    const d = data('ex_8.s1p');
    expect(d.version).toBe(1);
    expect(Array.from(d.frequencies)).toEqual([2e6]);
    expectComplex(parameterAt(d, 0, 0, 0), polar(0.894, -12.136));
  });

  it('example 9: version 1 Z normalised to R 75 reads as the same ohms as example 10', () => {
    const v1 = data('ex_9.s1p');
    const v2 = data('ex_10.ts');
    expect(v1.reference).toEqual([75]);
    const normalised = [[0.99, -4], [0.8, -22], [0.707, -45], [0.4, -62], [0.01, -89]];
    normalised.forEach(([m, a], k) => {
      expectComplex(parameterAt(v1, k, 0, 0), polar(75 * m, a));
      expectComplex(parameterAt(v1, k, 0, 0), parameterAt(v2, k, 0, 0));
    });
  });

  it('example 10 reads as example 7', () => {
    const a = data('ex_10.ts');
    const b = data('ex_7.ts');
    expect(Array.from(a.re)).toEqual(Array.from(b.re));
    expect(Array.from(a.im)).toEqual(Array.from(b.im));
  });

  it.each([
    ['ex_11.s2p', '2:7', 'hybrid (H) parameters are not read'],
    ['ex_12.ts', '3:7', 'hybrid (H) parameters are not read'],
    ['ex_12_g.ts', '3:7', 'inverse hybrid (G) parameters are not read'],
  ])('%s: H and G parameters are refused with a clear, located message', (name, at, text) => {
    const r = read(name);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors).toHaveLength(1);
      expect(`${r.errors[0].line}:${r.errors[0].column}`).toBe(at);
      expect(r.errors[0].message).toContain(text);
    }
  });

  it('example 13: 2-port S, RI, GHz at 1, 2 and 10 GHz', () => {
    const d = data('ex_13.s2p');
    expect(Array.from(d.frequencies)).toEqual([1e9, 2e9, 10e9]);
    const s11 = [[0.3926, -0.1211], [0.3517, -0.3054], [0.3419, 0.3336]] as [number, number][];
    const s21 = [[-0.0003, -0.0021], [-0.0096, -0.0298], [-0.0134, 0.0379]] as [number, number][];
    for (let k = 0; k < 3; k++) {
      expectComplex(parameterAt(d, k, 0, 0), s11[k]);
      expectComplex(parameterAt(d, k, 1, 1), s11[k]);
      expectComplex(parameterAt(d, k, 1, 0), s21[k]);
      expectComplex(parameterAt(d, k, 0, 1), s21[k]);
    }
  });

  it('example 14: version 1 4-port, each matrix over four lines; at 5 GHz as example 5', () => {
    const d = data('ex_14.s4p');
    expect(Array.from(d.frequencies)).toEqual([5e9, 6e9, 7e9]);
    expectEx5Matrix(d, 0);
    // Row 4 at 7 GHz: 0.62∠−114.19, 0.37∠−99.09, 0.45∠−46.41, 0.50∠136.69.
    expectComplex(parameterAt(d, 2, 3, 0), polar(0.62, -114.19));
    expectComplex(parameterAt(d, 2, 3, 3), polar(0.5, 136.69));
  });

  it('example 16: mixed-mode data are refused clearly', () => {
    const r = read('ex_16.ts');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.map((e) => `${e.line}:${e.column}`)).toEqual(['8:1']);
      expect(r.errors[0].message).toContain('mixed-mode');
    }
  });

  it('example 17: 2-port S with [Reference] 50 25 and noise data; the noise block is ignored', () => {
    const d = data('ex_17.ts');
    expect(d.reference).toEqual([50, 25]);
    expect(Array.from(d.frequencies)).toEqual([2e9, 22e9]);
    expectEx17(d);
  });

  it('example 18: the same S values in a version 1 file, noise data after the network data ignored', () => {
    const d = data('ex_18.s2p');
    expect(d.reference).toEqual([50, 50]);
    expect(Array.from(d.frequencies)).toEqual([2e9, 22e9]);
    expectEx17(d);
  });
});

function expectEx17(d: NetworkData): void {
  const at = (k: number, i: number, j: number, m: number, a: number) => expectComplex(parameterAt(d, k, i, j), polar(m, a));
  at(0, 0, 0, 0.95, -26);
  at(1, 0, 0, 0.6, -144);
  at(0, 1, 0, 3.57, 157);
  at(1, 1, 0, 1.3, 40);
  at(0, 0, 1, 0.04, 76);
  at(1, 0, 1, 0.14, 40);
  at(0, 1, 1, 0.66, -14);
  at(1, 1, 1, 0.56, -85);
}
