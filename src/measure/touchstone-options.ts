// The option line of a Touchstone file: "# <frequency unit> <parameter> <format> R <n>", fields in any
// order and letter case, each optional, with defaults GHz, S, MA and R 50 (Touchstone File Format
// Specification 2.0, IBIS Open Forum, 2009, "Option Line").

import { quote } from '../units/quote.js';
import type { DataFormat, FrequencyUnit, NetworkParameter } from './network-data.js';
import { readNumber, type Token } from './touchstone-tokens.js';

export interface OptionLine {
  unit: FrequencyUnit;
  parameter: NetworkParameter;
  format: DataFormat;
  /** R n: the reference impedance, Ω. */
  reference: number;
  /** Column of the R field, when the line has one. */
  referenceColumn?: number;
}

export const DEFAULT_OPTIONS: Readonly<OptionLine> = { unit: 'GHz', parameter: 'S', format: 'MA', reference: 50 };

const UNITS: Readonly<Record<string, FrequencyUnit>> = { hz: 'Hz', khz: 'kHz', mhz: 'MHz', ghz: 'GHz' };
const PARAMETERS: Readonly<Record<string, NetworkParameter>> = { s: 'S', y: 'Y', z: 'Z' };
const FORMATS: Readonly<Record<string, DataFormat>> = { ma: 'MA', db: 'DB', ri: 'RI' };
// Parameters the specification allows that zfolio does not convert to an impedance.
const REFUSED: Readonly<Record<string, string>> = {
  h: 'hybrid (H) parameters',
  g: 'inverse hybrid (G) parameters',
};

const EXPECTED = 'Hz, kHz, MHz or GHz; S, Y or Z; MA, DB or RI; R and a resistance';

/** Read the fields after "#"; each problem goes to `report` with its column. */
export function readOptionLine(fields: readonly Token[], report: (column: number, message: string) => void): OptionLine {
  const options: OptionLine = { ...DEFAULT_OPTIONS };
  const seen = new Map<string, string>();
  const once = (what: string, field: Token): boolean => {
    const before = seen.get(what);
    if (before !== undefined) {
      report(field.column, `the option line gives a second ${what}, ${quote(field.text)}, after ${quote(before)}; give each option once`);
      return false;
    }
    seen.set(what, field.text);
    return true;
  };
  for (let i = 0; i < fields.length; i++) {
    const field = fields[i];
    const key = field.text.toLowerCase();
    if (Object.hasOwn(UNITS, key)) {
      if (once('frequency unit', field)) options.unit = UNITS[key];
    } else if (Object.hasOwn(PARAMETERS, key)) {
      if (once('parameter type', field)) options.parameter = PARAMETERS[key];
    } else if (Object.hasOwn(REFUSED, key)) {
      report(field.column, `${REFUSED[key]} are not read: zfolio takes S, Y or Z parameters, found ${quote(field.text)}`);
    } else if (Object.hasOwn(FORMATS, key)) {
      if (once('data format', field)) options.format = FORMATS[key];
    } else if (key === 'r') {
      const value = fields[i + 1];
      const ohms = value ? readNumber(value.text, 0, value.text.length) : NaN;
      if (!value) report(field.column, 'expected the reference resistance after R (e.g. R 50), found the end of the line');
      else if (!(ohms > 0) || !Number.isFinite(ohms)) report(value.column, `expected the reference resistance after R, a number above zero in Ω, found ${quote(value.text)}`);
      else if (once('reference resistance', field)) {
        options.reference = ohms;
        options.referenceColumn = field.column;
      }
      if (value) i++;
    } else {
      report(field.column, `unknown option ${quote(field.text)}; the option line takes ${EXPECTED}`);
      // "X 50": the number belongs to the unknown option, not a second problem.
      const next = fields[i + 1];
      if (next && Number.isFinite(readNumber(next.text, 0, next.text.length))) i++;
    }
  }
  return options;
}
