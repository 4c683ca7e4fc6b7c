// The demo library's measurement files, synthesised: no part was measured. Each file is made from an
// invented "true" part (an element tree near the part file's typed model, as a real sample would differ from
// its datasheet), with seeded Gaussian noise on |Z| (in dB) and on the phase (in degrees), turned into the
// S-parameters of the fixture named in the part file and written as Touchstone. The same run always writes
// the same bytes (test/scripts/synthesise-measurements.test.ts checks the files in the repo against it).
//
// Usage: npm run measurements            (writes measurements/ of the demo library)
//        node --import tsx scripts/synthesise-measurements.ts DIR

import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { capacitor as C, inductor as L, parallel, resistor as R, series, type Element } from '../src/circuit/element.js';
import { impedanceSweep } from '../src/circuit/impedance.js';
import { logSweep } from '../src/circuit/sweep.js';
import { seededRandom } from '../src/analysis/rail-corners.js';
import type { Fixture } from '../src/measure/fixtures.js';
import type { DataFormat, FrequencyUnit } from '../src/measure/network-data.js';
import { writeTouchstone } from '../src/measure/touchstone-write.js';

interface DemoMeasurement {
  file: string;
  part: string;
  /** The invented sample, in words and as a tree. */
  truth: string;
  tree: Element;
  fixture: Fixture;
  sweep: { fromHz: number; toHz: number; perDecade: number };
  noise: { db: number; deg: number; seed: number };
  version: 1 | 2;
  format: DataFormat;
  unit: FrequencyUnit;
}

/** Each measurement's invented sample sits a few percent off the part file's typed values. */
export const DEMO_MEASUREMENTS: readonly DemoMeasurement[] = [
  {
    file: 'measurements/orv-c-0402-100n-x7r.s2p',
    part: 'ORV-C-0402-100N-X7R',
    truth: 'C 96.3 nF, ESR 27 mohm, ESL 0.47 nH, EPR 2 Gohm',
    tree: series(R(0.027), L(0.47e-9), parallel(C(96.3e-9), R(2e9))),
    fixture: 'shunt-thru',
    sweep: { fromHz: 10e3, toHz: 3e9, perDecade: 70 },
    noise: { db: 0.05, deg: 0.3, seed: 1201 },
    version: 1,
    format: 'RI',
    unit: 'Hz',
  },
  {
    file: 'measurements/orv-l-pwr-10u-2a.s2p',
    part: 'ORV-L-PWR-10U-2A',
    truth: 'L 10.4 uH, DCR 68 mohm, Cp 4.3 pF, Rp 11 kohm',
    tree: parallel(series(R(0.068), L(10.4e-6)), C(4.3e-12), R(11e3)),
    fixture: 'series-thru',
    sweep: { fromHz: 1e3, toHz: 300e6, perDecade: 60 },
    noise: { db: 0.05, deg: 0.3, seed: 1202 },
    version: 2,
    format: 'MA',
    unit: 'MHz',
  },
  {
    file: 'measurements/orv-fb-0603-600r-1a.s2p',
    part: 'ORV-FB-0603-600R-1A',
    truth: 'Rdc 160 mohm, R 660 ohm, L 1.45 uH, C 0.43 pF',
    tree: series(R(0.16), parallel(R(660), L(1.45e-6), C(0.43e-12))),
    fixture: 'series-thru',
    sweep: { fromHz: 100e3, toHz: 3e9, perDecade: 60 },
    noise: { db: 0.05, deg: 0.3, seed: 1203 },
    version: 1,
    format: 'DB',
    unit: 'GHz',
  },
  {
    file: 'measurements/orv-r-0402-49r9-0p1.s1p',
    part: 'ORV-R-0402-49R9-0P1',
    truth: 'R 49.93 ohm, Ls 0.34 nH, Cp 0.055 pF',
    tree: parallel(series(R(49.93), L(0.34e-9)), C(0.055e-12)),
    fixture: 'reflection',
    sweep: { fromHz: 1e6, toHz: 6e9, perDecade: 50 },
    noise: { db: 0.02, deg: 0.2, seed: 1204 },
    version: 1,
    format: 'MA',
    unit: 'MHz',
  },
];

