// A part's `measurements:` list: files under measurements/, an optional fixture, note and a real date; each
// problem located at its field.

import { describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';

function read(measurements: string): { part?: Part; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/p.yaml', `id: P\nkind: capacitor\nnominal: 100n\nmeasurements:\n${measurements}`, diagnostics);
  const part = source ? readPart({ source, diagnostics }) : undefined;
  return { part, messages: diagnostics.sorted().map(formatDiagnostic) };
}

describe('measurements on a part', () => {
  it('reads file, fixture, note and date, with the positions of the entry and its file', () => {
    const { part, messages } = read('  - {file: measurements/p.s2p, fixture: shunt-thru, note: bench, date: 2026-02-03}\n  - file: measurements/sub/p.s1p\n');
    expect(messages).toEqual([]);
    expect(part!.measurements.map(({ at, fileAt, ...rest }) => ({ ...rest, at: `${at.line}:${at.column}`, fileAt: `${fileAt.line}:${fileAt.column}` }))).toEqual([
      { file: 'measurements/p.s2p', fixture: 'shunt-thru', note: 'bench', date: '2026-02-03', at: '5:5', fileAt: '5:12' },
      { file: 'measurements/sub/p.s1p', fixture: undefined, note: undefined, date: undefined, at: '6:5', fileAt: '6:11' },
    ]);
  });

  it('a part without measurements has an empty list', () => {
    const diagnostics = new DiagnosticList();
    const source = parseYamlSource('parts/p.yaml', 'id: P\nkind: resistor\nnominal: 1k\n', diagnostics)!;
    expect(readPart({ source, diagnostics })!.measurements).toEqual([]);
  });

  it.each([
    ['  - {file: data/p.s2p}\n', 'parts/p.yaml:5:12: measurements[0].file: expected a file under measurements/, written from the library folder (e.g. measurements/part.s2p), found "data/p.s2p"'],
    ['  - {file: measurements/../parts/p.yaml}\n', 'parts/p.yaml:5:12: measurements[0].file: expected a file under measurements/, written from the library folder (e.g. measurements/part.s2p), found "measurements/../parts/p.yaml"'],
    ['  - {file: measurements/}\n', 'parts/p.yaml:5:12: measurements[0].file: expected a file under measurements/, written from the library folder (e.g. measurements/part.s2p), found "measurements/"'],
    ['  - {file: measurements/p.s2p, fixture: shunt}\n', 'parts/p.yaml:5:41: measurements[0].fixture: expected one of reflection, shunt-thru, series-thru, found "shunt"'],
    ['  - {file: measurements/p.s2p, date: 2026-02-30}\n', 'parts/p.yaml:5:38: measurements[0].date: expected a real date, found "2026-02-30": February 2026 has 28 days'],
    ['  - {fixture: reflection}\n', 'parts/p.yaml:5:5: missing field "measurements[0].file" (the measurement file under measurements/, e.g. file: measurements/part.s2p)'],
    ['  - {file: measurements/p.s2p, by: me}\n', 'parts/p.yaml:5:32: unknown field "measurements[0].by"; expected one of file, fixture, note, date'],
    ['  measurements/p.s2p\n', 'parts/p.yaml:5:3: measurements: expected a list, found "measurements/p.s2p"'],
  ])('refuses %j', (yaml, message) => {
    const { part, messages } = read(yaml);
    expect(part).toBeUndefined();
    expect(messages).toEqual([message]);
  });

  it('warns when the same file and fixture are listed twice', () => {
    const { part, messages } = read('  - {file: measurements/p.s2p}\n  - {file: measurements/p.s2p}\n');
    expect(part!.measurements).toHaveLength(2);
    expect(messages).toEqual(['parts/p.yaml:6:12: warning: measurements[1].file: "measurements/p.s2p" is listed twice with the same fixture; the second entry repeats the first']);
  });
});
