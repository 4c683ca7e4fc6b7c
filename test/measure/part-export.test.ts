// A part's exports: the .s1p file read back and turned into Z must equal the model (complex.js,
// test/reference/impedance.ts) to 1e-9 at every point; its header names the part and its model; the
// .subckt opens with the same header. Γ = (Z − Z0)/(Z + Z0) (Pozar, Microwave Engineering, 4th ed., §2.3).

import { Complex } from 'complex.js';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series } from '../../src/circuit/element.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { impedanceFromNetwork } from '../../src/measure/fixtures.js';
import { impedanceDecimals, partSubcircuit, partTouchstone, treeFormula } from '../../src/measure/part-export.js';
import { readTouchstone } from '../../src/measure/touchstone-read.js';
import { loadLibrary } from '../../src/model/library.js';
import { referenceZAt } from '../reference/impedance.js';

const DEMO = fileURLToPath(new URL('../../', import.meta.url));
const { library } = loadLibrary(DEMO);
const frequencies = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 10 });

describe('partTouchstone', () => {
  it.each(library!.parts.map((p) => [p.id, p] as const))('%s: S11 re 50 Ω reads back to the model', (_, part) => {
    const text = partTouchstone(part, frequencies, '100 Hz to 10 GHz, 10 points per decade');
    expect(text.startsWith(`! zfolio export\n! ${part.id}: `)).toBe(true);
    expect(text).toMatch(/^# Hz S RI R 50$/m);
    expect(/[^\x00-\x7f]/.test(text)).toBe(false);
    const read = readTouchstone(text, `${part.id}.s1p`);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const z = impedanceFromNetwork(read.data, 'reflection');
    expect(z.ok).toBe(true);
    if (!z.ok) return;
    frequencies.forEach((f, k) => {
      const reference = referenceZAt(part.network, f);
      // Γ near 1 (|Z| ≫ 50 Ω, up to 2e7 Ω at 100 Hz for 100 pF) loses digits in 1 − Γ: about |Z|/Z0·ε.
      expect(new Complex(z.impedance.re[k], z.impedance.im[k]).sub(reference).abs() / reference.abs()).toBeLessThan(1e-9 + (reference.abs() / 50) * 1e-15);
    });
  });
});

describe('partTouchstone at the precision of the site', () => {
  // The site writes each S11 with the decimals that keep Z to 6 significant digits (impedanceDecimals).
  // Read back with zfolio's Touchstone reader, Z must match complex.js's impedance of the element tree to
  // half a unit of the 6th digit (5e-6 of |Z|), plus the double's own loss in 1 − Γ where |Z| ≫ Z0 (above).
  const dense = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 100 });
  it.each(library!.parts.map((p) => [p.id, p] as const))('%s: Z read back to 6 significant digits, in fewer bytes than in full', (_, part) => {
    const text = partTouchstone(part, dense, '100 Hz to 10 GHz, 100 points per decade', 6);
    const read = readTouchstone(text, `${part.id}.s1p`);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const z = impedanceFromNetwork(read.data, 'reflection');
    expect(z.ok).toBe(true);
    if (!z.ok) return;
    let worst = 0;
    dense.forEach((f, k) => {
      const reference = referenceZAt(part.network, f);
      const miss = new Complex(z.impedance.re[k], z.impedance.im[k]).sub(reference).abs() / reference.abs();
      worst = Math.max(worst, miss - (reference.abs() / 50) * 1e-15);
    });
    expect(worst).toBeLessThan(5e-6);
    expect(text.length).toBeLessThan(0.75 * partTouchstone(part, dense, '100 Hz to 10 GHz, 100 points per decade').length);
  });

  it("says that an R or X a millionth of |Z| is lost, and it is: a 3.3 pF capacitor's ESR at 100 Hz", () => {
    const cap = { id: 'C-3P3', kind: 'capacitor', title: 'invented 3.3 pF', source: { path: 'parts/c.yaml', hash: '0' }, network: series(resistor(0.5, 'ESR'), inductor(0.3e-9, 'ESL'), capacitor(3.3e-12, 'C')) };
    const at = new Float64Array([100, 1e6]);
    const text = partTouchstone(cap, at, '2 points', 6);
    expect(text).toMatch(/^! S11 to the decimals that keep \|Z\| read back to 6 significant digits; an R or X below about 1e-6 of \|Z\| is lost \(sweep.csv keeps each to 6\)$/m);
    expect(partTouchstone(cap, at, '2 points')).not.toMatch(/is lost/);
    const read = readTouchstone(text, 'c.s1p');
    if (!read.ok) throw new Error('unreadable');
    // Z = Z0 (1 + S)/(1 − S) with complex.js (Pozar, §2.3), from the file's own S11 at 100 Hz.
    const s = new Complex(read.data.re[0], read.data.im[0]);
    const z = new Complex(1).add(s).div(new Complex(1).sub(s)).mul(50);
    const reference = referenceZAt(cap.network, 100);
    // |X| = 1/(2π·100·3.3 pF) ≈ 482 MΩ, so 0.5 Ω of ESR is 1e-9 of |Z|: |Z| survives, the ESR does not.
    expect(Math.abs(z.abs() / reference.abs() - 1)).toBeLessThan(5e-6);
    expect(Math.abs(z.re - 0.5)).toBeGreaterThan(0.05);
  });

  it('uses as many decimals as digits where |Z| is Z0 and more as S approaches ±1', () => {
    expect(impedanceDecimals(0, 0, 6)).toBe(6);
    // |Z| = 5 kΩ: S = 99/101, 1 − S² ≈ 0.0396.
    expect(impedanceDecimals(99 / 101, 0, 6)).toBe(7);
    expect(impedanceDecimals(1, 0, 6)).toBe(17);
  });
});

describe('headers', () => {
  it('the model as a formula of its named leaves, and unnamed ones by value', () => {
    expect(treeFormula(series(resistor(0.018, 'ESR'), inductor(4.5e-10, 'ESL'), parallel(capacitor(1e-7, 'C'), resistor(1e9, 'EPR'))))).toBe('ESR + ESL + (C || EPR)');
    expect(treeFormula(parallel(series(resistor(0.003), capacitor(2.2e-5)), resistor(50)))).toBe('(3 mΩ + 22 µF) || 50 Ω');
  });

  it('the subcircuit names the part, its model and its source', () => {
    const part = library!.partsById.get('ORV-C-0402-100N-X7R')!;
    const text = partSubcircuit(part);
    const lines = text.split('\n');
    expect(lines[0]).toBe('* zfolio export');
    expect(lines[1]).toBe(`* ORV-C-0402-100N-X7R: ${part.title} (capacitor)`);
    expect(lines[2]).toBe('* model: ESR + ESL + C; ESR = 25 mohm, ESL = 450 pH, C = 100 nF');
    expect(lines.some((l) => l.startsWith(`* source: ${part.source.path} (sha256:`))).toBe(true);
    expect(text).toContain('.SUBCKT ORV-C-0402-100N-X7R 1 2\n');
  });
});
