// Starting values for a fit, read off the measurement itself: the low- and high-frequency asymptotes (where
// one element dominates the impedance) and the resonance, where the reactance changes sign. Each value is a
// first guess for the fit to refine, not a result. A parameter the data give no handle on starts where its
// effect is small but not nil, so the fit can still grow it if the data want it.

import type { FitKind } from './fit-models.js';

export interface Sweep {
  frequencies: Float64Array;
  re: Float64Array;
  im: Float64Array;
}

const TWO_PI = 2 * Math.PI;

/** Starting values in FIT_PARAMETERS order for `kind`; the first list is the main guess, the others alternatives. */
export function startingValues(kind: FitKind, s: Sweep): Float64Array[] {
  switch (kind) {
    case 'capacitor':
      return capacitorStart(s);
    case 'inductor':
      return inductorStart(s);
    case 'resistor':
      return resistorStart(s);
    case 'bead':
      return beadStart(s);
  }
}

/** The first frequency where the reactance crosses zero in the given direction, interpolated in ln f. */
export function reactanceCrossing(s: Sweep, rising: boolean): number | undefined {
  for (let i = 1; i < s.frequencies.length; i++) {
    const a = s.im[i - 1];
    const b = s.im[i];
    if (rising ? a < 0 && b >= 0 : a > 0 && b <= 0) {
      const t = a / (a - b);
      return Math.exp(Math.log(s.frequencies[i - 1]) + t * (Math.log(s.frequencies[i]) - Math.log(s.frequencies[i - 1])));
    }
  }
  return undefined;
}

const magnitude = (s: Sweep, i: number) => Math.hypot(s.re[i], s.im[i]);

function indexOfMin(s: Sweep, score: (i: number) => number, from = 0, to = s.frequencies.length): number {
  let best = from;
  for (let i = from; i < to; i++) if (score(i) < score(best)) best = i;
  return best;
}

/** Median of the positive values of `values`, or undefined. */
function positiveMedian(values: number[]): number | undefined {
  const v = values.filter((x) => x > 0 && Number.isFinite(x)).sort((a, b) => a - b);
  return v.length ? v[Math.floor(v.length / 2)] : undefined;
}

function capacitorStart(s: Sweep): Float64Array[] {
  const n = s.frequencies.length;
  const f = s.frequencies;
  const fLow = f[0];
  const fHigh = f[n - 1];
  const fs = reactanceCrossing(s, true);
  const ws = fs !== undefined ? TWO_PI * fs : undefined;
  // Capacitance from where the phase is nearest −90°, corrected for the ESL that resonates at fs:
  // X = ωL − 1/(ωC) with L = 1/(ωs²·C), so C = (ω/ωs² − 1/ω)/X.
  const capacitive = indexOfMin(s, (i) => (s.im[i] < 0 ? s.re[i] / -s.im[i] : Infinity));
  const w = TWO_PI * f[capacitive];
  let c: number;
  if (s.im[capacitive] < 0) c = ws !== undefined && w < ws ? (w / (ws * ws) - 1 / w) / s.im[capacitive] : -1 / (w * s.im[capacitive]);
  else c = 1 / (TWO_PI * fLow * magnitude(s, 0));
  // ESL from the resonance, else from the inductive top of the sweep, else a resonance ten times above it.
  let esl: number;
  if (ws !== undefined) esl = 1 / (ws * ws * c);
  else if (s.im[n - 1] > 0) esl = s.im[n - 1] / (TWO_PI * fHigh) + 1 / ((TWO_PI * fHigh) ** 2 * c);
  else esl = 1 / ((TWO_PI * 10 * fHigh) ** 2 * c);
  // ESR: the resistance where |Z| is least (at resonance, where the reactances cancel).
  const least = indexOfMin(s, (i) => magnitude(s, i));
  const esr = s.re[least] > 0 ? s.re[least] : magnitude(s, least) * 0.1;
  // EPR from the conductance of the capacitor alone over the lowest few points.
  const conductances: number[] = [];
  for (let i = 0; i < Math.min(n, 5); i++) {
    const zr = s.re[i] - esr;
    const zi = s.im[i] - TWO_PI * f[i] * esl;
    conductances.push(zr / (zr * zr + zi * zi));
  }
  const g = positiveMedian(conductances);
  // Weak: its effect 1e-3 at the lowest frequency (|G/(jωC)| = 1e-3).
  const weakEpr = 1e3 / (TWO_PI * fLow * c);
  const epr = g !== undefined ? Math.min(1 / g, weakEpr * 1e3) : weakEpr;
  return [Float64Array.of(c, esr, esl, epr), Float64Array.of(c, esr, esl, weakEpr)];
}

