// A bead's model must reproduce its rating: |Z| of Rdc + (R ‖ L ‖ C) at the rated frequency within the
// part's tolerance of the rated impedance, or within 25% when no tolerance is given (common practice for
// ferrite beads, whose impedance is specified loosely). The reference |Z| is computed here with complex.js
// (a general-purpose library from the npm registry): series impedances add, parallel admittances add
// (Alexander & Sadiku, Fundamentals of Electric Circuits, §9.7).

import { Complex } from 'complex.js';
import { describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { REPO } from '../site-helpers.js';

function read(yaml: string): { part?: Part; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/bead.yaml', yaml, diagnostics);
  const part = source ? readPart({ source, diagnostics }) : undefined;
  return { part, messages: diagnostics.sorted().map(formatDiagnostic) };
}

/** |Rdc + 1/(1/R + 1/(jωL) + jωC)| at f, with complex.js. */
function referenceMagnitude(f: number, m: { rdc: number; r: number; l: number; c?: number }): number {
  const jw = new Complex(0, 2 * Math.PI * f);
  let y = new Complex(1 / m.r, 0).add(jw.mul(m.l).inverse());
  if (m.c !== undefined) y = y.add(jw.mul(m.c));
  return y.inverse().add(m.rdc).abs();
}

const bead = (nominal: string, tolerance: string | undefined, model: string) =>
  `id: T-FB\nkind: bead\nnominal: ${nominal}\nat: 100M\n${tolerance ? `tolerance: ${tolerance}\n` : ''}model: ${model}\n`;

describe('a bead whose model misses its rating', () => {
  // R ‖ L with X_L = 2π·100 MHz·0.225 µH = 141.4 Ω: |Z| ≈ 140 Ω, far from a rated 1 kΩ.
  const model = { rdc: 0.1, r: 1000, l: 0.225e-6 };
  const z = referenceMagnitude(1e8, model);

  it('the reference puts the model at about 140 Ω at 100 MHz', () => {
    expect(z).toBeGreaterThan(139);
    expect(z).toBeLessThan(141);
  });

  it('is a located warning at its nominal, saying what the model gives and how far off it is; the part still loads', () => {
    const { part, messages } = read(bead('1k', undefined, '{rdc: 100m, r: 1k, l: 225n}'));
    expect(part).toBeDefined();
    expect(messages).toEqual([
      `parts/bead.yaml:3:10: warning: nominal: the model gives |Z| = 140 Ω at 100 MHz, ${Math.round((1 - z / 1000) * 100)}% below the rated 1 kΩ, outside ±25% (no tolerance given; common practice); fit the model to the rating or correct the rating`,
    ]);
  });

  it('is held to the part\'s own tolerance when it states one', () => {
    // 140 Ω rated at 125 Ω: +12% — inside the default 25%, outside a stated 10%.
    expect(Math.abs(z / 125 - 1)).toBeGreaterThan(0.1);
    expect(Math.abs(z / 125 - 1)).toBeLessThan(0.25);
    expect(read(bead('125', undefined, '{rdc: 100m, r: 1k, l: 225n}')).messages).toEqual([]);
    const { messages } = read(bead('125', '10%', '{rdc: 100m, r: 1k, l: 225n}'));
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatch(/^parts\/bead\.yaml:3:10: warning: nominal: the model gives \|Z\| = 140 Ω at 100 MHz, 1[12](\.\d+)?% above the rated 125 Ω, outside its ±10% tolerance/);
  });
});

describe('a bead whose model reproduces its rating', () => {
  it('passes without a message when |Z(at)| is within 25% of nominal', () => {
    const model = { rdc: 0.15, r: 700, l: 1.4e-6, c: 0.45e-12 };
    const z = referenceMagnitude(1e8, model);
    // The model 20% above or below the rating (|Z|/nominal − 1 = ±0.2): inside 25% both ways.
    for (const rated of [z / 1.2, z / 0.8]) {
      expect(read(bead(String(rated), undefined, '{rdc: 150m, r: 700, l: 1.4u, c: 0.45p}')).messages).toEqual([]);
    }
    // ±30%: outside.
    for (const rated of [z / 1.3, z / 0.7]) {
      expect(read(bead(String(rated), undefined, '{rdc: 150m, r: 700, l: 1.4u, c: 0.45p}')).messages).toHaveLength(1);
    }
  });

  it('the demo library\'s beads are within their tolerance of their ratings', () => {
    const library = loadLibrary(REPO).library!;
    const beads = library.parts.filter((p) => p.kind === 'bead');
    expect(beads.length).toBeGreaterThanOrEqual(3);
    for (const b of beads) {
      const [rdc, r, l, c] = ['rdc', 'r', 'l', 'c'].map((k) => b.parameters[k]);
      const deviation = referenceMagnitude(b.ratedAtHz!, { rdc: rdc ?? 0, r, l, c }) / b.nominal! - 1;
      expect(Math.abs(deviation), b.id).toBeLessThanOrEqual(b.tolerance ?? 0.25);
    }
  });
});
