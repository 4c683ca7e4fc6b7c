// Reading one YAML file: limits that keep the reader's time linear and its recursion shallow, and the
// YAML features zfolio refuses rather than reads in a way the file does not show.

import { describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic, PER_FILE_LIMIT, quote } from '../../src/model/diagnostics.js';
import { readPart } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { MAX_DEPTH, MAX_FLOW_ITEMS, MAX_ITEMS, MAX_LINES } from '../../src/model/yaml-limits.js';

/**
 * The CPU time this process has used, ms. Unlike wall time it does not grow while other processes hold the
 * cores, so a ratio of two readings stays a ratio of work on a loaded machine.
 */
function cpuMs(): number {
  const used = process.cpuUsage();
  return (used.user + used.system) / 1000;
}

function read(text: string): { lines: string[]; ok: boolean; ms: number } {
  const diagnostics = new DiagnosticList();
  const started = cpuMs();
  const source = parseYamlSource('parts/x.yaml', text, diagnostics);
  if (source) readPart({ source, diagnostics });
  return { lines: diagnostics.sorted().map(formatDiagnostic), ok: source !== undefined, ms: cpuMs() - started };
}

const DEPTH = `lists and mappings are nested more than ${MAX_DEPTH} levels deep here; a library file needs only a few levels`;
const FLOW_ITEMS = `more than ${MAX_FLOW_ITEMS} items in "[...]" and "{...}" lists and mappings in one file; a library file is expected to be far smaller`;
/** 1,100 keys, each with a flow list of 100 items: 99 item separators a line. */
const MANY_FLOW_LISTS = Array.from({ length: 1100 }, (_, i) => `k${i}: [${'a, '.repeat(99)}a]\n`).join('');
/** "line:column" of the MAX_FLOW_ITEMS-th comma: where the budget of flow items runs out. */
function flowPosition(text: string): string {
  let commas = 0;
  for (let i = 0; i < text.length; i++) {
    if (text[i] !== ',' || ++commas < MAX_FLOW_ITEMS) continue;
    const lineStart = text.lastIndexOf('\n', i) + 1;
    return `${text.slice(0, i).split('\n').length}:${i - lineStart + 1}`;
  }
  return 'none';
}
const WIDTH = `a list or mapping with more than ${MAX_ITEMS} items; split it up`;

