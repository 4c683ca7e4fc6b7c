import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { suggestPlacements } from '../../src/analysis/plan-suggest.js';
import { selectCandidates } from '../../src/model/plan-candidates.js';
import { loadLibrary } from '../../src/model/library.js';
import { mulberry32 } from '../../bench/generate.js';
import { admittanceTable, countJudge, denseSweep, everyCountVector, type RefBranch } from './rail-reference.js';

// `plan --suggest` (candidates, mountings, DC bias, margin, the planner) against exhaustive enumeration of
// every count vector, each judged by the evaluator written in rail-reference.ts (complex.js element
// impedances, a dense sweep of 1,000 points per decade and golden-section refinement of every local
// maximum) — never zfolio's own rail evaluation. The test resolves each candidate's mounting and DC-bias
// fraction itself, from the numbers it wrote into the library:
//   mounting: the plan entries that name the part (each distinct one), else the part file's `mounting`,
//   else the plan's `mounting-by-package`, else the plan's `mounting` (README, "A rail plan");
//   DC bias: linear between table points, from 100 % at 0 V, the last fraction held above the table
//   (common practice: nominal capacitance is stated without DC bias).
// Cases are seeded (mulberry32, a public-domain generator), so every run checks the same cases. All parts
// and rails are generated and invented.

const logUniform = (r: () => number, lo: number, hi: number) => 10 ** (lo + (hi - lo) * r());
const PACKAGES = ['0402', '0603', '0805', '1206'];
const DENSE_PER_DECADE = 1000;
// A case where some set's worst |Z| lies within this of the target is a near tie that rounding could decide
// either way: it is not counted (and there must be few such cases).
const TIE = 1e-6;

interface GenPart {
  id: string;
  c: number;
  esr: number;
  esl: number;
  pkg: string;
  mounting?: number;
  bias?: [number, number][];
  cost?: number;
}

interface GenCase {
  root: string;
  parts: GenPart[];
  railV: number;
  targetOhm: number;
  marginDb: number;
  band: [number, number];
  railMounting: number;
  byPackage: Record<string, number>;
  entries: { id: string; mounting?: number }[];
  regulator: { r: number; l: number };
  plane?: { c: number; r: number };
  maxCount: number;
  allowBiasExtrapolation: boolean;
  perDecade: number;
}

/** DC-bias fraction as this test reads a table (see the header). */
function fractionAt(table: [number, number][] | undefined, v: number): number {
  if (!table) return 1;
  const points = table[0][0] > 0 ? [[0, 1] as [number, number], ...table] : table;
  if (v >= points[points.length - 1][0]) return points[points.length - 1][1];
  let i = 1;
  while (points[i][0] < v) i++;
  const [va, fa] = points[i - 1];
  const [vb, fb] = points[i];
  return fa + ((v - va) / (vb - va)) * (fb - fa);
}

const temp: string[] = [];
afterAll(() => temp.forEach((d) => rmSync(d, { recursive: true, force: true })));

