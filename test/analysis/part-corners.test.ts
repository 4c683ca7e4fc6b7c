// A part at the corners of its spread, against closed forms: the series RLC capacitor's SRF
// 1/(2π√(L·C)) (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §14.5) at C·(1 ± t), and
// the band edge of the plain capacitor model SRF·√(1 − 1/(1 + within)) (README, from C_eff = C/(1 − (f/SRF)²)).

import { describe, expect, it } from 'vitest';
import { logSweep } from '../../src/circuit/sweep.js';
import { partCorners } from '../../src/analysis/part-corners.js';
import { bandRuleOf } from '../../src/analysis/part-figures.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';

function part(yaml: string): Part {
  const diagnostics = new DiagnosticList();
  const p = readPart({ source: parseYamlSource('parts/p.yaml', yaml, diagnostics)!, diagnostics });
  expect(diagnostics.sorted()).toEqual([]);
  return p!;
}

const sweep = logSweep({ fromHz: 1e3, toHz: 1e10, perDecade: 50 });
const SRF = (l: number, c: number) => 1 / (2 * Math.PI * Math.sqrt(l * c));

describe('a series RLC capacitor at ±tolerance', () => {
  const C = 100e-9;
  const L = 0.45e-9;
  const t = 0.1;
  const p = part(`id: C\nkind: capacitor\nnominal: 100n\ntolerance: 10%\nparasitics: {esr: 18m, esl: 0.45n}\n`);
  const corners = partCorners(p, { fromC: 0, toC: 70 }, sweep, bandRuleOf(p, 0.1), 'series')!;

  it('has two corners, and its value at them is C·(1 ± t)', () => {
    expect(corners.corners).toBe(2);
    expect(corners.nominalValue!.min).toBeCloseTo(C * (1 - t), 20);
    expect(corners.nominalValue!.max).toBeCloseTo(C * (1 + t), 20);
  });

  it('SRF extremes equal 1/(2π√(L·C·(1 ± t))) to the root finder\'s 1e-9', () => {
    expect(Math.abs(corners.srfHz!.min / SRF(L, C * (1 + t)) - 1)).toBeLessThan(1e-8);
    expect(Math.abs(corners.srfHz!.max / SRF(L, C * (1 - t)) - 1)).toBeLessThan(1e-8);
  });

  it('the band\'s top edge is SRF·√(1 − 1/1.1) at each corner (ESR moves it by far less than 1e-6 here)', () => {
    const k = Math.sqrt(1 - 1 / 1.1);
    expect(Math.abs(corners.usableBand!.toHz.min / (k * SRF(L, C * (1 + t))) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(corners.usableBand!.toHz.max / (k * SRF(L, C * (1 - t))) - 1)).toBeLessThan(1e-6);
  });

  it('the envelope holds the curves of both corners: |Z| ≈ 1/(ωC·(1 ∓ t)) far below the SRF', () => {
    const i = 0; // 1 kHz
    const w = 2 * Math.PI * sweep[i];
    expect(corners.envelope.max[i] * w * C * (1 - t)).toBeCloseTo(1, 6);
    expect(corners.envelope.min[i] * w * C * (1 + t)).toBeCloseTo(1, 6);
  });

  it('the envelope at every sweep point is |Z| over C anywhere in C·(1 ± t): down to the ESR between the ends\' SRFs', () => {
    // |R + j(ωL − 1/(ωC'))| for C' in [C(1 − t), C(1 + t)]: greatest at an end; least at an end, or R where
    // ωL = 1/(ωC') has a root in the range (series R-L-C closed form, as above). A dense sweep over C' in
    // the test (2,001 points) stands for "anywhere".
    const R = 0.018;
    const z = (f: number, c: number) => Math.hypot(R, 2 * Math.PI * f * L - 1 / (2 * Math.PI * f * c));
    let inside = 0;
    sweep.forEach((f, i) => {
      const values = Array.from({ length: 2001 }, (_, k) => z(f, C * (1 - t) * ((1 + t) / (1 - t)) ** (k / 2000)));
      const least = f >= SRF(L, C * (1 + t)) && f <= SRF(L, C * (1 - t)) ? R : Math.min(...values);
      if (least === R) inside++;
      expect(Math.abs(corners.envelope.max[i] / Math.max(...values) - 1)).toBeLessThan(1e-9);
      // Geometric steps of 0.83% in C: within 0.5% of the least |Z| near resonance, exact elsewhere.
      expect(corners.envelope.min[i] / least - 1).toBeLessThan(5e-3);
      expect(corners.envelope.min[i] / Math.min(...values)).toBeGreaterThan(1 - 1e-9);
    });
    // The sweep has points between the two SRFs (22.6 MHz and 25 MHz, at 50 per decade): two.
    expect(inside).toBe(2);
  });
});

describe('temperature with tolerance, and parasitic spreads', () => {
  it('X7R at ±10%: C from 0.9·0.85 to 1.1·1.15 of nominal, SRF from the closed form at each end', () => {
    const p = part(`id: C\nkind: capacitor\nnominal: 1u\ntolerance: 10%\ndielectric: X7R\nparasitics: {esr: 10m, esl: 0.5n}\n`);
    const c = partCorners(p, { fromC: -10, toC: 55 }, sweep, bandRuleOf(p, 0.1), 'series')!;
    expect(c.nominalValue!.min).toBeCloseTo(1e-6 * 0.9 * 0.85, 18);
    expect(Math.abs(c.srfHz!.min / SRF(0.5e-9, 1e-6 * 1.1 * 1.15) - 1)).toBeLessThan(1e-8);
    expect(Math.abs(c.srfHz!.max / SRF(0.5e-9, 1e-6 * 0.9 * 0.85) - 1)).toBeLessThan(1e-8);
  });

  it('an ESL spread is its own factor: four corners, SRF extremes at low L·C and high L·C', () => {
    const p = part(`id: C\nkind: capacitor\nnominal: 1u\ntolerance: 20%\nparasitics: {esr: 10m, esl: 0.5n ±10%}\n`);
    const c = partCorners(p, { fromC: 0, toC: 70 }, sweep, bandRuleOf(p, 0.1), 'series')!;
    expect(c.corners).toBe(4);
    expect(Math.abs(c.srfHz!.min / SRF(0.55e-9, 1.2e-6) - 1)).toBeLessThan(1e-8);
    expect(Math.abs(c.srfHz!.max / SRF(0.45e-9, 0.8e-6) - 1)).toBeLessThan(1e-8);
  });

  it('nothing moves: no corners', () => {
    const p = part(`id: C\nkind: capacitor\nnominal: 1u\nparasitics: {esr: 10m, esl: 0.5n}\n`);
    expect(partCorners(p, { fromC: 0, toC: 70 }, sweep, bandRuleOf(p, 0.1), 'series')).toBeNull();
  });
});
