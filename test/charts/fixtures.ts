// Invented demo parts (no real part numbers or makers) analysed over a sweep, for the chart tests.

import { analysePart, type PartAnalysis } from '../../src/analysis/part-figures.js';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import type { SweepSpec } from '../../src/circuit/sweep.js';
import type { Part } from '../../src/model/part.js';

export const SWEEP: SweepSpec = { fromHz: 1e3, toHz: 1e10, perDecade: 800 / 7 };

/** Only the fields the analysis and the charts read; the rest of Part is not needed here. */
function part(id: string, kind: Part['kind'], behavesAs: Part['behavesAs'], nominal: number | undefined, network: Element, title = id): Part {
  return { id, kind, behavesAs, title, nominal, network, parameters: {}, dcBias: [], tags: [] } as unknown as Part;
}

/** 100 nF, ESR 18 mΩ, ESL 0.45 nH, leakage 1 GΩ: SRF = 1/(2π√(LC)) ≈ 23.7 MHz. */
export const capacitorPart = part('DEMO-C-100N', 'capacitor', 'capacitor', 100e-9, series(resistor(0.018), inductor(0.45e-9), parallel(capacitor(100e-9), resistor(1e9))));
/** 10 µH, DCR 50 mΩ, Cp 2 pF, Rp 20 kΩ: parallel SRF ≈ 35.6 MHz. */
export const inductorPart = part('DEMO-L-10U', 'inductor', 'inductor', 10e-6, parallel(series(resistor(0.05), inductor(10e-6)), capacitor(2e-12), resistor(20e3)));
/** A bead: rdc 30 mΩ + (r 600 Ω ‖ l 1 µH ‖ c 1.5 pF). */
export const beadPart = part('DEMO-FB-600', 'bead', 'bead', 600, series(resistor(0.03), parallel(resistor(600), inductor(1e-6), capacitor(1.5e-12))));
/** 1 kΩ with 0.6 nH and 0.08 pF. */
export const resistorPart = part('DEMO-R-1K', 'resistor', 'resistor', 1000, parallel(series(resistor(1000), inductor(0.6e-9)), capacitor(0.08e-12)));
/** Two capacitors in parallel, each with its ESL: a parallel anti-resonance between two series ones. */
export const networkPart = part(
  'DEMO-NET-PAIR',
  'network',
  'capacitor',
  10.1e-6,
  parallel(series(resistor(0.004), inductor(1.1e-9), capacitor(10e-6)), series(resistor(0.03), inductor(0.4e-9), capacitor(100e-9))),
);

export function analysed(p: Part, sweep: SweepSpec = SWEEP): PartAnalysis {
  return analysePart(p, sweep, 0.1);
}

export const ALL_PARTS = [capacitorPart, inductorPart, beadPart, resistorPart, networkPart];

/**
 * An invented rail for the rail chart: a regulator (1 mΩ + 20 nH), a plane (8 nF, 2 mΩ) and two groups of
 * capacitors, each group's count in parallel with 0.35 nH mounting inductance per placement. The branch
 * impedances are series R-L-C (or R-L); the total is their parallel combination. Peaks are the local maxima
 * of |Z| on the sweep, which is all a chart needs (the rail engine refines them).
 */
export function demoRail(): import('../../src/charts/rail-chart.js').RailChartData {
  const f = logSweepArray(1e4, 1e9, 120);
  const branch = (r: number, l: number, c: number | null) =>
    f.map((hz) => {
      const w = 2 * Math.PI * hz;
      return { re: r, im: w * l - (c === null ? 0 : 1 / (w * c)) };
    });
  const groups = [
    { label: 'regulator (1 mΩ, 20 nH)', z: branch(1e-3, 20e-9, null) },
    { label: '4 × DEMO-C-10U', z: branch(0.005 / 4, (0.4e-9 + 0.5e-9) / 4, 4 * 10e-6) },
    { label: '12 × DEMO-C-100N', z: branch(0.018 / 12, (0.45e-9 + 0.35e-9) / 12, 12 * 100e-9) },
    { label: 'plane (8 nF)', z: branch(2e-3, 0.01e-9, 8e-9) },
  ];
  const total = f.map((_, i) => {
    let gr = 0;
    let gi = 0;
    for (const g of groups) {
      const { re, im } = g.z[i];
      const d = re * re + im * im;
      gr += re / d;
      gi += -im / d;
    }
    return 1 / Math.hypot(gr, gi);
  });
  const peaks: { frequencyHz: number; impedanceOhm: number }[] = [];
  for (let i = 1; i < f.length - 1; i++) if (total[i] > total[i - 1] && total[i] > total[i + 1]) peaks.push({ frequencyHz: f[i], impedanceOhm: total[i] });
  return {
    rail: 'DEMO_CORE',
    frequencies: f,
    totalOhm: total,
    target: 4.5e-3,
    branches: groups.map((g) => ({ label: g.label, ohm: g.z.map((z) => Math.hypot(z.re, z.im)) })),
    peaks,
    band: { fromHz: 1e5, toHz: 2e8 },
  };
}

function logSweepArray(from: number, to: number, perDecade: number): number[] {
  const n = Math.round(Math.log10(to / from) * perDecade);
  return Array.from({ length: n + 1 }, (_, i) => from * 10 ** (i / perDecade));
}
