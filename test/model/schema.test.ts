// The JSON Schemas an editor's YAML language server uses for part files and folio.yaml, checked with ajv
// (a general-purpose JSON Schema validator, draft-07) against the demo library, against deliberately wrong
// files, and against zfolio's own reader so the two agree on what a valid file is.

import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import AjvModule, { type ErrorObject, type ValidateFunction } from 'ajv';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { yamlFilesUnder } from '../../src/model/library.js';
import { readPart } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';
import { parseQuantity } from '../../src/units/parse.js';
import { parseVoltageRating } from '../../src/model/voltage-rating.js';
import type { Dimension } from '../../src/units/quantity.js';

const Ajv = AjvModule.default;
const root = fileURLToPath(new URL('../../', import.meta.url));
const PART_SCHEMA = join(root, 'schema/part.schema.json');
const FOLIO_SCHEMA = join(root, 'schema/folio.schema.json');

// strict + strictTypes: ajv refuses unknown keywords and keywords that do not fit the declared type, so a
// typo in the schema fails here instead of being silently ignored by an editor.
const ajv = new Ajv({ allErrors: true, strict: true, strictTypes: true });
ajv.addSchema(JSON.parse(readFileSync(PART_SCHEMA, 'utf8')), 'part');
ajv.addSchema(JSON.parse(readFileSync(FOLIO_SCHEMA, 'utf8')), 'folio');
const validatePart = ajv.getSchema('part') as ValidateFunction;
const validateFolio = ajv.getSchema('folio') as ValidateFunction;

/** YAML as an editor reads it (YAML 1.2 core schema: 0.12 is a number) and as zfolio reads it (all strings). */
const asEditor = (text: string): unknown => parse(text);
const asZfolio = (text: string): unknown => parse(text, { schema: 'failsafe' });

const explain = (errors: ErrorObject[] | null | undefined) => (errors ?? []).map((e) => `${e.instancePath || '/'} ${e.message} ${JSON.stringify(e.params)}`).join('\n');

/** What zfolio's reader says about one part file: the number of errors it reports. */
function readerErrors(text: string): number {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/sample.yaml', text, diagnostics);
  if (source) readPart({ source, diagnostics });
  return diagnostics.errorCount;
}

const partFiles = yamlFilesUnder(root, 'parts');

describe('the demo library against the schemas', () => {
  it('has part files to check', () => {
    expect(partFiles.length).toBeGreaterThanOrEqual(34);
  });

  it.each(partFiles)('%s validates, read as an editor and as zfolio reads it', (path) => {
    const text = readFileSync(join(root, path), 'utf8');
    expect(validatePart(asEditor(text)), explain(validatePart.errors)).toBe(true);
    expect(validatePart(asZfolio(text)), explain(validatePart.errors)).toBe(true);
  });

  it.each(partFiles)('%s names the part schema on its first line, by a path that resolves to it', (path) => {
    const first = readFileSync(join(root, path), 'utf8').split('\n')[0];
    const match = /^# yaml-language-server: \$schema=(\S+)$/.exec(first);
    expect(match, first).not.toBeNull();
    expect(resolve(dirname(join(root, path)), match![1])).toBe(PART_SCHEMA);
  });

  it('folio.yaml validates, read both ways', () => {
    const text = readFileSync(join(root, 'folio.yaml'), 'utf8');
    expect(validateFolio(asEditor(text)), explain(validateFolio.errors)).toBe(true);
    expect(validateFolio(asZfolio(text)), explain(validateFolio.errors)).toBe(true);
  });
});

// Each wrong file is a small change to a valid one, so a rejection is due to that change.
const CAPACITOR = `id: T-C-1
kind: capacitor
title: 100 nF 16 V X7R 0402
nominal: 100n
voltage: 16V
package: "0402"
dielectric: X7R
parasitics: {esr: 18m, esl: 0.45n}
dc-bias: {3.3V: 80%, 16V: 40%}
mounting: 0.35nH
cost: 0.01
`;
const BEAD = `id: T-FB-1
kind: bead
nominal: 600R
at: 100M
model: {rdc: 150m, r: 700, l: 1.4u, c: 0.45p}
`;
const NETWORK = `id: T-N-1
kind: network
behaves-as: capacitor
nominal: 10u
network:
  series:
    - r: 5m
    - l: 1.1n
    - parallel: [{c: 10u}, {r: 50M}]
`;

interface WrongFile {
  what: string;
  text: string;
  /** The ajv error that says why: its keyword and, where useful, a parameter or path. */
  keyword: string;
  where?: string;
  param?: [string, string];
}

