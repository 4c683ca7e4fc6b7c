// Logarithmic frequency sweeps: a fixed count of points per decade, both ends included.

export interface SweepSpec {
  fromHz: number;
  toHz: number;
  perDecade: number;
}

/**
 * Frequencies from `fromHz` to `toHz` spaced evenly in log10(f), `perDecade` points per decade.
 * Points are computed from their index (not by repeated multiplication) so the same spec always gives the
 * same bits, and the last point is exactly `toHz`.
 */
export function logSweep({ fromHz, toHz, perDecade }: SweepSpec): Float64Array {
  if (!(fromHz > 0) || !(toHz > fromHz) || !(perDecade > 0)) {
    throw new RangeError(`invalid sweep ${fromHz}..${toHz} Hz at ${perDecade}/decade`);
  }
  const decades = Math.log10(toHz / fromHz);
  const steps = Math.max(1, Math.ceil(decades * perDecade - 1e-9));
  const out = new Float64Array(steps + 1);
  const logFrom = Math.log10(fromHz);
  for (let i = 0; i <= steps; i++) out[i] = 10 ** (logFrom + (decades * i) / steps);
  out[0] = fromHz;
  out[steps] = toHz;
  return out;
}

/**
 * The points of `logSweep`, each rounded to `digits` significant digits: the frequencies a file written at
 * that precision names. A model evaluated at these (rather than at the unrounded points) agrees with the
 * file at every row; the rounding moves a point by at most 5 parts in 10^digits of itself.
 */
export function roundedSweep(sweep: SweepSpec, digits: number): Float64Array {
  return logSweep(sweep).map((f) => Number(f.toPrecision(digits)));
}
