// A network function in partial fractions, F(s) = D0 + D1·s + Σ r_k/(s − p_k), with its poles known (the
// natural frequencies of the network) and its residues found by linear least squares on samples of F(jω):
// the residue step of vector fitting (B. Gustavsen, A. Semlyen, "Rational approximation of frequency
// domain responses by vector fitting", IEEE Trans. Power Delivery 14(3), 1999). A lumped R, L, C one-port
// has a rational F with numerator degree at most one above the denominator's, so with every pole present
// the form is exact and the fit reproduces F to rounding; poles left out (far above the range of interest)
// are absorbed by D0 and D1 over the samples. A complex pole stands for its conjugate pair: the pair
// contributes r/(s − p) + r̄/(s − p̄), real on the real axis.

import type { ComplexFrequency } from '../circuit/natural-frequencies.js';
import { leastSquares } from './least-squares.js';
import { hypot } from '../circuit/hypot.js';

export interface PartialFractions {
  /** Poles, rad/s; one of each conjugate pair (im > 0), real poles with im = 0. */
  readonly poles: readonly ComplexFrequency[];
  /** Residue at each pole (for a real pole, im = 0), in the units of F times rad/s. */
  readonly residues: readonly ComplexFrequency[];
  /** D0, F(∞) less the proportional term. */
  readonly constant: number;
  /** D1, the coefficient of s (an inductance for an impedance). */
  readonly proportional: number;
}

/** Samples of F(jω): angular frequencies (rad/s) and the real and imaginary parts there. */
export interface FrequencySamples {
  readonly omega: Float64Array;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

export interface FitOptions {
  /** Fit a D1·s term (an impedance that rises like sL at high frequency). */
  proportional: boolean;
  /** Weight of each sample in the squared error; 1/|F| makes it a relative fit. Default 1. */
  weights?: Float64Array;
}

/**
 * Poles closer than this (relative to their size) are one pole. Exact repeats come from modes the port
 * cannot see (identical branches exchanging current): they carry no residue, and one column is enough.
 */
const SAME_POLE = 1e-10;

export function distinctPoles(poles: readonly ComplexFrequency[]): ComplexFrequency[] {
  const out: ComplexFrequency[] = [];
  for (const p of poles) {
    const size = hypot(p.re, p.im);
    if (!out.some((q) => hypot(q.re - p.re, q.im - p.im) <= SAME_POLE * Math.max(size, hypot(q.re, q.im)))) out.push(p);
  }
  return out;
}

/**
 * The residues, D0 and (optionally) D1 of each of `targets` on the same poles and sample frequencies:
 * weighted linear least squares (Householder QR, least-squares.ts; columns scaled to unit norm), one
 * factorisation for all.
 */
export function fitPartialFractions(poles: readonly ComplexFrequency[], omega: Float64Array, targets: readonly { re: Float64Array; im: Float64Array }[], options: FitOptions): PartialFractions[] {
  const m = omega.length;
  const columns: { pole: number; part: 're' | 'im' | 'constant' | 'proportional' }[] = [];
  poles.forEach((p, k) => {
    columns.push({ pole: k, part: 're' });
    if (p.im !== 0) columns.push({ pole: k, part: 'im' });
  });
  columns.push({ pole: -1, part: 'constant' });
  if (options.proportional) columns.push({ pole: -1, part: 'proportional' });
  const n = columns.length;
  if (2 * m < n) throw new RangeError(`${m} samples cannot fix ${n} unknowns`);

  // Rows: real parts of the m samples, then their imaginary parts; column-major.
  const rows = 2 * m;
  const a = new Float64Array(rows * n);
  const w = options.weights;
  for (let i = 0; i < m; i++) {
    const s = omega[i];
    const wi = w ? w[i] : 1;
    for (let j = 0; j < n; j++) {
      const col = columns[j];
      let re = 0;
      let im = 0;
      if (col.part === 'constant') re = 1;
      else if (col.part === 'proportional') im = s;
      else {
        const p = poles[col.pole];
        // 1/(jω − p) = A and, for a pair, 1/(jω − p̄) = B.
        const da = p.re * p.re + (s - p.im) * (s - p.im);
        const ar = -p.re / da;
        const ai = -(s - p.im) / da;
        if (p.im === 0) {
          re = ar;
          im = ai;
        } else {
          const db = p.re * p.re + (s + p.im) * (s + p.im);
          const br = -p.re / db;
          const bi = -(s + p.im) / db;
          // r = x + jy: x·(A + B) + y·j(A − B)
          if (col.part === 're') {
            re = ar + br;
            im = ai + bi;
          } else {
            re = -(ai - bi);
            im = ar - br;
          }
        }
      }
      a[j * rows + i] = wi * re;
      a[j * rows + m + i] = wi * im;
    }
  }
  const scale = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let i = 0; i < rows; i++) sum += a[j * rows + i] ** 2;
    scale[j] = sum > 0 ? 1 / Math.sqrt(sum) : 1;
    for (let i = 0; i < rows; i++) a[j * rows + i] *= scale[j];
  }
  const rhs = targets.map((t) => {
    const b = new Float64Array(rows);
    for (let i = 0; i < m; i++) {
      const wi = w ? w[i] : 1;
      b[i] = wi * t.re[i];
      b[m + i] = wi * t.im[i];
    }
    return b;
  });
  const x = leastSquares(a, rows, n, rhs);
  return targets.map((_, c) => {
    const residues: ComplexFrequency[] = poles.map(() => ({ re: 0, im: 0 }));
    let constant = 0;
    let proportional = 0;
    columns.forEach((col, j) => {
      const v = x[c][j] * scale[j];
      if (col.part === 'constant') constant = v;
      else if (col.part === 'proportional') proportional = v;
      else if (col.part === 're') residues[col.pole].re = v;
      else residues[col.pole].im = v;
    });
    return { poles: [...poles], residues, constant, proportional };
  });
}

