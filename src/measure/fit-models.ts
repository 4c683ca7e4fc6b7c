// The models a measurement is fitted with: each kind's topology (as the part format builds it) with Z and
// its derivative by the logarithm of each parameter, ∂Z/∂ln p = p·∂Z/∂p, in closed form. Element laws and
// series/parallel rules: Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9; for a
// parallel combination Z = 1/Y, ∂Z = −Z²·∂Y.
//
//   capacitor  esr + esl + (C ‖ epr)        inductor  (dcr + L) ‖ cp ‖ rp
//   resistor   (R + ls) ‖ cp                bead      rdc + (r ‖ l ‖ c)

import type { Dimension } from '../units/quantity.js';

export const FIT_KINDS = ['capacitor', 'inductor', 'resistor', 'bead'] as const;
export type FitKind = (typeof FIT_KINDS)[number];

/** How a parameter is absent from a model: a series element shorted, a parallel one open; some are never absent. */
export type Absence = 'zero' | 'open' | 'required';

export interface ParameterSpec {
  /** As the part format names it. */
  name: string;
  /** The element it sets, as the part's model names it (part-network.ts; the model table's label). */
  element: string;
  dimension: Dimension;
  absence: Absence;
}

const p = (name: string, element: string, dimension: Dimension, absence: Absence): ParameterSpec => ({ name, element, dimension, absence });

/** Parameters of each kind in the part format's names and order. */
export const FIT_PARAMETERS: Readonly<Record<FitKind, readonly ParameterSpec[]>> = {
  capacitor: [p('nominal', 'C', 'capacitance', 'required'), p('esr', 'ESR', 'resistance', 'zero'), p('esl', 'ESL', 'inductance', 'zero'), p('epr', 'EPR', 'resistance', 'open')],
  inductor: [p('nominal', 'L', 'inductance', 'required'), p('dcr', 'DCR', 'resistance', 'zero'), p('cp', 'Cp', 'capacitance', 'open'), p('rp', 'Rp', 'resistance', 'open')],
  resistor: [p('nominal', 'R', 'resistance', 'required'), p('ls', 'Ls', 'inductance', 'zero'), p('cp', 'Cp', 'capacitance', 'open')],
  bead: [p('rdc', 'Rdc', 'resistance', 'zero'), p('r', 'R', 'resistance', 'required'), p('l', 'L', 'inductance', 'required'), p('c', 'C', 'capacitance', 'open')],
};

/**
 * Z at angular frequency w for parameter values `v` (SI, in FIT_PARAMETERS order) of which only those with
 * `on[i]` take part; writes Z to z[0], z[1] and, when `dz` is given, ∂Z/∂ln v[i] to dz[2i], dz[2i + 1] (zero
 * for a parameter that is off).
 */
export type ModelEvaluator = (w: number, v: Float64Array, on: readonly boolean[], z: Float64Array, dz: Float64Array | null) => void;

