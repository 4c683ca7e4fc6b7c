// Text widths for layout without a canvas. vega's own fallback guesses 0.8 em for every character, which
// spreads legends and drops tick labels that would fit. Here each character gets an advance width close to
// the widest common member of our font stack (DejaVu Sans; advance widths in em from memory, rounded up),
// so the estimate errs towards more room, never towards overlap.

import * as vega from 'vega';

const NARROW = 0.32; // i j l . , : ; ' | ! space
const DIGIT = 0.64;
const LOWER = 0.62;
const UPPER = 0.74;
const WIDE = 0.98; // m w M W Ω

const SPECIAL: ReadonlyMap<string, number> = new Map([
  ...[...'ijl.,:;\'|! '].map((c) => [c, NARROW] as const),
  ...[...'ftrI()[]{}/\\-'].map((c) => [c, 0.42] as const),
  ...[...'mwMW'].map((c) => [c, WIDE] as const),
  ['Ω', 0.8],
  ['µ', 0.64],
  ['°', 0.5],
  ['−', 0.84],
  ['+', 0.84],
  ['=', 0.84],
  ['<', 0.84],
  ['>', 0.84],
  ['×', 0.84],
  ['±', 0.84],
  ['…', 1.0],
  ['–', 0.5],
  ['"', 0.46],
  ['&', 0.78],
]);

/** Width in em of one character. */
export function charWidthEm(c: string): number {
  const special = SPECIAL.get(c);
  if (special !== undefined) return special;
  if (c >= '0' && c <= '9') return DIGIT;
  if (c >= 'a' && c <= 'z') return LOWER;
  if (c >= 'A' && c <= 'Z') return UPPER;
  return UPPER;
}

/** Estimated width in px of `text` set at `fontSize` px. */
export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const c of text) em += charWidthEm(c);
  return em * fontSize;
}

let installed = false;

/** Make vega measure text with this estimate (process-wide; idempotent). */
export function installTextMetrics(): void {
  if (installed) return;
  installed = true;
  // Exported by vega (from vega-scenegraph) but missing from its type declarations.
  const metrics = (vega as unknown as { textMetrics: { width: (item: { fontSize?: number }, text: unknown) => number } }).textMetrics;
  metrics.width = (item, text) => {
    const size = item.fontSize != null ? Number(item.fontSize) || 0 : 11;
    return textWidth(text == null ? '' : String(text).trim(), size);
  };
}
