// The exponential's remainder functions φ1(z) = (e^z − 1)/z and φ2(z) = (e^z − 1 − z)/z², for complex z.
// They carry the closed-form response of a pole p to a step (t·φ1(pt)) and to a ramp (t²·φ2(pt)) without
// the cancellation that the plain formulas suffer for small |pt|, and give t and t²/2 at p = 0 (the
// φ-functions of exponential integrators: M. Hochbruck, A. Ostermann, "Exponential integrators", Acta
// Numerica 19, 2010, §2). Below |z| = 1/2 a Taylor series, above it the plain formula, whose relative
// error there is a few ulps (e^z − 1 − z is at least about |z|²/3).

/** A complex number as a pair: [re, im]. Written into caller-owned scratch to keep the loops allocation-free. */
export type ComplexPair = [number, number];

const SERIES_RADIUS = 0.5;
/** Terms of the Taylor series: 0.5^16 / 18! ≈ 2.4e-21, below the rounding of the first term. */
const SERIES_TERMS = 16;

/** φ1(z) and φ2(z) into `phi1` and `phi2`; e^z into `exp`. */
export function phiFunctions(zr: number, zi: number, exp: ComplexPair, phi1: ComplexPair, phi2: ComplexPair): void {
  const m = Math.exp(zr);
  const er = zi === 0 ? m : m * Math.cos(zi);
  const ei = zi === 0 ? 0 : m * Math.sin(zi);
  exp[0] = er;
  exp[1] = ei;
  if (zr * zr + zi * zi < SERIES_RADIUS * SERIES_RADIUS) {
    // Horner on φ2(z) = Σ z^k/(k+2)!, then φ1 = 1 + z·φ2.
    let pr = INVERSE_FACTORIAL[SERIES_TERMS + 2];
    let pi = 0;
    for (let k = SERIES_TERMS - 1; k >= 0; k--) {
      const nr = pr * zr - pi * zi + INVERSE_FACTORIAL[k + 2];
      pi = pr * zi + pi * zr;
      pr = nr;
    }
    phi2[0] = pr;
    phi2[1] = pi;
    phi1[0] = 1 + (pr * zr - pi * zi);
    phi1[1] = pr * zi + pi * zr;
    return;
  }
  // φ1 = (e^z − 1)/z, φ2 = (φ1 − 1)/z.
  const d = zr * zr + zi * zi;
  const ar = er - 1;
  const p1r = (ar * zr + ei * zi) / d;
  const p1i = (ei * zr - ar * zi) / d;
  phi1[0] = p1r;
  phi1[1] = p1i;
  const br = p1r - 1;
  phi2[0] = (br * zr + p1i * zi) / d;
  phi2[1] = (p1i * zr - br * zi) / d;
}

/** 1/k! for k = 0 … SERIES_TERMS + 2. */
const INVERSE_FACTORIAL: number[] = [1];
for (let k = 1; k <= SERIES_TERMS + 2; k++) INVERSE_FACTORIAL[k] = INVERSE_FACTORIAL[k - 1] / k;