export const MODELS: Readonly<Record<FitKind, ModelEvaluator>> = {
  capacitor(w, v, on, z, dz) {
    const [c, esr, esl, epr] = v;
    // Yc = G + jωC, the capacitor with its leakage.
    const g = on[3] ? 1 / epr : 0;
    const b = w * c;
    const d = g * g + b * b;
    const zcr = g / d;
    const zci = -b / d;
    z[0] = zcr + (on[1] ? esr : 0);
    z[1] = zci + (on[2] ? w * esl : 0);
    if (!dz) return;
    // 1/Yc² = Zc²
    const qr = zcr * zcr - zci * zci;
    const qi = 2 * zcr * zci;
    // ∂Z/∂ln C = −jωC·Zc², ∂Z/∂ln esr = esr, ∂Z/∂ln esl = jω·esl, ∂Z/∂ln epr = G·Zc²
    dz[0] = b * qi;
    dz[1] = -b * qr;
    dz[2] = on[1] ? esr : 0;
    dz[3] = 0;
    dz[4] = 0;
    dz[5] = on[2] ? w * esl : 0;
    dz[6] = g * qr;
    dz[7] = g * qi;
  },

  inductor(w, v, on, z, dz) {
    const [l, dcr, cp, rp] = v;
    const wr = on[1] ? dcr : 0;
    const wi = w * l;
    // 1/(dcr + jωL)
    const wd = wr * wr + wi * wi;
    const ywr = wr / wd;
    const ywi = -wi / wd;
    const yr = ywr + (on[3] ? 1 / rp : 0);
    const yi = ywi + (on[2] ? w * cp : 0);
    parallelResult(yr, yi, z);
    if (!dz) return;
    // ∂Y/∂ln L = −jωL/(Zw²), ∂Y/∂ln dcr = −dcr/Zw²; 1/Zw² = Yw²
    const sr = ywr * ywr - ywi * ywi;
    const si = 2 * ywr * ywi;
    setFromAdmittance(dz, 0, z, wi * si, -wi * sr);
    setFromAdmittance(dz, 1, z, on[1] ? -dcr * sr : 0, on[1] ? -dcr * si : 0);
    setFromAdmittance(dz, 2, z, 0, on[2] ? w * cp : 0);
    setFromAdmittance(dz, 3, z, on[3] ? -1 / rp : 0, 0);
  },

  resistor(w, v, on, z, dz) {
    const [r, ls, cp] = v;
    const br = r;
    const bi = on[1] ? w * ls : 0;
    const bd = br * br + bi * bi;
    const ybr = br / bd;
    const ybi = -bi / bd;
    parallelResult(ybr, ybi + (on[2] ? w * cp : 0), z);
    if (!dz) return;
    const sr = ybr * ybr - ybi * ybi;
    const si = 2 * ybr * ybi;
    // ∂Y/∂ln R = −R/Zb², ∂Y/∂ln ls = −jω·ls/Zb², ∂Y/∂ln cp = jω·cp
    setFromAdmittance(dz, 0, z, -r * sr, -r * si);
    setFromAdmittance(dz, 1, z, on[1] ? bi * si : 0, on[1] ? -bi * sr : 0);
    setFromAdmittance(dz, 2, z, 0, on[2] ? w * cp : 0);
  },

  bead(w, v, on, z, dz) {
    const [rdc, r, l, c] = v;
    // Yc = 1/r + 1/(jωl) + jωc
    const yr = 1 / r;
    const yi = -1 / (w * l) + (on[3] ? w * c : 0);
    const d = yr * yr + yi * yi;
    const zcr = yr / d;
    const zci = -yi / d;
    z[0] = zcr + (on[0] ? rdc : 0);
    z[1] = zci;
    if (!dz) return;
    const core = [zcr, zci];
    dz[0] = on[0] ? rdc : 0;
    dz[1] = 0;
    // ∂Yc/∂ln r = −1/r, ∂Yc/∂ln l = j/(ωl), ∂Yc/∂ln c = jωc; ∂Z = −Zc²·∂Yc
    setFromAdmittance(dz, 1, core, -1 / r, 0);
    setFromAdmittance(dz, 2, core, 0, 1 / (w * l));
    setFromAdmittance(dz, 3, core, 0, on[3] ? w * c : 0);
  },
};

/** z = 1/y. */
function parallelResult(yr: number, yi: number, z: Float64Array): void {
  const d = yr * yr + yi * yi;
  z[0] = yr / d;
  z[1] = -yi / d;
}

/** dz[i] = −Z²·∂Y for a parallel combination of impedance z. */
function setFromAdmittance(dz: Float64Array, i: number, z: ArrayLike<number>, dyr: number, dyi: number): void {
  const qr = z[0] * z[0] - z[1] * z[1];
  const qi = 2 * z[0] * z[1];
  dz[2 * i] = -(qr * dyr - qi * dyi);
  dz[2 * i + 1] = -(qr * dyi + qi * dyr);
}
