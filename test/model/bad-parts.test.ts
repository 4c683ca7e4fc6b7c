// The bad-parts corpus: one library folder (test/fixtures/bad-parts) whose folio.yaml and every part file
// each hold one kind of mistake. Every file's messages are asserted exactly, as `file:line:col: message`,
// and nothing else may be reported. Positions: the value for a bad value, the key for an unknown or
// out-of-place field, the mapping for a missing field; columns count characters, not UTF-16 units.

import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';

const ROOT = fileURLToPath(new URL('../fixtures/bad-parts/', import.meta.url));
const result = loadLibrary(ROOT);
const linesOf = (file: string) => result.diagnostics.filter((d) => d.file === file).map(formatDiagnostic);

/** Every file of the corpus with the exact lines it must produce, in file order. */
const EXPECTED: Record<string, string[]> = {
  // The sweep ends below where it starts (reported at the value of `to`), and a misspelt field whose two
  // letters are swapped: Levenshtein distance 2, still offered as a near miss.
  'folio.yaml': [
    `folio.yaml:5:7: sweep.to: expected a frequency above the start of the sweep (from: 10 GHz), found 1 kHz`,
    `folio.yaml:6:1: unknown field "titel"; did you mean "title"?`,
  ],
  // "   esl:" is indented one column deeper than "  esr:"; the message points at the stray key.
  'parts/01-yaml-indentation.yaml': [
    `parts/01-yaml-indentation.yaml:6:4: YAML syntax: this key is indented further than the keys above it; keys of one mapping start at the same column`,
  ],
  'parts/02-yaml-unclosed-flow.yaml': [
    `parts/02-yaml-unclosed-flow.yaml:5:1: YAML syntax: a flow mapping "{...}" above is not closed; expected "}" before this line`,
  ],
  'parts/03-yaml-duplicate-key.yaml': [
    `parts/03-yaml-duplicate-key.yaml:4:1: duplicate field "nominal": already given at line 3, column 1; a field may appear only once in a mapping`,
  ],
  'parts/04-yaml-tab.yaml': [`parts/04-yaml-tab.yaml:5:1: YAML syntax: a tab is used for indentation; indent with spaces`],
  'parts/05-unknown-kind.yaml': [
    `parts/05-unknown-kind.yaml:2:7: kind: expected one of capacitor, inductor, resistor, bead, network, found "capacitr"; did you mean "capacitor"?`,
  ],
  'parts/06-near-miss-eslx.yaml': [`parts/06-near-miss-eslx.yaml:6:3: unknown field "parasitics.eslx"; did you mean "esl"?`],
  // The near miss already names "nominal": it is not reported a second time as missing.
  'parts/07-near-miss-nominl.yaml': [`parts/07-near-miss-nominl.yaml:3:1: unknown field "nominl"; did you mean "nominal"?`],
  'parts/08-unknown-field-far.yaml': [
    `parts/08-unknown-field-far.yaml:4:1: unknown field "colour"; expected one of id, kind, title, nominal, marking, tolerance, voltage, current, power, package, tags, notes, band, cost, measurements, parasitics, temperature, tc`,
  ],
  'parts/09-missing-id.yaml': [
    `parts/09-missing-id.yaml:1:1: missing field "id" (a unique id of letters, digits, ".", "_" and "-", e.g. CAP-0402-100N)`,
  ],
  'parts/10-missing-kind.yaml': [`parts/10-missing-kind.yaml:1:1: missing field "kind" (one of capacitor, inductor, resistor, bead, network)`],
  'parts/11-missing-nominal.yaml': [`parts/11-missing-nominal.yaml:1:1: missing field "nominal" (a capacitance in F, e.g. 100n or 100 nF)`],
  'parts/12-number-100q.yaml': [
    `parts/12-number-100q.yaml:3:10: nominal: expected a capacitance in F (e.g. 100n or 100 nF), found "100q"`,
  ],
  'parts/13-number-abc.yaml': [
    `parts/13-number-abc.yaml:5:8: parasitics.dcr: expected a resistance in Ω (e.g. 18m, 4R7 or 2.2 kΩ), found "abc"`,
  ],
  // "nominal:" with nothing after it: the place the value should be, just after the colon.
  'parts/14-number-empty.yaml': [
    `parts/14-number-empty.yaml:3:9: nominal: expected a resistance in Ω (e.g. 18m, 4R7 or 2.2 kΩ), found an empty value`,
  ],
  'parts/15-negative-value.yaml': [`parts/15-negative-value.yaml:5:8: parasitics.esr: expected a resistance greater than zero, found "-5m"`],
  'parts/16-zero-value.yaml': [`parts/16-zero-value.yaml:3:10: nominal: expected an inductance greater than zero, found "0"`],
  'parts/17-unit-capacitance-in-henry.yaml': [
    `parts/17-unit-capacitance-in-henry.yaml:3:10: nominal: expected a capacitance in F (e.g. 100n or 100 nF), found "100 nH" (an inductance, in H)`,
  ],
  'parts/18-unit-inductance-in-farad.yaml': [
    `parts/18-unit-inductance-in-farad.yaml:3:10: nominal: expected an inductance in H (e.g. 0.45n or 0.45 nH), found "2.2uF" (a capacitance, in F)`,
  ],
  'parts/19-unit-voltage-in-amp.yaml': [
    `parts/19-unit-voltage-in-amp.yaml:4:10: voltage: expected a voltage in V (e.g. 16V), found "16A" (a current, in A)`,
  ],
  // IEC 60062 RKM: R stands for the decimal point of a value in ohms only.
  'parts/20-rkm-r-in-inductance.yaml': [
    `parts/20-rkm-r-in-inductance.yaml:3:10: nominal: expected an inductance in H (e.g. 0.45n or 0.45 nH), found "4R7"; "R" marks the decimal point in resistances only (IEC 60062); for an inductance write 4.7 with an SI prefix, e.g. 4.7u or 4u7`,
  ],
  // IEC 60062 numeric code: "104" = 10·10⁴ pF = 100 nF.
  'parts/21-marking-disagrees.yaml': [`parts/21-marking-disagrees.yaml:4:10: marking: "104" means 100 nF, but nominal is 10 nF`],
  'parts/22-marking-malformed.yaml': [
    `parts/22-marking-malformed.yaml:4:10: marking: expected a marking code of 3 or 4 digits (last digit = power of ten, in Ω) or with R as the decimal point, found "47K"`,
  ],
  'parts/23-id-space.yaml': [`parts/23-id-space.yaml:1:5: id: expected an id of letters, digits, ".", "_" and "-" only, found "CAP 0402"`],
  'parts/24-id-slash.yaml': [`parts/24-id-slash.yaml:1:5: id: expected an id of letters, digits, ".", "_" and "-" only, found "CAP/0402"`],
  'parts/25-id-unicode.yaml': [`parts/25-id-unicode.yaml:1:5: id: expected an id of letters, digits, ".", "_" and "-" only, found "RES-4K7-Ω"`],
  // The first of two files with one id is sound; the second is reported, naming both places.
  'parts/26-duplicate-id-first.yaml': [],
  'parts/27-duplicate-id-second.yaml': [
    `parts/27-duplicate-id-second.yaml:2:5: duplicate id "CAP-TWICE": already defined at parts/26-duplicate-id-first.yaml:1:5`,
  ],
  // Reported at the model mapping ("{" after "model: ").
  'parts/28-bead-missing-l.yaml': [`parts/28-bead-missing-l.yaml:3:8: missing field "model.l" (an inductance in H, e.g. 0.45n or 0.45 nH)`],
  'parts/29-network-two-keys.yaml': [
    `parts/29-network-two-keys.yaml:5:7: network.series[0]: expected one element such as {r: 5m}, {l: 1n}, {c: 10u}, {series: [...]} or {parallel: [...]}, found a mapping of 2 elements (r, l); give each element its own list item`,
  ],
  // One-letter keys get no "did you mean": every letter is one edit from r, l and c.
  'parts/30-network-unknown-element.yaml': [
    `parts/30-network-unknown-element.yaml:6:7: network.parallel[1]: unknown element "x"; expected one of series, parallel, r, l, c`,
  ],
  'parts/31-network-empty-series.yaml': [
    `parts/31-network-empty-series.yaml:3:19: network.series: expected a list of one or more elements, found an empty list`,
  ],
  'parts/32-dc-bias-decreasing.yaml': [
    `parts/32-dc-bias-decreasing.yaml:8:3: dc-bias: voltages must increase down the table; 3.3V comes after 5 V`,
  ],
  'parts/33-dc-bias-over-120.yaml': [
    `parts/33-dc-bias-over-120.yaml:6:7: dc-bias.2V: expected the fraction of nominal capacitance kept at 2V, above 0% and at most 120% (e.g. 65%), found "130%"`,
  ],
  'parts/34-tolerance-words.yaml': [`parts/34-tolerance-words.yaml:4:12: tolerance: expected a ratio (e.g. 10% or 0.1), found "ten percent"`],
  'parts/35-top-level-list.yaml': [
    `parts/35-top-level-list.yaml:1:1: expected one part: a mapping of fields such as "id: ...", "kind: ...", "nominal: ..."; found a list`,
  ],
  'parts/36-empty-file.yaml': [
    `parts/36-empty-file.yaml:1:1: expected one part: a mapping of fields such as "id: ...", "kind: ...", "nominal: ..."; the file has no content`,
  ],
  // X9Q: 9 is the EIA-198 class 2 digit for +200 °C, but Q is no change letter.
  'parts/37-dielectric-x9q.yaml': [
    `parts/37-dielectric-x9q.yaml:4:13: dielectric: expected an EIA dielectric code such as C0G, X7R or X5R, found "X9Q": its last letter "Q" is none of A, B, C, D, E, F, P, R, S, T, U, V (the largest change of a class 2 code)`,
  ],
  // IEC 60384-14 classes; deliberately no guess, since a guessed class names a different rating.
  'parts/38-safety-class.yaml': [`parts/38-safety-class.yaml:5:9: safety: expected one of X1, X2, X3, Y1, Y2, Y3, Y4, found "Y5"`],
  // Only the misspelt behaves-as is reported, not a knock-on complaint about nominal.
  'parts/39-behaves-as-unknown.yaml': [
    `parts/39-behaves-as-unknown.yaml:3:13: behaves-as: expected one of capacitor, inductor, resistor, bead, found "capacitr"; did you mean "capacitor"?`,
  ],
  // The value is fine, the field is out of place: the key is pointed at.
  'parts/40-network-nominal-without-behaves-as.yaml': [
    `parts/40-network-nominal-without-behaves-as.yaml:3:1: nominal: a network's nominal value needs "behaves-as" (one of capacitor, inductor, resistor, bead) to say what it is; add behaves-as or remove nominal`,
  ],
  // "µ" and "Ω" earlier on the line count one column each.
  'parts/41-columns-after-micro-and-ohm.yaml': [
    `parts/41-columns-after-micro-and-ohm.yaml:4:41: parasitics.rp: expected a resistance in Ω (e.g. 18m, 4R7 or 2.2 kΩ), found "5 oops"`,
  ],
  // "🔋" (outside the Basic Multilingual Plane: two UTF-16 units) earlier on the line counts one column.
  'parts/42-columns-after-astral.yaml': [`parts/42-columns-after-astral.yaml:4:16: tags: expected a word, found ""`],
};

