import { describe, expect, it } from 'vitest';
import { curveObstacle, curveRows, levelObstacle, mergeCurve, plainCurve } from '../../src/charts/curves.js';
import { linearAxis, logAxis } from '../../src/charts/scales.js';
import { analysed, capacitorPart } from './fixtures.js';

describe('curves', () => {
  it('merges exact points into a sweep in frequency order and marks them kept', () => {
    const f = Float64Array.from([1, 10, 100, 1000]);
    const c = mergeCurve(f, (i) => [5, -1, 3, 0][i], [{ f: 50, v: 7 }, { f: 1e6, v: 1 }], true);
    expect(c.f).toEqual([1, 10, 50, 100, 1000]); // 1e6 is outside the sweep
    expect(c.v).toEqual([5, NaN, 7, 3, NaN]); // ≤ 0 is a gap on a log axis
    expect(c.keep).toEqual([true, false, true, false, true]);
  });

  it('down-samples a curve to within 0.15 px of the full sweep, breaking it at gaps', () => {
    const a = analysed(capacitorPart);
    const x = logAxis([1e3, 1e10], 540);
    const y = logAxis([1e-3, 1e4], 250);
    const m = (i: number) => Math.hypot(a.z.re[i], a.z.im[i]);
    const curve = mergeCurve(a.frequencies, m, [], true);
    const rows = curveRows(curve, x, y, 'mag');
    expect(rows.length).toBeLessThan(a.frequencies.length / 3);
    // Every sweep point lies within 0.15 px of the line through the kept rows (straight in px between them).
    let k = 0;
    for (let i = 0; i < a.frequencies.length; i++) {
      const f = a.frequencies[i];
      while (k < rows.length - 2 && (rows[k + 1].f as number) < f) k++;
      const [f0, f1] = [rows[k].f as number, rows[k + 1].f as number];
      const [y0, y1] = [y.toPx(rows[k].v as number), y.toPx(rows[k + 1].v as number)];
      const t = (x.toPx(f) - x.toPx(f0)) / (x.toPx(f1) - x.toPx(f0));
      // Vertical distance bounds the perpendicular one from above.
      const dy = Math.abs(y.toPx(m(i)) - (y0 + t * (y1 - y0)));
      const slope = Math.abs((y1 - y0) / (x.toPx(f1) - x.toPx(f0)));
      expect(dy / Math.sqrt(1 + slope * slope)).toBeLessThanOrEqual(0.15 + 1e-9);
    }
    const gapped = curveRows({ f: [1, 2, 3, 4, 5], v: [1, 1, NaN, 1, 1], keep: [false, false, false, false, false] }, logAxis([1, 5], 100), y, 's');
    expect(gapped.map((r) => r.v)).toEqual([1, 1, null, 1, 1]);
  });

  it('keeps the ends of a plain curve and the points asked for', () => {
    expect(plainCurve([1, 2, 3, 4], [5, 6, 7, 8], (i) => i === 2).keep).toEqual([true, false, true, true]);
  });

  it('turns a curve into an obstacle in px from the top-left corner, gaps as NaN', () => {
    const x = linearAxis([0, 10], 100);
    const y = linearAxis([0, 1], 50);
    const o = curveObstacle({ f: [0, 5, 10], v: [0, NaN, 1], keep: [true, false, true] }, x, y);
    expect(Array.from(o.xs)).toEqual([0, 50, 100]);
    expect(Array.from(o.ys)).toEqual([50, NaN, 0]);
    expect(levelObstacle(0.5, x, y)).toEqual({ xs: [0, 100], ys: [25, 25] });
  });
});
