// The interrupt budget a build with chart workers sets: V8 must then run a function for longer before it
// optimizes it, by about the factor asked for, and leave a budget the process was started with alone.

import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BUDGET_FACTOR } from '../../src/build/tier-up.js';

const script = fileURLToPath(new URL('./scripts/tier-up-calls.mjs', import.meta.url));

/** Calls of a small hot function before V8 marks it for optimization, in a process of its own. */
function callsBeforeOptimizing(raise: boolean, flags: string[] = []): number {
  const out = execFileSync(process.execPath, ['--allow-natives-syntax', ...flags, '--import', 'tsx', script, raise ? 'raise' : 'keep'], { encoding: 'utf8', timeout: 60_000 });
  return (JSON.parse(out) as { calls: number }).calls;
}

describe('slowerTierUp', () => {
  it('makes V8 run a function about BUDGET_FACTOR times longer before optimizing it', () => {
    const usual = callsBeforeOptimizing(false);
    const raised = callsBeforeOptimizing(true);
    // The budget counts bytecode, so calls scale with it; V8 also looks at a function only when a budget
    // runs out, so the ratio is not exact: within a factor of two of BUDGET_FACTOR.
    expect(usual).toBeGreaterThan(10);
    expect(raised / usual).toBeGreaterThan(BUDGET_FACTOR / 2);
    expect(raised / usual).toBeLessThan(BUDGET_FACTOR * 2);
  });

  it('keeps a budget given on the command line', () => {
    const given = callsBeforeOptimizing(false, ['--interrupt-budget=67584']);
    const kept = callsBeforeOptimizing(true, ['--interrupt-budget=67584']);
    expect(kept / given).toBeLessThan(2);
  });
});
