// Bad Touchstone files (test/fixtures/touchstone/bad): wrong option lines, missing values, text in numbers,
// too many ports or values, frequencies not increasing, unknown or misplaced keywords, truncated files, H, G
// and mixed-mode data. Each must be refused with exactly the located messages of expected.txt (reviewed by
// hand against the Touchstone File Format Specification 2.0, IBIS Open Forum, 2009), and never read.

import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readTouchstone } from '../../src/measure/touchstone-read.js';

const BAD = fileURLToPath(new URL('../fixtures/touchstone/bad/', import.meta.url));
const expected = new Map<string, string[]>();
for (const line of readFileSync(BAD + 'expected.txt', 'utf8').split('\n')) {
  if (line === '' || line.startsWith('#')) continue;
  const name = line.slice(0, line.indexOf(':'));
  expected.set(name, [...(expected.get(name) ?? []), line]);
}
const cases = readdirSync(BAD).filter((n) => n !== 'expected.txt').sort();

describe('bad Touchstone files', () => {
  it('at least 25 cases, each listed in expected.txt, and nothing listed that is not a case', () => {
    expect(cases.length).toBeGreaterThanOrEqual(25);
    expect(cases.filter((c) => !expected.has(c))).toEqual([]);
    expect([...expected.keys()].filter((c) => !cases.includes(c))).toEqual([]);
  });

  it.each(cases)('%s', (name) => {
    const result = readTouchstone(readFileSync(BAD + name, 'utf8'), name);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const lines = result.errors.map((e) => `${e.file}:${e.line}:${e.column}: ${e.message}`);
    expect(lines).toEqual(expected.get(name));
    for (const e of result.errors) {
      expect(e.line).toBeGreaterThanOrEqual(1);
      expect(e.column).toBeGreaterThanOrEqual(1);
    }
  });
});
