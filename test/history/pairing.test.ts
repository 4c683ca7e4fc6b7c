import { describe, expect, it } from 'vitest';
import { pairParts } from '../../src/history/pairing.js';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';

// Which part of one revision is which part of the other (invented parts). The rules: same id; else, among
// ids gone and ids new, the same file; else the same file contents apart from the id.

function part(path: string, id: string, nominal = '100n', esr = '20m'): Part {
  const d = new DiagnosticList();
  const text = `id: ${id}\nkind: capacitor\nnominal: ${nominal}\nvoltage: 16V\nparasitics: {esr: ${esr}, esl: 0.4n}\n`;
  const p = readPart({ source: parseYamlSource(path, text, d)!, diagnostics: d });
  expect(d.sorted().map(formatDiagnostic)).toEqual([]);
  return p!;
}
const ids = (parts: readonly Part[]) => parts.map((p) => p.id);
const pairsOf = (r: ReturnType<typeof pairParts>) => r.pairs.map((p) => [p.before.id, p.after.id, p.renamed]);

describe('pairParts', () => {
  it('pairs by id, whatever the file and values', () => {
    const r = pairParts([part('parts/a.yaml', 'A'), part('parts/b.yaml', 'B')], [part('parts/moved/b.yaml', 'B', '220n'), part('parts/a.yaml', 'A')]);
    expect(pairsOf(r)).toEqual([
      ['A', 'A', false],
      ['B', 'B', false],
    ]);
    expect(r.added).toEqual([]);
    expect(r.removed).toEqual([]);
  });
  it('an id changed inside the same file is one part renamed, even with other values changed', () => {
    const r = pairParts([part('parts/a.yaml', 'OLD')], [part('parts/a.yaml', 'NEW', '1u')]);
    expect(pairsOf(r)).toEqual([['OLD', 'NEW', true]]);
  });
  it('a file moved with its id changed is matched by its contents apart from the id', () => {
    const r = pairParts([part('parts/a.yaml', 'OLD', '4u7', '6m')], [part('parts/x/b.yaml', 'NEW', '4u7', '6m')]);
    expect(pairsOf(r)).toEqual([['OLD', 'NEW', true]]);
  });
  it('moved, renamed and changed: one removed, one added', () => {
    const r = pairParts([part('parts/a.yaml', 'OLD', '4u7')], [part('parts/x/b.yaml', 'NEW', '10u')]);
    expect(r.pairs).toEqual([]);
    expect(ids(r.removed)).toEqual(['OLD']);
    expect(ids(r.added)).toEqual(['NEW']);
  });
  it('each new part is matched once: two gone parts with the same contents, one new part', () => {
    const r = pairParts([part('parts/a.yaml', 'A1'), part('parts/b.yaml', 'A2')], [part('parts/c.yaml', 'A3')]);
    expect(pairsOf(r)).toEqual([['A1', 'A3', true]]);
    expect(ids(r.removed)).toEqual(['A2']);
    expect(r.added).toEqual([]);
  });
  it('a part kept under its id is not offered for renaming', () => {
    // B is unchanged; A vanished and C appeared in another file with A's contents: C is A renamed.
    const r = pairParts([part('parts/a.yaml', 'A'), part('parts/b.yaml', 'B')], [part('parts/b.yaml', 'B'), part('parts/c.yaml', 'C')]);
    expect(pairsOf(r)).toEqual([
      ['B', 'B', false],
      ['A', 'C', true],
    ]);
  });
});
