// The part record: every column over the sweep, the resolved sweep and the decades, computed once. Checked
// against closed forms worked by hand (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9):
// a series R-L-C capacitor model has X = ωL − 1/(ωC), so C_eff = −1/(ωX) = C/(1 − ω²LC).

import { describe, expect, it } from 'vitest';
import { analysePart, decadeFrequencies } from '../../src/analysis/part-figures.js';
import { analysed, beadPart, capacitorPart, resistorPart } from '../charts/fixtures.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('the part record', () => {
  const a = analysed(capacitorPart);

  it('holds every column over the sweep, and over the resolved sweep the charts draw', () => {
    expect(a.columns.frequencyHz).toBe(a.frequencies);
    expect(a.columns.magnitudeOhm).toHaveLength(a.frequencies.length);
    expect(a.resolvedColumns.frequencyHz).toBe(a.resolved.frequencies);
    expect(a.resolvedColumns.phaseDeg).toHaveLength(a.resolved.frequencies.length);
  });

  it('tabulates each decade with C_eff = C/(1 − ω²LC) (100 nF, 0.45 nH; leakage 1 GΩ negligible)', () => {
    expect(Array.from(a.decades.frequencyHz)).toEqual(decadeFrequencies(1e3, 1e10));
    const [C, L] = [100e-9, 0.45e-9];
    [1e3, 1e5, 1e7].forEach((f) => {
      const i = Array.from(a.decades.frequencyHz).indexOf(f);
      const w = 2 * Math.PI * f;
      expect(rel(a.decadeEffective[i], C / (1 - w * w * L * C))).toBeLessThan(1e-6);
    });
    // Above the SRF (23.7 MHz) X > 0: no capacitance to state.
    expect(a.decadeEffective[Array.from(a.decades.frequencyHz).indexOf(1e8)]).toBeNaN();
  });

  it("states a resistor's deviation |Z|/R − 1 and a bead's |Z| at its rated frequency", () => {
    const r = analysed(resistorPart);
    // 1 kΩ with 0.6 nH and 0.08 pF: at 1 kHz the parasitics are far below 1e-9 of R.
    expect(Math.abs(r.decadeEffective[0])).toBeLessThan(1e-9);
    expect(r.ratedImpedanceOhm).toBeUndefined();
    const bead = analysePart({ ...beadPart, ratedAtHz: 100e6 }, { fromHz: 1e3, toHz: 1e10, perDecade: 20 }, 0.1);
    // rdc 30 mΩ + (600 Ω ‖ j·2π·100M·1µ ‖ 1/(j·2π·100M·1.5p)): computed by hand as |Z| = 1/|1/600 + 1/(jωL) + jωC| + ...
    const w = 2 * Math.PI * 100e6;
    const g = 1 / 600;
    const b = w * 1.5e-12 - 1 / (w * 1e-6);
    const zr = 0.03 + g / (g * g + b * b);
    const zi = -b / (g * g + b * b);
    expect(rel(bead.ratedImpedanceOhm!, Math.hypot(zr, zi))).toBeLessThan(1e-12);
  });
});