function inductorStart(s: Sweep): Float64Array[] {
  const n = s.frequencies.length;
  const f = s.frequencies;
  const fp = reactanceCrossing(s, false);
  const wp = fp !== undefined ? TWO_PI * fp : undefined;
  // Inductance where the phase is nearest +90° below the resonance, corrected for Cp: L = (X/ω)(1 − ω²/ωp²).
  const end = fp !== undefined ? f.findIndex((x) => x >= fp) : n;
  const inductive = indexOfMin(s, (i) => (s.im[i] > 0 ? s.re[i] / s.im[i] : Infinity), 0, Math.max(1, end));
  const w = TWO_PI * f[inductive];
  let l = s.im[inductive] > 0 ? (s.im[inductive] / w) * (wp !== undefined ? Math.max(0.05, 1 - (w / wp) ** 2) : 1) : magnitude(s, 0) / (TWO_PI * f[0]);
  if (!(l > 0)) l = magnitude(s, 0) / (TWO_PI * f[0]);
  const fHigh = f[n - 1];
  const cp = wp !== undefined ? 1 / (wp * wp * l) : 1 / ((TWO_PI * 10 * fHigh) ** 2 * l);
  const dcr = s.re[0] > 0 ? s.re[0] : magnitude(s, 0) * 1e-3;
  // At the resonance the winding (dcr + jωL) looks like L/(Cp·dcr) in parallel: 1/Rpeak = 1/rp + dcr·Cp/L.
  const peak = indexOfMin(s, (i) => -magnitude(s, i));
  const rPeak = s.re[peak] > 0 ? s.re[peak] : magnitude(s, peak);
  const conductance = 1 / rPeak - (dcr * cp) / l;
  const weakRp = 1e3 * rPeak;
  const rp = wp !== undefined && conductance > 0 ? Math.min(1 / conductance, weakRp) : weakRp;
  return [Float64Array.of(l, dcr, cp, rp), Float64Array.of(l, dcr, cp, weakRp)];
}

function resistorStart(s: Sweep): Float64Array[] {
  const n = s.frequencies.length;
  const r = s.re[0] > 0 ? s.re[0] : magnitude(s, 0);
  const wTop = TWO_PI * s.frequencies[n - 1];
  // At the top of the sweep, a susceptance above zero is Cp's (Y ≈ 1/R + jωCp), a reactance above zero
  // Ls's (Z ≈ R + jωLs). The other starts weak (1% of R at the top); a third start has both weak.
  const weakLs = (0.01 * r) / wTop;
  const weakCp = 0.01 / (wTop * r);
  const d = s.re[n - 1] ** 2 + s.im[n - 1] ** 2;
  const susceptance = -s.im[n - 1] / d;
  const cp = susceptance > 0 ? susceptance / wTop : weakCp;
  const ls = s.im[n - 1] > 0 ? s.im[n - 1] / wTop : weakLs;
  return [Float64Array.of(r, ls, cp), Float64Array.of(r, weakLs, weakCp), Float64Array.of(r, ls * 10, cp * 10)];
}

function beadStart(s: Sweep): Float64Array[] {
  const n = s.frequencies.length;
  const f = s.frequencies;
  const rdc = s.re[0] > 0 ? s.re[0] : magnitude(s, 0) * 0.1;
  // Low frequencies: Z ≈ rdc + jωl.
  const l = positiveMedian([s.im[0] / (TWO_PI * f[0]), s.im[1] / (TWO_PI * f[1])]) ?? magnitude(s, 0) / (TWO_PI * f[0]);
  const peak = indexOfMin(s, (i) => -magnitude(s, i));
  const r = s.re[peak] - rdc > 0 ? s.re[peak] - rdc : magnitude(s, peak);
  const fp = reactanceCrossing(s, false);
  const wc = TWO_PI * (fp ?? 10 * f[n - 1]);
  const c = 1 / (wc * wc * l);
  return [Float64Array.of(rdc, r, l, c), Float64Array.of(rdc, r, l, 1 / ((TWO_PI * 10 * f[n - 1]) ** 2 * l))];
}
