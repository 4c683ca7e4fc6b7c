import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { suggestPlacements } from '../../src/analysis/plan-suggest.js';
import { selectCandidates } from '../../src/model/plan-candidates.js';
import { loadLibrary } from '../../src/model/library.js';
import { mulberry32 } from '../../bench/generate.js';
import { admittanceTable, countJudge, denseSweep, everyCountVector, type RefBranch, type TabulatedBranch } from './rail-reference.js';

// `plan --suggest --corners` against exhaustive enumeration: every count vector, each judged at nominal
// and at every corner of the parts it places by the evaluator written in rail-reference.ts (complex.js,
// a dense sweep of 1,000 points per decade, golden-section refinement of every local maximum), never
// zfolio's own. The best set is the one with the fewest placements (or lowest cost) whose worst |Z| at
// nominal and at every corner is at or under the target lowered by the margin.
//
// A corner puts each placed part's value at its low or high end, and its ESR too when the part gives it
// a spread. The value's ends are the factors multiplied at their own ends (README, "Spread and corners"):
// C·(1 − t₋)·(1 − d) and C·(1 + t₊)·(1 + d), t the tolerance as written, d the class 2 temperature change
// of the code's last letter over the operating range: X7R and X5R ±15 % (EIA-198 letter R; both codes'
// ranges cover the library's default 0 °C to 70 °C). An ESR written "18m +50%/-30%" is 0.7·ESR to
// 1.5·ESR. The parts state no DC-bias table, so their capacitance at the rail is the nominal.
// Cases are seeded (mulberry32, a public-domain generator); all parts and rails are generated and invented.

const logUniform = (r: () => number, lo: number, hi: number) => 10 ** (lo + (hi - lo) * r());
const DENSE_PER_DECADE = 1000;
const TIE = 1e-6;
const TOLERANCES: [string, number, number][] = [
  ['5%', 0.05, 0.05],
  ['10%', 0.1, 0.1],
  ['20%', 0.2, 0.2],
  ['+80%/-20%', 0.2, 0.8],
];

interface GenPart {
  id: string;
  c: number;
  esr: number;
  esl: number;
  tolerance: [string, number, number];
  dielectric?: 'X7R' | 'X5R';
  esrSpread: boolean;
  cost?: number;
}

interface GenCase {
  root: string;
  parts: GenPart[];
  targetOhm: number;
  marginDb: number;
  band: [number, number];
  mounting: number;
  regulator: { r: number; l: number };
  maxCount: number;
}

const temp: string[] = [];
afterAll(() => temp.forEach((d) => rmSync(d, { recursive: true, force: true })));

/** A part's branch at one end of each quantity (-1 low, 0 nominal, +1 high), as this test reads the spread. */
function branchAt(p: GenPart, mounting: number, value: -1 | 0 | 1, esr: -1 | 0 | 1): RefBranch {
  const d = p.dielectric ? 0.15 : 0;
  const [, minus, plus] = p.tolerance;
  const k = value === 0 ? 1 : value < 0 ? (1 - minus) * (1 - d) : (1 + plus) * (1 + d);
  const e = esr === 0 || !p.esrSpread ? 1 : esr < 0 ? 0.7 : 1.5;
  return { r: p.esr * e, l: p.esl + mounting, c: p.c * k, count: 1 };
}

/** The quantities that move for a part: its value always (it states a tolerance), its ESR when spread. */
const moving = (p: GenPart) => (p.esrSpread ? 2 : 1);

function generate(seed: number): GenCase {
  const r = mulberry32(seed);
  const m = 2 + Math.floor(r() * 2); // 2..3 parts
  const withCost = r() < 0.4;
  const parts: GenPart[] = [];
  for (let i = 0; i < m; i++) {
    parts.push({
      id: `CX-C-${i}`,
      c: Number(logUniform(r, -7.3, -4.5).toPrecision(3)),
      esr: Number(logUniform(r, -2.7, -1.7).toPrecision(3)),
      esl: Number(logUniform(r, -9.7, -9.1).toPrecision(3)),
      tolerance: TOLERANCES[Math.floor(r() * TOLERANCES.length)],
      dielectric: r() < 0.5 ? (r() < 0.5 ? 'X7R' : 'X5R') : undefined,
      esrSpread: r() < 0.4,
      cost: withCost ? Number((0.01 + 0.2 * r()).toFixed(3)) : undefined,
    });
  }
  const c: GenCase = {
    root: mkdtempSync(join(tmpdir(), 'zfolio-corners-plan-')),
    parts,
    targetOhm: 1,
    marginDb: r() < 0.25 ? 1.5 : 0,
    band: [Number(logUniform(r, 5, 5.5).toPrecision(2)), Number(logUniform(r, 7.2, 7.7).toPrecision(2))],
    mounting: Number(logUniform(r, -9.7, -9.3).toPrecision(3)),
    regulator: { r: Number(logUniform(r, -3, -2.3).toPrecision(3)), l: Number(logUniform(r, -8.5, -7.8).toPrecision(3)) },
    maxCount: 3,
  };
  temp.push(c.root);
  // A target near what a random set reaches at nominal, so optima are neither empty nor everything.
  const ref = reference(c);
  const probe = c.parts.map(() => 1 + Math.floor(r() * c.maxCount));
  c.targetOhm = Number((ref.worstAtNominal(probe) * (0.7 + 0.8 * r())).toPrecision(4));
  return c;
}