/** F(jω) of the expansion, as [re, im]. */
export function partialFractionsAt(f: PartialFractions, omega: number): [number, number] {
  let re = f.constant;
  let im = f.proportional * omega;
  for (let k = 0; k < f.poles.length; k++) {
    const p = f.poles[k];
    const r = f.residues[k];
    // r/(jω − p)
    const da = p.re * p.re + (omega - p.im) * (omega - p.im);
    const ar = -p.re / da;
    const ai = -(omega - p.im) / da;
    re += r.re * ar - r.im * ai;
    im += r.re * ai + r.im * ar;
    if (p.im !== 0) {
      // r̄/(jω − p̄)
      const db = p.re * p.re + (omega + p.im) * (omega + p.im);
      const br = -p.re / db;
      const bi = -(omega + p.im) / db;
      re += r.re * br + r.im * bi;
      im += r.re * bi - r.im * br;
    }
  }
  return [re, im];
}

/** F(0) = D0 − Σ r_k/p_k (pairs counted twice, real parts); Infinity with a pole at 0. */
export function partialFractionsAtZero(f: PartialFractions): number {
  let sum = f.constant;
  f.poles.forEach((p, k) => {
    const r = f.residues[k];
    if (p.re === 0 && p.im === 0) {
      sum = r.re === 0 ? sum : Infinity;
      return;
    }
    const d = p.re * p.re + p.im * p.im;
    const q = (r.re * p.re + r.im * p.im) / d; // Re(r/p)
    sum -= p.im === 0 ? q : 2 * q;
  });
  return sum;
}

/** The largest |F_fit − F|/scale over samples, scale = |F| (relative) or a given floor. */
export function fitError(f: PartialFractions, samples: FrequencySamples, floor = 0): number {
  let worst = 0;
  for (let i = 0; i < samples.omega.length; i++) {
    const [re, im] = partialFractionsAt(f, samples.omega[i]);
    const size = Math.max(hypot(samples.re[i], samples.im[i]), floor);
    worst = Math.max(worst, hypot(re - samples.re[i], im - samples.im[i]) / size);
  }
  return worst;
}
