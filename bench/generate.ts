// A generated library of many invented parts, for benchmarks: every kind, values spread over decades.

import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { seededRandom } from '../src/analysis/rail-corners.js';

/** Deterministic pseudo-random numbers (mulberry32), so every run generates the same library. */
export const mulberry32 = seededRandom;

const E6 = [1, 1.5, 2.2, 3.3, 4.7, 6.8];

export function generatedPartYaml(i: number, random: () => number): string {
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)];
  const value = (lo: number, hi: number) => `${pick(E6)}e${lo + Math.floor(random() * (hi - lo + 1))}`;
  const id = `GEN-${String(i).padStart(5, '0')}`;
  switch (i % 5) {
    case 0:
      return `id: ${id}\nkind: capacitor\ntitle: Generated capacitor ${i}\nnominal: ${value(-12, -5)}\nvoltage: ${pick([6.3, 10, 16, 25, 50])}V\npackage: "${pick(['0201', '0402', '0603', '0805', '1206'])}"\ndielectric: ${pick(['X7R', 'X5R', 'C0G'])}\nparasitics: {esr: ${value(-3, -1)}, esl: ${value(-10, -9)}}\ntags: [generated]\n`;
    case 1:
      return `id: ${id}\nkind: inductor\ntitle: Generated inductor ${i}\nnominal: ${value(-9, -4)}\ncurrent: 1A\nparasitics: {dcr: ${value(-3, 0)}, cp: ${value(-13, -12)}, rp: ${value(3, 5)}}\ntags: [generated]\n`;
    case 2:
      return `id: ${id}\nkind: resistor\ntitle: Generated resistor ${i}\nnominal: ${value(0, 6)}\npower: 0.1W\nparasitics: {ls: ${value(-10, -9)}, cp: ${value(-14, -13)}}\ntags: [generated]\n`;
    case 3: {
      // The draw of a rated value is kept so every later part of a library stays as it was; the rating
      // written is what the model gives at 100 MHz (Z = Rdc + 1/(1/R + 1/(jωL) + jωC)), so a generated
      // bead matches its rating as a librarian's would, instead of drawing a warning.
      pick([120, 220, 600, 1000]);
      const [rdc, r, l, c] = [value(-2, -1), value(2, 3), value(-7, -6), value(-13, -12)];
      const w = 2 * Math.PI * 100e6;
      const [g, b] = [1 / Number(r), w * Number(c) - 1 / (w * Number(l))];
      const rated = Math.hypot(Number(rdc) + g / (g * g + b * b), -b / (g * g + b * b));
      return `id: ${id}\nkind: bead\ntitle: Generated bead ${i}\nnominal: ${Number(rated.toPrecision(3))}\nat: 100M\nmodel: {rdc: ${rdc}, r: ${r}, l: ${l}, c: ${c}}\ntags: [generated]\n`;
    }
    default:
      return `id: ${id}\nkind: network\ntitle: Generated network ${i}\nbehaves-as: capacitor\nnominal: 10u\nnetwork: {series: [{r: 5m}, {l: 1.1n}, {parallel: [{c: 10u}, {r: 50M}]}]}\ntags: [generated]\n`;
  }
}

/** Write a library of `count` parts into a new temporary folder; returns its path. */
export function writeGeneratedLibrary(count: number, seed = 1): string {
  const root = mkdtempSync(join(tmpdir(), 'zfolio-gen-'));
  const random = mulberry32(seed);
  for (let i = 0; i < count; i++) {
    const dir = join(root, 'parts', `group-${Math.floor(i / 100)}`);
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, `gen-${i}.yaml`), generatedPartYaml(i, random));
  }
  writeFileSync(join(root, 'folio.yaml'), 'title: Generated benchmark library (invented parts)\n');
  return root;
}