const WRONG: WrongFile[] = [
  { what: 'an unknown field', text: CAPACITOR + 'colour: blue\n', keyword: 'additionalProperties', param: ['additionalProperty', 'colour'] },
  { what: 'an unknown kind', text: CAPACITOR.replace('kind: capacitor', 'kind: capacitator'), keyword: 'enum', where: '/kind' },
  { what: 'a bead without a model', text: BEAD.replace(/^model:.*\n/m, ''), keyword: 'required', param: ['missingProperty', 'model'] },
  { what: 'a network node with two keys', text: NETWORK.replace('    - r: 5m\n', '    - {r: 5m, l: 1n}\n'), keyword: 'maxProperties', where: '/network/series/0' },
  { what: 'an unknown network element', text: NETWORK.replace('- r: 5m', '- x: 5m'), keyword: 'additionalProperties', where: '/network/series/0' },
  { what: 'an empty series list', text: NETWORK.replace(/network:[\s\S]*$/, 'network: {series: []}\n'), keyword: 'minItems', where: '/network/series' },
  { what: 'an inductor parasitic on a capacitor', text: CAPACITOR.replace('esr: 18m', 'dcr: 18m'), keyword: 'additionalProperties', param: ['additionalProperty', 'dcr'] },
  { what: 'a capacitor without nominal', text: CAPACITOR.replace('nominal: 100n\n', ''), keyword: 'required', param: ['missingProperty', 'nominal'] },
  { what: 'a nominal in the wrong unit', text: CAPACITOR.replace('nominal: 100n', 'nominal: 100 nH'), keyword: 'pattern', where: '/nominal' },
  { what: 'a value that is not a number', text: CAPACITOR.replace('esr: 18m', 'esr: low'), keyword: 'pattern', where: '/parasitics/esr' },
  { what: 'a bad id', text: CAPACITOR.replace('id: T-C-1', 'id: T C 1'), keyword: 'pattern', where: '/id' },
  { what: 'an unknown safety class', text: CAPACITOR + 'safety: X9\n', keyword: 'enum', where: '/safety' },
  { what: 'a three-letter dielectric that is no EIA code', text: CAPACITOR.replace('dielectric: X7R', 'dielectric: X7Q'), keyword: 'pattern', where: '/dielectric' },
  { what: 'a DC-bias key that is not a voltage', text: CAPACITOR.replace('3.3V: 80%', 'high: 80%'), keyword: 'pattern', where: '/dc-bias' },
  { what: 'a DC-bias table on an inductor', text: 'id: T-L-1\nkind: inductor\nnominal: 4u7\ndc-bias: {1V: 90%}\n', keyword: 'false schema', where: '/dc-bias' },
  { what: 'a mounting inductance on an inductor', text: 'id: T-L-1\nkind: inductor\nnominal: 4u7\nmounting: 1nH\n', keyword: 'false schema', where: '/mounting' },
  { what: 'a mounting inductance on a network that does not behave as a capacitor', text: NETWORK.replace('behaves-as: capacitor', 'behaves-as: resistor') + 'mounting: 1nH\n', keyword: 'false schema', where: '/mounting' },
  { what: 'a mounting that is not an inductance', text: CAPACITOR.replace('mounting: 0.35nH', 'mounting: 0.35nF'), keyword: 'pattern', where: '/mounting' },
  { what: 'a safety class on an inductor', text: 'id: T-L-1\nkind: inductor\nnominal: 4u7\nsafety: X2\n', keyword: 'false schema', where: '/safety' },
  { what: 'a marking on a bead', text: BEAD + 'marking: "601"\n', keyword: 'false schema', where: '/marking' },
  { what: 'a bead nominal without its frequency', text: BEAD.replace('at: 100M\n', ''), keyword: 'dependencies', param: ['missingProperty', 'at'] },
  { what: 'a network nominal without behaves-as', text: NETWORK.replace('behaves-as: capacitor\n', ''), keyword: 'false schema', where: '/nominal' },
  { what: 'a typed network without nominal', text: NETWORK.replace('nominal: 10u\n', ''), keyword: 'required', param: ['missingProperty', 'nominal'] },
  { what: 'a safety class with a bare voltage (IEC 60384-14: say AC or DC)', text: CAPACITOR.replace('voltage: 16V', 'voltage: 310V') + 'safety: X2\n', keyword: 'pattern', where: '/voltage' },
  { what: 'a safety class without a voltage', text: CAPACITOR.replace('voltage: 16V\n', '').replace(/dc-bias:.*\n/, '') + 'safety: Y2\n', keyword: 'required', param: ['missingProperty', 'voltage'] },
  { what: 'a voltage rating of an unknown kind', text: CAPACITOR.replace('voltage: 16V', 'voltage: 16V RF'), keyword: 'pattern', where: '/voltage' },
  { what: 'a marking code with multiplier 8', text: CAPACITOR + 'marking: "108"\n', keyword: 'pattern', where: '/marking' },
];

