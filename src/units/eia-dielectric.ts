// EIA dielectric codes of ceramic capacitors (EIA-198-1, "Ceramic Dielectric Capacitors Classes I, II,
// III and IV"; the tables below are from memory of that standard as the trade reproduces it).
//
// Class 2 and 3, e.g. X7R: a letter for the lowest temperature, a digit for the highest, a letter for the
// largest change of capacitance over that range (relative to 25 °C, without DC bias).
// Class 1, e.g. C0G: a letter for the significant figure of the temperature coefficient in ppm/K, a digit
// for its multiplier (and sign), a letter for its tolerance. NP0 is the older name of C0G.

import { quote } from './quote.js';

/** Lowest temperature of the range, °C, by first letter. */
export const CLASS_2_LOW_C: Readonly<Record<string, number>> = { X: -55, Y: -30, Z: 10 };
/** Highest temperature of the range, °C, by digit. */
export const CLASS_2_HIGH_C: Readonly<Record<string, number>> = { '2': 45, '4': 65, '5': 85, '6': 105, '7': 125, '8': 150, '9': 200 };
/** Largest change of capacitance over the range, as fractions below and above the value at 25 °C. */
export const CLASS_2_CHANGE: Readonly<Record<string, { minus: number; plus: number }>> = {
  A: { minus: 0.01, plus: 0.01 },
  B: { minus: 0.015, plus: 0.015 },
  C: { minus: 0.022, plus: 0.022 },
  D: { minus: 0.033, plus: 0.033 },
  E: { minus: 0.047, plus: 0.047 },
  F: { minus: 0.075, plus: 0.075 },
  P: { minus: 0.1, plus: 0.1 },
  R: { minus: 0.15, plus: 0.15 },
  S: { minus: 0.22, plus: 0.22 },
  T: { minus: 0.33, plus: 0.22 },
  U: { minus: 0.56, plus: 0.22 },
  V: { minus: 0.82, plus: 0.22 },
};

/** Significant figure of a class 1 temperature coefficient, ppm/K, by first letter. */
export const CLASS_1_FIGURE: Readonly<Record<string, number>> = { C: 0, B: 0.3, L: 0.8, A: 0.9, M: 1, P: 1.5, R: 2.2, S: 3.3, T: 4.7, V: 5.6, U: 7.5 };
/** Multiplier of the significant figure, by digit: 0–4 negative coefficients, 5–9 positive. */
export const CLASS_1_MULTIPLIER: Readonly<Record<string, number>> = { '0': -1, '1': -10, '2': -100, '3': -1000, '4': -10000, '5': 1, '6': 10, '7': 100, '8': 1000, '9': 10000 };
/** Tolerance of the coefficient, ppm/K, by last letter. */
export const CLASS_1_TOLERANCE: Readonly<Record<string, number>> = { G: 30, H: 60, J: 120, K: 250, L: 500, M: 1000, N: 2500 };
/** Class 1 coefficients are specified from −55 °C to +125 °C (common practice). */
export const CLASS_1_RANGE_C = { fromC: -55, toC: 125 } as const;

export type EiaDielectric =
  | { class: 2; code: string; fromC: number; toC: number; minus: number; plus: number }
  | { class: 1; code: string; fromC: number; toC: number; coefficientPerK: number; tolerancePerK: number };

export type DecodedDielectric = { ok: true; dielectric: EiaDielectric } | { ok: false; message: string };

const EXPECTED = 'expected an EIA dielectric code such as C0G, X7R or X5R';

const own = <T>(table: Readonly<Record<string, T>>, key: string): T | undefined => (Object.hasOwn(table, key) ? table[key] : undefined);

/**
 * Decode a three-character EIA code. NP0 reads as C0G. A code that has the shape of neither class, or a
 * character outside its table, is refused with what each position may hold.
 */
export function decodeEiaDielectric(text: string): DecodedDielectric {
  const code = text === 'NP0' ? 'C0G' : text;
  const [a, b, c] = [...code];
  if ([...code].length === 3 && Object.hasOwn(CLASS_2_LOW_C, a)) {
    const high = own(CLASS_2_HIGH_C, b);
    const change = own(CLASS_2_CHANGE, c);
    if (high !== undefined && change !== undefined) return { ok: true, dielectric: { class: 2, code: text, fromC: CLASS_2_LOW_C[a], toC: high, ...change } };
    const wrong = high === undefined ? `its digit ${quote(b)} is none of ${Object.keys(CLASS_2_HIGH_C).join(', ')} (the highest temperature of a class 2 code)` : `its last letter ${quote(c)} is none of ${Object.keys(CLASS_2_CHANGE).join(', ')} (the largest change of a class 2 code)`;
    return { ok: false, message: `${EXPECTED}, found ${quote(text)}: ${wrong}` };
  }
  if ([...code].length === 3 && Object.hasOwn(CLASS_1_FIGURE, a) && /^[0-9]$/.test(b)) {
    const tolerance = own(CLASS_1_TOLERANCE, c);
    if (tolerance !== undefined) {
      // Built as one decimal literal, so 7.5 × −100 is exactly −750.
      const multiplier = CLASS_1_MULTIPLIER[b];
      const coefficient = Number(`${multiplier < 0 ? '-' : ''}${CLASS_1_FIGURE[a]}e${Math.log10(Math.abs(multiplier)) - 6}`);
      return { ok: true, dielectric: { class: 1, code: text, ...CLASS_1_RANGE_C, coefficientPerK: coefficient === 0 ? 0 : coefficient, tolerancePerK: Number(`${tolerance}e-6`) } };
    }
    return { ok: false, message: `${EXPECTED}, found ${quote(text)}: its last letter ${quote(c)} is none of ${Object.keys(CLASS_1_TOLERANCE).join(', ')} (the tolerance of a class 1 coefficient)` };
  }
  return {
    ok: false,
    message: `${EXPECTED}, found ${quote(text)}: class 2 codes are ${Object.keys(CLASS_2_LOW_C).join('/')} + a digit + a letter, class 1 codes a letter of ${Object.keys(CLASS_1_FIGURE).join('')} + a digit + a letter`,
  };
}

/** Whether a dielectric text is meant as an EIA code (three characters) rather than a word such as "polymer". */
export function looksLikeEiaCode(text: string): boolean {
  return [...text].length === 3;
}
