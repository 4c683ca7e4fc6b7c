import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.js';
import { formatEng } from '../../src/units/format.js';

// `zfolio plan` on the fixture library (invented parts and rails): the load step beside the impedance verdict.
const fixture = fileURLToPath(new URL('../fixtures/rail-library', import.meta.url));

async function run(args: string[]) {
  let out = '';
  let err = '';
  const code = await main(args, { cwd: fixture, env: {}, isTTY: false, out: (t) => (out += t), err: (t) => (err += t) });
  return { code, out, err };
}

describe('zfolio plan: the load step', () => {
  it('--json carries transient {riseS, droopV, atS, settleS, finalV, budgetV, pass} in SI units, without the curves', async () => {
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--json'])).out);
    expect(Object.keys(json.transient)).toEqual(expect.arrayContaining(['riseS', 'droopV', 'atS', 'settleS', 'finalV', 'budgetV', 'pass', 'stepA', 'durationS', 'overshootV', 'dcPath']));
    expect(json.transient.curves).toBeUndefined();
    expect(json.transient.riseS).toBeCloseTo(0.35 / 100e6, 20);
    expect(json.transient.budgetV).toBeCloseTo(0.05, 15); // 1.0 V × 5%
    expect(json.transient.pass).toBe(json.transient.droopV <= json.transient.budgetV && json.transient.overshootV <= json.transient.budgetV);
  });

  it('a plan with an explicit target and no step has transient null', async () => {
    expect(JSON.parse((await run(['plan', 'VDD_WEAK', '--json'])).out).transient).toBeNull();
  });

  it('the human form prints the load step under the impedance result, with its budget and how it was found', async () => {
    const { out } = await run(['plan', 'VDD_TEST']);
    const json = JSON.parse((await run(['plan', 'VDD_TEST', '--json'])).out).transient;
    const lines = out.split('\n');
    const at = lines.findIndex((l) => l.startsWith('  load step  '));
    // The impedance verdict's two lines (nominal, worst corner) come just before it.
    expect(lines[at - 2]).toMatch(/^ {2}nominal {4}(PASS|FAIL)/);
    expect(lines[at - 1]).toMatch(/^ {2}corners {4}(PASS|FAIL)/);
    expect(lines[at]).toBe(`  load step  ${json.pass ? 'PASS' : 'FAIL'}  dips ${formatEng(json.droopV, 'V')} at ${formatEng(json.atS, 's')} (budget ${formatEng(json.budgetV, 'V')}), settles by ${formatEng(json.settleS, 's')}`);
    expect(lines[at + 1]).toBe(`             step 2 A over ${formatEng(json.riseS, 's')} (0.35 / band top), budget 50 mV = 1 V × 5%`);
    expect((await run(['plan', 'VDD_WEAK'])).out).toContain('  load step  no load step: the plan gives its target without a step current');
  });
});
