// The block `zfolio fit` tells a librarian to paste into a part file must give back the model it fitted: each
// kind is fitted to a noise-free synthetic sweep made in the test (complex.js on an element tree written
// here, test/measure/synthetic.ts), the block is pasted into a part file and read by the same reader a
// library uses, and the part's model is held to the tree the sweep came from with the test's complex.js
// evaluator. The block prints four significant digits, so a parameter may move by 5e-4 of itself; |Z| is
// held to 1 % (sensitivities in these models stay under 15 near their resonances). Values invented.

import { describe, expect, it } from 'vitest';
import { capacitor as C, inductor as L, parallel, resistor as R, series, type Element } from '../../src/circuit/element.js';
import { fitImpedance } from '../../src/measure/fit.js';
import type { FitKind } from '../../src/measure/fit-models.js';
import { fitYaml, yamlQuantity } from '../../src/present/fit-report.js';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { referenceZAt } from '../reference/impedance.js';
import { logFrequencies, synthesise } from '../measure/synthetic.js';

const CASES: { kind: FitKind; tree: Element; fromHz: number; toHz: number; rest: string; block: RegExp }[] = [
  {
    kind: 'capacitor',
    tree: series(R(0.018), L(0.45e-9), parallel(C(100e-9), R(1e7))),
    fromHz: 10,
    toHz: 1e9,
    rest: '',
    block: /^nominal: 100nF\nparasitics: \{esr: 18mΩ, esl: 450pH, epr: 10MΩ\}$/,
  },
  {
    kind: 'inductor',
    tree: parallel(series(R(0.05), L(10e-6)), C(5e-12), R(20e3)),
    fromHz: 1e3,
    toHz: 1e9,
    rest: '',
    block: /^nominal: 10µH\nparasitics: \{dcr: 50mΩ, cp: 5pF, rp: 20kΩ\}$/,
  },
  {
    kind: 'resistor',
    tree: parallel(series(R(10), L(2e-9)), C(0.2e-12)),
    fromHz: 1e3,
    toHz: 1e10,
    rest: '',
    block: /^nominal: 10Ω\nparasitics: \{ls: 2nH, cp: 200fF\}$/,
  },
  {
    kind: 'bead',
    tree: series(R(0.05), parallel(R(600), L(1.2e-6), C(1.5e-12))),
    fromHz: 1e5,
    toHz: 3e9,
    // A bead's file states its rated |Z| and where; the block gives its model.
    rest: 'nominal: 600R\nat: 100M\n',
    block: /^model: \{rdc: 50mΩ, r: 600Ω, l: 1\.2µH, c: 1\.5pF\}$/,
  },
];

describe('the block to paste into a part file', () => {
  for (const c of CASES) {
    it(`${c.kind}: read back by the part reader, it is the model the sweep came from`, () => {
      const outcome = fitImpedance(c.kind, synthesise(c.tree, logFrequencies(c.fromHz, c.toHz, 401)));
      expect(outcome.ok).toBe(true);
      if (!outcome.ok) return;
      const block = fitYaml(outcome.fit).join('\n');
      expect(block).toMatch(c.block);
      const diagnostics = new DiagnosticList();
      const text = `id: P\nkind: ${c.kind}\n${c.rest}${block}\n`;
      const part = readPart({ source: parseYamlSource('parts/p.yaml', text, diagnostics)!, diagnostics });
      expect(diagnostics.sorted().map(formatDiagnostic)).toEqual([]);
      for (const f of logFrequencies(c.fromHz, c.toHz, 61)) {
        const want = referenceZAt(c.tree, f);
        const got = referenceZAt(part!.network, f);
        expect(got.sub(want).abs() / want.abs(), `${f} Hz`).toBeLessThan(0.01);
      }
    });
  }
});

describe('yamlQuantity', () => {
  it('four significant digits, no space, the SI symbol the part reader takes', () => {
    expect(yamlQuantity(18.0149e-3, 'capacitor', 'esr')).toBe('18.01mΩ');
    expect(yamlQuantity(4.7e-6, 'inductor', 'nominal')).toBe('4.7µH');
    expect(yamlQuantity(1.23456e-12, 'bead', 'c')).toBe('1.235pF');
  });
});
