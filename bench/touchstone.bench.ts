// Measured data (issue 12): read a 10,001-point two-port Touchstone file and fit a capacitor to it, each
// against a plain split-and-parseFloat reading of the same text in the same run. The file is a synthetic
// shunt-thru measurement of an invented capacitor with seeded noise, made here.

import { capacitor, inductor, parallel, resistor, series } from '../src/circuit/element.js';
import { impedanceSweep } from '../src/circuit/impedance.js';
import { logSweep } from '../src/circuit/sweep.js';
import { fitImpedance } from '../src/measure/fit.js';
import { impedanceFromNetwork } from '../src/measure/fixtures.js';
import { readTouchstone } from '../src/measure/touchstone-read.js';
import { writeTouchstone } from '../src/measure/touchstone-write.js';
import { mulberry32 } from './generate.js';
import { measure, type BenchSection } from './measure.js';

/** S-parameters of a shunt impedance between two 50 Ω ports (Pozar, table 4.2), with noise on S21. */
function shuntThruFile(points: number): string {
  const model = series(resistor(0.012), inductor(0.6e-9), parallel(capacitor(1e-6), resistor(1e8)));
  const frequencies = logSweep({ fromHz: 1e3, toHz: 1e9, perDecade: (points - 1) / 6 });
  const z = impedanceSweep(model, frequencies);
  const random = mulberry32(12);
  const n = frequencies.length;
  const re = new Float64Array(4 * n);
  const im = new Float64Array(4 * n);
  for (let k = 0; k < n; k++) {
    // S11 = −Z0/(2Z + Z0), S21 = 2Z/(2Z + Z0); 0.1% noise on S21.
    const dr = 2 * z.re[k] + 50;
    const di = 2 * z.im[k];
    const d = dr * dr + di * di;
    const s11 = [(-50 * dr) / d, (50 * di) / d];
    const noise = 1 + 0.001 * (random() - 0.5);
    const s21 = [((2 * z.re[k] * dr + 2 * z.im[k] * di) / d) * noise, ((2 * z.im[k] * dr - 2 * z.re[k] * di) / d) * noise];
    [s11, s21, s21, s11].forEach(([a, b], i) => ((re[4 * k + i] = a), (im[4 * k + i] = b)));
  }
  return writeTouchstone({ version: 1, ports: 2, parameter: 'S', format: 'RI', unit: 'Hz', reference: 50, frequencies, re, im, comments: ['synthetic shunt-thru measurement of an invented 1 uF capacitor'] });
}

/** The plain way: split lines and fields, parseFloat every number, no checks. */
function plainRead(text: string): number {
  let sum = 0;
  for (const line of text.split('\n')) {
    const body = line.split('!')[0].trim();
    if (body === '' || body.startsWith('#')) continue;
    for (const field of body.split(/\s+/)) sum += parseFloat(field);
  }
  return sum;
}

const ms = (seconds: number) => `${(seconds * 1000).toFixed(1)} ms`;

export const touchstoneBench: BenchSection = {
  name: 'touchstone',
  run() {
    const text = shuntThruFile(10_001);
    let sink = 0;
    const plain = measure(() => {
      sink += plainRead(text);
    });
    const read = measure(() => {
      const r = readTouchstone(text, 'bench.s2p');
      if (!r.ok) throw new Error('the bench file did not read');
      sink += r.data.frequencies.length;
    });
    const data = readTouchstone(text, 'bench.s2p');
    if (!data.ok) throw new Error('the bench file did not read');
    let fitted: ReturnType<typeof fitImpedance> | undefined;
    const cpuBefore = process.cpuUsage();
    const fit = measure(() => {
      const impedance = impedanceFromNetwork(data.data, 'shunt-thru');
      if (!impedance.ok) throw new Error(impedance.error.message);
      fitted = fitImpedance('capacitor', impedance.impedance);
      if (fitted.ok) sink += fitted.fit.parameters.nominal;
    }, 5);
    const cpu = process.cpuUsage(cpuBefore);
    const cpuPerRun = (cpu.user + cpu.system) / 1e6 / (fit.runs + 1);
    const points = data.data.frequencies.length;
    const lines = [
      `two-port file, ${points} points, ${(text.length / 1e6).toFixed(2)} MB (split-and-parseFloat reading = 1.0×):`,
      `  split and parseFloat, no checks     ${ms(plain.secondsPerRun)}  1.0×`,
      `  readTouchstone (checked, located)   ${ms(read.secondsPerRun)}  ${(read.secondsPerRun / plain.secondsPerRun).toFixed(1)}×   goal < 50 ms: ${(read.secondsPerRun / 0.05).toFixed(2)} of budget`,
      `  S21 → Z, fit a capacitor            ${ms(fit.secondsPerRun)}  ${(fit.secondsPerRun / plain.secondsPerRun).toFixed(1)}×   goal < 200 ms: ${(fit.secondsPerRun / 0.2).toFixed(2)} of budget; CPU ${ms(cpuPerRun)} a fit`,
    ];
    if (fitted?.ok) {
      const p = fitted.fit.parameters;
      lines.push(`  fitted: C ${p.nominal?.toExponential(4)} F, ESR ${p.esr?.toExponential(4)} Ω, ESL ${p.esl?.toExponential(4)} H; rms ${fitted.fit.residual.rmsDb.toFixed(4)} dB`);
    }
    if (sink === 42) lines.push('');
    return lines;
  },
};