describe('wrong part files are rejected by the schema and by zfolio alike', () => {
  it('the valid bases pass both', () => {
    for (const text of [CAPACITOR, BEAD, NETWORK]) {
      expect(validatePart(asEditor(text)), explain(validatePart.errors)).toBe(true);
      expect(validatePart(asZfolio(text)), explain(validatePart.errors)).toBe(true);
      expect(readerErrors(text)).toBe(0);
    }
  });

  it.each(WRONG)('$what', ({ text, keyword, where, param }) => {
    for (const doc of [asEditor(text), asZfolio(text)]) {
      expect(validatePart(doc)).toBe(false);
      const reasons = (validatePart.errors ?? []).filter(
        (e) => e.keyword === keyword && (where === undefined || e.instancePath === where) && (param === undefined || (e.params as Record<string, unknown>)[param[0]] === param[1]),
      );
      expect(reasons.length, explain(validatePart.errors)).toBeGreaterThan(0);
    }
    expect(readerErrors(text)).toBeGreaterThan(0);
  });
});

describe('folio.yaml: wrong settings are rejected', () => {
  it.each([
    ['an unknown field', 'title: x\ncolour: blue\n'],
    ['an unknown paper size', 'paper: A3\n'],
    ['a fractional point count', 'sweep: {per-decade: 12.5}\n'],
    ['a derating above 100%', 'derating: 120%\n'],
    ['a sweep limit that is not a frequency', 'sweep: {from: 100 V}\n'],
  ])('%s', (_, text) => {
    expect(validateFolio(asEditor(text))).toBe(false);
    expect(validateFolio(asZfolio(text))).toBe(false);
  });
});

// The schema's number patterns must accept what zfolio's parser accepts and refuse what it refuses. The
// expected column is the notation as DESIGN.md states it: SI prefixes, unit symbols, RKM codes (IEC 60062).
const NOTATION: [Dimension, string, boolean][] = [
  ['capacitance', '100n', true],
  ['capacitance', '100 nF', true],
  ['capacitance', '100 n F', true],
  ['capacitance', '0.1u', true],
  ['capacitance', '4u7', true],
  ['capacitance', '4n7F', true],
  ['capacitance', '4µ7', true],
  ['capacitance', '1e-7', true],
  ['capacitance', '2F2', true],
  ['capacitance', '100 nH', false],
  ['capacitance', '4R7', false],
  ['capacitance', '100x', false],
  ['capacitance', 'n', false],
  ['inductance', '0.45 nH', true],
  ['inductance', '2n7', true],
  ['inductance', '1u0', true],
  ['inductance', '4.7µH', true],
  ['inductance', '4.7 µF', false],
  ['resistance', '4R7', true],
  ['resistance', 'R005', true],
  ['resistance', '0R12', true],
  ['resistance', '4K7', true],
  ['resistance', '4k7Ω', true],
  ['resistance', '2.2 kΩ', true],
  ['resistance', '10 mΩ', true],
  ['resistance', '10 mohm', true],
  ['resistance', '50 Ohms', true],
  ['resistance', '18m', true],
  ['resistance', '4r7', false],
  ['resistance', 'R', false],
  ['resistance', '10 mV', false],
  ['frequency', '100M', true],
  ['frequency', '10 GHz', true],
  ['frequency', '100 hz', true],
  ['frequency', '100 MF', false],
  ['voltage', '6.3V', true],
  ['voltage', '16 V', true],
  ['voltage', '6V3', false],
  ['current', '500 mA', true],
  ['power', '250 mW', true],
  ['ratio', '10%', true],
  ['ratio', '0.1', true],
  ['ratio', '10 %', true],
  ['ratio', '10%%', false],
];

describe('the schema number patterns agree with zfolio\'s parser', () => {
  it.each(NOTATION)('%s %j → %s', (dim, text, accepted) => {
    const validate = ajv.getSchema(`part#/definitions/${dim}`) as ValidateFunction;
    expect(validate(text)).toBe(accepted);
    const parsed = parseQuantity(text, dim);
    expect(parsed.ok && parsed.value > 0).toBe(accepted);
  });

  it.each([
    ['16V', true],
    ['400V DC', true],
    ['310V AC', true],
    ['310 V AC', true],
    ['310VAC', true],
    ['250 V~', true],
    ['310V rms', false],
    ['310A AC', false],
  ])('voltage rating %j → %s', (text, accepted) => {
    const validate = ajv.getSchema('part#/definitions/voltageRating') as ValidateFunction;
    expect(validate(text)).toBe(accepted);
    expect(parseVoltageRating(text).ok).toBe(accepted);
  });

  it('numbers in SI base units are accepted when positive', () => {
    const validate = ajv.getSchema('part#/definitions/capacitance') as ValidateFunction;
    expect(validate(1e-7)).toBe(true);
    expect(validate(0)).toBe(false);
    expect(validate(-1e-7)).toBe(false);
  });
});
