// What a datasheet page says of a measurement: the miss, whether it is within folio.yaml's limit, and the
// typed model beside the fitted one. The measurement is synthesised in the test (measured-library.ts).

import { describe, expect, it } from 'vitest';
import { measurementPageData } from '../../src/pages/measurement-page.js';
import { libraryMeasurements } from '../../src/measure/part-measurements.js';
import { loadLibrary } from '../../src/model/library.js';
import { measuredLibrary } from '../measure/measured-library.js';
import type { Element } from '../../src/circuit/element.js';
import { FIT_PARAMETERS, type FitKind } from '../../src/measure/fit-models.js';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tempDir } from '../site-helpers.js';

/** A library of one part of each kind the fit handles, with every optional element given (invented values). */
function fitKindsLibrary(): string {
  const root = tempDir('fit-kinds');
  mkdirSync(join(root, 'parts'));
  writeFileSync(join(root, 'folio.yaml'), 'title: Fit kinds (invented)\n');
  const parts = {
    cap: 'id: C-ALL\nkind: capacitor\nnominal: 1u\nparasitics: {esr: 5m, esl: 0.4n, epr: 1G}\n',
    ind: 'id: L-ALL\nkind: inductor\nnominal: 1u\nparasitics: {dcr: 20m, cp: 2p, rp: 5k}\n',
    res: 'id: R-ALL\nkind: resistor\nnominal: 100\nparasitics: {ls: 0.5n, cp: 0.1p}\n',
    bead: 'id: B-ALL\nkind: bead\nnominal: 120R\nat: 100M\nmodel: {rdc: 50m, r: 600, l: 1u, c: 1p}\n',
  };
  for (const [name, text] of Object.entries(parts)) writeFileSync(join(root, 'parts', `${name}.yaml`), text);
  return root;
}

function page(typed: string, warnDb = 1) {
  const { library } = loadLibrary(measuredLibrary({ typed }));
  const part = library!.partsById.get('CAP-M')!;
  const [m] = libraryMeasurements(library!.parts, warnDb).byPart.get('CAP-M')!;
  return measurementPageData(part, m, 1, warnDb, []);
}

describe('measurementPageData', () => {
  it('a typed model 3× the measured ESR: the miss, beyond 1 dB rms, and the fit finding 20 mΩ (−66.7% of the typed 60 mΩ)', () => {
    const p = page('{esr: 60m, esl: 0.5n}');
    expect(p.file).toBe('measurements/cap.s2p');
    expect(p.fixtureText).toBe('two-port shunt-thru (part from the line to ground), against 50 Ω');
    expect(p.pointsText).toBe('241 points from 1 kHz to 1 GHz');
    expect(p.missText).toMatch(/^1\.57 dB rms in \|Z\| \(at most 9\.54 dB, at 22\.4 MHz\) and [\d.]+° rms in phase$/);
    expect([p.within, p.limitText]).toEqual([false, '1 dB rms (folio.yaml measurements: warn-above)']);
    expect([p.date, p.note]).toEqual(['2026-01-15', 'synthetic']);
    // The file's own opening comment, as test/measure/measured-library.ts writes it.
    expect(p.header).toBe('synthetic measurement made by a test');
    const rows = p.fit!.rows;
    // Rows are named as the model table names the elements, with the part file's key beside.
    expect(rows.map((r) => [r.name, r.key, r.typed, r.difference])).toEqual([
      ['C', 'nominal', '100 nF', '0.0%'],
      ['ESR', 'esr', '60 mΩ', '−66.7%'],
      ['ESL', 'esl', '500 pH', '0.0%'],
      ['EPR', 'epr', 'absent (open)', '—'],
    ]);
    expect(rows[1].fitted).toMatch(/^20 mΩ ± /);
    expect(rows[3].fitted).toMatch(/^left out \(/);
  });

  it("names each fitted element as the part's own model does, for every kind the fit handles", () => {
    // The element names the part's model gives its leaves (the model table's labels), read from the tree.
    const names = (e: Element): string[] => ('parts' in e ? e.parts.flatMap(names) : e.name !== undefined ? [e.name] : []);
    const { library } = loadLibrary(fitKindsLibrary());
    for (const part of library!.parts) {
      const spec = FIT_PARAMETERS[part.kind as FitKind];
      // Every element is present in these parts, so each row names one of the tree's leaves, all of them once.
      expect(spec.map((s) => s.element).sort(), part.id).toEqual(names(part.network).sort());
    }
  });

  it('a typed model as measured is within the limit', () => {
    const p = page('{esr: 20m, esl: 0.5n}');
    expect(p.within).toBe(true);
    expect(p.missText.startsWith('0.00 dB rms')).toBe(true);
  });
});
