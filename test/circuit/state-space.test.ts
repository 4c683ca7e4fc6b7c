import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { mergedTree, nodalPencil, withoutUnknown, type NodalPencil } from '../../src/circuit/state-space.js';
import { referenceZ } from '../reference/impedance.js';

// The pencil (G + sC)·x = e·I of modified nodal analysis (Ho, Ruehli & Brennan, IEEE Trans. Circuits and
// Systems 22(6), 1975) is checked by solving it in the test: Gaussian elimination with partial pivoting over
// complex.js numbers (a general complex-math library), then x_port/I against the element-law impedance of
// test/reference/impedance.ts. Pole and zero facts of a series R-L-C are the quadratic formula.

/** Solve A·x = b, A row-major n × n, by Gaussian elimination with partial pivoting; also returns det(A). */
function solve(a: Complex[], b: Complex[], n: number): { x: Complex[]; det: Complex } {
  const m = a.slice();
  const r = b.slice();
  let det = new Complex(1, 0);
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (m[i * n + k].abs() > m[p * n + k].abs()) p = i;
    if (p !== k) {
      for (let j = 0; j < n; j++) [m[k * n + j], m[p * n + j]] = [m[p * n + j], m[k * n + j]];
      [r[k], r[p]] = [r[p], r[k]];
      det = det.neg();
    }
    const pivot = m[k * n + k];
    det = det.mul(pivot);
    if (pivot.isZero()) return { x: [], det };
    for (let i = k + 1; i < n; i++) {
      const f = m[i * n + k].div(pivot);
      for (let j = k; j < n; j++) m[i * n + j] = m[i * n + j].sub(f.mul(m[k * n + j]));
      r[i] = r[i].sub(f.mul(r[k]));
    }
  }
  const x = new Array<Complex>(n);
  for (let i = n - 1; i >= 0; i--) {
    let sum = r[i];
    for (let j = i + 1; j < n; j++) sum = sum.sub(m[i * n + j].mul(x[j]));
    x[i] = sum.div(m[i * n + i]);
  }
  return { x, det };
}

const matrixAt = (p: NodalPencil, s: Complex): Complex[] =>
  Array.from({ length: p.size * p.size }, (_, k) => s.mul(p.c[k]).add(p.g[k]));

/** Port impedance from the pencil: drive node 0 with 1 A and read its voltage. */
function pencilZ(p: NodalPencil, s: Complex): Complex {
  const e = Array.from({ length: p.size }, (_, i) => new Complex(i === 0 ? 1 : 0, 0));
  return solve(matrixAt(p, s), e, p.size).x[0];
}

const trees: Record<string, Element> = {
  'series R-L-C capacitor': series(resistor(0.012), inductor(0.6e-9), capacitor(4.7e-6)),
  'inductor with Cp': parallel(series(resistor(0.08), inductor(2.2e-6)), capacitor(3.1e-12)),
  'bead': series(resistor(0.05), parallel(resistor(220), inductor(1.1e-6), capacitor(1.4e-12))),
  'two branches in parallel': parallel(
    series(resistor(0.3), capacitor(1e-6), parallel(inductor(10e-9), resistor(2))),
    series(inductor(3e-9), capacitor(22e-9)),
  ),
};
const points = [new Complex(0, 2 * Math.PI * 1e6), new Complex(-2e5, 3e7), new Complex(4e4, 8e5), new Complex(-1e7, 6e9)];

const expectClose = (a: Complex, b: Complex, tol: number) => expect(a.sub(b).abs()).toBeLessThanOrEqual(tol * b.abs());

describe('nodalPencil: the port impedance of its solution is the element-law impedance', () => {
  for (const [name, tree] of Object.entries(trees)) {
    it(name, () => {
      const pencil = nodalPencil(tree);
      for (const s of points) expectClose(pencilZ(pencil, s), referenceZ(tree, s), 1e-9);
    });
  }
  it('unknowns: one per node, the port first, then one current per inductor', () => {
    // Series R-L-C: port, two inner nodes, one inductor current.
    expect(nodalPencil(trees['series R-L-C capacitor']).size).toBe(4);
    // R ‖ L ‖ C: the port alone and the inductor current.
    expect(nodalPencil(parallel(resistor(10), inductor(1e-6), capacitor(1e-9))).size).toBe(2);
  });
});

