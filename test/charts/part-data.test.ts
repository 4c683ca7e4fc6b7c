import { describe, expect, it } from 'vitest';
import { bandData, curveRows, mergeCurve, resonancesByImportance, sweepAxis } from '../../src/charts/part-data.js';
import { resonanceLabel } from '../../src/present/resonance-words.js';
import { logAxis } from '../../src/charts/scales.js';
import { analysed, beadPart, capacitorPart, networkPart, resistorPart } from './fixtures.js';

describe('what the part charts share', () => {
  it('spans the sweep exactly on the frequency axis', () => {
    const a = analysed(capacitorPart);
    const fa = sweepAxis(a.frequencies, 540);
    expect(fa.params.fDomain).toEqual([1e3, 1e10]);
    expect(fa.params.fLabels).toEqual(['1 kHz', '10 kHz', '100 kHz', '1 MHz', '10 MHz', '100 MHz', '1 GHz', '10 GHz']);
    expect(fa.datasets.fMajor).toHaveLength(8);
  });

  it('names the self-resonance SRF and the others by type, self-resonance first', () => {
    // The first series resonance is the 10 µF branch's own, 1/(2π√(1.1 nH · 10 µF)) = 1.517 MHz; the others
    // come from the analysis (tested in test/analysis) and only their naming is checked here.
    const a = analysed(networkPart);
    expect(a.resonances.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    const ordered = resonancesByImportance(a);
    expect(ordered[0]).toBe(a.selfResonance);
    expect(ordered.map((r) => resonanceLabel(r, a.selfResonance))).toEqual(['SRF 1.52 MHz', 'parallel 13.6 MHz', 'series 24.1 MHz']);
  });

  it('recognises the self-resonance in a copied input (another thread, JSON), by value', () => {
    const a = analysed(networkPart);
    const copy = { ...a, resonances: a.resonances.map((r) => ({ ...r })), selfResonance: JSON.parse(JSON.stringify(a.selfResonance)) };
    expect(copy.selfResonance).not.toBe(copy.resonances[0]);
    expect(resonancesByImportance(copy).map((r) => resonanceLabel(r, copy.selfResonance))[0]).toBe('SRF 1.52 MHz');
  });

  it('shades the band with its caption and range in the key, and an edge line only where the band ends inside the sweep', () => {
    const c = analysed(capacitorPart);
    // Capacitor band edge SRF·√(1 − 1/1.1) (see src/analysis/band.ts); SRF = 1/(2π√(LC)) = 23.72 MHz.
    expect(bandData(c).key).toEqual({ kind: 'band', text: 'usable band (±10%): up to 7.15 MHz' });
    expect(bandData(c).bandEdges).toHaveLength(1);
  });

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
});