function writeCase(c: GenCase): void {
  mkdirSync(join(c.root, 'parts'), { recursive: true });
  mkdirSync(join(c.root, 'plans'), { recursive: true });
  writeFileSync(join(c.root, 'folio.yaml'), 'title: Generated corner-planning library (invented)\nsweep: {from: 1k, to: 1G, per-decade: 40}\n');
  for (const p of c.parts) {
    const lines = [`id: ${p.id}`, 'kind: capacitor', `nominal: ${p.c}`, `tolerance: "${p.tolerance[0]}"`, 'voltage: 16V', `parasitics: {esr: ${p.esr}${p.esrSpread ? ' +50%/-30%' : ''}, esl: ${p.esl}}`];
    if (p.dielectric) lines.push(`dielectric: ${p.dielectric}`);
    if (p.cost !== undefined) lines.push(`cost: ${p.cost}`);
    writeFileSync(join(c.root, 'parts', `${p.id}.yaml`), lines.join('\n') + '\n');
  }
  const plan = ['rail: CX', 'voltage: 1V', `target: ${c.targetOhm}`, `band: {from: ${c.band[0]}, to: ${c.band[1]}}`, `mounting: ${c.mounting}`, `regulator: {r: ${c.regulator.r}, l: ${c.regulator.l}}`, 'capacitors: []'];
  writeFileSync(join(c.root, 'plans', 'cx.yaml'), plan.join('\n') + '\n');
}

/** The test's own evaluator of a set at nominal and at its corners. */
function reference(c: GenCase) {
  const sweep = denseSweep(c.band[0], c.band[1], DENSE_PER_DECADE);
  const fixed: RefBranch[] = [{ r: c.regulator.r, l: c.regulator.l, c: 0, count: 1 }];
  const judge = countJudge(sweep, fixed);
  const cache = new Map<string, TabulatedBranch>();
  const tabulated = (i: number, value: -1 | 0 | 1, esr: -1 | 0 | 1) => {
    const key = `${i}/${value}/${esr}`;
    if (!cache.has(key)) {
      const branch = branchAt(c.parts[i], c.mounting, value, esr);
      cache.set(key, { branch, y: admittanceTable(branch, sweep) });
    }
    return cache.get(key)!;
  };
  /** Worst |Z| of `counts` with part i at ends[i] = [value, esr]. */
  const worst = (counts: readonly number[], ends: readonly (readonly [-1 | 0 | 1, -1 | 0 | 1])[], refineAbove: number) =>
    judge(counts.map((_, i) => tabulated(i, ends[i][0], ends[i][1])), counts, refineAbove).impedanceOhm;
  const nominalEnds = c.parts.map(() => [0, 0] as const);
  /** Nominal, then every corner of the placed parts' moving quantities (unplaced parts do not matter). */
  const worstOverCorners = (counts: readonly number[], refineAbove = 0) => {
    let out = worst(counts, nominalEnds, refineAbove);
    const placed = c.parts.map((_, i) => i).filter((i) => counts[i] > 0);
    const k = placed.reduce((sum, i) => sum + moving(c.parts[i]), 0);
    for (let corner = 0; corner < 2 ** k; corner++) {
      const ends = c.parts.map(() => [0, 0] as [-1 | 0 | 1, -1 | 0 | 1]);
      let bit = 0;
      for (const i of placed) {
        ends[i][0] = (corner >> bit++) & 1 ? 1 : -1;
        if (c.parts[i].esrSpread) ends[i][1] = (corner >> bit++) & 1 ? 1 : -1;
      }
      out = Math.max(out, worst(counts, ends, refineAbove));
    }
    return out;
  };
  return { worstAtNominal: (counts: readonly number[]) => worst(counts, nominalEnds, 0), worstOverCorners, byCost: c.parts.every((p) => p.cost !== undefined) };
}

