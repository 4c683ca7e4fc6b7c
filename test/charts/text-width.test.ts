import { describe, expect, it } from 'vitest';
import { charWidthEm, textWidth } from '../../src/charts/text-width.js';
import { readFontAdvances } from './font-advances.js';

// The estimate is held to a real font: DejaVu Sans Book, the widest common member of the charts' font stack
// (Debian's fonts-dejavu-core, which .ci/run installs with Chromium), its advance widths read from the font
// file's hmtx table (test/charts/font-advances.ts, after the OpenType specification). The word-level check
// in Chromium itself is test/print/chart-geometry.test.ts.
const font = readFontAdvances('/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf');

/** Every character the font has in the given code point ranges. */
function charactersIn(ranges: [number, number][]): string[] {
  const out: string[] = [];
  for (const [from, to] of ranges) for (let c = from; c <= to; c++) if (font.advanceEm(String.fromCodePoint(c)) !== undefined) out.push(String.fromCodePoint(c));
  return out;
}

// Basic Latin and Latin-1, Latin Extended-A, Greek, general punctuation, currency and letterlike symbols,
// arrows, mathematical operators and the miscellaneous technical block: what labels, titles and notes hold.
const RANGES: [number, number][] = [
  [0x20, 0x7e],
  [0xa0, 0x17f],
  [0x370, 0x3ff],
  [0x2000, 0x206f],
  [0x20a0, 0x20cf],
  [0x2100, 0x214f],
  [0x2190, 0x23ff],
];

describe('charWidthEm against DejaVu Sans', () => {
  const chars = charactersIn(RANGES);
  it('is never narrower than the font’s advance, for every character the font has in those blocks', () => {
    expect(chars.length).toBeGreaterThan(900);
    const narrower = chars.filter((c) => charWidthEm(c) < font.advanceEm(c)!);
    expect(narrower.map((c) => `${c} U+${c.codePointAt(0)!.toString(16)} ${charWidthEm(c)} < ${font.advanceEm(c)!.toFixed(3)}`)).toEqual([]);
  });
  it('is the advance rounded up to 0.01 em for ASCII, so the estimate is also close', () => {
    const ascii = charactersIn([[0x20, 0x7e]]);
    expect(ascii).toHaveLength(95);
    const loose = ascii.filter((c) => charWidthEm(c) - font.advanceEm(c)! >= 0.01);
    expect(loose).toEqual([]);
  });
});

describe('textWidth', () => {
  it('adds the characters’ widths at the font size', () => {
    // "SRF 7.12 MHz" at 11 px: S .64, R .70, F .58, space .32, 7 .64, . .32, 1 .64, 2 .64, space .32, M .87, H .76, z .53.
    expect(textWidth('SRF 7.12 MHz', 11)).toBeCloseTo(11 * (0.64 + 0.7 + 0.58 + 0.32 + 0.64 + 0.32 + 0.64 + 0.64 + 0.32 + 0.87 + 0.76 + 0.53), 10);
  });
  it('a whole label is at least as wide as the font sets it', () => {
    for (const label of ['|Z| 12.4 mΩ at 48.2 MHz', 'ESR 8 mΩ', 'Phase −89.7°', 'C_eff 0.91 µF', 'Q 54 at 2.1 MHz', '±20 % · X7R']) {
      const real = [...label].reduce((sum, c) => sum + font.advanceEm(c)!, 0) * 10.5;
      expect(textWidth(label, 10.5)).toBeGreaterThanOrEqual(real);
    }
  });
});
