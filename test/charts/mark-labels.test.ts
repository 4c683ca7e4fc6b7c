// Labels beside marked points and notes in the plot: each takes the first free position of its candidates,
// a required one is shown even when every position collides, and the rows carry the point's data position.

import { describe, expect, it } from 'vitest';
import { ABOVE_FIRST } from '../../src/charts/labels.js';
import { placeMarkLabels, shown } from '../../src/charts/mark-labels.js';

const plot = { width: 400, height: 200 };

describe('placeMarkLabels', () => {
  it('places a label above a peak when nothing is there, with its data position in the row', () => {
    const { labels } = placeMarkLabels([{ at: { f: 1e6, v: 2 }, x: 200, y: 100, text: 'peak', candidates: ABOVE_FIRST }], plot, []);
    expect(labels).toEqual([{ f: 1e6, v: 2, t: 'peak', dx: ABOVE_FIRST[0].dx, dy: ABOVE_FIRST[0].dy, al: ABOVE_FIRST[0].align, bl: ABOVE_FIRST[0].baseline }]);
  });

  it('drops a label that collides everywhere unless it is required, and keeps the order given', () => {
    // A horizontal curve through every candidate position of a point at the plot's middle, several px thick.
    const walls = [-20, -16, -12, -8, -4, 0, 4, 8, 12, 16, 20].map((d) => ({ xs: [0, 400], ys: [100 + d, 100 + d] }));
    const request = (required: boolean) => ({ at: { f: 1 }, x: 200, y: 100, text: 'a long label text', required, candidates: ABOVE_FIRST });
    const placed = placeMarkLabels([request(false), request(true)], plot, walls);
    expect(placed.labels[0]).toBeNull();
    expect(placed.labels[1]).not.toBeNull();
    expect(shown(placed.labels)).toHaveLength(1);
  });

  it('places notes after the labels, clear of them, as pixel rows', () => {
    const below = [{ dx: 0, dy: 4, align: 'center' as const, baseline: 'top' as const }];
    const { notes } = placeMarkLabels([], plot, [], [{ x: 100, y: 50, text: 'note', candidates: below }]);
    expect(notes).toEqual([{ x: 100, y: 54, t: 'note', al: 'center', bl: 'top' }]);
  });
});