/** Every count vector: the best objective at nominal only, and at nominal and every corner. */
function enumerate(c: GenCase) {
  const ref = reference(c);
  const limit = c.targetOhm * 10 ** (-c.marginDb / 20);
  const weight = (i: number) => (ref.byCost ? c.parts[i].cost! : 1);
  const m = c.parts.length;
  // Set inside the callback below, so typed here rather than narrowed to their first values.
  let nominal = null as number | null;
  let corners = null as number | null;
  let nearTie = false;
  everyCountVector(m, c.maxCount, (counts) => {
    const objective = counts.reduce((sum, n, i) => sum + n * weight(i), 0);
    const atNominal = ref.worstAtNominal(counts);
    if (atNominal <= limit && (nominal === null || objective < nominal)) nominal = objective;
    if (corners !== null && objective >= corners) return;
    const worst = ref.worstOverCorners(counts, limit / 2);
    if (Math.abs(worst / limit - 1) < TIE || Math.abs(atNominal / limit - 1) < TIE) nearTie = true;
    if (worst <= limit) corners = objective;
  });
  return { ref, nominal, corners, nearTie, limit, weight };
}

describe('plan --suggest --corners against exhaustive enumeration of sets and corners', () => {
  const seeds = Array.from({ length: 32 }, (_, i) => 9100 + i);
  const tally = { meetable: 0, unmeetable: 0, costlier: 0, ties: 0, byCost: 0, withMargin: 0 };

  it.each(seeds)('seed %i: the same optimal objective, and the set holds at nominal and every corner', (seed) => {
    const c = generate(seed);
    writeCase(c);
    const { library, diagnostics } = loadLibrary(c.root);
    expect(library, diagnostics.map((d) => d.message).join('\n')).toBeDefined();
    const { ref, nominal, corners, nearTie, limit, weight } = enumerate(c);
    if (nearTie) {
      tally.ties++;
      return;
    }
    const plan = library!.plans[0];
    const selection = selectCandidates(plan, library!.parts, { only: [], derating: library!.settings.derating });
    const s = suggestPlacements(plan, selection, { maxCount: c.maxCount, marginDb: c.marginDb, perDecade: 40, corners: library!.settings.temperature });
    expect(s.cornerRounds).not.toBeNull();
    if (ref.byCost) tally.byCost++;
    if (c.marginDb > 0) tally.withMargin++;
    if (corners === null) {
      tally.unmeetable++;
      expect(s.figures).toBeNull();
      expect(s.status).toBe('unmeetable');
      expect(s.cornerRounds!.stop).toBe('no-set');
      return;
    }
    tally.meetable++;
    if (nominal !== null && corners > nominal + 1e-9) tally.costlier++;
    expect(s.status).toBe('optimal');
    expect(s.cornerRounds!.stop).toBe('held');
    const counts = c.parts.map((p) => s.placements.find((x) => x.part.id === p.id)?.count ?? 0);
    const objective = counts.reduce((sum, n, i) => sum + n * weight(i), 0);
    expect(Math.abs(objective - corners)).toBeLessThanOrEqual(1e-9 * Math.max(1, corners));
    expect(ref.worstOverCorners(counts)).toBeLessThanOrEqual(limit);
    // zfolio's own corner verdict for the set agrees with the reference's worst over its corners.
    const f = s.figures!;
    expect(f.corners!.pass).toBe(true);
    const worstOhm = Math.max(f.worstImpedanceOhm, f.corners!.worstImpedanceOhm);
    expect(Math.abs(worstOhm / ref.worstOverCorners(counts) - 1)).toBeLessThan(1e-6);
  });

  it('the cases cover sets that cost more at the corners than at nominal, unmeetable rails, costs and margins', () => {
    expect(tally.ties).toBeLessThanOrEqual(2);
    expect(tally.meetable + tally.unmeetable + tally.ties).toBe(seeds.length);
    expect(tally.meetable).toBeGreaterThanOrEqual(10);
    expect(tally.costlier).toBeGreaterThanOrEqual(5);
    expect(tally.unmeetable).toBeGreaterThanOrEqual(1);
    expect(tally.byCost).toBeGreaterThanOrEqual(3);
    expect(tally.withMargin).toBeGreaterThanOrEqual(3);
  });
});
