// Chart frames as they print: one px of the viewBox is one CSS px, 1/96 in (CSS Values and Units Level 3,
// §5.2), so 25.4/96 mm. A4 is 210 mm wide (ISO 216); with 15 mm margins the text column is 180 mm.

import { describe, expect, it } from 'vitest';
import { frame, halfFrame, HALF_CHART_WIDTH, HALF_PLOT_WIDTH, outerSize, PLOT_WIDTH } from '../../src/charts/frame.js';

const MM_PER_PX = 25.4 / 96;
const COLUMN_MM = 210 - 2 * 15;

describe('chart frames', () => {
  it('a wide chart is 640 px, about 169 mm: inside the 180 mm text column', () => {
    const size = outerSize(frame(PLOT_WIDTH, 300));
    expect(size.width).toBe(640);
    expect(size.width * MM_PER_PX).toBeCloseTo(169.3, 1);
    expect(size.width * MM_PER_PX).toBeLessThanOrEqual(COLUMN_MM);
    expect(size.height).toBe(300 + 34 + 42);
  });

  it('a part chart is 332 px, about 88 mm: two to a row with a gap in the same column', () => {
    const size = outerSize(halfFrame(200));
    expect(size.width).toBe(HALF_CHART_WIDTH);
    expect(HALF_CHART_WIDTH).toBe(332);
    expect(size.width * MM_PER_PX).toBeCloseTo(87.8, 1);
    expect(2 * size.width * MM_PER_PX).toBeLessThan(COLUMN_MM);
    expect(size.height).toBe(200 + 28 + 40);
    expect(halfFrame(200).width).toBe(HALF_PLOT_WIDTH);
  });

  it('keeps the same plot rectangle for every chart of a kind, whatever the paddings asked for', () => {
    const a = frame(PLOT_WIDTH, 250, 10, 60);
    expect(a.width).toBe(PLOT_WIDTH);
    expect(a.padding).toEqual({ left: 82, right: 24, top: 10, bottom: 60 });
    expect(outerSize(a)).toEqual({ width: 640, height: 320 });
  });
});
