// Figures derived point by point from Z = R + jX (standard definitions; e.g. Alexander & Sadiku, ch. 9
// and 14): |Z|, phase, Y = 1/Z = G + jB, Q = |X|/R, effective C = −1/(ωX) and effective L = X/ω.

import { admittanceInto } from './admittance.js';
import type { ImpedanceArrays } from './impedance.js';
import { hypot } from './hypot.js';

export interface ImpedanceFigures {
  readonly frequencyHz: Float64Array;
  /** Resistance R = Re Z, Ω. */
  readonly resistanceOhm: Float64Array;
  /** Reactance X = Im Z, Ω. */
  readonly reactanceOhm: Float64Array;
  readonly magnitudeOhm: Float64Array;
  /** arg Z in degrees, −90 (capacitive) .. +90 (inductive). */
  readonly phaseDeg: Float64Array;
  /** Conductance G = Re Y, S. */
  readonly conductanceS: Float64Array;
  /** Susceptance B = Im Y, S. */
  readonly susceptanceS: Float64Array;
  readonly admittanceMagnitudeS: Float64Array;
  /** Quality factor |X|/R; Infinity where R = 0. */
  readonly q: Float64Array;
  /** Capacitance that would show the same reactance, −1/(ωX), F; NaN where X ≥ 0. */
  readonly effectiveCapacitanceF: Float64Array;
  /** Inductance that would show the same reactance, X/ω, H; NaN where X ≤ 0. */
  readonly effectiveInductanceH: Float64Array;
}

const DEG_PER_RAD = 180 / Math.PI;

export function deriveFigures(frequencyHz: Float64Array, z: ImpedanceArrays): ImpedanceFigures {
  const n = frequencyHz.length;
  const magnitude = new Float64Array(n);
  const phase = new Float64Array(n);
  const g = new Float64Array(n);
  const b = new Float64Array(n);
  const yMag = new Float64Array(n);
  const q = new Float64Array(n);
  const cEff = new Float64Array(n);
  const lEff = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const r = z.re[i];
    const x = z.im[i];
    const m = hypot(r, x);
    const omega = 2 * Math.PI * frequencyHz[i];
    magnitude[i] = m;
    phase[i] = Math.atan2(x, r) * DEG_PER_RAD;
    yMag[i] = 1 / m;
    q[i] = Math.abs(x) / r;
    cEff[i] = x < 0 ? -1 / (omega * x) : NaN;
    lEff[i] = x > 0 ? x / omega : NaN;
  }
  admittanceInto(z.re, z.im, g, b);
  return {
    frequencyHz,
    resistanceOhm: z.re,
    reactanceOhm: z.im,
    magnitudeOhm: magnitude,
    phaseDeg: phase,
    conductanceS: g,
    susceptanceS: b,
    admittanceMagnitudeS: yMag,
    q,
    effectiveCapacitanceF: cEff,
    effectiveInductanceH: lEff,
  };
}
