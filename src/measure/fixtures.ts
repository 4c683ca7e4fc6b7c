// The impedance of a part from a measurement, by the fixture it was measured in.
//
// - reflection (one port): Z = Z0·(1 + Γ)/(1 − Γ), Γ = S11; or Z11 itself; or 1/Y11 (D. M. Pozar,
//   Microwave Engineering, 4th ed., 2012, §2.3 and §4.2).
// - shunt-thru (the part from the line to ground between two ports): S21 = 2Z/(2Z + Z0), so
//   Z = (Z0/2)·S21/(1 − S21); accurate for |Z| well below Z0/2, as for capacitors.
// - series-thru (the part in series between the ports): S21 = 2Z0/(2Z0 + Z), so Z = 2·Z0·(1 − S21)/S21;
//   accurate for |Z| well above Z0/2, as for inductors and beads.
// The two-port forms follow from the ABCD matrices of a shunt and a series impedance and the ABCD-to-S
// conversion (Pozar, §4.4, table 4.2); I. Stepins et al., "Measuring capacitor parameters using vector
// network analyzers", Electronics 18(1), 2014, describe both set-ups for capacitors. Y or Z two-port data are
// first turned into S21 by the same table: S21 = 2·Z21·Z0/ΔZ, ΔZ = (Z11 + Z0)(Z22 + Z0) − Z12·Z21, and
// S21 = −2·Y21·Y0/ΔY, ΔY = (Y11 + Y0)(Y22 + Y0) − Y12·Y21, Y0 = 1/Z0.

import type { Diagnostic } from '../model/diagnostics.js';
import { MEASUREMENT_FIXTURES, type MeasurementFixture } from '../model/measurement-entry.js';
import type { NetworkData } from './network-data.js';

/** The fixtures, named as part files and the command line name them. */
export const FIXTURES = MEASUREMENT_FIXTURES;
export type Fixture = MeasurementFixture;

/** Z = re + j·im, Ω, at each frequency of a measurement. */
export interface MeasuredImpedance {
  fixture: Fixture;
  /** The ports' reference impedance, Ω. */
  referenceOhm: number;
  frequencies: Float64Array;
  re: Float64Array;
  im: Float64Array;
}

export type ImpedanceResult = { ok: true; impedance: MeasuredImpedance } | { ok: false; error: Diagnostic };

const PORTS: Readonly<Record<Fixture, number>> = { reflection: 1, 'shunt-thru': 2, 'series-thru': 2 };

/** The part's impedance at every frequency of `data`, measured in `fixture`. */
export function impedanceFromNetwork(data: NetworkData, fixture: Fixture): ImpedanceResult {
  const fail = (at: Diagnostic | { file: string; line: number; column: number }, message: string): ImpedanceResult => ({ ok: false, error: { ...at, severity: 'error', message } });
  if (data.ports !== PORTS[fixture]) {
    const hint = data.ports === 1 ? 'a one-port file is a reflection measurement' : data.ports === 2 ? 'a two-port file is a shunt-thru or series-thru measurement' : 'zfolio reads one-port and two-port measurements';
    return fail(data.at.ports, `a ${fixture} measurement needs a ${PORTS[fixture]}-port file, found ${data.ports} port${data.ports === 1 ? '' : 's'}; ${hint}`);
  }
  const z0 = data.reference[0];
  if (data.ports === 2 && data.reference[1] !== z0) {
    return fail(data.at.reference, `the ${fixture} formula needs the same reference impedance at both ports, found ${data.reference[0]} Ω and ${data.reference[1]} Ω`);
  }
  const count = data.frequencies.length;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    const [zr, zi] = fixture === 'reflection' ? onePort(data, k, z0) : twoPort(data, k, z0, fixture);
    if (!Number.isFinite(zr) || !Number.isFinite(zi)) {
      const why = fixture === 'shunt-thru' ? 'S21 = 1, an open' : fixture === 'series-thru' ? 'S21 = 0, no transmission' : 'Γ = 1, an open';
      return fail({ file: data.file, line: data.lines[k], column: 1 }, `the ${fixture} formula gives no finite impedance here (${why}); leave this frequency out or check the fixture`);
    }
    re[k] = zr;
    im[k] = zi;
  }
  return { ok: true, impedance: { fixture, referenceOhm: z0, frequencies: data.frequencies, re, im } };
}

