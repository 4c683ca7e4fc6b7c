// A review that accepts a rail must not sign a verdict the analysis does not give: the rail's load step and
// its corners count as much as its nominal target. Here a rail meets its target everywhere in its band but
// rings when the load steps, so its droop exceeds the ripple budget; `zfolio check` warns at the decision.
//
// The rail: a regulator R = 5 mΩ + L = 10 nH, and one capacitor C = 10 µF with ESR r = 2 mΩ (no ESL, no
// mounting, no plane). Its verdicts are computed here without zfolio:
// - |Z| over the band (3 MHz to 30 MHz) from complex arithmetic on the two branches in parallel, on a dense
//   sweep: under the 10 mΩ target (Z_t = V·ripple/ΔI = 1 V × 2% / 2 A, the usual target-impedance rule).
// - The load step by fourth-order Runge-Kutta on the network's state equations (any numerical-methods text):
//   states i_r (regulator current into the rail) and v_C; L·di_r/dt = −v − R·i_r, C·dv_C/dt = (v − v_C)/r,
//   and Kirchhoff's current law i_r = i_load + (v − v_C)/r gives v = v_C + r·(i_r − i_load).

import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Complex } from 'complex.js';
import { beforeAll, describe, expect, it } from 'vitest';
import { railVerdicts } from '../../src/analysis/review-checks.js';
import { loadLibrary, type Library } from '../../src/model/library.js';
import { run } from '../cli/fake-io.js';
import { tempDir } from '../site-helpers.js';

const R = 5e-3;
const L = 10e-9;
const C = 10e-6;
const r = 2e-3;
const STEP = 2;
const RISE = 10e-9;
const TARGET = (1 * 0.02) / STEP;
const BUDGET = 1 * 0.02;

/** |Z| of the regulator branch in parallel with the capacitor branch, by complex.js. */
function railImpedance(f: number): number {
  const w = 2 * Math.PI * f;
  const reg = new Complex(R, w * L);
  const cap = new Complex(r, -1 / (w * C));
  return reg.mul(cap).div(reg.add(cap)).abs();
}

/** The largest |v| after a ramp of the load current from 0 to STEP over RISE, by RK4 with step h. */
function largestExcursion(h: number, end: number): number {
  const load = (t: number) => (t >= RISE ? STEP : (STEP * t) / RISE);
  const deriv = (t: number, ir: number, vc: number) => {
    const v = vc + r * (ir - load(t));
    return [(-v - R * ir) / L, (v - vc) / r / C, v];
  };
  let ir = 0;
  let vc = 0;
  let worst = 0;
  for (let t = 0; t < end; t += h) {
    const [a1, b1, v] = deriv(t, ir, vc);
    worst = Math.max(worst, Math.abs(v));
    const [a2, b2] = deriv(t + h / 2, ir + (h / 2) * a1, vc + (h / 2) * b1);
    const [a3, b3] = deriv(t + h / 2, ir + (h / 2) * a2, vc + (h / 2) * b2);
    const [a4, b4] = deriv(t + h, ir + h * a3, vc + h * b3);
    ir += (h / 6) * (a1 + 2 * a2 + 2 * a3 + a4);
    vc += (h / 6) * (b1 + 2 * b2 + 2 * b3 + b4);
  }
  return worst;
}

let root: string;
let library: Library;

beforeAll(() => {
  root = tempDir('review-load-step');
  for (const d of ['parts', 'plans', 'reviews']) mkdirSync(join(root, d));
  writeFileSync(join(root, 'folio.yaml'), 'title: Load-step review test library (invented)\nsweep: {from: 10k, to: 1G, per-decade: 40}\n');
  writeFileSync(join(root, 'parts/c.yaml'), 'id: T-C-10U\nkind: capacitor\nnominal: 10u\nvoltage: 16V\nparasitics: {esr: 2m}\n');
  writeFileSync(
    join(root, 'plans/ring.yaml'),
    'rail: RAIL_RING\nvoltage: 1V\nripple: 2%\nstep: 2A\nrise: 10ns\nband: {from: 3M, to: 30M}\nmounting: 0nH\nregulator: {r: 5m, l: 10nH}\ncapacitors:\n  - {part: T-C-10U, count: 1}\n',
  );
  writeFileSync(
    join(root, 'reviews/r.yaml'),
    ['title: Rail review (invented)', 'date: 2026-03-18', 'board: test board', 'reviewers: [A. Person]', 'covers: {plans: [RAIL_RING]}', 'decisions:', '  - Accept RAIL_RING as placed.', ''].join('\n'),
  );
  const loaded = loadLibrary(root);
  if (!loaded.library) throw new Error(loaded.diagnostics.map((d) => d.message).join('\n'));
  library = loaded.library;
});

describe('a rail that meets its target but not its load step', () => {
  it('the test\'s own evaluators: |Z| under target over the band, the droop above the budget', () => {
    let peak = 0;
    for (let i = 0; i <= 4000; i++) peak = Math.max(peak, railImpedance(3e6 * 10 ** (i / 4000)));
    expect(peak).toBeLessThan(TARGET * 0.7);
    const coarse = largestExcursion(1e-10, 20e-6);
    const fine = largestExcursion(5e-11, 20e-6);
    expect(Math.abs(fine / coarse - 1)).toBeLessThan(1e-4);
    expect(fine).toBeGreaterThan(BUDGET * 1.5);
  });

  it('its verdicts: the target passes, the load step fails, by the amount the simulation gives', () => {
    const v = railVerdicts(library).get('RAIL_RING')!;
    expect(v.pass).toBe(true);
    expect(v.loadStep?.pass).toBe(false);
    expect(v.loadStep?.resolved).toBe(true);
    expect(v.loadStep?.budgetV).toBeCloseTo(BUDGET, 12);
    expect(Math.abs(v.loadStep!.excursionV / largestExcursion(5e-11, 20e-6) - 1)).toBeLessThan(1e-3);
    expect(v.corners ?? null).toBeNull();
  });

  it('`zfolio check` warns at the decision that accepts it', async () => {
    const result = await run(['check', '--library', root], '/');
    expect(result.err).toMatch(/reviews\/r\.yaml:7:\d+: warning: decisions\[0\]: accepts RAIL_RING, which fails its load step \(the rail moves by up to \d+(\.\d+)? mV against a budget of 20 mV, plans\/ring\.yaml\)/);
    expect(result.err).not.toMatch(/fails its target/);
  });
});
