// Bracketed root finding by Brent's method (R. P. Brent, Algorithms for Minimization without Derivatives,
// 1973, ch. 4): inverse quadratic interpolation and secant steps, falling back to bisection, so it never
// leaves the bracket and converges at least as fast as bisection.

/**
 * A root of `fn` in [a, b], where fn(a) and fn(b) differ in sign (or one is zero), to absolute tolerance
 * `tolerance` in x. Returns NaN when the bracket does not hold a sign change.
 */
export function brentRoot(fn: (x: number) => number, a: number, b: number, tolerance: number, maxIterations = 200): number {
  let fa = fn(a);
  let fb = fn(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Number.isNaN(fa) || Number.isNaN(fb) || Math.sign(fa) === Math.sign(fb)) return NaN;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (Math.sign(fb) === Math.sign(fc)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = fn(b);
  }
  return b;
}

/**
 * A root in frequency between two sweep points, found in ln f so the tolerance is relative:
 * the result is within `relativeTolerance`·f of the true crossing.
 */
export function frequencyRoot(fn: (frequencyHz: number) => number, lowHz: number, highHz: number, relativeTolerance: number): number {
  const u = brentRoot((x) => fn(Math.exp(x)), Math.log(lowHz), Math.log(highHz), relativeTolerance);
  if (Number.isNaN(u)) return NaN;
  // Endpoints are returned exactly, not through exp(log(x)).
  if (u === Math.log(lowHz)) return lowHz;
  if (u === Math.log(highHz)) return highHz;
  return Math.exp(u);
}
