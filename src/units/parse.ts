// Engineering notation in, SI base units out.
// Accepted: a bare number (SI base units), a number with an SI prefix and/or unit symbol ("100n", "100 nF",
// "0.1u", "2.2 kΩ"), an RKM code where the letter stands for the decimal point (IEC 60062: "4R7", "4K7",
// "2M2", "4n7", "R47"), and for ratios a percentage ("10%").
// Values are built as one decimal literal ("100e-9"), so "100n" is exactly the double nearest 1e-7.

import { quote } from './quote.js';
import { DIMENSIONS, SI_PREFIX_EXPONENTS, dimensionOfUnit, type Dimension } from './quantity.js';

export type Parsed = { ok: true; value: number } | { ok: false; message: string };

const DECIMAL = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))(?:[eE]([+-]?\d+))?\s*(.*)$/;
// Letter between two digit groups, or R/F at either end, optionally followed by a unit symbol.
const RKM = /^(\d*)([RKkMGTpnuµμmF])(\d*)\s*(\S*)$/;

// "K" is not an SI prefix, but upper-case K for kilo is universal on resistor labels (IEC 60062 RKM).
const EXPONENTS: Readonly<Record<string, number>> = { ...SI_PREFIX_EXPONENTS, K: 3 };

const ok = (value: number): Parsed => ({ ok: true, value });
const fail = (message: string): Parsed => ({ ok: false, message });

const EXAMPLES: Readonly<Record<Dimension, string>> = {
  capacitance: '100n or 100 nF',
  inductance: '0.45n or 0.45 nH',
  resistance: '18m, 4R7 or 2.2 kΩ',
  frequency: '10M or 10 MHz',
  voltage: '16V',
  current: '2A or 500 mA',
  power: '0.25W or 250 mW',
  time: '10n or 10 ns',
  ratio: '10% or 0.1',
};

/** What a user should write, for messages: "a capacitance in F (e.g. 100n or 100 nF)". */
export function expectation(dim: Dimension): string {
  if (dim === 'ratio') return `a ratio (e.g. ${EXAMPLES.ratio})`;
  const { noun, symbol } = DIMENSIONS[dim];
  return `${noun} in ${symbol} (e.g. ${EXAMPLES[dim]})`;
}

function describe(input: unknown): string {
  return typeof input === 'string' ? quote(input) : String(input);
}

/** Parse a value of the given dimension. Sign is kept; callers decide whether negatives are allowed. */
export function parseQuantity(input: unknown, dim: Dimension): Parsed {
  if (typeof input === 'number') {
    return Number.isFinite(input) ? ok(input) : fail(`expected ${expectation(dim)}, found ${describe(input)}`);
  }
  if (typeof input !== 'string') {
    return fail(`expected ${expectation(dim)}, found ${input === null || input === undefined ? 'nothing' : typeof input}`);
  }
  const text = input.trim();
  if (text === '') return fail(`expected ${expectation(dim)}, found an empty value`);

  const decimal = DECIMAL.exec(text);
  if (decimal) {
    const [, mantissa, exponent, suffix] = decimal;
    const ambiguous = ambiguity(`${mantissa}${exponent !== undefined ? `e${exponent}` : ''}`, suffix, dim);
    if (ambiguous) return fail(`expected ${expectation(dim)}, found ${describe(input)}: ${ambiguous}`);
    const scale = suffixScale(suffix, dim);
    if (typeof scale === 'number') return finite(Number(`${mantissa}e${Number(exponent ?? 0) + scale}`), input, dim);
    // "4R7", "2M2": the leading digits matched DECIMAL but the rest is an RKM tail.
    const rkm = parseRkm(text, dim);
    if (rkm) return rkm;
    return fail(`expected ${expectation(dim)}, found ${describe(input)}${scale.hint}`);
  }
  return parseRkm(text, dim) ?? fail(`expected ${expectation(dim)}, found ${describe(input)}`);
}

