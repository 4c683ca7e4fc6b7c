// Admittance Y = 1/Z = G + jB, G = R/(R² + X²), B = −X/(R² + X²), and its slope dY/dω = −dZ/dω·Y² (any
// circuit-analysis text, e.g. Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9): the one
// place the reciprocal is written, for sweeps (typed arrays) and for one point with its slope.

/** Y = 1/Z at every point: G into `g`, B into `b`. */
export function admittanceInto(re: ArrayLike<number>, im: ArrayLike<number>, g: Float64Array, b: Float64Array, n = re.length): void {
  for (let i = 0; i < n; i++) {
    const d = re[i] * re[i] + im[i] * im[i];
    g[i] = re[i] / d;
    b[i] = -im[i] / d;
  }
}

/** Adds `count` times Y = 1/Z at every point into (g, b): `count` identical branches in parallel. */
export function addAdmittance(re: ArrayLike<number>, im: ArrayLike<number>, count: number, g: Float64Array, b: Float64Array, n = re.length): void {
  for (let i = 0; i < n; i++) {
    const d = re[i] * re[i] + im[i] * im[i];
    g[i] += (count * re[i]) / d;
    b[i] -= (count * im[i]) / d;
  }
}

/**
 * Adds `count` times Y = 1/Z and dY/dω = −dZ/dω·Y² into `acc` = [G, B, dG/dω, dB/dω], given Z = zr + j·zi
 * and dZ/dω = dzr + j·dzi at one frequency.
 */
export function addAdmittanceSlope(zr: number, zi: number, dzr: number, dzi: number, count: number, acc: Float64Array): void {
  const d = zr * zr + zi * zi;
  const yr = zr / d;
  const yi = -zi / d;
  const sr = yr * yr - yi * yi;
  const si = 2 * yr * yi;
  acc[0] += count * yr;
  acc[1] += count * yi;
  acc[2] -= count * (dzr * sr - dzi * si);
  acc[3] -= count * (dzr * si + dzi * sr);
}
