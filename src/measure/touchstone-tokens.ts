// Splitting the lines of a Touchstone file: comments run from "!" to the end of the line, fields are
// separated by spaces or tabs (Touchstone File Format Specification 2.0, IBIS Open Forum, 2009, §"Rules").

/** A field of a line and its 1-based column. */
export interface Token {
  text: string;
  column: number;
}

/** The fields of `text` between `from` and `to` (a line without its comment), with columns counted from `lineStart`. */
export function tokensOf(text: string, from: number, to: number, lineStart: number): Token[] {
  const out: Token[] = [];
  let i = from;
  while (i < to) {
    while (i < to && isBlank(text.charCodeAt(i))) i++;
    if (i >= to) break;
    const start = i;
    while (i < to && !isBlank(text.charCodeAt(i))) i++;
    out.push({ text: text.slice(start, i), column: start - lineStart + 1 });
  }
  return out;
}

/** Space or tab: the field separators. */
export function isBlank(code: number): boolean {
  return code === 32 || code === 9;
}

/**
 * A number as Touchstone writes it (an optional sign, digits with an optional decimal point, an optional
 * exponent), or NaN. Only these characters are let through to Number(), which then checks the order: so
 * "0x1F", "Infinity" and "1_000" are refused rather than read as JavaScript would.
 */
export function readNumber(text: string, start: number, end: number): number {
  if (end <= start) return NaN;
  for (let i = start; i < end; i++) {
    const c = text.charCodeAt(i);
    // 0-9 . + - e E
    if (!((c >= 48 && c <= 57) || c === 46 || c === 43 || c === 45 || c === 101 || c === 69)) return NaN;
  }
  const first = text.charCodeAt(start);
  if (first === 101 || first === 69) return NaN;
  return Number(text.slice(start, end));
}
