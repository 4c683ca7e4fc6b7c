// Numbers rounded to a few significant digits, as text, fast: a site of many parts writes millions of them
// (sweep CSVs, Touchstone files). `String(Number(x.toPrecision(d)))` parses the rounded text back into a
// double and prints that double's shortest form again; here the digits toPrecision gives (exact decimal
// rounding, ECMA-262 Number.prototype.toPrecision) are laid out as Number.prototype.toString would lay out
// the double they name (ECMA-262 Number::toString: plain from 1e-7 to below 1e21, else d.ddde±x), without
// the round trip. The output is the same text, character for character: a decimal of at most 15
// significant digits reads back to a double whose shortest form is that decimal (IEEE 754 binary64 keeps
// 15 decimal digits, DBL_DIG in C's <float.h>). Outside the normal range, where that fails (subnormals, and
// roundings that overflow), and for more than 15 digits, the round trip is taken.
//
// Faster still, where it is safe: the rounded digits as an integer, M = round(|x| × 10^n), computed in
// doubles. 10^n is exact for |n| ≤ 22 (5^22 < 2^53), so the product (or quotient) is the exact one rounded
// once, within half a unit in its last place, |x| × 10^n × 2^-53. Rounding to an integer can go wrong only
// when the exact product is that close to a half (the one place where rounding jumps); a guard of
// |x| × 10^n × 10^-15 (nine such units) sends those values, and every case outside these ranges, to
// toPrecision/toFixed. toPrecision and toFixed themselves are exact and slower (most of the time of a CSV row).

/** 10^0 … 10^22, each exact as a double. */
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/** |x| × 10^n, the exact product rounded once (|n| ≤ 22). */
const scaled = (a: number, n: number) => (n >= 0 ? a * POW10[n] : a / POW10[-n]);

/** A rounding's digits as an integer (no trailing zeros) and its point: value = 0.DIGITS × 10^point. */
let roundedDigits = 0;
let roundedPoint = 0;

/**
 * Round a > 0 to `significant` digits in doubles (see the top of this file) into roundedDigits and
 * roundedPoint; false where that is not safe (the caller takes toPrecision).
 */
function roundSignificant(a: number, significant: number): boolean {
  if (significant > 12) return false;
  const low = POW10[significant - 1];
  const high = POW10[significant];
  let e = Math.floor(Math.log10(a));
  let n = significant - 1 - e;
  if (n > 22 || n < -22) return false;
  let m = scaled(a, n);
  // log10 may be one off next to a power of ten.
  if (m < low || m >= high) {
    e += m < low ? -1 : 1;
    n = significant - 1 - e;
    if (n > 22 || n < -22) return false;
    m = scaled(a, n);
    if (m < low || m >= high) return false;
  }
  let whole = Math.floor(m);
  const fraction = m - whole;
  if (Math.abs(fraction - 0.5) <= m * 1e-15) return false;
  if (fraction > 0.5) whole++;
  if (whole === high) {
    whole = low;
    e++;
  }
  let point = e + 1;
  while (whole % 10 === 0) whole /= 10;
  roundedDigits = whole;
  roundedPoint = point;
  return true;
}

/**
 * Round |value| to `decimals` decimals in doubles (see the top of this file) into roundedDigits (0 for a
 * rounded zero) and roundedPoint, when the result has at most 15 significant digits; false otherwise.
 */
function roundFixed(a: number, decimals: number): boolean {
  if (decimals > 22) return false;
  const m = a * POW10[decimals];
  if (!(m < 1e15)) return false;
  let whole = Math.floor(m);
  const fraction = m - whole;
  if (Math.abs(fraction - 0.5) <= m * 1e-15) return false;
  if (fraction > 0.5) whole++;
  if (whole === 0) {
    roundedDigits = 0;
    return true;
  }
  let point = -decimals;
  while (whole % 10 === 0) {
    whole /= 10;
    point++;
  }
  roundedDigits = whole;
  roundedPoint = point + digitCount(whole);
  return true;
}

/** Decimal digits of a positive whole number below 10^22. */
function digitCount(whole: number): number {
  let k = 1;
  while (k < 22 && whole >= POW10[k]) k++;
  return k;
}

/** Number::toString's layout of ±0.DIGITS × 10^point (the exponent form, with "+", beyond its plain range). */
function plainText(negative: boolean, digits: string, point: number): string {
  const k = digits.length;
  let text: string;
  if (k <= point && point <= 21) text = point === k ? digits : digits + '0'.repeat(point - k);
  else if (0 < point && point <= 21) text = digits.slice(0, point) + '.' + digits.slice(point);
  else if (-6 < point && point <= 0) text = (point === 0 ? '0.' : '0.' + '0'.repeat(-point)) + digits;
  else return exponentText(negative, digits, point, true);
  return negative ? '-' + text : text;
}

/** d.ddd e±x (the sign of a positive exponent written only when `plus`). */
function exponentText(negative: boolean, digits: string, point: number, plus: boolean): string {
  const x = point - 1;
  const mantissa = digits.length === 1 ? digits : digits[0] + '.' + digits.slice(1);
  return (negative ? '-' : '') + mantissa + (x < 0 ? 'e-' + String(-x) : (plus ? 'e+' : 'e') + String(x));
}

