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

describe('a shorter wording, and a label nudged back inside the plot', () => {
  const plot = { width: 234, height: 160 };
  // Every check below is plain geometry on the returned box: inside the plot's 2 px margin, clear of the
  // curve given (Liang–Barsky, segmentHitsBox above), not over the point.
  const inside = (b: ReturnType<typeof labelBox>) => b.x0 >= 2 && b.x1 <= plot.width - 2 && b.y0 >= 2 && b.y1 <= plot.height - 2;

  it('a label whose full text fits nowhere is shown in its short wording where that fits', () => {
    // Right of the point runs out of the plot; below it, a vertical curve 25 px to the left crosses the
    // full text centred under the point (over 50 px wide) but not the short one (under 45 px).
    const candidates = [
      { dx: 7, dy: 0, align: 'left' as const, baseline: 'middle' as const },
      { dx: 0, dy: 8, align: 'center' as const, baseline: 'top' as const },
    ];
    const r: LabelRequest = { x: 200, y: 80, text: 'series 190 MHz', shortText: '190 MHz', fontSize: 10, candidates };
    const curves = [{ xs: [175, 175], ys: [0, 160] }];
    expect(placeLabels([{ ...r, shortText: undefined }], plot, curves)).toEqual([null]);
    const [p] = placeLabels([r], plot, curves);
    expect(p).not.toBeNull();
    expect(p!.text).toBe('190 MHz');
    const b = labelBox(r, p!);
    expect(inside(b)).toBe(true);
    expect(b.x0).toBeGreaterThan(175);
    expect(b.y0).toBe(88);
  });

  it('the full wording is kept wherever it fits', () => {
    const r: LabelRequest = { x: 100, y: 80, text: 'series 190 MHz', shortText: '190 MHz', fontSize: 10 };
    const [p] = placeLabels([r], plot);
    expect(p!.text).toBe('series 190 MHz');
  });

  it('a label that must be shown and fits nowhere keeps its full wording where it covers least', () => {
    const r: LabelRequest = { x: 117, y: 80, text: 'SRF 1.07 MHz', shortText: '1.07 MHz', fontSize: 10, required: true };
    // A dense fan of lines through the point leaves no free place for either wording.
    const fan = Array.from({ length: 36 }, (_, k) => ({ xs: [117 - 200 * Math.cos((k * Math.PI) / 36), 117 + 200 * Math.cos((k * Math.PI) / 36)], ys: [80 - 200 * Math.sin((k * Math.PI) / 36), 80 + 200 * Math.sin((k * Math.PI) / 36)] }));
    const [p] = placeLabels([r], plot, fan);
    expect(p!.text).toBe('SRF 1.07 MHz');
  });

  it('a label below its point that sticks out of the side by a few px is moved in, still below its point', () => {
    // Below-right of a point placed so that "190 MHz" would end 3 px past the right margin.
    const w = labelBox({ x: 0, y: 0, text: '190 MHz', fontSize: 10 }, { dx: 0, dy: 0, align: 'left', baseline: 'top' }).x1;
    const x = plot.width - 2 - 7 - w + 3;
    const r: LabelRequest = { x, y: 80, text: '190 MHz', fontSize: 10, candidates: [{ dx: 7, dy: 16, align: 'left', baseline: 'top' }] };
    const [p] = placeLabels([r], plot);
    expect(p).not.toBeNull();
    const b = labelBox(r, p!);
    expect(inside(b)).toBe(true);
    expect(b.x1).toBeCloseTo(plot.width - 2, 9);
    expect(b.x0).toBeCloseTo(x + 7 - 3, 9);
    expect(b.y0).toBe(96);
  });

  it('a label beside its point (middle baseline) is never moved over the point', () => {
    const r: LabelRequest = { x: 200, y: 80, text: '190 MHz', fontSize: 10, candidates: [{ dx: 7, dy: 0, align: 'left', baseline: 'middle' }] };
    expect(placeLabels([r], plot)).toEqual([null]);
  });

  it('a label sticking out by more than the nudge is not moved', () => {
    const r: LabelRequest = { x: 215, y: 80, text: '190 MHz', fontSize: 10, candidates: [{ dx: 7, dy: 16, align: 'left', baseline: 'top' }] };
    expect(placeLabels([r], plot)).toEqual([null]);
  });

  it('keeps a label clear of its own lines by the clearance, and with clearance 0 lets it come up to them, not across', () => {
    // A vertical rule 3 px right of where "190 MHz" would end, placed right of its point.
    const w = labelBox({ x: 0, y: 0, text: '190 MHz', fontSize: 10 }, { dx: 0, dy: 0, align: 'left', baseline: 'top' }).x1;
    const right = { dx: 7, dy: 0, align: 'left', baseline: 'middle' } as const;
    const rule = (x: number) => ({ xs: [x, x], ys: [0, plot.height] });
    const at = (ruleX: number, clearance?: number): LabelRequest => ({ x: 100, y: 80, text: '190 MHz', fontSize: 10, candidates: [right], lines: { obstacles: [rule(ruleX)], ...(clearance === undefined ? {} : { clearance }) } });
    const end = 100 + 7 + w;
    expect(placeLabels([at(end + 3)], plot)).toMatchObject([right]);
    expect(placeLabels([at(end + 2)], plot)).toEqual([null]); // within the default 2.5 px
    expect(placeLabels([at(end + 0.5, 0)], plot)).toMatchObject([right]);
    expect(placeLabels([at(end - 0.5, 0)], plot)).toEqual([null]); // across the text's end
    // The lines are the label's own: another label, 10 px further right and higher up, sits across the rule.
    const other: LabelRequest = { x: 110, y: 40, text: '190 MHz', fontSize: 10, candidates: [right] };
    const box = labelBox(other, right);
    expect(box.x0 < end + 3 && end + 3 < box.x1).toBe(true);
    expect(placeLabels([at(end + 3), other], plot)).toMatchObject([right, right]);
  });

  it('slides a label centred under its point sideways where a line crosses it there, keeping the point over its words', () => {
    // A rule 10 px left of the point: "SRF 919 MHz" centred below crosses it; slid right it does not.
    const below = { dx: 0, dy: 8, align: 'center', baseline: 'top' } as const;
    const r: LabelRequest = { x: 150, y: 60, text: 'SRF 919 MHz', fontSize: 10, candidates: [below], required: true };
    const rule = { xs: [140, 140], ys: [0, plot.height] };
    const [p] = placeLabels([r], plot, [rule]);
    expect(p).not.toBeNull();
    const b = labelBox(r, p!);
    expect(b.x0).toBeGreaterThan(140 + 2.5); // clear of the rule by the clearance
    expect(b.x0).toBeLessThanOrEqual(150 - 4); // the point over the words, 4 px inside their left end
    expect(b.y0).toBe(68); // still below, as the candidate says
    expect(p!.dx).toBeGreaterThan(0);
    // A label placed beside its point (no centred candidate) is not slid: it fits nowhere and is dropped.
    const beside: LabelRequest = { x: 150, y: 60, text: 'SRF 919 MHz', fontSize: 10, candidates: [{ dx: -7, dy: 0, align: 'right', baseline: 'middle' }] };
    expect(placeLabels([beside], plot, [{ xs: [120, 120], ys: [0, plot.height] }])).toEqual([null]);
  });
});