describe('mergedTree: fewer elements, the same impedance', () => {
  it('two inductors in series and two capacitors in parallel become one each', () => {
    const tree = series(resistor(0.01), inductor(1e-9), parallel(capacitor(1e-6), capacitor(2.2e-6)), inductor(0.5e-9));
    const merged = mergedTree(tree);
    expect(merged.type === 'series' && merged.parts.map((p) => p.type)).toEqual(['R', 'L', 'C']);
    const [r, l, c] = merged.type === 'series' ? merged.parts : [];
    expect(r.type === 'R' && r.ohms).toBe(0.01);
    expect(l.type === 'L' && l.henries).toBeCloseTo(1.5e-9, 22);
    expect(c.type === 'C' && c.farads).toBeCloseTo(3.2e-6, 18);
    for (const s of points) expectClose(referenceZ(merged, s), referenceZ(tree, s), 1e-12);
    // Unmerged: four nodes and two inductor currents; merged R-L-C: three nodes and one current.
    expect(nodalPencil(tree).size).toBe(4);
  });
  it('nested groups of the same kind flatten; resistors in parallel combine as conductances', () => {
    const tree = parallel(resistor(100), parallel(resistor(300), inductor(2e-6)), inductor(6e-6));
    const merged = mergedTree(tree);
    expect(merged.type).toBe('parallel');
    // 100 ‖ 300 = 75 Ω; 2 µH ‖ 6 µH = 1.5 µH.
    const parts = merged.type === 'parallel' ? merged.parts : [];
    expect(parts).toHaveLength(2);
    expect(parts[0].type === 'R' && parts[0].ohms).toBeCloseTo(75, 12);
    expect(parts[1].type === 'L' && parts[1].henries).toBeCloseTo(1.5e-6, 18);
    for (const s of points) expectClose(referenceZ(merged, s), referenceZ(tree, s), 1e-12);
  });
});

describe('poles and zeros of a series R-L-C (quadratic formula)', () => {
  const R = 0.012;
  const L = 0.6e-9;
  const C = 4.7e-6;
  const tree = series(resistor(R), inductor(L), capacitor(C));
  // Z(s) = (s²LC + sRC + 1)/(sC): zeros at s = (−R ± √(R² − 4L/C))/(2L), a pole at s = 0.
  const disc = new Complex(R * R - (4 * L) / C, 0).sqrt();
  const zero = disc.neg().sub(R).div(2 * L);
  const relDet = (p: NodalPencil, s: Complex, away: Complex) =>
    solve(matrixAt(p, s), new Array(p.size).fill(new Complex(0, 0)), p.size).det.abs() /
    solve(matrixAt(p, away), new Array(p.size).fill(new Complex(0, 0)), p.size).det.abs();

  it('det(G + sC) vanishes at the pole s = 0 and not at the zero', () => {
    const pencil = nodalPencil(tree);
    const away = new Complex(-1e5, 1e6);
    expect(relDet(pencil, new Complex(0, 0), away)).toBeLessThan(1e-12);
    expect(relDet(pencil, zero, away)).toBeGreaterThan(1e-3);
  });
  it('with the port unknown removed, the determinant vanishes at the zeros of Z', () => {
    const shorted = withoutUnknown(nodalPencil(tree), 0);
    const away = new Complex(-1e5, 1e6);
    expect(relDet(shorted, zero, away)).toBeLessThan(1e-9);
    expect(relDet(shorted, zero.conjugate(), away)).toBeLessThan(1e-9);
    expect(relDet(shorted, new Complex(0, 0), away)).toBeGreaterThan(1e-3);
  });
  it('withoutUnknown keeps every other entry in place', () => {
    const pencil = nodalPencil(tree);
    const n = pencil.size;
    const cut = withoutUnknown(pencil, 1);
    expect(cut.size).toBe(n - 1);
    const kept = [0, 2, 3];
    kept.forEach((i, r) =>
      kept.forEach((j, q) => {
        expect(cut.g[r * (n - 1) + q]).toBe(pencil.g[i * n + j]);
        expect(cut.c[r * (n - 1) + q]).toBe(pencil.c[i * n + j]);
      }),
    );
  });
});
