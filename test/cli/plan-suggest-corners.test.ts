// zfolio plan --suggest --corners on a rail of one candidate, C 1 µF ±20%, ESR 10 mΩ, ESL 1 nH, no
// mounting, regulator or plane: n in parallel is the series R-L-C closed form |R/n + j(ωL/n − 1/(ωnC))|
// (Alexander & Sadiku, ch. 14), largest at the band's low end, 100 kHz. Against 1.75 Ω one part passes at
// nominal (+0.82 dB) and misses at its low corner (C·0.8, −1.1 dB); two pass at both (+4.9 dB at the low
// corner), so planning for the worst corner places two.

import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { formatDecibels } from '../../src/units/format.js';
import { tempDir } from '../site-helpers.js';
import { run } from './fake-io.js';

const TARGET = 1.75;
const marginDb = (n: number, c: number) => {
  const w = 2 * Math.PI * 1e5;
  return 20 * Math.log10(TARGET / Math.hypot(0.01 / n, (w * 1e-9) / n - 1 / (w * n * c)));
};

let root: string;
beforeAll(() => {
  root = tempDir('suggest-corners');
  for (const d of ['parts', 'plans']) mkdirSync(join(root, d));
  writeFileSync(join(root, 'folio.yaml'), 'title: Corner planning test library (invented)\nsweep: {from: 10k, to: 1G, per-decade: 40}\n');
  writeFileSync(join(root, 'parts/c.yaml'), 'id: T-C-1U\nkind: capacitor\nnominal: 1u\ntolerance: 20%\nvoltage: 16V\nparasitics: {esr: 10m, esl: 1n}\n');
  writeFileSync(join(root, 'plans/edge.yaml'), `rail: RAIL_EDGE\nvoltage: 1V\ntarget: ${TARGET}\nband: {from: 100k, to: 10M}\nmounting: 0nH\ncapacitors: []\n`);
});

describe('plan --suggest --corners', () => {
  it('the closed form: one part misses at its low corner, two hold at every corner', () => {
    expect(marginDb(1, 1e-6)).toBeGreaterThan(0);
    expect(marginDb(1, 0.8e-6)).toBeLessThan(0);
    expect(marginDb(2, 0.8e-6)).toBeGreaterThan(0);
    expect(marginDb(2, 1.2e-6)).toBeGreaterThan(0);
  });

  it('places one at nominal and two for the worst corner, and says how it planned', async () => {
    const nominal = await run(['plan', 'RAIL_EDGE', '--suggest', '--library', root], '/');
    expect(nominal.code).toBe(0);
    expect(nominal.out).toContain('- {part: T-C-1U, count: 1, mounting: 0H}');
    const r = await run(['plan', 'RAIL_EDGE', '--suggest', '--corners', '--library', root], '/');
    expect(r.code).toBe(0);
    expect(r.out).toContain('  corners    planned for the worst corner: the set holds at every corner evaluated (2 searches, 1 corner added)');
    expect(r.out).toContain(`  corners    PASS  worst margin ${formatDecibels(marginDb(2, 0.8e-6))} at 100 kHz`);
    expect(r.out).toContain('- {part: T-C-1U, count: 2, mounting: 0H}');
    const json = JSON.parse((await run(['plan', 'RAIL_EDGE', '--suggest', '--corners', '--json', '--library', root], '/')).out);
    expect(json.cornerRounds).toEqual({ rounds: 2, scenarios: 1, stop: 'held' });
    expect(json.placements).toMatchObject([{ partId: 'T-C-1U', count: 2 }]);
    expect(json.plan.corners).toMatchObject({ method: 'all', evaluated: 2, pass: true, extremes: { 'T-C-1U': 'low' } });
    expect(json.plan.corners.worstMarginDb).toBeCloseTo(marginDb(2, 0.8e-6), 6);
  });

  it('with --max-count 1 no set holds at the corners: exit 3, and the closest set is shown with its corner verdict', async () => {
    const r = await run(['plan', 'RAIL_EDGE', '--suggest', '--corners', '--max-count', '1', '--library', root], '/');
    expect(r.code).toBe(3);
    expect(r.out).toContain('planned for the worst corner: no set holds at the corners added (2 searches, 1 corner added)');
    expect(r.out).toContain('status     cannot be met: no choice of 0 to 1 of each of 1 candidate keeps |Z| under the target across the band at nominal and at the corners added');
    expect(r.out).toContain('  closest    worst margin +0.83 dB at 100 kHz');
    expect(r.out).toContain(`  corners    FAIL (1 of 2 corners miss the target)  worst margin ${formatDecibels(marginDb(1, 0.8e-6))} at 100 kHz`);
  });

  it('against a target one part cannot meet even at nominal, it says so rather than blaming corners it never added', async () => {
    // Half the target the closed form gives one part at its nominal value misses at nominal (margin below 0).
    const lib = tempDir('suggest-corners-nominal');
    for (const d of ['parts', 'plans']) mkdirSync(join(lib, d));
    writeFileSync(join(lib, 'folio.yaml'), 'title: Corner planning test library (invented)\nsweep: {from: 10k, to: 1G, per-decade: 40}\n');
    writeFileSync(join(lib, 'parts/c.yaml'), 'id: T-C-1U\nkind: capacitor\nnominal: 1u\ntolerance: 20%\nvoltage: 16V\nparasitics: {esr: 10m, esl: 1n}\n');
    writeFileSync(join(lib, 'plans/edge.yaml'), `rail: RAIL_EDGE\nvoltage: 1V\ntarget: ${TARGET / 2}\nband: {from: 100k, to: 10M}\nmounting: 0nH\ncapacitors: []\n`);
    expect(marginDb(1, 1e-6) - 20 * Math.log10(2)).toBeLessThan(0);
    const r = await run(['plan', 'RAIL_EDGE', '--suggest', '--corners', '--max-count', '1', '--library', lib], '/');
    expect(r.code).toBe(3);
    expect(r.out).toContain('(fewest placements; 1 candidate)');
    expect(r.out).toContain('status     cannot be met: no choice of 0 to 1 of each of 1 candidate keeps |Z| under the target across the band (proven, 1 node)');
    expect(r.out).toContain('planned for the worst corner: no set holds even at nominal (1 search, 0 corners added)');
  });
});