function generate(seed: number): GenCase {
  const r = mulberry32(seed);
  const m = 2 + Math.floor(r() * 3); // 2..4 parts
  const railV = [0.9, 1.2, 1.8, 3.3][Math.floor(r() * 4)];
  const withCost = r() < 0.5;
  const parts: GenPart[] = [];
  for (let i = 0; i < m; i++) {
    const p: GenPart = {
      id: `EX-C-${i}`,
      c: Number(logUniform(r, -7.5, -4.3).toPrecision(3)),
      esr: Number(logUniform(r, -2.7, -1.5).toPrecision(3)),
      esl: Number(logUniform(r, -9.7, -8.9).toPrecision(3)),
      pkg: PACKAGES[Math.floor(r() * PACKAGES.length)],
    };
    if (r() < 0.3) p.mounting = Number(logUniform(r, -9.5, -8.9).toPrecision(3));
    if (r() < 0.6) {
      const end = [1, 2.5, 6.3][Math.floor(r() * 3)];
      p.bias = [
        [end / 2, Number((0.85 + 0.12 * r()).toFixed(2))],
        [end, Number((0.45 + 0.3 * r()).toFixed(2))],
      ];
    }
    if (withCost) p.cost = Number((0.005 + 0.2 * r()).toFixed(3));
    parts.push(p);
  }
  const byPackage: Record<string, number> = {};
  for (const pkg of PACKAGES) if (r() < 0.3) byPackage[pkg] = Number(logUniform(r, -9.8, -9.2).toPrecision(3));
  const entries: GenCase['entries'] = [];
  for (const p of parts) {
    if (r() < 0.5) entries.push(r() < 0.6 ? { id: p.id, mounting: Number(logUniform(r, -9.8, -9).toPrecision(3)) } : { id: p.id });
    // Now and then the same part at a second mounting.
    if (r() < 0.15) entries.push({ id: p.id, mounting: Number(logUniform(r, -9.8, -9).toPrecision(3)) });
  }
  const c: GenCase = {
    root: mkdtempSync(join(tmpdir(), 'zfolio-exhaustive-')),
    parts,
    railV,
    targetOhm: 1,
    marginDb: [0, 0, 1.5, 3][Math.floor(r() * 4)],
    band: [Number(logUniform(r, 5, 5.7).toPrecision(2)), Number(logUniform(r, 7.3, 8).toPrecision(2))],
    railMounting: Number(logUniform(r, -9.7, -9.3).toPrecision(3)),
    byPackage,
    entries,
    regulator: { r: Number(logUniform(r, -3, -2.3).toPrecision(3)), l: Number(logUniform(r, -8.5, -7.6).toPrecision(3)) },
    plane: r() < 0.5 ? { c: Number(logUniform(r, -8.5, -7.5).toPrecision(3)), r: 2e-3 } : undefined,
    maxCount: 2 + Math.floor(r() * 2),
    allowBiasExtrapolation: r() < 0.5,
    perDecade: 40,
  };
  temp.push(c.root);
  // A target near what a random set reaches, so optima are neither empty nor everything.
  const reference = referenceProblem(c);
  const probe = reference.candidates.map(() => Math.floor(r() * (c.maxCount + 1)));
  c.targetOhm = Number((reference.worst(probe).impedanceOhm * (0.5 + 1.0 * r())).toPrecision(4));
  return c;
}

/** The library and plan files of a case (bare numbers are SI base units). */
function writeCase(c: GenCase): void {
  mkdirSync(join(c.root, 'parts'), { recursive: true });
  mkdirSync(join(c.root, 'plans'), { recursive: true });
  writeFileSync(join(c.root, 'folio.yaml'), `title: Generated exhaustive-check library (invented)\nsweep: {from: 1k, to: 1G, per-decade: ${c.perDecade}}\n`);
  for (const p of c.parts) {
    const lines = [`id: ${p.id}`, 'kind: capacitor', `nominal: ${p.c}`, 'voltage: 16V', `package: "${p.pkg}"`, `parasitics: {esr: ${p.esr}, esl: ${p.esl}}`];
    if (p.mounting !== undefined) lines.push(`mounting: ${p.mounting}`);
    if (p.bias) lines.push(`dc-bias: {${p.bias.map(([v, f]) => `${v}V: ${f}`).join(', ')}}`);
    if (p.cost !== undefined) lines.push(`cost: ${p.cost}`);
    writeFileSync(join(c.root, 'parts', `${p.id}.yaml`), lines.join('\n') + '\n');
  }
  const plan = [
    'rail: EX',
    `voltage: ${c.railV}V`,
    `target: ${c.targetOhm}`,
    `band: {from: ${c.band[0]}, to: ${c.band[1]}}`,
    `mounting: ${c.railMounting}`,
    ...(Object.keys(c.byPackage).length > 0 ? [`mounting-by-package: {${Object.entries(c.byPackage).map(([k, v]) => `"${k}": ${v}`).join(', ')}}`] : []),
    `regulator: {r: ${c.regulator.r}, l: ${c.regulator.l}}`,
    ...(c.plane ? [`plane: {c: ${c.plane.c}, r: ${c.plane.r}}`] : []),
    c.entries.length > 0 ? 'capacitors:' : 'capacitors: []',
    ...c.entries.map((e) => `  - {part: ${e.id}, count: 1${e.mounting !== undefined ? `, mounting: ${e.mounting}` : ''}}`),
  ];
  writeFileSync(join(c.root, 'plans', 'ex.yaml'), plan.join('\n') + '\n');
}

