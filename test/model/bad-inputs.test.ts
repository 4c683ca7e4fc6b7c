// The bad-input corpus (test/fixtures/bad-inputs): over a hundred files, each with one thing zfolio must
// refuse — prototype keys, YAML tags and directives, control characters, bare CR line ends, ambiguous units,
// bare numbers where a fraction is meant, values outside the range the engine computes with, impossible
// dates, over-long ids, nesting and width limits. Each is dropped into a sound base library and must give
// exactly the located messages listed in expected.txt (reviewed by hand), at least one of them an error,
// and nothing about any other file.

import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/model/library.js';
import { baseCopy, CORPUS, corpusCases, runCase } from './bad-inputs-run.js';

const expected = new Map<string, string[]>();
for (const line of readFileSync(join(CORPUS, 'expected.txt'), 'utf8').split('\n')) {
  if (line === '' || line.startsWith('#')) continue;
  const name = line.slice(0, line.indexOf(':'));
  expected.set(name, [...(expected.get(name) ?? []), line]);
}
const cases = corpusCases();
const base = baseCopy();
afterAll(() => base.done());

describe('the bad-input corpus', () => {
  it('holds at least 120 cases, each listed in expected.txt, and nothing listed that is not a case', () => {
    expect(cases.length).toBeGreaterThanOrEqual(120);
    expect(cases.filter((c) => !expected.has(c))).toEqual([]);
    expect([...expected.keys()].filter((c) => !cases.includes(c))).toEqual([]);
  });

  it('has a sound base library', () => {
    const { library, diagnostics } = loadLibrary(base.root);
    expect(diagnostics).toEqual([]);
    expect(library?.parts.length).toBe(3);
  });

  it.each(cases)('%s', (name) => {
    const result = runCase(base.root, name);
    expect(result.lines).toEqual(expected.get(name));
    expect(result.errors).toBeGreaterThan(0);
    expect(result.others).toEqual([]);
  });
});
