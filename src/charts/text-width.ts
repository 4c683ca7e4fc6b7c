// Text widths for layout without a canvas. vega's own fallback guesses 0.8 em for every character, which
// spreads legends and drops tick labels that would fit. Here each character gets the advance width it has in
// DejaVu Sans (Book), the widest common member of our font stack, read from the font's hmtx table and rounded
// up to 0.01 em; a character outside the table counts a full em. So the estimate errs towards more room,
// never towards overlap (test/charts/text-width.test.ts reads the font file to hold it to that). Plain
// numbers: pages lay out text with it too, without loading vega (text-metrics.ts hands it to vega).

/** Characters by their advance width in em. */
const GROUPS: readonly (readonly [number, string])[] = [
  [0.28, "'ijl"],
  [0.3, 'IJ'],
  [0.32, ' ,.·'],
  [0.34, '/:;\\|'],
  [0.36, 'f'],
  [0.37, '-'],
  [0.4, '()[]t'],
  [0.41, '!²³'],
  [0.42, 'r'],
  [0.46, '"'],
  [0.5, '*_`°–'],
  [0.53, 'sz'],
  [0.54, '?'],
  [0.55, 'c'],
  [0.56, 'L'],
  [0.58, 'Fk'],
  [0.6, 'vxyγλ'],
  [0.61, 'Pπτ'],
  [0.62, 'TYaeo'],
  [0.64, '$0123456789ESbdghnpqu{}µμ√β€'],
  [0.66, 'Kφα'],
  [0.69, 'ABVXZΔ'],
  [0.7, 'CR'],
  [0.74, 'U'],
  [0.75, 'N'],
  [0.76, 'H'],
  [0.77, 'Ω'],
  [0.78, '&DG'],
  [0.79, 'OQ'],
  [0.82, 'w'],
  [0.84, '#+<=>^~−×±≤≥≈ω'],
  [0.87, 'M'],
  [0.9, '∠'],
  [0.96, '%'],
  [0.97, '½'],
  [0.98, 'm'],
  [0.99, 'W'],
  [1, '@…—'],
  [1.02, '℀℁℅℠'],
  [1.03, 'œ'],
  [1.05, '№≪≫'],
  [1.06, '∭∰'],
  [1.07, 'Œ℆ℳ'],
  [1.08, '₨℡'],
  [1.13, '℃'],
  [1.16, '⌤⌥⌧⎇'],
  [1.2, '℻'],
  [1.28, '₧₯'],
  [1.35, '‰'],
  [1.42, '⌦⌫'],
  [1.43, '⋘⋙'],
  [1.45, '⌨'],
  [1.74, '‱'],
];
/** A character the table does not hold: 1 em, as wide as the widest letters and dashes. */
const UNKNOWN = 1;

const WIDTHS: ReadonlyMap<string, number> = new Map(GROUPS.flatMap(([w, chars]) => [...chars].map((c) => [c, w] as const)));

/** Width in em of one character. */
export function charWidthEm(c: string): number {
  return WIDTHS.get(c) ?? UNKNOWN;
}

/** Estimated width in px of `text` set at `fontSize` px. */
export function textWidth(text: string, fontSize: number): number {
  let em = 0;
  for (const c of text) em += charWidthEm(c);
  return em * fontSize;
}