interface RefCandidate {
  id: string;
  mounting: number;
  branch: RefBranch;
  weight: number;
}

/** The case as this test understands it: candidates with their mountings and fractions, and an evaluator. */
function referenceProblem(c: GenCase) {
  const defaultMounting = (p: GenPart) => p.mounting ?? c.byPackage[p.pkg] ?? c.railMounting;
  const usable = c.parts.filter((p) => c.allowBiasExtrapolation || !p.bias || c.railV <= p.bias[p.bias.length - 1][0]);
  const byCost = usable.length > 0 && usable.every((p) => p.cost !== undefined);
  const candidates: RefCandidate[] = [];
  for (const p of usable) {
    const named = c.entries.filter((e) => e.id === p.id).map((e) => e.mounting ?? defaultMounting(p));
    const mountings = named.length > 0 ? [...new Set(named)] : [defaultMounting(p)];
    for (const mounting of mountings) {
      candidates.push({ id: p.id, mounting, branch: { r: p.esr, l: p.esl + mounting, c: p.c * fractionAt(p.bias, c.railV), count: 1 }, weight: byCost ? p.cost! : 1 });
    }
  }
  const fixed: RefBranch[] = [{ r: c.regulator.r, l: c.regulator.l, c: 0, count: 1 }];
  if (c.plane) fixed.push({ r: c.plane.r, l: 0, c: c.plane.c, count: 1 });
  const sweep = denseSweep(c.band[0], c.band[1], DENSE_PER_DECADE);
  const judge = countJudge(sweep, fixed);
  const tabulated = candidates.map((cand) => ({ branch: cand.branch, y: admittanceTable(cand.branch, sweep) }));
  const worst = (counts: readonly number[], refineAbove = 0) => judge(tabulated, counts, refineAbove);
  return { candidates, worst, byCost };
}

/** Every count vector: the best objective among sets under the (margin-lowered) target, and the best worst |Z|. */
function enumerate(c: GenCase) {
  const ref = referenceProblem(c);
  const m = ref.candidates.length;
  const limit = c.targetOhm * 10 ** (-c.marginDb / 20);
  // Set inside the callback below, so typed here rather than narrowed to their first values.
  let best = null as { objective: number; counts: number[] } | null;
  let closest = Infinity;
  let nearTie = false;
  everyCountVector(m, c.maxCount, (counts) => {
    // Peaks far under the target cannot decide anything: refine only those within a factor of two of it.
    const worst = ref.worst(counts, limit / 2).impedanceOhm;
    if (Math.abs(worst / limit - 1) < TIE) nearTie = true;
    closest = Math.min(closest, worst);
    if (worst > limit) return;
    const objective = counts.reduce((sum, n, i) => sum + n * ref.candidates[i].weight, 0);
    if (!best || objective < best.objective) best = { objective, counts: [...counts] };
  });
  return { ref, best, closest, nearTie, limit };
}