describe('the bad-parts corpus', () => {
  it('has at least 28 bad part files and an expectation for every file in it', () => {
    const onDisk = ['folio.yaml', ...readdirSync(`${ROOT}parts`).sort().map((f) => `parts/${f}`)];
    expect(Object.keys(EXPECTED)).toEqual(onDisk);
    const bad = Object.entries(EXPECTED).filter(([file, lines]) => file.startsWith('parts/') && lines.length > 0);
    expect(bad.length).toBeGreaterThanOrEqual(28);
  });

  for (const [file, lines] of Object.entries(EXPECTED)) {
    it(`${file}: ${lines.length === 0 ? 'nothing' : lines.length === 1 ? 'one message' : `${lines.length} messages`}`, () => {
      expect(linesOf(file)).toEqual(lines);
    });
  }

  it('reports everything from every file in one run, in file order, and nothing else', () => {
    expect(result.diagnostics.map(formatDiagnostic)).toEqual(Object.values(EXPECTED).flat());
    expect(result.diagnostics.every((d) => d.severity === 'error')).toBe(true);
    expect(result.library).toBeUndefined();
  });

  it('the duplicate-id message names both files', () => {
    const [line] = linesOf('parts/27-duplicate-id-second.yaml');
    expect(line).toContain('parts/27-duplicate-id-second.yaml:2:5');
    expect(line).toContain('parts/26-duplicate-id-first.yaml:1:5');
  });

  it('counts columns in characters: recomputed from the file text, independently of the YAML parser', () => {
    // Column = characters before the value on its line + 1; Array.from splits a string into code points.
    const columnOf = (file: string, lineNo: number, needle: string) => {
      const line = readFileSync(`${ROOT}${file}`, 'utf8').split('\n')[lineNo - 1];
      return Array.from(line.slice(0, line.indexOf(needle))).length + 1;
    };
    const at = (file: string) => result.diagnostics.find((d) => d.file === file)!;
    const micro = at('parts/41-columns-after-micro-and-ohm.yaml');
    expect([micro.line, micro.column]).toEqual([4, columnOf('parts/41-columns-after-micro-and-ohm.yaml', 4, '5 oops')]);
    const astral = at('parts/42-columns-after-astral.yaml');
    expect([astral.line, astral.column]).toEqual([4, columnOf('parts/42-columns-after-astral.yaml', 4, '""')]);
    // In UTF-16 units the battery would count twice: the column must not be that.
    const line4 = readFileSync(`${ROOT}parts/42-columns-after-astral.yaml`, 'utf8').split('\n')[3];
    expect(astral.column).not.toBe(line4.indexOf('""') + 1);
  });
});
