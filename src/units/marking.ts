// Numeric marking codes printed on parts (IEC 60062:2016, clause 4, "numeric code"):
// significant digits followed by one multiplier digit (the power of ten), in pF for capacitors and Ω for
// resistors; "R" in place of the decimal point for small values ("4R7"). Inductors use the same scheme in µH
// by common practice (no IEC clause; stated from memory of general trade use).

import { quote } from './quote.js';
import type { Parsed } from './parse.js';

export type MarkedKind = 'capacitor' | 'resistor' | 'inductor';

/** The unit a code counts in, as a power of ten of the SI base unit. */
const UNIT_OF_CODE: Readonly<Record<MarkedKind, { exponent: number; text: string }>> = {
  capacitor: { exponent: -12, text: 'pF' },
  resistor: { exponent: 0, text: 'Ω' },
  inductor: { exponent: -6, text: 'µH' },
};

/**
 * The value a marking code stands for, in SI base units.
 * "104" on a capacitor = 10·10⁴ pF = 100 nF; "4702" on a resistor = 470·10² Ω = 47 kΩ; "4R7" = 4.7 (unit of code).
 * A multiplier digit of 9 means 10⁻¹ ("109" = 1.0 pF), as the EIA convention has it (from memory).
 */
export function parseMarking(code: string, kind: MarkedKind): Parsed {
  const { exponent, text } = UNIT_OF_CODE[kind];
  const trimmed = code.trim();
  const withPoint = /^(\d*)R(\d*)$/.exec(trimmed);
  if (withPoint && (withPoint[1] !== '' || withPoint[2] !== '')) {
    return { ok: true, value: Number(`${withPoint[1] || '0'}.${withPoint[2] || '0'}e${exponent}`) };
  }
  if (/^\d{3,4}$/.test(trimmed)) {
    const significant = Number(trimmed.slice(0, -1));
    const multiplierDigit = Number(trimmed.slice(-1));
    const power = multiplierDigit === 9 ? -1 : multiplierDigit;
    if (multiplierDigit === 8) {
      return { ok: false, message: `marking ${quote(code)}: multiplier digit 8 is not used; expected 0–7 or 9` };
    }
    return { ok: true, value: Number(`${significant}e${power + exponent}`) };
  }
  return {
    ok: false,
    message: `expected a marking code of 3 or 4 digits (last digit = power of ten, in ${text}) or with R as the decimal point, found ${quote(code)}`,
  };
}