describe('plan --suggest against exhaustive enumeration with an independent evaluator', () => {
  const seeds = Array.from({ length: 36 }, (_, i) => 7000 + i);
  const tally = { meetable: 0, unmeetable: 0, nontrivial: 0, ties: 0, ownMounting: 0, twoMountings: 0, withMargin: 0 };

  it.each(seeds)('seed %i: same candidates and mountings, same feasibility, same optimal objective', (seed) => {
    const c = generate(seed);
    writeCase(c);
    const { library, diagnostics } = loadLibrary(c.root);
    expect(library, diagnostics.map((d) => d.message).join('\n')).toBeDefined();
    const { ref, best, closest, nearTie, limit } = enumerate(c);
    if (nearTie) {
      tally.ties++;
      return;
    }
    const plan = library!.plans[0];
    const selection = selectCandidates(plan, library!.parts, { only: [], allowBiasExtrapolation: c.allowBiasExtrapolation, derating: library!.settings.derating });
    const s = suggestPlacements(plan, selection, { maxCount: c.maxCount, marginDb: c.marginDb, perDecade: c.perDecade });
    // The candidates, each at the mounting this test resolved for it.
    const sort = (xs: [string, number][]) => xs.sort((a, b) => a[0].localeCompare(b[0]) || a[1] - b[1]);
    const theirs = sort(s.candidates.map((k) => [k.part.id, k.mountingH]));
    const ours = sort(ref.candidates.map((k) => [k.id, k.mounting]));
    expect(theirs.map(([id]) => id)).toEqual(ours.map(([id]) => id));
    theirs.forEach(([, h], i) => expect(Math.abs(h / ours[i][1] - 1)).toBeLessThan(1e-12));
    expect(s.objective).toBe(ref.byCost ? 'cost' : 'count');
    if (s.candidates.some((k) => k.mountingFrom !== 'rail')) tally.ownMounting++;
    if (new Set(s.candidates.map((k) => k.part.id)).size < s.candidates.length) tally.twoMountings++;
    if (c.marginDb > 0) tally.withMargin++;

    /** A set zfolio reports, judged by the reference: its worst |Z|. */
    const judged = (placements: typeof s.placements) => {
      const counts = ref.candidates.map((k) => placements.find((p) => p.part.id === k.id && Math.abs(p.mountingH / k.mounting - 1) < 1e-12)?.count ?? 0);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(placements.reduce((a, p) => a + p.count, 0));
      return ref.worst(counts).impedanceOhm;
    };
    if (best) {
      tally.meetable++;
      if (best.objective > 0) tally.nontrivial++;
      expect(s.status).toBe('optimal');
      const objective = s.placements.reduce((sum, p) => sum + p.count * (ref.byCost ? p.part.cost! : 1), 0);
      expect(Math.abs(objective - best.objective)).toBeLessThanOrEqual(1e-9 * Math.max(1, best.objective));
      expect(judged(s.placements)).toBeLessThanOrEqual(limit);
      // zfolio's own figure for the set agrees with the reference's.
      expect(Math.abs(s.figures!.worstImpedanceOhm / judged(s.placements) - 1)).toBeLessThan(1e-6);
    } else {
      tally.unmeetable++;
      expect(s.status).toBe('unmeetable');
      expect(s.figures).toBeNull();
      // The closest set shown: its worst |Z| is what the reference finds for it, and no better than the best
      // any set reaches (it is the best found, not claimed the best possible).
      const near = judged(s.closest!.placements);
      expect(Math.abs(s.closest!.figures.worstImpedanceOhm / near - 1)).toBeLessThan(1e-6);
      expect(near).toBeGreaterThanOrEqual(closest * (1 - 1e-9));
    }
  });

  it('the cases cover meetable and unmeetable rails, own mountings, parts at two mountings and margins', () => {
    expect(tally.ties).toBeLessThanOrEqual(2);
    expect(tally.meetable + tally.unmeetable + tally.ties).toBe(seeds.length);
    expect(tally.meetable).toBeGreaterThanOrEqual(15);
    expect(tally.nontrivial).toBeGreaterThanOrEqual(10);
    expect(tally.unmeetable).toBeGreaterThanOrEqual(3);
    expect(tally.ownMounting).toBeGreaterThanOrEqual(20);
    expect(tally.twoMountings).toBeGreaterThanOrEqual(2);
    expect(tally.withMargin).toBeGreaterThanOrEqual(8);
  });
});
