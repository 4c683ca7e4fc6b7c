// Independent references for the engine's verdicts, written for the tests: the impedance of an element tree
// at any complex frequency s with complex.js (a general-purpose complex-number library from the registry),
// by the element laws Z_R = R, Z_L = sL, Z_C = 1/(sC), series sums and parallel reciprocal sums (any
// circuit-analysis text, e.g. Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9 and 15),
// and extrema of |Z| found by a dense sweep refined by golden-section search. None of zfolio's own
// evaluators is used here.

import { Complex } from 'complex.js';
import type { Element } from '../../src/circuit/element.js';

/** Z(s) of a tree, s = sigma + j·omega in rad/s. */
export function referenceZ(element: Element, s: Complex): Complex {
  switch (element.type) {
    case 'R':
      return new Complex(element.ohms, 0);
    case 'L':
      return s.mul(element.henries);
    case 'C':
      return s.mul(element.farads).inverse();
    case 'series':
      return element.parts.reduce((sum, p) => sum.add(referenceZ(p, s)), new Complex(0, 0));
    case 'parallel':
      return element.parts.reduce((sum, p) => sum.add(referenceZ(p, s).inverse()), new Complex(0, 0)).inverse();
  }
}

/** Z(j·2πf). */
export function referenceZAt(element: Element, frequencyHz: number): Complex {
  return referenceZ(element, new Complex(0, 2 * Math.PI * frequencyHz));
}

/** |Z| of N identical placements of each branch in parallel (a rail), at f. */
export function referenceRailZ(branches: readonly { element: Element; count: number }[], frequencyHz: number): Complex {
  const s = new Complex(0, 2 * Math.PI * frequencyHz);
  return branches.reduce((y, b) => y.add(referenceZ(b.element, s).inverse().mul(b.count)), new Complex(0, 0)).inverse();
}

export interface ReferenceExtremum {
  frequencyHz: number;
  value: number;
}

/**
 * Every interior local maximum of `value(f)` over [fromHz, toHz]: a log sweep of `points` points, then
 * golden-section search on each sampled maximum between its neighbours (in ln f, to 1e-13 relative).
 */
export function referenceMaxima(value: (f: number) => number, fromHz: number, toHz: number, points: number): ReferenceExtremum[] {
  const f = Array.from({ length: points }, (_, i) => fromHz * (toHz / fromHz) ** (i / (points - 1)));
  const v = f.map(value);
  const found: ReferenceExtremum[] = [];
  for (let i = 1; i < points - 1; i++) {
    if (!(v[i] > v[i - 1] && v[i] >= v[i + 1])) continue;
    let a = Math.log(f[i - 1]);
    let b = Math.log(f[i + 1]);
    const phi = (Math.sqrt(5) - 1) / 2;
    let c = b - phi * (b - a);
    let d = a + phi * (b - a);
    let fc = value(Math.exp(c));
    let fd = value(Math.exp(d));
    while (b - a > 1e-13) {
      if (fc > fd) {
        b = d;
        d = c;
        fd = fc;
        c = b - phi * (b - a);
        fc = value(Math.exp(c));
      } else {
        a = c;
        c = d;
        fc = fd;
        d = a + phi * (b - a);
        fd = value(Math.exp(d));
      }
    }
    const at = Math.exp((a + b) / 2);
    found.push({ frequencyHz: at, value: value(at) });
  }
  return found;
}

/** Sign changes of X(f) over a dense log sweep: [f below, f above, 'series' | 'parallel']. */
export function referenceReactanceCrossings(element: Element, fromHz: number, toHz: number, points: number): { lowHz: number; highHz: number; type: 'series' | 'parallel' }[] {
  const out: { lowHz: number; highHz: number; type: 'series' | 'parallel' }[] = [];
  let previous: { f: number; sign: number } | undefined;
  for (let i = 0; i < points; i++) {
    const f = fromHz * (toHz / fromHz) ** (i / (points - 1));
    const z = referenceZAt(element, f);
    // Rounding noise in X is no sign: the same floor the engine's README states (1e-12 of |Z|).
    const sign = Math.abs(z.im) > 1e-12 * z.abs() ? Math.sign(z.im) : 0;
    if (sign === 0) continue;
    if (previous && sign !== previous.sign) out.push({ lowHz: previous.f, highHz: f, type: sign > 0 ? 'series' : 'parallel' });
    previous = { f, sign };
  }
  return out;
}
