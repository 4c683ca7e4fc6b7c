import { cpSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPart, type Part } from '../../src/model/part.js';
import { defaultMounting, readPlan, uniqueRails, voltageStress } from '../../src/model/plan.js';
import { parseYamlSource } from '../../src/model/source.js';

// Plan files are checked like part files: every problem at file:line:col with what was expected and what
// was found. The fixture library's parts are invented (see its files).
const fixture = fileURLToPath(new URL('../fixtures/rail-library', import.meta.url));
const { library } = loadLibrary(fixture);
const partsById = library!.partsById;

const GOOD: Record<string, string> = {
  rail: 'VDD_X',
  voltage: '1.0V',
  ripple: '5%',
  step: '2A',
  band: '{from: 100k, to: 100M}',
  mounting: '0.3nH',
  capacitors: '\n  - {part: RT-C-1U, count: 2}',
};

/** A plan file: the good fields with some replaced ('' drops a field), in this order, extras last. */
function planText(over: Record<string, string> = {}): string {
  const fields = { ...GOOD, ...over };
  return Object.entries(fields)
    .filter(([, v]) => v !== '')
    .map(([k, v]) => `${k}: ${v}`)
    .join('\n') + '\n';
}

function read(text: string, derating = 0.8) {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('plans/bad.yaml', text, diagnostics);
  const plan = source ? readPlan({ source, diagnostics }, partsById, derating) : undefined;
  return { plan, messages: diagnostics.sorted().map(formatDiagnostic) };
}

describe('a good plan', () => {
  it('reads every field in SI units', () => {
    const { plan, messages } = read(planText({ regulator: '{r: 2m, l: 15nH}', plane: '{c: 10nF, r: 3m}', capacitors: '\n  - {part: RT-C-1U, count: 2}\n  - {part: RT-C-22U, count: 3, mounting: 0.5nH}' }));
    expect(messages).toEqual([]);
    expect(plan).toMatchObject({ rail: 'VDD_X', title: 'VDD_X', voltageV: 1, target: { kind: 'ripple', ripple: 0.05, stepA: 2 }, band: { fromHz: 1e5, toHz: 1e8 }, mountingH: 0.3e-9 });
    expect(plan!.regulator).toEqual({ rOhm: 2e-3, lH: 15e-9 });
    expect(plan!.plane).toEqual({ cF: 10e-9, rOhm: 3e-3 });
    expect(plan!.placements.map((p) => [p.part.id, p.count, p.mountingH])).toEqual([
      ['RT-C-1U', 2, 0.3e-9],
      ['RT-C-22U', 3, 0.5e-9],
    ]);
    expect(plan!.placements[1].at).toEqual({ file: 'plans/bad.yaml', line: 9, column: 12 });
  });
  it('takes an explicit target instead of ripple and step', () => {
    const { plan, messages } = read(planText({ ripple: '', step: '', target: '4.5m' }));
    expect(messages).toEqual([]);
    expect(plan!.target).toEqual({ kind: 'explicit', ohms: 4.5e-3 });
  });
  it('reads the load step: rise and duration in seconds, and a step beside an explicit target', () => {
    const { plan, messages } = read(planText({ ripple: '', target: '4.5m', rise: '2.5ns', duration: '40u' }));
    expect(messages).toEqual([]);
    expect(plan).toMatchObject({ target: { kind: 'explicit', ohms: 4.5e-3, stepA: 2 }, riseS: 2.5e-9, durationS: 40e-6 });
    const plain = read(planText()).plan!;
    expect([plain.riseS, plain.durationS]).toEqual([undefined, undefined]);
  });
  it('accepts a network that behaves as a capacitor', () => {
    const { plan, messages } = read(planText({ capacitors: '\n  - {part: RT-N-10U, count: 1}' }));
    expect(messages).toEqual([]);
    expect(plan!.placements[0].part.kind).toBe('network');
  });
});