describe('the reader stays linear and shallow', () => {
  it('a network of 10,000 elements in one flow list reads in time linear in its size (positions cost O(log n) on a long line)', () => {
    const network = (n: number) => `id: N\nkind: network\nnetwork: {series: [${Array.from({ length: n }, () => '{r: 1m}').join(', ')}]}\n`;
    const [small, large] = [network(1_000), network(10_000)];
    expect(read(large).lines).toEqual([]);
    // Ten times the elements: about ten times the time when linear, a hundred or more when quadratic (as it
    // was, when each position rescanned its line: 10,000 elements took over 9 s). Best of several, the two
    // sizes taken in turns so both see the same machine load, and garbage collection mostly cancels out;
    // 40 leaves room for both.
    const times = { small: [] as number[], large: [] as number[] };
    for (let round = 0; round < 6; round++) {
      times.small.push(read(small).ms, read(small).ms);
      times.large.push(read(large).ms);
    }
    const ratio = Math.min(...times.large) / Math.min(...times.small);
    expect(ratio).toBeLessThan(40);
  });

  it('columns count characters on a long line with astral characters before the mistake', () => {
    // Each "😀" is one character (two UTF-16 units): the bad value starts at character 11 + 3·1000 + 1 of line 2.
    const r = read(`id: N\ntitle: "${'x😀x'.repeat(1000)}"\nkind: capacitor\nnominal: 1q\n`);
    expect(r.lines).toEqual(['parts/x.yaml:4:10: nominal: expected a capacitance in F (e.g. 100n or 100 nF), found "1q"']);
    const astral = read(`id: N\nkind: capacitor\nnominal: 1n\ntags: [${'😀, '.repeat(500)}1q]\nvoltage: ${'😀'}\n`);
    expect(astral.lines).toEqual(['parts/x.yaml:5:10: voltage: expected a voltage in V (e.g. 16V), found "😀"']);
  });

  it.each([
    // The scan before parsing allows one level of slack for its count of "- " lines; it stops at the 66th level.
    ['flow lists 100,000 deep', '['.repeat(100_000), `parts/x.yaml:1:${MAX_DEPTH + 1}: ${DEPTH}`],
    ['"- " 10,000 times on a line (the YAML reader would run out of memory)', '- '.repeat(10_000) + 'x\n', `parts/x.yaml:1:${2 * MAX_DEPTH + 3}: ${DEPTH}`],
    ['"? " 100,000 times on a line', '? '.repeat(100_000) + 'x\n', `parts/x.yaml:1:${2 * MAX_DEPTH + 3}: ${DEPTH}`],
    ['a 5 MB flow list that is never closed', 'tags: [' + '1, '.repeat(1_700_000), `parts/x.yaml:1:${8 + 3 * (MAX_ITEMS - 1) + 1}: ${WIDTH}`],
    ['many flow lists, each within the width limit', MANY_FLOW_LISTS, `parts/x.yaml:${flowPosition(MANY_FLOW_LISTS)}: ${FLOW_ITEMS}`],
    ['more lines than a library file holds', '# c\n'.repeat(MAX_LINES + 1), `parts/x.yaml:${MAX_LINES + 1}:1: the file has more than ${MAX_LINES} lines; a library file is expected to be far smaller`],
  ])('%s: refused with its own message, quickly', (_, text, message) => {
    const r = read(text);
    expect(r.lines).toEqual([message]);
    expect(r.ms).toBeLessThan(2000);
  });

  it('a block list longer than the width limit is refused after reading', () => {
    const r = read(`id: N\nkind: capacitor\nnominal: 1n\ntags:\n${'  - t\n'.repeat(MAX_ITEMS + 1)}`);
    expect(r.lines).toEqual([`parts/x.yaml:5:3: ${WIDTH}`]);
  });

  it('nesting one level past the limit, too shallow for the scan, is refused after reading', () => {
    // The part's mapping is level 1; each {series: [...]} adds two: the 32nd's list is level 65, located at its first item.
    const r = read(`id: N\nkind: network\nnetwork: ${'{series: ['.repeat(32)}{r: 1m}${']}'.repeat(32)}\n`);
    expect(r.lines).toEqual([`parts/x.yaml:3:${10 + 10 * 31 + 10}: ${DEPTH}`]);
  });

  it('nesting just within the limit is read', () => {
    const deep = `id: N\nkind: network\nnetwork: ${'{series: ['.repeat(31)}{r: 1m}${']}'.repeat(31)}\n`;
    expect(read(deep).lines).toEqual([]);
  });
});

describe('YAML that would be read as something the file does not show', () => {
  it('"%YAML 1.2" and a byte-order mark are fine', () => {
    expect(read('%YAML 1.2\n---\nid: N\nkind: capacitor\nnominal: 1n\n').lines).toEqual([]);
    expect(read('\ufeffid: N\nkind: capacitor\nnominal: 1n\n').lines).toEqual([]);
  });

  it('a bare CR anywhere is located at the first one', () => {
    expect(read('id: N\r\nkind: capacitor\r\nnominal: 1n\rtitle: x\r\n').lines).toEqual([
      'parts/x.yaml:3:12: a line ends with a bare carriage return (CR, as old Mac files do); save the file with LF or CRLF line ends',
    ]);
  });

  it('a tab or a line break inside a value is text; a CR, NUL or ESC is not', () => {
    expect(read('id: N\nkind: capacitor\nnominal: 1n\nnotes: "a\\tb\\nc"\n').lines).toEqual([]);
    expect(read('id: N\nkind: capacitor\nnominal: 1n\nnotes: "a\\eb"\n').lines).toEqual([
      'parts/x.yaml:4:8: this value holds a control character (U+001B, ESC); text takes printable characters, tabs and line breaks only',
    ]);
  });
});

describe('messages stay short', () => {
  it('quote() cuts at 80 characters, says how long the value was, and escapes control characters', () => {
    expect(quote('a\u0000b\u0085')).toBe('"a\\u0000b\\u0085"');
    const long = quote('x'.repeat(50_000_000));
    expect(long).toBe(`"${'x'.repeat(80)}…" (50000000 characters)`);
  });

  it(`at most ${PER_FILE_LIMIT} problems are listed for one file, then a count of the rest`, () => {
    const r = read(`id: N\nkind: capacitor\nnominal: 1n\n${Array.from({ length: 150 }, (_, i) => `f${i}: 1`).join('\n')}\n`);
    expect(r.lines).toHaveLength(PER_FILE_LIMIT + 1);
    expect(r.lines[PER_FILE_LIMIT]).toBe(`parts/x.yaml:103:1: and 50 more errors in this file, not listed (at most ${PER_FILE_LIMIT} are listed per file)`);
  });
});
