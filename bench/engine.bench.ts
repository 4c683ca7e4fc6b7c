// The sweep kernel and library loading (issue: part models and the impedance engine).

import { capacitor, inductor, parallel, resistor, series, type Element } from '../src/circuit/element.js';
import { impedanceSweep, impedanceSweepInto } from '../src/circuit/impedance.js';
import { logSweep } from '../src/circuit/sweep.js';
import { loadLibrary } from '../src/model/library.js';
import { writeGeneratedLibrary } from './generate.js';
import { measure, type BenchSection } from './measure.js';

// The plain way: one object per complex number, a fresh object per operation, one frequency at a time.
class PlainComplex {
  constructor(
    readonly re: number,
    readonly im: number,
  ) {}
  add(o: PlainComplex) {
    return new PlainComplex(this.re + o.re, this.im + o.im);
  }
  inverse() {
    const d = this.re * this.re + this.im * this.im;
    return new PlainComplex(this.re / d, -this.im / d);
  }
}

function plainImpedance(e: Element, w: number): PlainComplex {
  switch (e.type) {
    case 'R':
      return new PlainComplex(e.ohms, 0);
    case 'L':
      return new PlainComplex(0, w * e.henries);
    case 'C':
      return new PlainComplex(0, -1 / (w * e.farads));
    case 'series':
      return e.parts.reduce((sum, p) => sum.add(plainImpedance(p, w)), new PlainComplex(0, 0));
    case 'parallel':
      return e.parts.reduce((sum, p) => sum.add(plainImpedance(p, w).inverse()), new PlainComplex(0, 0)).inverse();
  }
}

export const engineBench: BenchSection = {
  name: 'engine',
  run() {
    const lines: string[] = [];
    // The capacitor model: esr + esl + (C ‖ epr), over a 1,000-point sweep.
    const model = series(resistor(0.018), inductor(0.45e-9), parallel(capacitor(100e-9), resistor(1e9)));
    const freqs = logSweep({ fromHz: 1e3, toHz: 1e10, perDecade: 1000 / 7 });
    const points = freqs.length;
    let sink = 0;
    const fast = measure(() => {
      const z = impedanceSweep(model, freqs);
      sink += z.re[7];
    });
    const re = new Float64Array(points);
    const im = new Float64Array(points);
    const reused = measure(() => {
      impedanceSweepInto(model, freqs, re, im);
      sink += re[7];
    });
    const plain = measure(() => {
      for (let i = 0; i < points; i++) sink += plainImpedance(model, 2 * Math.PI * freqs[i]).re;
    });
    const fastRate = points / fast.secondsPerRun;
    const reusedRate = points / reused.secondsPerRun;
    const plainRate = points / plain.secondsPerRun;
    const rate = (r: number) => `${(r / 1e6).toFixed(1)} M points/s`;
    lines.push(`sweep kernel, capacitor model, ${points}-point sweep, one core (goal ≥ 20 M points/s, aim ≥ 20× the object-per-complex baseline):`);
    lines.push(`  object-per-complex baseline            ${rate(plainRate)}  1.0×`);
    lines.push(`  impedanceSweep (allocates its result)  ${rate(fastRate)}  ${(fastRate / plainRate).toFixed(1)}×`);
    lines.push(`  impedanceSweepInto (reused arrays)     ${rate(reusedRate)}  ${(reusedRate / plainRate).toFixed(1)}×`);

    const root = writeGeneratedLibrary(1000);
    const load = measure(() => {
      const { library } = loadLibrary(root);
      if (!library || library.parts.length !== 1000) throw new Error('generated library failed to load');
    }, 3);
    lines.push(`load + validate 1,000 generated part files: ${(load.secondsPerRun * 1000).toFixed(0)} ms (goal < 1 s: ${(load.secondsPerRun / 1).toFixed(2)} of budget)`);
    if (sink === 42) lines.push('');
    return lines;
  },
};
