// A part's spread as factors, and its model at a combination of extremes. The multipliers are checked
// against the products written out here; the models by their element values and against complex.js.

import { describe, expect, it } from 'vitest';
import type { Element } from '../../src/circuit/element.js';
import { spreadFactors, spreadModel, temperatureChange, valueSpread } from '../../src/analysis/part-spread.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { referenceZAt } from '../reference/impedance.js';

function part(yaml: string): Part {
  const diagnostics = new DiagnosticList();
  const p = readPart({ source: parseYamlSource('parts/p.yaml', yaml, diagnostics)!, diagnostics });
  expect(diagnostics.sorted()).toEqual([]);
  return p!;
}

const leaves = (e: Element): Record<string, number> => {
  if (e.type === 'series' || e.type === 'parallel') return Object.assign({}, ...e.parts.map(leaves));
  return { [e.name ?? e.type]: e.type === 'R' ? e.ohms : e.type === 'L' ? e.henries : e.farads };
};

const WIDE = { fromC: -55, toC: 125 };

describe('the value\'s extremes', () => {
  it('tolerance and an EIA class 2 change multiply, each at its own extreme (X7R: ±15%, EIA-198-1)', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 10u\ntolerance: 10%\ndielectric: X7R\n');
    const v = valueSpread(p, { fromC: -10, toC: 55 })!;
    // The code states its change over its own range; the narrower operating range cannot tighten it.
    expect(v.temperature).toEqual({ low: -0.15, high: 0.15 });
    expect(v.low).toBeCloseTo(0.9 * 0.85, 15);
    expect(v.high).toBeCloseTo(1.1 * 1.15, 15);
  });

  it('an asymmetric tolerance and a Y5V change (+22%/−82%)', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 10u\ntolerance: +80%/-20%\ndielectric: Y5V\n');
    const v = valueSpread(p, { fromC: -30, toC: 85 })!;
    expect(v.low).toBeCloseTo(0.8 * 0.18, 15);
    expect(v.high).toBeCloseTo(1.8 * 1.22, 15);
  });

  it('a coefficient changes the value by α·(T − 25 °C): bilinear, extremes at the ends of both ranges', () => {
    const p = part('id: L\nkind: inductor\nnominal: 10u\ntc: 200ppm/K\n');
    // −40 °C is 65 K below 25 °C, 85 °C is 60 K above: ±200 ppm/K gives ±1.3% at −40 °C, ±1.2% at 85 °C.
    expect(temperatureChange(p.spread.temperature!, { fromC: -40, toC: 85 })).toEqual({ low: expect.closeTo(-0.013, 15), high: expect.closeTo(0.013, 15) });
    const signed = part('id: L\nkind: inductor\nnominal: 10u\ntc: -150ppm/K\n');
    expect(temperatureChange(signed.spread.temperature!, { fromC: -40, toC: 85 })).toEqual({ low: expect.closeTo(-150e-6 * 60, 15), high: expect.closeTo(150e-6 * 65, 15) });
    // A range wholly above 25 °C: the change never crosses zero.
    expect(temperatureChange(signed.spread.temperature!, { fromC: 40, toC: 85 })).toEqual({ low: expect.closeTo(-150e-6 * 60, 15), high: expect.closeTo(-150e-6 * 15, 15) });
  });

  it('C0G: 0 ± 30 ppm/K over −55 °C to 125 °C is ±0.3% at most (EIA-198-1)', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 1n\ndielectric: C0G\n');
    expect(temperatureChange(p.spread.temperature!, WIDE)).toEqual({ low: expect.closeTo(-30e-6 * 100, 15), high: expect.closeTo(30e-6 * 100, 15) });
  });

  it('a part that states no spread has no factor', () => {
    expect(spreadFactors(part('id: C\nkind: capacitor\nnominal: 1n\n'), WIDE)).toEqual([]);
  });
});

describe('models at a corner', () => {
  it('scale the value\'s element and each parasitic with a spread, nothing else', () => {
    const p = part('id: C\nkind: capacitor\nnominal: 10u\ntolerance: 10%\nparasitics: {esr: 10m +50%/-30%, esl: 1n, epr: 1M}\n');
    const factors = spreadFactors(p, WIDE);
    expect(factors).toEqual([
      { quantity: 'value', low: 0.9, high: 1.1 },
      { quantity: 'esr', low: 0.7, high: 1.5 },
    ]);
    const lowHigh = leaves(spreadModel(p, factors, [false, true]));
    expect(lowHigh).toEqual({ C: 10e-6 * 0.9, ESR: 10e-3 * 1.5, ESL: 1e-9, EPR: 1e6 });
    // The same combination is the same tree (compiled kernels and natural frequencies are shared).
    expect(spreadModel(p, factors, [false, true])).toBe(spreadModel(p, factors, [false, true]));
  });

  it('an inductor scales L, a resistor R; a bead\'s rated impedance scales its core, |Z| times k at every frequency', () => {
    const l = part('id: L\nkind: inductor\nnominal: 10u\ntolerance: 20%\nparasitics: {dcr: 50m, cp: 2p}\n');
    expect(leaves(spreadModel(l, spreadFactors(l, WIDE), [true]))).toEqual({ DCR: 50e-3, L: 12e-6, Cp: 2e-12 });
    const r = part('id: R\nkind: resistor\nnominal: 1k\ntolerance: 1%\nparasitics: {ls: 1n}\n');
    expect(leaves(spreadModel(r, spreadFactors(r, WIDE), [false]))).toEqual({ R: 990, Ls: 1e-9 });
    const b = part('id: B\nkind: bead\nnominal: 600\nat: 100M\ntolerance: 25%\nmodel: {rdc: 50m, r: 700, l: 1.2u, c: 1.5p}\n');
    const high = spreadModel(b, spreadFactors(b, WIDE), [true]);
    for (const f of [1e6, 30e6, 100e6, 1e9]) {
      // Core impedance times 1.25 (complex.js); the DC resistance in series stays.
      const core = referenceZAt(b.network, f).sub(0.05).mul(1.25).add(0.05);
      const got = referenceZAt(high, f);
      expect(got.sub(core).abs() / core.abs()).toBeLessThan(1e-12);
    }
  });
});
