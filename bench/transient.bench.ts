// Load steps (issue 14): the transient of a rail of ten distinct generated capacitors (plus regulator and
// plane) over 10,000 time points, against one impedance evaluation of the same rail in the same run.
// Every part here is generated and invented.

import { capacitor, inductor, parallel, resistor, series } from '../src/circuit/element.js';
import { logSweep } from '../src/circuit/sweep.js';
import { evaluateRail, placementElement, planeElement, regulatorElement, type RailBranch } from '../src/analysis/rail.js';
import { railTransient, riseForBandwidth, transientCurves } from '../src/analysis/transient.js';
import { mulberry32 } from './generate.js';
import { measure, type BenchSection } from './measure.js';

const E6 = [1, 1.5, 2.2, 3.3, 4.7, 6.8];

/** Ten distinct capacitors, 1 nF to 680 µF, ESR falling and ESL rising with size, with leakage; invented. */
function generatedRail(): RailBranch[] {
  const random = mulberry32(1414);
  const branches: RailBranch[] = [
    { kind: 'regulator', label: 'regulator', element: regulatorElement(1e-3, 15e-9), count: 1 },
    { kind: 'plane', label: 'plane', element: planeElement(15e-9, 2e-3), count: 1 },
  ];
  for (let i = 0; i < 10; i++) {
    const c = E6[Math.floor(random() * 6)] * 10 ** (-9 + Math.floor(i / 2) + (i % 2) * 0.5);
    const esr = 0.002 + 0.02 * random();
    const esl = (0.2 + 0.8 * random()) * 1e-9;
    const model = series(resistor(esr), inductor(esl), parallel(capacitor(c), resistor(1e8 / (c * 1e6 + 1))));
    branches.push({ kind: 'capacitor', label: `C${i}`, element: placementElement(model, 0.3e-9), count: 1 + Math.floor(random() * 8) });
  }
  return branches;
}

const ms = (seconds: number) => `${(seconds * 1000).toFixed(2)} ms`;

export const transientBench: BenchSection = {
  name: 'transient',
  run() {
    const branches = generatedRail();
    const band = { fromHz: 100e3, toHz: 40e6 };
    const sweep = logSweep({ ...band, perDecade: 200 });
    const riseS = riseForBandwidth(band.toHz);
    let sink = 0;
    // Warm-up of both alike: the first runs compile (JIT) the numeric loops.
    for (let i = 0; i < 20; i++) sink += evaluateRail(branches, 0.01, sweep).worst.marginDb;
    for (let i = 0; i < 10; i++) sink += transientCurves(railTransient(branches, { stepA: 2.5, riseS, range: band }), [1e-9]).voltage[0];
    const impedance = measure(() => {
      sink += evaluateRail(branches, 0.01, sweep).worst.marginDb;
    });
    let points = 0;
    let fitError = 0;
    // CPU time too: on a machine shared with other work, the wall time counts the waits for a core.
    const cpuBefore = process.cpuUsage();
    const transient = measure(() => {
      const t = railTransient(branches, { stepA: 2.5, riseS, range: band });
      const times = Float64Array.from({ length: 10_000 }, (_, i) => (t.durationS * i) / 9_999);
      const curves = transientCurves(t, times);
      sink += t.droopV + curves.voltage[5000] + curves.shares[0][5000];
      points = times.length;
      fitError = t.fitError;
    }, 10);
    const cpu = process.cpuUsage(cpuBefore);
    const cpuPerRun = (cpu.user + cpu.system) / 1e6 / (transient.runs + 1);
    const t = railTransient(branches, { stepA: 2.5, riseS, range: band });
    const lines = [
      `transient of a rail of 10 distinct capacitors + regulator + plane (${t.impedance.poles.length} poles), step 2.5 A, rise ${(riseS * 1e9).toFixed(2)} ns (goal < 50 ms):`,
      `  one impedance evaluation (|Z| over ${sweep.length} frequencies, peaks)  ${ms(impedance.secondsPerRun).padStart(9)}`,
      `  transient: fit, droop, settling, and v(t) with every branch's current at ${points} times  ${ms(transient.secondsPerRun).padStart(9)}  = ${(transient.secondsPerRun / impedance.secondsPerRun).toFixed(1)}× one impedance evaluation, ${(transient.secondsPerRun / 0.05).toFixed(2)} of the goal`,
      `  the same in CPU time per run (this process, one core)  ${ms(cpuPerRun).padStart(9)}  = ${(cpuPerRun / 0.05).toFixed(2)} of the goal`,
      `  droop ${(t.droopV * 1e3).toFixed(2)} mV at ${(t.droopAtS * 1e6).toFixed(3)} µs, settled at ${t.settleS === null ? 'never' : `${(t.settleS * 1e6).toFixed(2)} µs`}, fit error ${fitError.toExponential(1)}`,
    ];
    if (sink === 42) lines.push('');
    return lines;
  },
};
