import { cpSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { targetImpedance } from '../../src/analysis/rail.js';

// `zfolio plan` run in-process on the fixture library (invented parts and rails).
const fixture = fileURLToPath(new URL('../fixtures/rail-library', import.meta.url));

async function run(args: string[], cwd = fixture) {
  let out = '';
  let err = '';
  const code = await main(args, { cwd, env: {}, isTTY: false, out: (t) => (out += t), err: (t) => (err += t) });
  return { code, out, err };
}

const temp: string[] = [];
afterAll(() => temp.forEach((d) => rmSync(d, { recursive: true, force: true })));
const tempDir = () => {
  const dir = mkdtempSync(join(tmpdir(), 'zfolio-plan-cli-'));
  temp.push(dir);
  return dir;
};

describe('exit status', () => {
  it('is 0 when every plan checked passes and 3 when one fails its target', async () => {
    expect((await run(['plan', 'VDD_TEST'])).code).toBe(0);
    expect((await run(['plan', 'VDD_WEAK'])).code).toBe(3);
    expect((await run(['plan'])).code).toBe(3);
  });
});

describe('zfolio plan --json', () => {
  it('has the keys targetOhm, pass, worstMarginDb, worstFrequencyHz and peaks [{frequencyHz, impedanceOhm}]', async () => {
    const { code, out } = await run(['plan', 'VDD_TEST', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(Object.keys(json)).toEqual(expect.arrayContaining(['targetOhm', 'pass', 'worstMarginDb', 'worstFrequencyHz', 'peaks']));
    // Z_t = V·ripple/ΔI = 1 V × 5 % / 2 A = 25 mΩ (Smith et al., 1999)
    expect(json.targetOhm).toBeCloseTo(targetImpedance(1, 0.05, 2), 15);
    expect(json.targetOhm).toBeCloseTo(0.025, 15);
    expect(json.pass).toBe(true);
    expect(json.worstMarginDb).toBeGreaterThan(0);
    expect(json.worstFrequencyHz).toBeGreaterThanOrEqual(1e5);
    expect(json.worstFrequencyHz).toBeLessThanOrEqual(1e8);
    expect(json.peaks.length).toBeGreaterThan(0);
    for (const p of json.peaks) {
      expect(typeof p.frequencyHz).toBe('number');
      expect(p.impedanceOhm).toBeLessThanOrEqual(json.targetOhm);
      // each peak's margin is 20·log10(Z_t/|Z|)
      expect(p.marginDb).toBeCloseTo(20 * Math.log10(json.targetOhm / p.impedanceOhm), 9);
    }
    // DC bias: RT-C-22U at 1 V keeps 90 % (its table), RT-C-1U has no table.
    const bulk = json.placements.find((p: { partId: string }) => p.partId === 'RT-C-22U');
    expect(bulk.biasFraction).toBe(0.9);
    expect(bulk.biasFromTable).toBe(true);
    expect(json.biasDerated).toEqual(['RT-C-22U', 'RT-C-4U7']);
    expect(json.branches.map((b: { label: string }) => b.label)).toEqual(['regulator', 'plane', '6 × RT-C-22U', '4 × RT-C-4U7', '6 × RT-C-1U', '8 × RT-C-100N', '4 × RT-C-10N']);
  });

  it('a failing rail says so, with its derating warning', async () => {
    const json = JSON.parse((await run(['plan', 'VDD_WEAK', '--json'])).out);
    expect(json.pass).toBe(false);
    expect(json.worstMarginDb).toBeLessThan(0);
    expect(json.targetOhm).toBe(0.01);
    expect(json.warnings).toHaveLength(1);
    expect(json.warnings[0]).toMatchObject({ file: 'plans/vdd-weak.yaml', line: 10, column: 12, severity: 'warning' });
  });

  it('a part placed above its DC-bias table: the JSON says the value was extrapolated, and warns', async () => {
    const dir = tempDir();
    const file = join(dir, 'hot.yaml');
    writeFileSync(file, 'rail: HOT\nvoltage: 3.3V\ntarget: 20m\nband: {from: 1M, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: RT-C-4U7, count: 4}\n  - {part: RT-C-22U, count: 2}\n');
    const { out, err } = await run(['plan', file, '--json']);
    const json = JSON.parse(out);
    // RT-C-4U7's table ends at 2 V (80 %): held above it. RT-C-22U's goes to 6.3 V: 3.3 V is a table point (60 %).
    expect(json.placements[0]).toMatchObject({ partId: 'RT-C-4U7', biasFraction: 0.8, biasFromTable: true, biasExtrapolated: true, biasTableEndV: 2 });
    expect(json.placements[1]).toMatchObject({ partId: 'RT-C-22U', biasFraction: 0.6, biasExtrapolated: false, biasTableEndV: 6.3 });
    expect(json.warnings.map((w: { message: string }) => w.message)).toEqual([expect.stringContaining('the DC-bias table of RT-C-4U7 ends at 2 V, below the rail\'s 3.3 V; its last fraction, 80%, is used')]);
    expect(err).toContain('hot.yaml:7:12: warning: capacitors[0].part: the DC-bias table of RT-C-4U7 ends at 2 V');
    const text = (await run(['plan', file])).out;
    expect(text).toContain('4 × RT-C-4U7  3.76 µF at 3.3 V (80% of 4.7 µF, extrapolated: the DC-bias table ends at 2 V), mounting 300 pH');
  });

  it('every plan when none is named: an array', async () => {
    const json = JSON.parse((await run(['plan', '--json'])).out);
    expect(json.map((p: { rail: string }) => p.rail)).toEqual(['VDD_TEST', 'VDD_WEAK']);
  });

  it('is byte-identical from run to run', async () => {
    expect((await run(['plan', '--json'])).out).toBe((await run(['plan', '--json'])).out);
  });
});

describe('zfolio plan (human form)', () => {
  it('names the target, the verdict, the worst margin and the peaks, by file path too', async () => {
    const { code, out } = await run(['plan', 'plans/vdd-test.yaml']);
    expect(code).toBe(0);
    expect(out).toContain('target     25 mΩ = 1 V × 5% / 2 A');
    expect(out).toMatch(/nominal {4}PASS {2}worst margin \+\d+\.\d\d dB at [\d.]+ [kM]?Hz/);
    expect(out).toContain('6 × RT-C-22U   19.8 µF at 1 V (90% of 22 µF, DC-bias table), mounting 300 pH');
    expect(out).toMatch(/peaks\n {4}[\d.]+ [kM]Hz/);
  });
  it('a failing plan shows FAIL and its warning', async () => {
    const { out } = await run(['plan', 'VDD_WEAK']);
    expect(out).toMatch(/nominal {4}FAIL {2}worst margin −\d+\.\d\d dB/);
    expect(out).toContain('warnings\n    plans/vdd-weak.yaml:10:12: warning: capacitors[1].part:');
  });
});

describe('zfolio plan --suggest', () => {
  it('chooses a set that passes, proven optimal, and prints it as plan YAML', async () => {
    const { code, out } = await run(['plan', 'VDD_TEST', '--suggest']);
    expect(code).toBe(0);
    expect(out).toContain('status     optimal, proven by search');
    expect(out).toContain('left out   RT-C-1U-LV (above derating)');
    expect(out).toMatch(/result {5}PASS/);
    expect(out).toMatch(/as plan YAML\n {4}capacitors:\n {6}- \{part: RT-C-/);
  });
  it('--json: the chosen placements and the analysed plan', async () => {
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--suggest', '--json'])).out);
    expect(json.status).toBe('optimal');
    expect(json.proven).toBe(true);
    // RT-C-2U2-NR states no cost, so the goal is the fewest placements.
    expect(json.objective).toBe('count');
    expect(json.plan.pass).toBe(true);
    const total = json.placements.reduce((n: number, p: { count: number }) => n + p.count, 0);
    expect(json.plan.totalPlacements).toBe(total);
    expect(json.candidates).not.toContain('RT-C-1U-LV');
    expect(json.candidates).not.toContain('RT-L-1U');
  });
  it('with costs on every candidate (--only decoupling), the goal is the lowest cost', async () => {
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--suggest', '--only', 'decoupling,bulk', '--json'])).out);
    expect(json.objective).toBe('cost');
    expect(json.status).toBe('optimal');
    expect(json.plan.pass).toBe(true);
    expect(json.plan.totalCost).toBeGreaterThan(0);
  });
  it('a rail that cannot be met is reported as such, not as a pass', async () => {
    const { code, out } = await run(['plan', 'VDD_TEST', '--suggest', '--only', 'hf', '--max-count', '2']);
    expect(code).toBe(3);
    expect(out).toContain('status     cannot be met: no choice of 0 to 2 of each of 1 candidate keeps |Z| under the target across the band (proven');
    expect(out).not.toContain('PASS');
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--suggest', '--only', 'hf', '--max-count', '2', '--json'])).out);
    expect(json.status).toBe('unmeetable');
    expect(json.plan).toBeNull();
    expect(json.placements).toEqual([]);
  });
});

describe('zfolio plan --suggest: margin, selection and the closest set', () => {
  it('--margin DB holds |Z| that far under the target; the set costs at least the set without margin', async () => {
    const plain = JSON.parse((await run(['plan', 'VDD_TEST', '--suggest', '--only', 'decoupling,bulk', '--json'])).out);
    const { code, out } = await run(['plan', 'VDD_TEST', '--suggest', '--only', 'decoupling,bulk', '--margin', '3', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.marginDb).toBe(3);
    expect(json.status).toBe('optimal');
    expect(json.plan.worstMarginDb).toBeGreaterThanOrEqual(3 - 1e-9);
    // A set 3 dB under the target is also under it, so the optimum without margin costs no more.
    expect(plain.plan.totalCost).toBeLessThanOrEqual(json.plan.totalCost + 1e-12);
    const text = (await run(['plan', 'VDD_TEST', '--suggest', '--only', 'decoupling,bulk', '--margin', '3dB'])).out;
    expect(text).toContain('(lowest total cost, +3.00 dB margin required; 6 candidates named decoupling or bulk)');
  });
  it('--margin takes a negative value as --margin=-1, and refuses what is not a number', async () => {
    // 1 dB over the target allowed: a set that meets that is found (exit 0), and may fail the target itself.
    const over = await run(['plan', 'VDD_TEST', '--suggest', '--margin=-1', '--json']);
    expect(over.code).toBe(0);
    expect(JSON.parse(over.out).plan.worstMarginDb).toBeGreaterThanOrEqual(-1 - 1e-9);
    const bad = await run(['plan', 'VDD_TEST', '--suggest', '--margin', 'lots']);
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('--margin: expected a number of decibels such as 3 or 1.5dB, found "lots"');
    expect((await run(['plan', 'VDD_TEST', '--margin', '3'])).code).toBe(2);
  });
  it('--only takes part ids as well as tags', async () => {
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--suggest', '--only', 'RT-C-22U,hf', '--json'])).out);
    expect(json.candidates).toEqual(['RT-C-10N', 'RT-C-22U']);
  });
  it('--only with a name no capacitor has is misuse (exit 2) that lists the tags there are', async () => {
    const { code, err } = await run(['plan', 'VDD_TEST', '--suggest', '--only', 'decoupling,hff']);
    expect(code).toBe(2);
    // RT-L-1U is an inductor and has no tags; the capacitors carry bulk, decoupling, hf and spare.
    expect(err).toContain('--only: no capacitor has the id or tag "hff"; the library\'s capacitors carry the tags bulk, decoupling, hf, spare, and any capacitor\'s id may be given');
    expect((await run(['plan', 'VDD_TEST', '--suggest', '--only', 'RT-L-1U'])).code).toBe(2);
  });
  it('a part whose DC-bias table ends below the rail is left out unless named or allowed', async () => {
    const dir = tempDir();
    const file = join(dir, 'hot.yaml');
    writeFileSync(file, 'rail: HOT\nvoltage: 3.3V\ntarget: 30m\nband: {from: 1M, to: 20M}\nmounting: 0.3nH\nregulator: {r: 3m, l: 5nH}\n');
    const plain = JSON.parse((await run(['plan', file, '--suggest', '--json'])).out);
    // RT-C-4U7's table ends at 2 V; RT-C-22U's at 6.3 V; RT-C-1U-LV is rated 1.2 V.
    expect(plain.skipped).toEqual([
      { partId: 'RT-C-1U-LV', reason: 'over-rating' },
      { partId: 'RT-C-4U7', reason: 'beyond-bias-table', tableEndV: 2 },
    ]);
    expect(plain.candidates).not.toContain('RT-C-4U7');
    const text = (await run(['plan', file, '--suggest'])).out;
    expect(text).toContain('left out   RT-C-1U-LV (rated below the rail), RT-C-4U7 (DC-bias table ends at 2 V)\n             (to weigh these, name them with --only, or give --allow-bias-extrapolation)');
    const allowed = JSON.parse((await run(['plan', file, '--suggest', '--allow-bias-extrapolation', '--json'])).out);
    expect(allowed.candidates).toContain('RT-C-4U7');
    const named = JSON.parse((await run(['plan', file, '--suggest', '--only', 'RT-C-4U7,RT-C-1U', '--json'])).out);
    expect(named.candidates).toEqual(['RT-C-1U', 'RT-C-4U7']);
    expect(named.skipped).toEqual([]);
    // Placed, it brings its warning with it (at the part's id in its file).
    const alone = JSON.parse((await run(['plan', file, '--suggest', '--only', 'RT-C-4U7', '--json'])).out);
    expect(alone.plan.placements.map((p: { partId: string }) => p.partId)).toEqual(['RT-C-4U7']);
    expect(alone.plan.placements[0]).toMatchObject({ biasExtrapolated: true, biasFraction: 0.8 });
    expect(alone.plan.warnings).toEqual([expect.objectContaining({ file: 'parts/rt-c-4u7.yaml', severity: 'warning', message: expect.stringContaining('the DC-bias table of RT-C-4U7 ends at 2 V') })]);
  });
  it('a target that cannot be met: the closest set found, its worst margin and where, and it re-checks the same', async () => {
    const { code, out } = await run(['plan', 'VDD_TEST', '--suggest', '--only', 'hf', '--max-count', '2', '--json']);
    expect(code).toBe(3);
    const json = JSON.parse(out);
    expect(json.status).toBe('unmeetable');
    expect(json.closest.worstMarginDb).toBeLessThan(0);
    expect(json.closest.plan.pass).toBe(false);
    expect(json.closest.worstFrequencyHz).toBe(json.closest.plan.worstFrequencyHz);
    const text = (await run(['plan', 'VDD_TEST', '--suggest', '--only', 'hf', '--max-count', '2'])).out;
    expect(text).toMatch(/closest {4}worst margin −\d+\.\d\d dB at [\d.]+ [kM]?Hz \(\|Z\| [\d.]+ [mµ]?Ω\) with (\d × RT-C-10N|no capacitors)\n {13}\(the closest set a local search found, not proven the closest possible\)/);
    // Checking that set as a plan gives the same margin.
    const dir = tempDir();
    const file = join(dir, 'closest.yaml');
    const entries = json.closest.placements.map((p: { partId: string; count: number; mountingH: number }) => `  - {part: ${p.partId}, count: ${p.count}, mounting: ${p.mountingH}}\n`).join('');
    writeFileSync(file, `rail: CLOSE\nvoltage: 1.0V\nripple: 5%\nstep: 2A\nband: {from: 100k, to: 100M}\nmounting: 0.3nH\nregulator: {r: 3m, l: 5nH}\nplane: {c: 10nF, r: 3m}\ncapacitors:${entries ? '\n' + entries : ' []\n'}`);
    const again = JSON.parse((await run(['plan', file, '--json'])).out);
    expect(Math.abs(again.worstMarginDb - json.closest.worstMarginDb)).toBeLessThanOrEqual(1e-9);
    // A set that misses its target gets no load step from --suggest; checked as a plan, it does.
    expect(json.closest.plan.transient).toBeNull();
    expect(again.transient.budgetV).toBeGreaterThan(0);
  });
});

describe('zfolio plan --suggest on the demo library: mains parts', () => {
  const demo = fileURLToPath(new URL('../..', import.meta.url));
  it('parts with a safety class are left out unless named by --only or allowed', async () => {
    const plain = JSON.parse((await run(['plan', 'VDD_3V3', '--suggest', '--max-count', '2', '--json', '--library', demo])).out);
    expect(plain.skipped).toEqual(expect.arrayContaining([
      { partId: 'ORV-C-X2-100N-310V', reason: 'safety-class', safetyClass: 'X2' },
      { partId: 'ORV-C-Y2-2N2-300V', reason: 'safety-class', safetyClass: 'Y2' },
    ]));
    expect(plain.candidates).not.toContain('ORV-C-X2-100N-310V');
    const allowed = JSON.parse((await run(['plan', 'VDD_3V3', '--suggest', '--max-count', '2', '--allow-safety-class', '--json', '--library', demo])).out);
    expect(allowed.candidates).toEqual(expect.arrayContaining(['ORV-C-X2-100N-310V', 'ORV-C-Y2-2N2-300V']));
    const named = JSON.parse((await run(['plan', 'VDD_3V3', '--suggest', '--max-count', '2', '--only', 'ORV-C-X2-100N-310V,ORV-C-0402-100N-X7R', '--json', '--library', demo])).out);
    expect(named.candidates).toEqual(['ORV-C-0402-100N-X7R', 'ORV-C-X2-100N-310V']);
  });
});

describe('plan files, paths and misuse', () => {
  it('reads a plan file outside plans/ against the library, and reports its errors with file:line:col', async () => {
    const dir = tempDir();
    const good = join(dir, 'draft.yaml');
    writeFileSync(good, 'rail: DRAFT\nvoltage: 1V\ntarget: 20m\nband: {from: 1M, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: RT-C-100N, count: 10}\n');
    const ok = await run(['plan', good, '--json']);
    // Evaluated; 10 × 100 nF cannot hold 20 mΩ down to 1 MHz, so the exit status says the target is missed.
    expect(JSON.parse(ok.out).pass).toBe(false);
    expect(ok.code).toBe(3);
    expect(JSON.parse(ok.out).rail).toBe('DRAFT');
    const bad = join(dir, 'bad.yaml');
    writeFileSync(bad, 'rail: DRAFT\nvoltage: 1V\ntarget: 20m\nband: {from: 1M, to: 10M}\nmounting: 0.3nH\ncapacitors:\n  - {part: RT-C-100N, count: 0}\n');
    const failed = await run(['plan', 'bad.yaml', '--library', fixture], dir);
    expect(failed.code).toBe(1);
    expect(failed.err.split('\n')).toContain('bad.yaml:7:30: capacitors[0].count: expected a whole number of placements from 1 to 10000, found "0"');
  });
  it('a plan file outside plans/ is read with the checks of a library file: size and encoding', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'huge.yaml'), Buffer.alloc(5 * 1024 * 1024 + 1, 0x20));
    writeFileSync(join(dir, 'latin1.yaml'), Buffer.from([0x72, 0x61, 0x69, 0x6c, 0x3a, 0x20, 0xe9, 0x0a]));
    const huge = await run(['plan', 'huge.yaml', '--library', fixture], dir);
    expect(huge.code).toBe(1);
    expect(huge.err).toBe('huge.yaml:1:1: the file is 5.0 MB; a library file may be at most 5 MB\n');
    const latin1 = await run(['plan', 'latin1.yaml', '--library', fixture], dir);
    expect(latin1.code).toBe(1);
    expect(latin1.err).toBe('latin1.yaml:1:7: the file is not UTF-8 text (an invalid byte here); save it as UTF-8\n');
  });
  it('an unknown rail is misuse (exit 2) with a suggestion', async () => {
    const { code, err } = await run(['plan', 'VDD_TSET']);
    expect(code).toBe(2);
    expect(err).toContain('no plan with rail or file "VDD_TSET"; did you mean VDD_TEST?');
  });
  it('--max-count without --suggest, and --suggest without one plan, are misuse', async () => {
    expect((await run(['plan', 'VDD_TEST', '--max-count', '3'])).code).toBe(2);
    expect((await run(['plan', '--suggest'])).code).toBe(2);
    expect((await run(['plan', 'VDD_TEST', '--suggest', '--max-count', '0'])).code).toBe(2);
  });
  it('a library without plans/ says so', async () => {
    const dir = tempDir();
    cpSync(join(fixture, 'parts'), join(dir, 'parts'), { recursive: true });
    const { code, out } = await run(['plan'], dir);
    expect(code).toBe(0);
    expect(out).toBe('no plans in the library (rail plans are YAML files under plans/)\n');
  });
  it('--help prints the usage', async () => {
    const { code, out } = await run(['plan', '--help']);
    expect(code).toBe(0);
    expect(out).toMatch(/^Usage: zfolio plan/);
  });
});
