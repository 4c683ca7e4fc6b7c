// Rail peaks that sit between sweep points: every anti-resonance is found and refined, checked against a
// dense sweep with golden-section refinement written in the test, on complex.js (test/reference).

import { describe, expect, it } from 'vitest';
import { capacitor, inductor, resistor, series, type Element } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { evaluateRail, marginDb, type RailBranch } from '../../src/analysis/rail.js';
import { referenceMaxima, referenceRailZ } from '../reference/impedance.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const cap = (c: number, l: number, r: number): Element => series(resistor(r), inductor(l), capacitor(c));
const branch = (element: Element, count = 1): RailBranch => ({ kind: 'capacitor', label: 'c', element, count });

/** Every interior maximum of the rail's |Z| over the band, by the test's own dense sweep. */
function referencePeaks(branches: RailBranch[], fromHz: number, toHz: number) {
  return referenceMaxima((f) => referenceRailZ(branches, f).abs(), fromHz, toHz, 200_000);
}

describe('two parallel 1 µF capacitors, ESL 1 nH and 1.06 nH (the anti-resonance inside one sweep step)', () => {
  const branches = [branch(cap(1e-6, 1e-9, 100e-6)), branch(cap(1e-6, 1.06e-9, 100e-6))];
  const band = { fromHz: 4.5709e6, toHz: 5.4954e6 };
  const sweep = logSweep({ ...band, perDecade: 100 });
  const rail = evaluateRail(branches, 3.5e-3, sweep);
  const reference = referencePeaks(branches, band.fromHz, band.toHz);

  it('the sweep alone does not show the peak (the case this guards)', () => {
    const sampled = sweep.map((f) => referenceRailZ(branches, f).abs());
    expect(Math.max(...sampled)).toBeLessThan(3.5e-3);
  });
  it('fails: 4.419 mΩ at 4.9591 MHz, −2.03 dB (reference: dense sweep on complex.js)', () => {
    expect(reference).toHaveLength(1);
    expect(rail.pass).toBe(false);
    expect(rail.peaks).toHaveLength(1);
    expect(rel(rail.peaks[0].frequencyHz, reference[0].frequencyHz)).toBeLessThan(1e-6);
    expect(rel(rail.peaks[0].impedanceOhm, reference[0].value)).toBeLessThan(1e-6);
    expect(rail.worst.marginDb).toBeCloseTo(marginDb(3.5e-3, reference[0].value), 6);
    expect(rail.worst.marginDb).toBeCloseTo(-2.03, 2);
  });
  it('the peak sits near the lossless loop resonance 1/(2π√((L1+L2)·C1C2/(C1+C2))), within the loss shift', () => {
    // Any circuit-analysis text: the loop L1–C1–C2–L2 has series L = L1 + L2 and series C = C1C2/(C1+C2).
    const lossless = 1 / (2 * Math.PI * Math.sqrt(2.06e-9 * 0.5e-6));
    // Loss moves the peak off the lossless frequency by a few (α/ω)² relative, α = ΣR/(2ΣL) (second order in
    // the damping, as for any lightly damped resonator); here (α/ω)² ≈ 2.4e-6.
    const alpha = 200e-6 / (2 * 2.06e-9);
    const shift = (alpha / (2 * Math.PI * lossless)) ** 2;
    expect(rel(rail.peaks[0].frequencyHz, lossless)).toBeLessThan(4 * shift);
    expect(rel(rail.peaks[0].frequencyHz, lossless)).toBeGreaterThan(shift / 4);
  });
});

/** A rail of capacitors in pairs whose ESLs differ slightly: one narrow anti-resonance per pair. */
function pairs(count: number, q: number): RailBranch[] {
  const out: RailBranch[] = [];
  for (let k = 0; k < count; k++) {
    const c = 1e-6 / 3 ** k;
    const l = 1e-9;
    // Q of each series branch at its resonance: (1/R)·√(L/C).
    const r = Math.sqrt(l / c) / q;
    out.push(branch(cap(c, l, r)), branch(cap(c, l * 1.05, r), 2));
  }
  return out;
}

describe.each([
  [1, 1e2],
  [2, 1e3],
  [5, 1e4],
  [5, 3e2],
])('%i lightly damped anti-resonance(s), Q %d, on a 20-point-per-decade sweep', (count, q) => {
  const branches = pairs(count, q);
  const band = { fromHz: 1e6, toHz: 1e8 };
  const sweep = logSweep({ ...band, perDecade: 20 });
  const rail = evaluateRail(branches, 1, sweep, { branchCurves: false });
  const reference = referencePeaks(branches, band.fromHz, band.toHz);

  it('finds every peak the dense reference finds, to 1e-6 in frequency and height', () => {
    expect(reference.length).toBeGreaterThanOrEqual(count);
    expect(rail.peaks).toHaveLength(reference.length);
    reference.forEach((r, i) => {
      expect(rel(rail.peaks[i].frequencyHz, r.frequencyHz)).toBeLessThan(1e-6);
      expect(rel(rail.peaks[i].impedanceOhm, r.value)).toBeLessThan(1e-6);
    });
  });
  it('the worst point is the highest reference peak (or a band end)', () => {
    const ends = [band.fromHz, band.toHz].map((f) => referenceRailZ(branches, f).abs());
    const highest = Math.max(...reference.map((r) => r.value), ...ends);
    expect(rel(rail.worst.impedanceOhm, highest)).toBeLessThan(1e-6);
  });
});
