// Numbers rounded to a few significant digits, as text, fast: a site of many parts writes millions of them
// (sweep CSVs, Touchstone files). `String(Number(x.toPrecision(d)))` parses the rounded text back into a
// double and prints that double's shortest form again; here the digits toPrecision gives (exact decimal
// rounding, ECMA-262 Number.prototype.toPrecision) are laid out as Number.prototype.toString would lay out
// the double they name (ECMA-262 Number::toString: plain from 1e-7 to below 1e21, else d.ddde±x), without
// the round trip. The output is the same text, character for character: a decimal of at most 15
// significant digits reads back to a double whose shortest form is that decimal (IEEE 754 binary64 keeps
// 15 decimal digits, DBL_DIG in C's <float.h>). Outside the normal range, where that fails (subnormals, and
// roundings that overflow), and for more than 15 digits, the round trip is taken.

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

/** Number::toString's layout of 0.DIGITS × 10^point. */
function plainLayout(d: Decimal): string {
  const { digits, point } = d;
  const k = digits.length;
  let text: string;
  if (k <= point && point <= 21) text = digits + '0'.repeat(point - k);
  else if (0 < point && point <= 21) text = digits.slice(0, point) + '.' + digits.slice(point);
  else if (-6 < point && point <= 0) text = '0.' + '0'.repeat(-point) + digits;
  else return exponentLayout(d, true);
  return d.negative ? '-' + text : text;
}

/** d.ddd e±x (the sign of a positive exponent written only when `plus`). */
function exponentLayout(d: Decimal, plus: boolean): string {
  const { digits, point } = d;
  const x = point - 1;
  const mantissa = digits.length === 1 ? digits : digits[0] + '.' + digits.slice(1);
  return (d.negative ? '-' : '') + mantissa + (x < 0 ? 'e-' + String(-x) : (plus ? 'e+' : 'e') + String(x));
}

/** Values the layout of their rounded digits is the round trip's for (see the top of this file). */
const direct = (value: number, significant: number) => significant <= 15 && Math.abs(value) >= 1e-300 && Math.abs(value) <= 1e300;

/** `String(Number(value.toPrecision(significant)))`, faster. */
export function significantText(value: number, significant: number): string {
  if (!direct(value, significant)) return String(Number(value.toPrecision(significant)));
  return plainLayout(decimal(value, significant));
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
  const d = decimal(value, significant);
  const plain = plainLayout(d);
  const exponent = exponentLayout(d, false);
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