function onePort(data: NetworkData, k: number, z0: number): [number, number] {
  const a = data.re[k];
  const b = data.im[k];
  switch (data.parameter) {
    case 'Z':
      return [a, b];
    case 'Y':
      return divide(1, 0, a, b);
    case 'S': {
      // Z0·(1 + Γ)/(1 − Γ)
      const [r, i] = divide(1 + a, b, 1 - a, -b);
      return [z0 * r, z0 * i];
    }
  }
}

function twoPort(data: NetworkData, k: number, z0: number, fixture: Fixture): [number, number] {
  const [sr, si] = s21(data, k, z0);
  if (fixture === 'shunt-thru') {
    // (Z0/2)·S21/(1 − S21)
    const [r, i] = divide(sr, si, 1 - sr, -si);
    return [(z0 / 2) * r, (z0 / 2) * i];
  }
  // 2·Z0·(1 − S21)/S21
  const [r, i] = divide(1 - sr, -si, sr, si);
  return [2 * z0 * r, 2 * z0 * i];
}

/** S21 at frequency index k, from S, Z or Y data, for a reference z0 at both ports. */
function s21(data: NetworkData, k: number, z0: number): [number, number] {
  const base = 4 * k;
  const p = (i: number) => [data.re[base + i], data.im[base + i]] as const;
  const [p11, p12, p21, p22] = [p(0), p(1), p(2), p(3)];
  if (data.parameter === 'S') return [p21[0], p21[1]];
  const ref = data.parameter === 'Z' ? z0 : 1 / z0;
  // Δ = (P11 + ref)(P22 + ref) − P12·P21
  const [ar, ai] = multiply(p11[0] + ref, p11[1], p22[0] + ref, p22[1]);
  const [br, bi] = multiply(p12[0], p12[1], p21[0], p21[1]);
  const sign = data.parameter === 'Z' ? 2 * ref : -2 * ref;
  return divide(sign * p21[0], sign * p21[1], ar - br, ai - bi);
}

function multiply(ar: number, ai: number, br: number, bi: number): [number, number] {
  return [ar * br - ai * bi, ar * bi + ai * br];
}

function divide(ar: number, ai: number, br: number, bi: number): [number, number] {
  const d = br * br + bi * bi;
  return [(ar * br + ai * bi) / d, (ai * br - ar * bi) / d];
}

/**
 * Where each fixture measures well, as |Z| bounds (common practice): a shunt-thru up to ten times Z0/2,
 * a series-thru down to a tenth of Z0/2; beyond, S21 is so near 1 that its error swamps the part. A
 * reflection is best near Z0 and loses accuracy as Γ nears ±1: below Z0/50 or above 50·Z0.
 */
export function accurateRange(fixture: Fixture, z0: number): { lowOhm: number; highOhm: number } {
  switch (fixture) {
    case 'shunt-thru':
      return { lowOhm: 0, highOhm: 5 * z0 };
    case 'series-thru':
      return { lowOhm: z0 / 20, highOhm: Infinity };
    case 'reflection':
      return { lowOhm: z0 / 50, highOhm: 50 * z0 };
  }
}

/** How many of the points between `fromHz` and `toHz` lie outside the fixture's accurate range. */
export function pointsOutside(z: MeasuredImpedance, fromHz: number, toHz: number): { count: number; lowOhm: number; highOhm: number } {
  const range = accurateRange(z.fixture, z.referenceOhm);
  let count = 0;
  for (let k = 0; k < z.frequencies.length; k++) {
    const f = z.frequencies[k];
    if (f < fromHz || f > toHz) continue;
    const size = Math.hypot(z.re[k], z.im[k]);
    if (size < range.lowOhm || size > range.highOhm) count++;
  }
  return { count, ...range };
}

/** Γ = (Z − Z0)/(Z + Z0) of an impedance, for one-port files written from a model. */
export function reflectionOf(zr: number, zi: number, z0: number): [number, number] {
  return divide(zr - z0, zi, zr + z0, zi);
}
