import { describe, expect, it } from 'vitest';
import { vega } from '../../src/charts/vega-runtime.js';
import { OVERLAY_COLORS, OVERLAY_DASHES, PART_SERIES, RAIL_TOTAL, RESONANCE_MARK, TARGET_LINE, INK, BAND_EDGE } from '../../src/charts/palette.js';
import { overlayColor, overlayStyle } from '../../src/charts/overlay.js';
import { textWidth } from '../../src/charts/text-width.js';
import { installTextMetrics } from '../../src/charts/text-metrics.js';

// Relative luminance and contrast ratio as defined in WCAG 2.1 (§ "relative luminance", "contrast ratio"),
// with the sRGB transfer function of IEC 61966-2-1.
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const contrastOnWhite = (hex: string) => 1.05 / (luminance(hex) + 0.05);

describe('palette', () => {
  it('checks the contrast formula against its fixed points: black on white is 21:1, white on white 1:1', () => {
    expect(contrastOnWhite('#000000')).toBeCloseTo(21, 9);
    expect(contrastOnWhite('#ffffff')).toBeCloseTo(1, 9);
  });

  it('gives every line and mark colour at least 3:1 against white paper (WCAG 2.1 SC 1.4.11)', () => {
    const colours = [...OVERLAY_COLORS, ...Object.values(PART_SERIES).map((s) => s.color), RAIL_TOTAL.color, TARGET_LINE.color, RESONANCE_MARK, INK, BAND_EDGE];
    for (const c of colours) expect(contrastOnWhite(c), c).toBeGreaterThanOrEqual(3);
  });

  it('tells overlaid curves apart by dash alone for up to nine, by colour or dash for up to 72', () => {
    const dashes = new Set(OVERLAY_DASHES.map((d) => d.join(',')));
    expect(dashes.size).toBe(OVERLAY_DASHES.length);
    expect(OVERLAY_DASHES.length).toBeGreaterThanOrEqual(9);
    expect(new Set(OVERLAY_COLORS).size).toBe(OVERLAY_COLORS.length);
    const styles = new Set(Array.from({ length: 72 }, (_, k) => JSON.stringify(overlayStyle(k))));
    expect(styles.size).toBe(72);
    expect(overlayColor(8)).toBe(OVERLAY_COLORS[0]);
  });

  it('draws the series of one part chart in distinct dash patterns where they share a colour', () => {
    const { susceptanceCapacitive: bc, susceptanceInductive: bl, conductance: g } = PART_SERIES;
    expect(bc.color).toBe(bl.color);
    expect(bc.dash.join(',')).not.toBe(bl.dash.join(','));
    expect(g.dash.join(',')).not.toBe(bc.dash.join(','));
  });
});

describe('text widths', () => {
  it('grows with the text and the font size, and counts wide letters wider', () => {
    expect(textWidth('10 kHz', 10)).toBeGreaterThan(textWidth('1 kHz', 10));
    expect(textWidth('1 kHz', 20)).toBeCloseTo(2 * textWidth('1 kHz', 10), 9);
    expect(textWidth('mmm', 10)).toBeGreaterThan(textWidth('iii', 10) * 2);
  });

  it('replaces vega’s flat 0.8 em per character once installed', () => {
    installTextMetrics();
    const metrics = (vega as unknown as { textMetrics: { width: (item: object, text: string) => number } }).textMetrics;
    expect(metrics.width({ fontSize: 10 }, '1 kHz')).toBeCloseTo(textWidth('1 kHz', 10), 9);
    expect(metrics.width({ fontSize: 10 }, '1 kHz')).toBeLessThan(0.8 * 5 * 10);
  });
});