/**
 * Units that read as one thing and are often meant as another: "100mhz" is 100 millihertz by the SI prefix
 * but almost always meant as megahertz; "1MF" is a megafarad by the prefix, but older drawings wrote MF and
 * MFD for microfarads. Refused with both readings rather than guessed.
 */
function ambiguity(number: string, suffix: string, dim: Dimension): string | undefined {
  if (dim === 'frequency') {
    if (suffix === 'mhz' || suffix === 'm') {
      return `MHz or mHz? write ${number}M or ${number} MHz for megahertz, or ${number} mHz if millihertz is meant`;
    }
    if (suffix === 'khz') return `write ${number}k or ${number} kHz for kilohertz (the unit is Hz)`;
    if (suffix === 'ghz') return `write ${number}G or ${number} GHz for gigahertz (the unit is Hz)`;
  }
  if (dim === 'capacitance' && /^(M|MF|MFD|MFd|Mfd|mfd)$/.test(suffix.trim())) {
    return `µF or MF? older drawings wrote MF and MFD for microfarads; write ${number}u or ${number} µF (a megafarad is no component value)`;
  }
  return undefined;
}

function finite(value: number, input: unknown, dim: Dimension): Parsed {
  return Number.isFinite(value) ? ok(value) : fail(`expected ${expectation(dim)}, found ${describe(input)} (out of range)`);
}

/** The power of ten a suffix like "nF", "k", "Ω", "%" stands for, or a hint why it is not acceptable. */
function suffixScale(suffix: string, dim: Dimension): number | { hint: string } {
  if (suffix === '') return 0;
  if (dim === 'ratio') return suffix === '%' ? -2 : { hint: '' };
  const own = DIMENSIONS[dim];
  const isOwnUnit = (u: string) => u === own.symbol || own.aliases.includes(u);
  if (isOwnUnit(suffix)) return 0;
  const first = [...suffix][0];
  const rest = suffix.slice(first.length).trim();
  const exponent = Object.hasOwn(EXPONENTS, first) ? EXPONENTS[first] : undefined;
  if (exponent !== undefined && (rest === '' || isOwnUnit(rest))) return exponent;

  // Name the dimension that was written, so the message says "found an inductance".
  const foreign = dimensionOfUnit(suffix) ?? (exponent !== undefined ? dimensionOfUnit(rest) : undefined);
  if (foreign) return { hint: ` (${DIMENSIONS[foreign].noun}, in ${DIMENSIONS[foreign].symbol})` };
  return { hint: '' };
}

function parseRkm(text: string, dim: Dimension): Parsed | undefined {
  const m = RKM.exec(text);
  if (!m) return undefined;
  const [, whole, letter, fraction, unit] = m;
  if (whole === '' && fraction === '') return undefined;
  if (dim === 'capacitance' && letter === 'M' && fraction !== '') {
    return fail(`expected ${expectation(dim)}, found ${describe(text)}: ${ambiguity(`${whole || '0'}.${fraction}`, 'M', dim)}`);
  }
  if (unit !== '' && suffixScale(unit, dim) !== 0) return undefined;
  let exponent: number;
  if (letter === 'R') {
    // IEC 60062: R marks the decimal point of a value in ohms only.
    if (dim !== 'resistance') return undefined;
    exponent = 0;
  } else if (letter === 'F') {
    if (dim !== 'capacitance' || fraction === '') return undefined;
    exponent = 0;
  } else {
    // A trailing prefix letter ("47n") is ordinary SI notation, handled by the decimal rule.
    if (fraction === '') return undefined;
    exponent = EXPONENTS[letter] ?? 0;
  }
  const value = Number(`${whole || '0'}.${fraction || '0'}e${exponent}`);
  return Number.isFinite(value) ? ok(value) : undefined;
}

/** Parse a ratio: "10%" = 0.1; a bare number is the ratio itself. */
export function parseRatio(input: unknown): Parsed {
  return parseQuantity(input, 'ratio');
}
