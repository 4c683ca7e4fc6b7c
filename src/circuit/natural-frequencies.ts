// Natural frequencies of an element tree: the poles of Z(s) (the network's free oscillations with its port
// open) and its zeros (with the port shorted), as complex frequencies s = σ + jω in rad/s. A lightly damped
// pole or zero sits a distance |σ| from the jω axis, and |Z(jω)| has a peak or a notch about |σ| wide at
// ω ≈ Im s: this is what tells the analysis where the sweep must look closer.
//
// The poles are the finite generalised eigenvalues of the nodal pencil (G + sC)x = 0 (state-space.ts). C is
// usually singular (nodes without a capacitor, the infinite eigenvalues), so the pencil is shifted and
// inverted (e.g. Y. Saad, Numerical Methods for Large Eigenvalue Problems, 2nd ed., 2011, §4.1):
// with A = G + σ0·C, A⁻¹C·x = x/(σ0 − s), an ordinary eigenproblem whose eigenvalue 0 is s = ∞. The shift
// σ0 > 0 is real: every pole of a passive network lies in the closed left half-plane, so A is invertible.
// Eigenvalues come from ml-matrix (Hessenberg reduction and shifted QR, after EISPACK's hqr2), after a
// diagonal balancing of the matrix (B. N. Parlett, C. Reinsch, "Balancing a matrix for calculation of
// eigenvalues and eigenvectors", Numer. Math. 13, 1969).

import { EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix';
import type { Element } from './element.js';
import { laplaceImpedance } from './laplace.js';
import { nodalPencil, withoutUnknown, type NodalPencil } from './state-space.js';
import { hypot } from './hypot.js';

/** A complex frequency s = re + j·im, rad/s. */
export interface ComplexFrequency {
  re: number;
  im: number;
}

export interface NaturalFrequencies {
  /** Finite poles of Z(s), each conjugate pair once (im ≥ 0). */
  poles: ComplexFrequency[];
  /** Finite zeros of Z(s), each conjugate pair once (im ≥ 0). */
  zeros: ComplexFrequency[];
}

/** The frequencies of interest, Hz (a sweep's ends). */
export interface FrequencyRange {
  fromHz: number;
  toHz: number;
}

const cache = new WeakMap<Element, Map<string, NaturalFrequencies>>();

/**
 * How far above the range a root is still kept, as a ratio of |s| to 2π·toHz. Above it lie roots that
 * cannot shape |Z| inside the range, and the pencil's infinite eigenvalues, which rounding turns into
 * finite ones of enormous size (for a defective block of size k, about ε^(1/k) of the largest eigenvalue).
 */
const ABOVE_RANGE = 1e3;

/**
 * Poles and zeros of the tree's impedance that can shape |Z(jω)| over `range`: all with |s| up to a
 * thousand times the range's top. The shift sits at the range's geometric middle, so roots far outside it
 * lose relative accuracy. Cached per tree and range.
 */
export function naturalFrequencies(element: Element, range: FrequencyRange): NaturalFrequencies {
  let byRange = cache.get(element);
  if (!byRange) {
    byRange = new Map();
    cache.set(element, byRange);
  }
  const key = `${range.fromHz}:${range.toHz}`;
  let found = byRange.get(key);
  if (!found) {
    const pencil = nodalPencil(element);
    const shift = 2 * Math.PI * Math.sqrt(range.fromHz * range.toHz);
    const limit = 2 * Math.PI * range.toHz * ABOVE_RANGE;
    const inRange = (roots: ComplexFrequency[]) => roots.filter((r) => hypot(r.re, r.im) <= limit);
    found = {
      poles: polished(element, inRange(pencilRoots(pencil, shift)), 'pole', range),
      zeros: pencil.size > 1 ? polished(element, inRange(pencilRoots(withoutUnknown(pencil, 0), shift)), 'zero', range) : [],
    };
    byRange.set(key, found);
  }
  return found;
}

/**
 * Each root refined by Newton's method on the tree itself, evaluated at the complex frequency (laplace.ts):
 * on Y = 1/Z for a pole (s ← s + Z/Z'), on Z for a zero (s ← s − Z/Z'). One shift cannot give every
 * eigenvalue of a pencil whose elements span many decades to full relative accuracy — a lightly damped root
 * far from the shift can even come out on the wrong side of the jω axis — while Newton's method on the
 * network's own impedance converges quadratically to the root it starts near. A root from which Newton's
 * method does not converge, or would move more than half-way to its nearest neighbour, is not a root of the
 * impedance and is dropped: the pencil's infinite eigenvalues, which rounding turns into finite ones (for a
 * defective block of size k, about ε^(1/k) of the largest), and poles and zeros that cancel exactly. Roots
 * below the range (where Z' may not exist, as at s = 0) are kept as found.
 */
function polished(element: Element, roots: ComplexFrequency[], kind: 'pole' | 'zero', range: FrequencyRange): ComplexFrequency[] {
  const sign = kind === 'pole' ? 1 : -1;
  const below = 2 * Math.PI * range.fromHz;
  const out: ComplexFrequency[] = [];
  roots.forEach((root, i) => {
    if (hypot(root.re, root.im) < below) {
      out.push(root);
      return;
    }
    let nearest = Infinity;
    roots.forEach((other, j) => {
      if (j !== i) nearest = Math.min(nearest, hypot(other.re - root.re, other.im - root.im), hypot(other.re - root.re, other.im + root.im));
    });
    // A root on the real axis stays there (Z is real for real s), so only complex roots can cross over.
    if (root.im !== 0) nearest = Math.min(nearest, 2 * root.im);
    let re = root.re;
    let im = root.im;
    let step = Infinity;
    for (let k = 0; k < 30; k++) {
      const [zr, zi, dr, di] = laplaceImpedance(element, re, im);
      const d = dr * dr + di * di;
      // Z/Z'
      const qr = (zr * dr + zi * di) / d;
      const qi = (zi * dr - zr * di) / d;
      if (!Number.isFinite(qr) || !Number.isFinite(qi)) break;
      re += sign * qr;
      im += sign * qi;
      step = hypot(qr, qi);
      if (hypot(re - root.re, im - root.im) > nearest / 2) return;
      if (step <= 4 * Number.EPSILON * hypot(re, im)) break;
    }
    // Rounding can keep the last steps from shrinking below a few ulps; a step of 1e-9 is converged enough.
    if (step <= 1e-9 * hypot(re, im)) out.push({ re, im: Math.abs(im) });
  });
  return out;
}

/** Finite roots of det(G + sC), one of each conjugate pair; `shiftRadPerS` > 0 inside the range of interest. */
export function pencilRoots(pencil: NodalPencil, shiftRadPerS: number): ComplexFrequency[] {
  const n = pencil.size;
  if (n === 0 || !pencil.c.some((v) => v !== 0)) return [];
  // Frequency in units of the shift: s = σ0·ŝ, so G + ŝ·(σ0·C) with numbers near 1 for the range of interest.
  const a = new Float64Array(n * n);
  const cs = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) {
    cs[i] = pencil.c[i] * shiftRadPerS;
    a[i] = pencil.g[i] + cs[i];
  }
  equilibrate(a, cs, n);
  if (!a.every(Number.isFinite) || !cs.every(Number.isFinite)) return [];
  const lu = new LuDecomposition(Matrix.from1DArray(n, n, Array.from(a)));
  if (lu.isSingular()) return [];
  const m = lu.solve(Matrix.from1DArray(n, n, Array.from(cs)));
  const flat = m.to1DArray();
  // hqr2 has no iteration limit: never hand it anything but finite numbers.
  if (!flat.every(Number.isFinite)) return [];
  balance(flat, n);
  const evd = new EigenvalueDecomposition(Matrix.from1DArray(n, n, flat), { assumeSymmetric: false });
  const re = evd.realEigenvalues;
  const im = evd.imaginaryEigenvalues;
  let largest = 0;
  for (let i = 0; i < n; i++) largest = Math.max(largest, hypot(re[i], im[i]));
  const roots: ComplexFrequency[] = [];
  for (let i = 0; i < n; i++) {
    const size = hypot(re[i], im[i]);
    // The infinite eigenvalues of the pencil come out as rounding-level multiples of the largest one.
    if (!(size > largest * 1e-13)) continue;
    // ŝ = 1 − 1/λ
    const d = re[i] * re[i] + im[i] * im[i];
    const sRe = (1 - re[i] / d) * shiftRadPerS;
    const sIm = (im[i] / d) * shiftRadPerS;
    if (sIm < 0 || !Number.isFinite(sRe) || !Number.isFinite(sIm)) continue;
    roots.push({ re: sRe, im: sIm });
  }
  return roots.sort((x, y) => x.im - y.im || x.re - y.re);
}

