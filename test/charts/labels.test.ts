import { describe, expect, it } from 'vitest';
import { labelBox, placeLabels, segmentHitsBox, type LabelRequest } from '../../src/charts/labels.js';

const box = { x0: 10, y0: 10, x1: 20, y1: 20 };

describe('segment against box (Liang–Barsky)', () => {
  it('finds crossings, touches and misses', () => {
    expect(segmentHitsBox(0, 15, 30, 15, box)).toBe(true); // straight through
    expect(segmentHitsBox(12, 12, 14, 14, box)).toBe(true); // inside
    expect(segmentHitsBox(0, 0, 9, 30, box)).toBe(false); // passes left of it
    expect(segmentHitsBox(0, 25, 30, 25, box)).toBe(false); // below
    expect(segmentHitsBox(0, 0, 30, 30, box)).toBe(true); // diagonal through a corner region
    expect(segmentHitsBox(0, 21, 21, 0, box)).toBe(true); // clips the corner
    expect(segmentHitsBox(0, 19, 19, 0, box)).toBe(false); // misses the corner
  });
});

const overlap = (a: ReturnType<typeof labelBox>, b: ReturnType<typeof labelBox>) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

describe('label placement', () => {
  const plot = { width: 300, height: 200 };

  it('keeps labels inside the plot: a point at the right edge gets its label on the left', () => {
    const r: LabelRequest = { x: 298, y: 100, text: 'SRF 23.7 MHz', fontSize: 10 };
    const [p] = placeLabels([r], plot);
    const b = labelBox(r, p!);
    expect(b.x0).toBeGreaterThanOrEqual(2);
    expect(b.x1).toBeLessThanOrEqual(298);
  });

  it('places crowded labels without overlaps, or drops those not required', () => {
    const requests: LabelRequest[] = Array.from({ length: 12 }, (_, k) => ({ x: 150, y: 100 + k * 3, text: `${k} MHz`, fontSize: 10, required: k === 0 }));
    const placed = placeLabels(requests, plot);
    expect(placed[0]).not.toBeNull();
    const boxes = placed.flatMap((p, k) => (p ? [labelBox(requests[k], p)] : []));
    for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) expect(overlap(boxes[i], boxes[j])).toBe(false);
    expect(placed.some((p) => p === null)).toBe(true);
  });

  it('moves a label off a curve running through its first choice', () => {
    const r: LabelRequest = { x: 100, y: 100, text: 'decade', fontSize: 10 };
    const curve = { xs: [0, 300], ys: [100, 100] }; // horizontal through the anchor: right/left-middle both cross it
    const [p] = placeLabels([r], plot, [curve]);
    const b = labelBox(r, p!);
    expect(segmentHitsBox(0, 100, 300, 100, b)).toBe(false);
  });
});