describe('bad plan files, each with its exact message', () => {
  const cases: [string, Record<string, string>, string][] = [
    ['an unknown part id, with a near miss', { capacitors: '\n  - {part: RT-C-1U, count: 2}\n  - {part: RT-C-22V, count: 2}' }, 'plans/bad.yaml:9:12: capacitors[1].part: no part with id "RT-C-22V" in the library; did you mean "RT-C-22U"?'],
    ['a part that is not a capacitor', { capacitors: '\n  - {part: RT-L-1U, count: 1}' }, 'plans/bad.yaml:8:12: capacitors[0].part: RT-L-1U is an inductor; a plan places capacitors (or networks with "behaves-as: capacitor")'],
    ['a zero voltage', { voltage: '0V' }, 'plans/bad.yaml:2:10: voltage: expected a voltage greater than zero, found "0V"'],
    ['a negative step current', { step: '-2A' }, 'plans/bad.yaml:4:7: step: expected a current greater than zero, found "-2A"'],
    ['a zero count', { capacitors: '\n  - part: RT-C-1U\n    count: 0' }, 'plans/bad.yaml:9:12: capacitors[0].count: expected a whole number of placements from 1 to 10000, found "0"'],
    ['a fractional count', { capacitors: '\n  - {part: RT-C-1U, count: 2.5}' }, 'plans/bad.yaml:8:28: capacitors[0].count: expected a whole number of placements from 1 to 10000, found "2.5"'],
    ['an empty band', { band: '{from: 10M, to: 1M}' }, 'plans/bad.yaml:5:23: band.to: expected a frequency above band.from (10 MHz), found 1 MHz: the band is empty'],
    ['a band with equal ends', { band: '{from: 1M, to: 1M}' }, 'plans/bad.yaml:5:22: band.to: expected a frequency above band.from (1 MHz), found 1 MHz: the band is empty'],
    ['both a target and ripple/step', { target: '10m' }, 'plans/bad.yaml:9:9: target: give either "target" or "ripple" and "step" (Z_t = V·ripple/ΔI), not both'],
    ['neither a target nor ripple/step', { ripple: '', step: '' }, 'plans/bad.yaml:1:1: missing the target impedance: give "ripple" and "step" (Z_t = V·ripple/ΔI, e.g. ripple: 3% and step: 6A) or "target" (e.g. target: 4.5m)'],
    ['ripple without step', { step: '' }, 'plans/bad.yaml:1:1: missing field "step" (the load\'s step current ΔI, e.g. 6A), needed with "ripple"'],
    ['a ripple of 100 % or more', { ripple: '120%' }, 'plans/bad.yaml:3:9: ripple: expected a fraction of the rail voltage below 100%, found "120%"'],
    ['a rail above a part\'s voltage rating', { voltage: '1.5V', capacitors: '\n  - {part: RT-C-1U-LV, count: 1}' }, "plans/bad.yaml:8:12: capacitors[0].part: the rail's 1.5 V exceeds the 1.2 V rating of RT-C-1U-LV; choose a part rated above the rail"],
    ['a misspelt field', { mounting: '', mountng: '0.3nH' }, 'plans/bad.yaml:8:1: unknown field "mountng"; did you mean "mounting"?'],
    ['a regulator with neither r nor l', { regulator: '{}' }, 'plans/bad.yaml:9:12: regulator: expected its output resistance "r", inductance "l" or both, found neither'],
    ['a missing band', { band: '' }, 'plans/bad.yaml:1:1: missing field "band"'],
    ['a rise time in volts', { rise: '5V' }, 'plans/bad.yaml:9:7: rise: expected a time in s (e.g. 10n or 10 ns), found "5V" (a voltage, in V)'],
    ['a negative duration', { duration: '-1u' }, 'plans/bad.yaml:9:11: duration: expected a time greater than zero, found "-1u"'],
    ['a rise time with a target and no step', { ripple: '', step: '', target: '4m', rise: '5n' }, 'plans/bad.yaml:8:7: rise: a load step needs its current: give "step" (ΔI, e.g. step: 2A) with the target'],
  ];
  it.each(cases)('%s', (_, over, expected) => {
    const { plan, messages } = read(planText(over));
    expect(plan).toBeUndefined();
    expect(messages).toEqual([expected]);
  });
});