/** Deterministic uniforms (mulberry32, the generator corner sampling uses) and normals by Box–Muller (Ann. Math. Statist. 29, 1958). */
function seededNormal(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

const Z0 = 50;

/**
 * S-parameters of the part in its fixture (D. M. Pozar, Microwave Engineering, 4th ed., table 4.2): a shunt
 * Z has S11 = −Z0/(2Z + Z0), S21 = 2Z/(2Z + Z0); a series Z has S11 = Z/(Z + 2Z0), S21 = 2Z0/(Z + 2Z0);
 * a one-port has Γ = (Z − Z0)/(Z + Z0). Returned as [S11, S21] pairs of [re, im].
 */
function fixtureS(fixture: Fixture, zr: number, zi: number): [[number, number], [number, number]] {
  const div = (ar: number, ai: number, br: number, bi: number): [number, number] => {
    const d = br * br + bi * bi;
    return [(ar * br + ai * bi) / d, (ai * br - ar * bi) / d];
  };
  if (fixture === 'reflection') return [div(zr - Z0, zi, zr + Z0, zi), [0, 0]];
  if (fixture === 'shunt-thru') return [div(-Z0, 0, 2 * zr + Z0, 2 * zi), div(2 * zr, 2 * zi, 2 * zr + Z0, 2 * zi)];
  return [div(zr, zi, zr + 2 * Z0, zi), div(2 * Z0, 0, zr + 2 * Z0, zi)];
}

/** The text of one demo measurement file. */
export function synthesise(m: DemoMeasurement): string {
  const frequencies = logSweep(m.sweep);
  const z = impedanceSweep(m.tree, frequencies);
  const normal = seededNormal(m.noise.seed);
  const ports = m.fixture === 'reflection' ? 1 : 2;
  const n2 = ports * ports;
  const re = new Float64Array(n2 * frequencies.length);
  const im = new Float64Array(n2 * frequencies.length);
  for (let k = 0; k < frequencies.length; k++) {
    const size = Math.hypot(z.re[k], z.im[k]) * 10 ** ((m.noise.db * normal()) / 20);
    const phase = Math.atan2(z.im[k], z.re[k]) + (m.noise.deg * normal() * Math.PI) / 180;
    const [s11, s21] = fixtureS(m.fixture, size * Math.cos(phase), size * Math.sin(phase));
    const values = ports === 1 ? [s11] : [s11, s21, s21, s11];
    values.forEach(([a, b], i) => {
      re[n2 * k + i] = a;
      im[n2 * k + i] = b;
    });
  }
  const comments = [
    `SYNTHETIC measurement for the zfolio demo library: no part was measured.`,
    `Made by scripts/synthesise-measurements.ts from an invented sample of ${m.part} (an invented part of`,
    `Orrinvale Instruments, an invented company): ${m.truth},`,
    `measured ${m.fixture} against ${Z0} ohm, with seeded Gaussian noise of ${m.noise.db} dB rms on |Z| and`,
    `${m.noise.deg} degrees rms on the phase (seed ${m.noise.seed}). Not data from any maker or instrument.`,
  ];
  return writeTouchstone({ version: m.version, ports, parameter: 'S', format: m.format, unit: m.unit, reference: Z0, frequencies, re, im, comments, digits: 7 });
}

/** Write every demo measurement under `libraryRoot`. */
export function writeDemoMeasurements(libraryRoot: string): string[] {
  return DEMO_MEASUREMENTS.map((m) => {
    const path = join(libraryRoot, m.file);
    mkdirSync(join(path, '..'), { recursive: true });
    writeFileSync(path, synthesise(m));
    return path;
  });
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const root = resolve(process.argv[2] ?? fileURLToPath(new URL('..', import.meta.url)));
  for (const path of writeDemoMeasurements(root)) console.log(path);
}
