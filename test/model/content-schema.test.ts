// The JSON Schemas an editor's YAML language server uses for comparisons, rail plans and reviews, checked
// with ajv (a general-purpose JSON Schema validator, draft-07) against the demo files, against deliberately
// wrong files, and against zfolio's own readers so the two agree on what a valid file is.

import { readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import AjvModule, { type ErrorObject, type ValidateFunction } from 'ajv';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { comparisonKey, readComparison } from '../../src/model/comparison.js';
import { DiagnosticList } from '../../src/model/diagnostics.js';
import { loadLibrary, yamlFilesUnder, type Library } from '../../src/model/library.js';
import { readPlan } from '../../src/model/plan.js';
import { readReview } from '../../src/model/review.js';
import { parseYamlSource } from '../../src/model/source.js';

const Ajv = AjvModule.default;
const root = fileURLToPath(new URL('../../', import.meta.url));
const SCHEMA = {
  comparison: join(root, 'schema/comparison.schema.json'),
  plan: join(root, 'schema/plan.schema.json'),
  review: join(root, 'schema/review.schema.json'),
} as const;
type Kind = keyof typeof SCHEMA;

// strict + strictTypes: ajv refuses unknown keywords and keywords that do not fit the declared type, so a
// typo in a schema fails here instead of being silently ignored by an editor.
const ajv = new Ajv({ allErrors: true, strict: true, strictTypes: true });
for (const kind of Object.keys(SCHEMA) as Kind[]) ajv.addSchema(JSON.parse(readFileSync(SCHEMA[kind], 'utf8')), kind);
const validator = (kind: Kind) => ajv.getSchema(kind) as ValidateFunction;

/** YAML as an editor reads it (YAML 1.2 core schema: 0.9 is a number) and as zfolio reads it (all strings). */
const asEditor = (text: string): unknown => parse(text);
const asZfolio = (text: string): unknown => parse(text, { schema: 'failsafe' });

const explain = (errors: ErrorObject[] | null | undefined) => (errors ?? []).map((e) => `${e.instancePath || '/'} ${e.message} ${JSON.stringify(e.params)}`).join('\n');

const { library: loaded } = loadLibrary(root);
const library = loaded as Library;

/** The number of errors zfolio's reader reports for one file of `kind`, read against the demo library. */
function readerErrors(kind: Kind, text: string): number {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource(`${kind}s/sample.yaml`, text, diagnostics);
  if (source) {
    const ctx = { source, diagnostics };
    if (kind === 'plan') readPlan(ctx, library.partsById, library.settings.derating);
    else if (kind === 'comparison') readComparison(ctx, library.partsById, library.parts);
    else {
      readReview(ctx, {
        parts: library.partsById,
        comparisons: new Map(library.comparisons.map((c) => [comparisonKey(c), c])),
        plans: new Map(library.plans.map((p) => [p.rail, p])),
      });
    }
  }
  return diagnostics.errorCount;
}

const demoFiles: [Kind, string][] = [
  ...yamlFilesUnder(root, 'comparisons').map((p): [Kind, string] => ['comparison', p]),
  ...yamlFilesUnder(root, 'plans').map((p): [Kind, string] => ['plan', p]),
  ...yamlFilesUnder(root, 'reviews').map((p): [Kind, string] => ['review', p]),
];

describe('the demo comparisons, plans and reviews against their schemas', () => {
  it('the demo library loads, and has 2 or more comparisons, 2 or more plans and a review to check', () => {
    expect(loaded).toBeDefined();
    const count = (kind: Kind) => demoFiles.filter(([k]) => k === kind).length;
    expect(count('comparison')).toBeGreaterThanOrEqual(2);
    expect(count('plan')).toBeGreaterThanOrEqual(2);
    expect(count('review')).toBeGreaterThanOrEqual(1);
  });

  it.each(demoFiles)('%s %s validates, read as an editor and as zfolio reads it', (kind, path) => {
    const text = readFileSync(join(root, path), 'utf8');
    const validate = validator(kind);
    expect(validate(asEditor(text)), explain(validate.errors)).toBe(true);
    expect(validate(asZfolio(text)), explain(validate.errors)).toBe(true);
    expect(readerErrors(kind, text)).toBe(0);
  });

  it.each(demoFiles)('%s %s names its schema on its first line, by a path that resolves to it', (kind, path) => {
    const first = readFileSync(join(root, path), 'utf8').split('\n')[0];
    const match = /^# yaml-language-server: \$schema=(\S+)$/.exec(first);
    expect(match, first).not.toBeNull();
    expect(resolve(dirname(join(root, path)), match![1])).toBe(SCHEMA[kind]);
  });
});

// Each wrong file is a small change to a valid one, so a rejection is due to that change.
const PLAN = `rail: VDD_T
voltage: 1.0V
ripple: 3%
step: 2A
band: {from: 100k, to: 40M}
mounting: 0.3nH
mounting-by-package: {"0402": 0.25nH, "0805": 0.35nH}
regulator: {r: 1m, l: 15nH}
plane: {c: 10nF, r: 2m}
capacitors:
  - {part: ORV-C-0805-22U-X6S, count: 4}
  - {part: ORV-C-0402-100N-X7R, count: 12, mounting: 0.25nH}
`;
const COMPARISON_BY_ID = `title: Two decoupling parts
parts: [ORV-C-0402-100N-X7R, ORV-C-0402-1U-X5R]
`;
const COMPARISON_BY_FILTER = `title: RF inductors
select: {kind: inductor, tags: [rf], package: "0402"}
`;
const REVIEW = `title: A review
date: 2026-05-04
board: T-1 rev A
reviewers:
  - {name: Pat Example, role: power}
  - Sam Example
covers:
  plans: [VDD_CORE]
  comparisons: [decoupling-0402]
  parts: [ORV-C-0402-100N-X7R]
decisions:
  - Accept **VDD_CORE**.
open-points:
  - {text: Measure the rail., owner: Sam Example, due: 2026-06-01}
  - A point with no owner yet.
`;

interface WrongFile {
  kind: Kind;
  what: string;
  text: string;
  /** The ajv error that says why: its keyword and, where useful, a path or a parameter. */
  keyword: string;
  where?: string;
  param?: [string, string];
}

const WRONG: WrongFile[] = [
  { kind: 'plan', what: 'an unknown field', text: PLAN + 'colour: blue\n', keyword: 'additionalProperties', param: ['additionalProperty', 'colour'] },
  { kind: 'plan', what: 'a bad rail name', text: PLAN.replace('rail: VDD_T', 'rail: VDD T'), keyword: 'pattern', where: '/rail' },
  { kind: 'plan', what: 'a voltage in amperes', text: PLAN.replace('voltage: 1.0V', 'voltage: 1.0A'), keyword: 'pattern', where: '/voltage' },
  { kind: 'plan', what: 'a ripple of 100% or more', text: PLAN.replace('ripple: 3%', 'ripple: 120%'), keyword: 'pattern', where: '/ripple' },
  { kind: 'plan', what: 'a step without a ripple or a target', text: PLAN.replace('ripple: 3%\n', ''), keyword: 'required', param: ['missingProperty', 'ripple'] },
  { kind: 'plan', what: 'a rise time in volts', text: PLAN + 'rise: 5V\n', keyword: 'pattern', where: '/rise' },
  { kind: 'plan', what: 'a rise time without a step', text: PLAN.replace('ripple: 3%\nstep: 2A\n', 'target: 15m\nrise: 5n\n'), keyword: 'dependencies', param: ['missingProperty', 'step'] },
  { kind: 'plan', what: 'an explicit target as well as ripple and step', text: PLAN + 'target: 10m\n', keyword: 'false schema', where: '/ripple' },
  { kind: 'plan', what: 'no target at all', text: PLAN.replace('ripple: 3%\nstep: 2A\n', ''), keyword: 'anyOf', where: '' },
  { kind: 'plan', what: 'a band without its upper end', text: PLAN.replace('band: {from: 100k, to: 40M}', 'band: {from: 100k}'), keyword: 'required', param: ['missingProperty', 'to'] },
  { kind: 'plan', what: 'a band end that is not a frequency', text: PLAN.replace('to: 40M', 'to: 40 MF'), keyword: 'pattern', where: '/band/to' },
  { kind: 'plan', what: 'a plan without mounting inductance', text: PLAN.replace('mounting: 0.3nH\n', ''), keyword: 'required', param: ['missingProperty', 'mounting'] },
  { kind: 'plan', what: 'a package mounting that is not an inductance', text: PLAN.replace('"0805": 0.35nH', '"0805": 0.35nF'), keyword: 'pattern', where: '/mounting-by-package/0805' },
  { kind: 'plan', what: 'a package mounting that is a list', text: PLAN.replace('mounting-by-package: {"0402": 0.25nH, "0805": 0.35nH}', 'mounting-by-package: [0.25nH]'), keyword: 'type', where: '/mounting-by-package' },
  { kind: 'plan', what: 'a regulator with neither r nor l', text: PLAN.replace('regulator: {r: 1m, l: 15nH}', 'regulator: {}'), keyword: 'minProperties', where: '/regulator' },
  { kind: 'plan', what: 'a plane without its capacitance', text: PLAN.replace('plane: {c: 10nF, r: 2m}', 'plane: {r: 2m}'), keyword: 'required', param: ['missingProperty', 'c'] },
  { kind: 'plan', what: 'a zero count', text: PLAN.replace('count: 4', 'count: 0'), keyword: 'anyOf', where: '/capacitors/0/count' },
  { kind: 'plan', what: 'a fractional count', text: PLAN.replace('count: 4', 'count: 2.5'), keyword: 'anyOf', where: '/capacitors/0/count' },
  { kind: 'plan', what: 'a placement without a count', text: PLAN.replace('{part: ORV-C-0805-22U-X6S, count: 4}', '{part: ORV-C-0805-22U-X6S}'), keyword: 'required', param: ['missingProperty', 'count'] },
  { kind: 'plan', what: 'an unknown placement field', text: PLAN.replace('count: 4}', 'count: 4, esl: 1n}'), keyword: 'additionalProperties', param: ['additionalProperty', 'esl'] },
  { kind: 'comparison', what: 'both ids and a filter', text: COMPARISON_BY_ID + 'select: {kind: capacitor}\n', keyword: 'oneOf', where: '' },
  { kind: 'comparison', what: 'neither ids nor a filter', text: 'title: Nothing chosen\n', keyword: 'oneOf', where: '' },
  { kind: 'comparison', what: 'no title', text: COMPARISON_BY_ID.replace('title: Two decoupling parts\n', ''), keyword: 'required', param: ['missingProperty', 'title'] },
  { kind: 'comparison', what: 'an empty id list', text: 'title: Empty\nparts: []\n', keyword: 'minItems', where: '/parts' },
  { kind: 'comparison', what: 'an id listed twice', text: 'title: Twice\nparts: [ORV-C-0402-1U-X5R, ORV-C-0402-1U-X5R]\n', keyword: 'uniqueItems', where: '/parts' },
  { kind: 'comparison', what: 'an unknown kind in the filter', text: COMPARISON_BY_FILTER.replace('kind: inductor', 'kind: coil'), keyword: 'enum', where: '/select/kind' },
  { kind: 'comparison', what: 'an unknown filter field', text: COMPARISON_BY_FILTER.replace('package: "0402"', 'size: "0402"'), keyword: 'additionalProperties', param: ['additionalProperty', 'size'] },
  { kind: 'review', what: 'a date not written YYYY-MM-DD', text: REVIEW.replace('date: 2026-05-04', 'date: 04.05.2026'), keyword: 'pattern', where: '/date' },
  { kind: 'review', what: 'a due date with month 13', text: REVIEW.replace('due: 2026-06-01', 'due: 2026-13-01'), keyword: 'pattern', where: '/open-points/0/due' },
  { kind: 'review', what: 'no board', text: REVIEW.replace('board: T-1 rev A\n', ''), keyword: 'required', param: ['missingProperty', 'board'] },
  { kind: 'review', what: 'covering nothing', text: REVIEW.replace(/covers:\n(?: {2}.*\n)+/, 'covers: {}\n'), keyword: 'anyOf', where: '/covers' },
  { kind: 'review', what: 'an unknown list under covers', text: REVIEW.replace('  parts: [ORV-C-0402-100N-X7R]', '  boards: [T-1]'), keyword: 'additionalProperties', param: ['additionalProperty', 'boards'] },
  { kind: 'review', what: 'a reviewer with an unknown field', text: REVIEW.replace('{name: Pat Example, role: power}', '{name: Pat Example, team: power}'), keyword: 'additionalProperties', param: ['additionalProperty', 'team'] },
  { kind: 'review', what: 'an open point without its text', text: REVIEW.replace('{text: Measure the rail., owner: Sam Example', '{owner: Sam Example'), keyword: 'required', param: ['missingProperty', 'text'] },
];

describe('wrong comparison, plan and review files are rejected by the schema and by zfolio alike', () => {
  it.each([
    ['plan', PLAN],
    ['plan', PLAN.replace('ripple: 3%\n', 'target: 15m\n') + 'rise: 5ns\nduration: 20u\n'],
    ['comparison', COMPARISON_BY_ID],
    ['comparison', COMPARISON_BY_FILTER],
    ['review', REVIEW],
  ] as [Kind, string][])('the valid %s base passes both', (kind, text) => {
    const validate = validator(kind);
    expect(validate(asEditor(text)), explain(validate.errors)).toBe(true);
    expect(validate(asZfolio(text)), explain(validate.errors)).toBe(true);
    expect(readerErrors(kind, text)).toBe(0);
  });

  it.each(WRONG)('$kind: $what', ({ kind, text, keyword, where, param }) => {
    const validate = validator(kind);
    for (const doc of [asEditor(text), asZfolio(text)]) {
      expect(validate(doc)).toBe(false);
      const reasons = (validate.errors ?? []).filter(
        (e) => e.keyword === keyword && (where === undefined || e.instancePath === where) && (param === undefined || (e.params as Record<string, unknown>)[param[0]] === param[1]),
      );
      expect(reasons.length, explain(validate.errors)).toBeGreaterThan(0);
    }
    expect(readerErrors(kind, text)).toBeGreaterThan(0);
  });
});

// A schema sees one file; what another file holds only zfolio's reader can check. These pass the schema
// by design and must still fail in zfolio.
describe('what only the reader can know: references to the rest of the library', () => {
  it.each([
    ['plan', 'an unknown part id', PLAN.replace('ORV-C-0805-22U-X6S', 'ORV-C-0805-22U-X9S')],
    ['plan', 'a part rated below the rail', PLAN.replace('voltage: 1.0V', 'voltage: 10V')],
    ['plan', 'an inductor placed as a capacitor', PLAN.replace('ORV-C-0805-22U-X6S', 'ORV-L-RF-0402-10N')],
    ['plan', 'a band whose upper end is below its lower', PLAN.replace('{from: 100k, to: 40M}', '{from: 40M, to: 100k}')],
    ['comparison', 'an unknown part id', COMPARISON_BY_ID.replace('ORV-C-0402-1U-X5R', 'ORV-C-0402-1U-X5X')],
    ['review', 'an unknown rail', REVIEW.replace('plans: [VDD_CORE]', 'plans: [VDD_CORF]')],
    ['review', 'an unknown comparison', REVIEW.replace('comparisons: [decoupling-0402]', 'comparisons: [decoupling-0403]')],
  ] as [Kind, string, string][])('%s: %s', (kind, _, text) => {
    const validate = validator(kind);
    expect(validate(asZfolio(text)), explain(validate.errors)).toBe(true);
    expect(readerErrors(kind, text)).toBeGreaterThan(0);
  });
});