describe('voltage ratings', () => {
  it('a rail above settings.derating × rating is a warning on the plan, which still loads', () => {
    const { plan, messages } = read(planText({ capacitors: '\n  - {part: RT-C-1U-LV, count: 1}' }));
    const expected = 'plans/bad.yaml:8:12: warning: capacitors[0].part: the rail\'s 1 V is 83.3% of the 1.2 V rating of RT-C-1U-LV, above the derating limit of 80% (folio.yaml "derating")';
    expect(messages).toEqual([expected]);
    expect(plan!.warnings.map(formatDiagnostic)).toEqual([expected]);
  });
  it('the derating limit comes from the settings: at 90 % the same part is fine', () => {
    expect(read(planText({ capacitors: '\n  - {part: RT-C-1U-LV, count: 1}' }), 0.9).messages).toEqual([]);
  });
  it('a part with no rating is a warning', () => {
    expect(read(planText({ capacitors: '\n  - {part: RT-C-2U2-NR, count: 1}' })).messages).toEqual([
      "plans/bad.yaml:8:12: warning: capacitors[0].part: RT-C-2U2-NR states no voltage rating, so the rail's 1 V cannot be checked against it",
    ]);
  });
  it('a rail above the last point of a part\'s DC-bias table is a warning naming the part, both voltages and the fraction held', () => {
    // RT-C-4U7's table ends at 2 V (80 %); the rail is at 3.3 V.
    expect(read(planText({ voltage: '3.3V', capacitors: '\n  - {part: RT-C-4U7, count: 1}' })).messages).toEqual([
      "plans/bad.yaml:8:12: warning: capacitors[0].part: the DC-bias table of RT-C-4U7 ends at 2 V, below the rail's 3.3 V; its last fraction, 80%, is used, which is likely optimistic (class 2 ceramics keep losing capacitance as the voltage rises)",
    ]);
    // At the table's last voltage, or below its first point, nothing is extrapolated.
    expect(read(planText({ voltage: '2V', capacitors: '\n  - {part: RT-C-4U7, count: 1}' })).messages).toEqual([]);
    expect(read(planText({ voltage: '0.3V', capacitors: '\n  - {part: RT-C-4U7, count: 1}' })).messages).toEqual([]);
  });
  it('voltageStress: exactly at the rating is allowed, above it is not (common practice: a rating is a maximum)', () => {
    const part = partsById.get('RT-C-1U-LV')!;
    expect(voltageStress(part, 1.2, 0.8)).toBe('above-derating');
    expect(voltageStress(part, 1.21, 0.8)).toBe('over-rating');
    expect(voltageStress(part, 0.96, 0.8)).toBe('ok');
  });
});

// Mounting inductance, most specific first: the entry's own, the part file's, the plan's package table,
// the plan's default. Two invented parts beside the fixture's: a 0402 part with no mounting of its own and a
// can that states one.
function partOf(text: string): Part {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/extra.yaml', text, diagnostics)!;
  const part = readPart({ source, diagnostics });
  expect(diagnostics.sorted().map(formatDiagnostic)).toEqual([]);
  return part!;
}
const SMALL = partOf('id: MT-C-0402\nkind: capacitor\nnominal: 1u\nvoltage: 10V\npackage: "0402"\nparasitics: {esr: 10m, esl: 0.4n}\n');
const CAN = partOf('id: MT-C-CAN\nkind: capacitor\nnominal: 100u\nvoltage: 10V\npackage: "0402"\nmounting: 1.2nH\nparasitics: {esr: 15m, esl: 2n}\n');
const withExtras = new Map([...partsById, [SMALL.id, SMALL], [CAN.id, CAN]]);

function readWith(text: string) {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('plans/m.yaml', text, diagnostics);
  const plan = source ? readPlan({ source, diagnostics }, withExtras, 0.8) : undefined;
  return { plan, messages: diagnostics.sorted().map(formatDiagnostic) };
}

