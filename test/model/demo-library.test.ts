// The demo library at the repository root (folio.yaml and parts/): an invented company's house part list.
// It must load clean, cover every kind, and its figures must agree with closed forms and the trade's
// usual ranges, so that the pages built from it show sensible parts.

import { readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analysePart, impedanceOfPart } from '../../src/analysis/part-figures.js';
import { loadLibrary, type Library } from '../../src/model/library.js';
import { PART_KINDS, type Part } from '../../src/model/part.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const result = loadLibrary(root);
const library = result.library as Library;
const byId = (id: string): Part => {
  const part = library.partsById.get(id);
  if (!part) throw new Error(`demo part ${id} is missing`);
  return part;
};
const analyse = (part: Part) => analysePart(part, library.settings.sweep, library.settings.within);
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('the demo library loads', () => {
  it('with no errors, and no warning about any part file (the one rail-plan warning is tested with the plans)', () => {
    expect(result.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(result.diagnostics.filter((d) => d.file.startsWith('parts/'))).toEqual([]);
    expect(result.library).toBeDefined();
  });

  it('takes its settings from folio.yaml: 100 Hz to 10 GHz, 100 a decade, 10%, A4, 80%', () => {
    expect(library.settings.title).toMatch(/invented/i);
    expect(library.settings.notice).toMatch(/invented/i);
    expect(library.settings.sweep).toEqual({ fromHz: 100, toHz: 10e9, perDecade: 100 });
    expect(library.settings.within).toBeCloseTo(0.1, 12);
    expect(library.settings.paper).toBe('A4');
    expect(library.settings.derating).toBeCloseTo(0.8, 12);
  });

  it('has at least 34 parts with unique ids, each in a file named after its id', () => {
    expect(library.parts.length).toBeGreaterThanOrEqual(34);
    const ids = library.parts.map((p) => p.id);
    expect(new Set(ids).size).toBe(ids.length);
    expect(new Set(ids.map((id) => id.toLowerCase())).size).toBe(ids.length);
    for (const part of library.parts) expect(basename(part.source.path)).toBe(`${part.id.toLowerCase()}.yaml`);
  });

  it('covers every kind, and at least two networks that behave as a kind with a nominal value', () => {
    for (const kind of PART_KINDS) expect(library.parts.some((p) => p.kind === kind), kind).toBe(true);
    const typedNetworks = library.parts.filter((p) => p.kind === 'network' && p.behavesAs !== undefined && p.nominal !== undefined);
    expect(typedNetworks.length).toBeGreaterThanOrEqual(2);
  });

  it('says in every part file that the data are invented, and gives every part a title, tags and a package', () => {
    for (const part of library.parts) {
      const lines = part.source.text.split('\n');
      expect(lines[1], part.source.path).toMatch(/^# Invented part for the zfolio demo library; values typical of the kind/);
      expect(part.title, part.id).not.toBe(part.id);
      expect(part.tags.length, part.id).toBeGreaterThan(0);
      if (part.kind !== 'network' || part.behavesAs) expect(part.package, part.id).toBeDefined();
    }
  });
});

describe('capacitors in the demo library', () => {
  const capacitors = () => library.parts.filter((p) => p.kind === 'capacitor');

  it('cover the sizes 0201 to 1210 and the dielectrics C0G, X7R, X5R, X6S', () => {
    const packages = new Set(capacitors().map((p) => p.package));
    for (const size of ['0201', '0402', '0603', '0805', '1206', '1210']) expect(packages.has(size), size).toBe(true);
    const dielectrics = new Set(capacitors().map((p) => p.dielectric));
    for (const code of ['C0G', 'X7R', 'X5R', 'X6S']) expect(dielectrics.has(code), code).toBe(true);
  });

  it('all carry a unit price, for cost-aware planning', () => {
    for (const part of capacitors()) expect(part.cost, part.id).toBeGreaterThan(0);
  });

  it('class 2 parts rated 4 V to 50 V have DC-bias tables that stay within the rating and fall with voltage', () => {
    // Class 2 ceramics lose capacitance as DC bias rises (common practice); a table that rises is a typo.
    const class2 = capacitors().filter((p) => /^X[5-7][RS]$/.test(p.dielectric ?? ''));
    const withTables = class2.filter((p) => p.dcBias.length > 0);
    expect(withTables.length).toBeGreaterThanOrEqual(5);
    const ratings = withTables.map((p) => p.voltageV as number);
    expect(Math.min(...ratings)).toBe(4);
    expect(Math.max(...ratings)).toBe(50);
    for (const part of withTables) {
      const last = part.dcBias[part.dcBias.length - 1];
      expect(last.voltageV, part.id).toBeLessThanOrEqual(part.voltageV as number);
      for (let i = 1; i < part.dcBias.length; i++) expect(part.dcBias[i].fraction, part.id).toBeLessThan(part.dcBias[i - 1].fraction);
    }
  });

  it('include bulk parts described in free words, with leakage', () => {
    const bulk = capacitors().filter((p) => /electrolytic|polymer/.test(p.dielectric ?? ''));
    expect(bulk.length).toBeGreaterThanOrEqual(3);
    for (const part of bulk) expect(part.parameters.epr, part.id).toBeGreaterThan(0);
  });

  it('include mains safety parts with an AC voltage rating and a caution in their notes', () => {
    const mains = capacitors().filter((p) => p.safetyClass !== undefined);
    expect(mains.map((p) => p.safetyClass).sort()).toEqual(['X2', 'Y2']);
    for (const part of mains) {
      // Mains parts are rated in AC r.m.s. (IEC 60384-14); they state no DC rating in the demo.
      expect(part.voltageAcV, part.id).toBeGreaterThanOrEqual(250);
      expect(part.voltageV, part.id).toBeUndefined();
      expect(part.notes, part.id).toMatch(/hazardous voltage/);
      expect(part.notes, part.id).toMatch(/local codes/);
    }
  });
});

describe('figures of the demo parts', () => {
  it('every capacitor and inductor (and network behaving as one) has an SRF inside the sweep and a usable band below it', () => {
    const reactive = library.parts.filter((p) => p.behavesAs === 'capacitor' || p.behavesAs === 'inductor');
    expect(reactive.length).toBeGreaterThanOrEqual(25);
    const { fromHz, toHz } = library.settings.sweep;
    for (const part of reactive) {
      const a = analyse(part);
      expect(a.selfResonance, part.id).toBeDefined();
      const srf = a.selfResonance!.frequencyHz;
      expect(srf, part.id).toBeGreaterThan(fromHz);
      expect(srf, part.id).toBeLessThan(toHz);
      expect(a.usableBand, part.id).not.toBeNull();
      expect(a.usableBand!.toHz, part.id).toBeLessThan(srf);
      expect(a.usableBand!.toIsSweepEnd, part.id).toBe(false);
    }
  });

  it('every resistor and bead has a usable band', () => {
    for (const part of library.parts.filter((p) => p.behavesAs === 'resistor' || p.behavesAs === 'bead')) {
      expect(analyse(part).usableBand, part.id).not.toBeNull();
    }
  });

  it('100 nF 0402: SRF = 1/(2π√(ESL·C)) from its own file values (series RLC resonance, Alexander & Sadiku, Fundamentals of Electric Circuits, §14.5)', () => {
    const part = byId('ORV-C-0402-100N-X7R');
    const C = part.nominal as number;
    const L = part.parameters.esl;
    expect(part.parameters.epr).toBeUndefined(); // with no leakage resistor the series closed form is exact
    const srf = 1 / (2 * Math.PI * Math.sqrt(L * C));
    const a = analyse(part);
    // Resonances are refined to 1e-9 relative; 1e-7 leaves room for the bracket.
    expect(rel(a.selfResonance!.frequencyHz, srf)).toBeLessThan(1e-7);
    expect(a.selfResonance!.impedanceOhm).toBeCloseTo(part.parameters.esr, 9); // |Z| = ESR at series resonance
    // Band edge for the series model: C_eff = C/(1 − (f/SRF)²) reaches C(1 + within) at SRF·√(1 − 1/(1 + within)).
    expect(rel(a.usableBand!.toHz, srf * Math.sqrt(1 - 1 / 1.1))).toBeLessThan(1e-6);
  });

  it('4.7 µH power inductor: SRF = (1/2π)·√(1/(L·Cp) − (R/L)²) from its own file values', () => {
    // (R + jωL) ‖ Cp ‖ Rp: Im Y = −ωL/(R² + ω²L²) + ωCp = 0 gives ω² = 1/(L·Cp) − R²/L², and the real Rp
    // does not move it (parallel resonance of a lossy coil, in any circuit-analysis text, e.g. Alexander &
    // Sadiku §14.6 and its problems; stated from memory).
    const part = byId('ORV-L-PWR-4U7-3A');
    const L = part.nominal as number;
    const { dcr, cp } = part.parameters;
    const srf = Math.sqrt(1 / (L * cp) - (dcr / L) ** 2) / (2 * Math.PI);
    const a = analyse(part);
    expect(a.selfResonance!.type).toBe('parallel');
    expect(rel(a.selfResonance!.frequencyHz, srf)).toBeLessThan(1e-7);
  });

  // Usual SRF ranges of these sizes (common practice; ranges wide enough to hold any ordinary part of the kind).
  it.each([
    { id: 'ORV-C-0402-100N-X7R', low: 10e6, high: 50e6, usual: '100 nF 0402: tens of MHz' },
    { id: 'ORV-C-0805-10U-X5R', low: 1e6, high: 5e6, usual: '10 µF 0805: a few MHz' },
    { id: 'ORV-C-1206-47U-X5R', low: 300e3, high: 2e6, usual: '47 µF 1206: below a megahertz or so' },
    { id: 'ORV-C-0201-100P-C0G', low: 500e6, high: 3e9, usual: '100 pF 0201: around a gigahertz' },
    { id: 'ORV-C-ALU-470U-35V', low: 10e3, high: 300e3, usual: '470 µF radial electrolytic: tens of kHz' },
    { id: 'ORV-L-PWR-4U7-3A', low: 20e6, high: 80e6, usual: '4.7 µH power inductor: tens of MHz' },
    { id: 'ORV-L-PWR-22U-1A4', low: 5e6, high: 30e6, usual: '22 µH power inductor: around 10 MHz' },
    { id: 'ORV-L-RF-0402-10N', low: 2e9, high: 6e9, usual: '10 nH 0402 RF inductor: several GHz' },
    { id: 'ORV-L-RF-0603-47N', low: 1e9, high: 3e9, usual: '47 nH 0603 RF inductor: 1 to 3 GHz' },
  ])('$id SRF lies in the usual range ($usual)', ({ id, low, high }) => {
    const srf = analyse(byId(id)).selfResonance!.frequencyHz;
    expect(srf).toBeGreaterThan(low);
    expect(srf).toBeLessThan(high);
  });

  it('every bead meets its rated impedance at its rated frequency within its tolerance', () => {
    const beads = library.parts.filter((p) => p.kind === 'bead');
    expect(beads.length).toBeGreaterThanOrEqual(2);
    for (const bead of beads) {
      const z = impedanceOfPart(bead, bead.ratedAtHz as number);
      expect(rel(Math.hypot(z.re, z.im), bead.nominal as number), bead.id).toBeLessThanOrEqual(bead.tolerance as number);
    }
  });

  it('the wideband 22 µF network shows a second series resonance above its first, with a parallel peak between', () => {
    const a = analyse(byId('ORV-N-C-1206-22U-WB'));
    expect(a.resonances.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    // The first dip is the main stack alone, close to 1/(2π√(1 nH · 22 µF)) (series RLC resonance, §14.5 as above);
    // the small path shifts it by less than 0.1%.
    expect(rel(a.resonances[0].frequencyHz, 1 / (2 * Math.PI * Math.sqrt(1e-9 * 22e-6)))).toBeLessThan(1e-3);
  });

  it('the RC snubber network declares no behaviour and so has no usable band', () => {
    const a = analyse(byId('ORV-N-RC-SNUBBER'));
    expect(a.part.behavesAs).toBeUndefined();
    expect(a.usableBand).toBeNull();
  });
});

describe('the demo library on disk', () => {
  it('folio.yaml points editors at the folio schema', () => {
    const first = readFileSync(join(root, 'folio.yaml'), 'utf8').split('\n')[0];
    expect(first).toBe('# yaml-language-server: $schema=schema/folio.schema.json');
  });
});