/** The length of exponentText without "+" (the sign left out: both forms have it). */
function exponentLength(k: number, point: number): number {
  const x = point - 1;
  return k + (k > 1 ? 1 : 0) + 1 + (x < 0 ? 1 + digitCount(-x) : x === 0 ? 1 : digitCount(x));
}

/** The length of plainText's plain forms (the sign left out), or Infinity where it writes an exponent. */
function plainLength(k: number, point: number): number {
  if (k <= point && point <= 21) return point;
  if (0 < point && point <= 21) return k + 1;
  if (-6 < point && point <= 0) return 2 - point + k;
  return Infinity;
}

/** The decimal digits of a rounded value (no trailing zeros) and its decimal point position: value = 0.DIGITS × 10^point. */
interface Decimal {
  negative: boolean;
  digits: string;
  point: number;
}

function decimal(value: number, significant: number): Decimal {
  const text = value.toPrecision(significant);
  const negative = text.charCodeAt(0) === 45; // '-'
  const body = negative ? text.slice(1) : text;
  const e = body.indexOf('e');
  const mantissa = e < 0 ? body : body.slice(0, e);
  const exponent = e < 0 ? 0 : Number(body.slice(e + 1));
  const dot = mantissa.indexOf('.');
  const whole = dot < 0 ? mantissa : mantissa.slice(0, dot) + mantissa.slice(dot + 1);
  let point = (dot < 0 ? mantissa.length : dot) + exponent;
  // Leading zeros ("0.000123" gives "0000123") move the point left.
  let first = 0;
  while (first < whole.length - 1 && whole.charCodeAt(first) === 48) first++;
  point -= first;
  let last = whole.length;
  while (last > first + 1 && whole.charCodeAt(last - 1) === 48) last--;
  return { negative, digits: whole.slice(first, last), point };
}

/** Values the layout of their rounded digits is the round trip's for (see the top of this file). */
const direct = (value: number, significant: number) => significant <= 15 && Math.abs(value) >= 1e-300 && Math.abs(value) <= 1e300;

/** `String(Number(value.toPrecision(significant)))`, faster. */
export function significantText(value: number, significant: number): string {
  if (!direct(value, significant)) return String(Number(value.toPrecision(significant)));
  if (value !== 0 && roundSignificant(Math.abs(value), significant)) return plainText(value < 0, String(roundedDigits), roundedPoint);
  const d = decimal(value, significant);
  return plainText(d.negative, d.digits, d.point);
}

/**
 * The value to `significant` digits in the shorter of the plain form and the exponent form without "+"
 * ("15915.5", "6.28319e-5", "4.8e10"); the plain form when both are as long.
 */
export function shortSignificantText(value: number, significant: number): string {
  if (!direct(value, significant)) {
    const rounded = Number(value.toPrecision(significant));
    const plain = String(rounded);
    const exponent = rounded.toExponential().replace('e+', 'e');
    return exponent.length < plain.length ? exponent : plain;
  }
  if (value !== 0 && roundSignificant(Math.abs(value), significant)) {
    const digits = String(roundedDigits);
    const point = roundedPoint;
    return exponentLength(digits.length, point) < plainLength(digits.length, point) ? exponentText(value < 0, digits, point, false) : plainText(value < 0, digits, point);
  }
  const d = decimal(value, significant);
  const plain = plainText(d.negative, d.digits, d.point);
  const exponent = exponentText(d.negative, d.digits, d.point, false);
  return exponent.length < plain.length ? exponent : plain;
}

/**
 * `String(Number(value.toFixed(decimals)))`, faster: toFixed's digits (exact decimal rounding, ECMA-262
 * Number.prototype.toFixed) without the trailing zeros, which is Number::toString's text of the double they
 * name when they are at most 15 significant digits (see the top of this file) and the value is at least
 * 1e-6 (below that toString writes an exponent). Otherwise, and beyond toFixed's plain range, the round trip.
 */
export function fixedText(value: number, decimals: number): string {
  if (!(Math.abs(value) < 1e21)) return String(Number(value.toFixed(decimals)));
  if (roundFixed(Math.abs(value), decimals)) return roundedDigits === 0 ? '0' : plainText(value < 0, String(roundedDigits), roundedPoint);
  const text = value.toFixed(decimals);
  const dot = text.indexOf('.');
  let end = text.length;
  if (dot >= 0) {
    while (text.charCodeAt(end - 1) === 48) end--; // '0'
    if (end - 1 === dot) end--;
  }
  let first = text.charCodeAt(0) === 45 ? 1 : 0; // '-'
  while (first < end && (text.charCodeAt(first) === 48 || first === dot)) first++;
  if (first === end) return '0'; // a zero, -0 included, which toString writes "0"
  const significant = end - first - (dot > first && dot < end ? 1 : 0);
  if (significant > 15 || (dot >= 0 && first - dot > 6)) return String(Number(text));
  return end === text.length ? text : text.slice(0, end);
}
