// A spread written beside a value: how far it may lie below and above it, as fractions.
// "10%" and "±10%" are symmetric; "+80%/-20%" (either order) is asymmetric, as class 2 and 3 ceramics and
// electrolytics are sold (common practice). A bare number is the fraction itself (0.1 = 10%), and one
// above 1 is refused: it is almost always a percentage without its sign.

import { parseRatio } from './parse.js';
import { quote } from './quote.js';

/** A value ranges from nominal·(1 − minus) to nominal·(1 + plus). */
export interface Bounds {
  minus: number;
  plus: number;
}

export type ParsedBounds = { ok: true; bounds: Bounds; symmetric: boolean } | { ok: false; message: string };

const EXAMPLE = 'a spread such as 10%, ±10% or +80%/-20%';

/** One side: "80%", "0.2"; never negative, a bare number at most 1. */
function side(text: string, whole: string): { ok: true; value: number } | { ok: false; message: string } {
  const parsed = parseRatio(text);
  if (!parsed.ok || parsed.value < 0) return { ok: false, message: `expected ${EXAMPLE}, found ${quote(whole)}` };
  if (parsed.value > 1 && !text.trim().endsWith('%')) {
    return { ok: false, message: `expected ${EXAMPLE}, found ${quote(whole)}: a bare number is the fraction itself, so ${quote(text.trim(), 20)} would mean ${Number((parsed.value * 100).toPrecision(6))}%; write ${text.trim()}% if ${text.trim()} percent is meant` };
  }
  return { ok: true, value: parsed.value };
}

/** Whether text is written as a signed spread ("±10%", "+80%/-20%") rather than a plain ratio. */
export function isSignedSpread(text: string): boolean {
  return /^\s*(±|\+\/?-|[+\-−])/.test(text) || text.includes('/');
}

/**
 * Parse "±10%", "+80%/-20%", "-20%/+80%", "+5%" (above only) or "-10%" (below only); a plain "10%" is
 * symmetric. A value cannot lose all of itself: a side below of 100% or more is refused.
 */
export function parseBounds(input: string): ParsedBounds {
  const text = input.trim().replace(/−/g, '-');
  let minus: number;
  let plus: number;
  let symmetric = false;
  const pm = /^(?:±|\+\/?-)\s*(.+)$/.exec(text);
  if (pm || !/^[+-]/.test(text)) {
    if (text.includes('/')) return { ok: false, message: `expected ${EXAMPLE}, found ${quote(input)}` };
    const s = side(pm ? pm[1] : text, input);
    if (!s.ok) return s;
    minus = plus = s.value;
    symmetric = true;
  } else {
    const halves = text.split('/').map((h) => h.trim());
    if (halves.length > 2 || halves.some((h) => !/^[+-]/.test(h))) return { ok: false, message: `expected ${EXAMPLE}, found ${quote(input)}` };
    const signs = halves.map((h) => h[0]);
    if (halves.length === 2 && signs[0] === signs[1]) return { ok: false, message: `expected one side above (+) and one below (-), e.g. +80%/-20%, found ${quote(input)}` };
    minus = 0;
    plus = 0;
    for (const h of halves) {
      const s = side(h.slice(1), input);
      if (!s.ok) return s;
      if (h[0] === '+') plus = s.value;
      else minus = s.value;
    }
  }
  if (minus >= 1) return { ok: false, message: `expected less than 100% below the value (a part cannot lose all of it), found ${quote(input)}` };
  return { ok: true, bounds: { minus, plus }, symmetric };
}

/** Split "18m +50%/-30%" into the value and its spread; the spread starts at the last space before ±, + or -. */
export function splitValueAndSpread(text: string): { value: string; spread?: string } {
  const m = /^(.*\S)\s+((?:±|[+\-−])[^\s]*(?:\s*\/\s*[+\-−]\S*)?)$/.exec(text.trim());
  return m ? { value: m[1], spread: m[2] } : { value: text };
}