/** Scale rows and columns of the pencil (A, C) alike so that A's rows and columns peak near 1. */
function equilibrate(a: Float64Array, c: Float64Array, n: number): void {
  for (let pass = 0; pass < 2; pass++) {
    for (let i = 0; i < n; i++) {
      let peak = 0;
      for (let j = 0; j < n; j++) peak = Math.max(peak, Math.abs(a[i * n + j]));
      if (peak > 0) {
        const s = 2 ** -Math.round(Math.log2(peak));
        for (let j = 0; j < n; j++) {
          a[i * n + j] *= s;
          c[i * n + j] *= s;
        }
      }
    }
    for (let j = 0; j < n; j++) {
      let peak = 0;
      for (let i = 0; i < n; i++) peak = Math.max(peak, Math.abs(a[i * n + j]));
      if (peak > 0) {
        const s = 2 ** -Math.round(Math.log2(peak));
        for (let i = 0; i < n; i++) {
          a[i * n + j] *= s;
          c[i * n + j] *= s;
        }
      }
    }
  }
}

/** Parlett–Reinsch balancing in place: a diagonal similarity by powers of two, eigenvalues unchanged. */
function balance(m: number[], n: number): void {
  const RADIX = 2;
  let converged = false;
  for (let sweep = 0; !converged && sweep < 100; sweep++) {
    converged = true;
    for (let i = 0; i < n; i++) {
      let column = 0;
      let row = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        column += Math.abs(m[j * n + i]);
        row += Math.abs(m[i * n + j]);
      }
      if (column === 0 || row === 0) continue;
      let f = 1;
      let g = row / RADIX;
      const total = column + row;
      let c = column;
      while (c < g) {
        f *= RADIX;
        c *= RADIX * RADIX;
      }
      g = row * RADIX;
      while (c > g) {
        f /= RADIX;
        c /= RADIX * RADIX;
      }
      if ((c + row) / f < 0.95 * total) {
        converged = false;
        for (let j = 0; j < n; j++) m[i * n + j] /= f;
        for (let j = 0; j < n; j++) m[j * n + i] *= f;
      }
    }
  }
}
