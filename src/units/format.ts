// SI base units out to engineering notation, for pages, the command line and PDFs only.

import { DIMENSIONS, type Dimension } from './quantity.js';

// Exponent (multiple of 3) to prefix; µ is U+00B5 as the SI Brochure prints it.
const PREFIX_BY_EXPONENT: ReadonlyMap<number, string> = new Map([
  [-15, 'f'],
  [-12, 'p'],
  [-9, 'n'],
  [-6, 'µ'],
  [-3, 'm'],
  [0, ''],
  [3, 'k'],
  [6, 'M'],
  [9, 'G'],
  [12, 'T'],
]);

export interface FormatOptions {
  /** Significant digits (default 3). */
  digits?: number;
  /** Put a space between number and unit (default true, as the SI Brochure asks). */
  space?: boolean;
}

/**
 * Format a value in SI base units as engineering notation: 2.25e7 Hz -> "22.5 MHz".
 * Trailing zeros are dropped ("100 nF", not "100.0 nF"); values outside f..T fall back to e-notation.
 */
export function formatEng(value: number, unit: Dimension | string, options: FormatOptions = {}): string {
  const digits = options.digits ?? 3;
  const symbol = unit in DIMENSIONS ? DIMENSIONS[unit as Dimension].symbol : unit;
  const sep = options.space === false || symbol === '' ? '' : ' ';
  if (Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return `${value > 0 ? '∞' : '−∞'}${sep}${symbol}`;
  if (value === 0) return `0${sep}${symbol}`;

  const sign = value < 0 ? '−' : '';
  const magnitude = Math.abs(value);
  // Round first, then choose the prefix, so 999.96 becomes "1 k" and not "1000".
  const rounded = Number(magnitude.toPrecision(digits));
  let exponent = Math.floor(Math.log10(rounded) / 3) * 3;
  // log10 can land a hair below an exact power of ten.
  if (rounded / 10 ** exponent >= 1000) exponent += 3;
  const prefix = PREFIX_BY_EXPONENT.get(exponent);
  if (prefix === undefined) {
    const [mantissa, exp] = rounded.toExponential(digits - 1).split('e');
    return `${sign}${trimZeros(mantissa)}e${Number(exp)}${sep}${symbol}`;
  }
  const scaled = Number((rounded / 10 ** exponent).toPrecision(digits));
  return `${sign}${trimZeros(String(scaled))}${sep}${prefix}${symbol}`;
}

/**
 * Two values of one range (a band's edges) with enough significant digits to show their difference to two
 * digits, 3 at least and 9 at most: a narrow band reads "159.075 MHz to 159.235 MHz", not "159 MHz to 159 MHz".
 */
export function formatEngRange(from: number, to: number, unit: Dimension | string): [string, string] {
  const width = Math.abs(to - from);
  const size = Math.max(Math.abs(from), Math.abs(to));
  const needed = width > 0 ? 2 + Math.ceil(Math.log10(size / width)) : 3;
  const digits = Math.min(9, Math.max(3, Number.isFinite(needed) ? needed : 3));
  return [formatEng(from, unit, { digits }), formatEng(to, unit, { digits })];
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A ratio as a percentage: 0.1 -> "10%". */
export function formatPercent(ratio: number, digits = 3): string {
  if (!Number.isFinite(ratio)) return '—';
  return `${formatNumber(ratio * 100, digits)}%`;
}

/**
 * A small signed deviation in percent at a fixed resolution of 0.001 % (finer than the tightest
 * resistor tolerance sold, 0.01 %; common practice): "+0.012%", "−3.40%" … "0.000%" for what rounds to
 * nothing, so a value of 1e−13 from rounding in the sweep does not print as a number.
 */
export function formatDeviation(ratio: number): string {
  if (!Number.isFinite(ratio)) return '—';
  const percent = ratio * 100;
  if (Math.abs(percent) < 0.0005) return '0.000%';
  const text = Math.abs(percent) >= 100 ? formatNumber(Math.abs(percent)) : Math.abs(percent).toFixed(3);
  return `${percent < 0 ? '−' : '+'}${text}%`;
}

/** A phase angle in degrees with one decimal: "−89.9°". */
export function formatDegrees(degrees: number): string {
  if (!Number.isFinite(degrees)) return '—';
  const text = degrees.toFixed(1);
  return `${text.startsWith('-') ? '−' + text.slice(1) : text}°`;
}

/** A plain number with a given count of significant digits, no unit: Q = "42.1". */
export function formatNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  const rounded = Number(value.toPrecision(digits));
  const abs = Math.abs(rounded);
  if (abs !== 0 && (abs >= 1e6 || abs < 1e-3)) return rounded.toExponential(digits - 1).replace(/\.?0+e/, 'e');
  return (rounded < 0 ? '−' : '') + trimZeros(String(Math.abs(rounded)));
}

/** A ratio in decibels with its sign: "+1.25 dB", "−3.40 dB" (margins to a target). */
export function formatDecibels(db: number): string {
  if (Number.isNaN(db)) return '—';
  if (!Number.isFinite(db)) return db > 0 ? '+∞ dB' : '−∞ dB';
  return `${db >= 0 ? '+' : '−'}${Math.abs(db).toFixed(2)} dB`;
}