describe('mounting inductance of each placement', () => {
  const text = planText({
    mounting: '0.3nH\nmounting-by-package: {"0402": 0.25nH}',
    capacitors: '\n  - {part: MT-C-0402, count: 2}\n  - {part: MT-C-0402, count: 1, mounting: 0.6nH}\n  - {part: MT-C-CAN, count: 1}\n  - {part: MT-C-CAN, count: 1, mounting: 0.9nH}\n  - {part: RT-C-1U, count: 1}',
  });
  it('the entry\'s own first, then the part file\'s, then the package table, then the rail default', () => {
    const { plan, messages } = readWith(text);
    expect(messages).toEqual([]);
    expect(plan!.mountingByPackage).toEqual({ '0402': 0.25e-9 });
    expect(plan!.placements.map((p) => [p.part.id, p.mountingH, p.mountingFrom])).toEqual([
      ['MT-C-0402', 0.25e-9, 'package'],
      ['MT-C-0402', 0.6e-9, 'entry'],
      ['MT-C-CAN', 1.2e-9, 'part'], // its own 1.2 nH, though its package is in the table
      ['MT-C-CAN', 0.9e-9, 'entry'],
      ['RT-C-1U', 0.3e-9, 'rail'], // states no package
    ]);
  });
  it('defaultMounting is the same resolution without an entry', () => {
    const plan = readWith(text).plan!;
    expect(defaultMounting(plan, SMALL)).toEqual({ mountingH: 0.25e-9, mountingFrom: 'package' });
    expect(defaultMounting(plan, CAN)).toEqual({ mountingH: 1.2e-9, mountingFrom: 'part' });
    expect(defaultMounting({ mountingH: 0.3e-9, mountingByPackage: {} }, SMALL)).toEqual({ mountingH: 0.3e-9, mountingFrom: 'rail' });
  });
  it('a package no part has is a warning with a near miss; a value that is no inductance is an error', () => {
    expect(readWith(planText({ mounting: '0.3nH\nmounting-by-package: {"0403": 0.25nH}' })).messages).toEqual([
      'plans/m.yaml:7:23: warning: mounting-by-package: no part in the library has package "0403"; did you mean "0402"?',
    ]);
    const bad = readWith(planText({ mounting: '0.3nH\nmounting-by-package: {"0402": 0.25nF}' }));
    expect(bad.plan).toBeUndefined();
    expect(bad.messages).toEqual([expect.stringMatching(/^plans\/m\.yaml:7:31: mounting-by-package\.0402: /)]);
  });
  it('a part file\'s mounting belongs to capacitors: on an inductor, or a network that is not one, it is an error', () => {
    const errors = (text: string) => {
      const diagnostics = new DiagnosticList();
      const source = parseYamlSource('parts/l.yaml', text, diagnostics)!;
      expect(readPart({ source, diagnostics })).toBeUndefined();
      return diagnostics.sorted().map(formatDiagnostic);
    };
    expect(errors('id: MT-L\nkind: inductor\nnominal: 1u\nmounting: 1nH\n')).toEqual([
      'parts/l.yaml:4:1: unknown field "mounting"; expected one of id, kind, title, nominal, marking, tolerance, voltage, current, power, package, tags, notes, band, cost, measurements, parasitics, temperature, tc',
    ]);
    expect(errors('id: MT-N\nkind: network\nbehaves-as: inductor\nnominal: 1u\nnetwork: {l: 1u}\nmounting: 1nH\n')).toEqual([
      'parts/l.yaml:6:11: mounting: a mounting inductance applies to capacitors placed on rails only; this network does not behave as a capacitor',
    ]);
  });
});

describe('plans in a library', () => {
  const temp: string[] = [];
  afterAll(() => temp.forEach((d) => rmSync(d, { recursive: true, force: true })));
  const copy = () => {
    const dir = mkdtempSync(join(tmpdir(), 'zfolio-plan-'));
    cpSync(fixture, dir, { recursive: true });
    temp.push(dir);
    return dir;
  };

  it('the fixture library loads its two plans in path order, with the derating warning among its diagnostics', () => {
    const { library: lib, diagnostics } = loadLibrary(fixture);
    expect(lib!.plans.map((p) => p.rail)).toEqual(['VDD_TEST', 'VDD_WEAK']);
    expect(diagnostics.map(formatDiagnostic)).toEqual([
      'plans/vdd-weak.yaml:10:12: warning: capacitors[1].part: the rail\'s 1 V is 83.3% of the 1.2 V rating of RT-C-1U-LV, above the derating limit of 80% (folio.yaml "derating")',
    ]);
  });
  it('a library without plans/ has no plans and no complaint', () => {
    const dir = copy();
    rmSync(join(dir, 'plans'), { recursive: true });
    const { library: lib, diagnostics } = loadLibrary(dir);
    expect(lib!.plans).toEqual([]);
    expect(diagnostics).toEqual([]);
  });
  it('a bad plan makes the library fail to load, with its message', () => {
    const dir = copy();
    writeFileSync(join(dir, 'plans', 'vdd-bad.yaml'), planText({ rail: 'VDD_BAD', capacitors: '\n  - {part: RT-C-100M, count: 1}' }));
    const { library: lib, diagnostics } = loadLibrary(dir);
    expect(lib).toBeUndefined();
    expect(diagnostics.map(formatDiagnostic)).toContain('plans/vdd-bad.yaml:8:12: capacitors[0].part: no part with id "RT-C-100M" in the library; did you mean "RT-C-100N"?');
  });
  it('two plans of one rail: the second is an error at its rail name', () => {
    const dir = copy();
    writeFileSync(join(dir, 'plans', 'vdd-twin.yaml'), planText({ rail: 'VDD_TEST' }));
    const { diagnostics } = loadLibrary(dir);
    expect(diagnostics.map(formatDiagnostic)).toContain('plans/vdd-twin.yaml:1:7: duplicate rail "VDD_TEST": already planned at plans/vdd-test.yaml:2:7');
  });
  it('uniqueRails keeps the first of each rail', () => {
    const a = read(planText()).plan!;
    const diagnostics = new DiagnosticList();
    expect(uniqueRails([a, { ...a }], diagnostics)).toHaveLength(1);
    expect(diagnostics.errorCount).toBe(1);
  });
});
