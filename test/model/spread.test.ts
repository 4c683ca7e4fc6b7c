// Where a part's spread comes from, as part files, folio.yaml and plans write it: tolerances symmetric and
// not, temperature characteristics from EIA dielectric codes (EIA-198-1; decoder checked in
// test/units/eia-dielectric.test.ts), explicit blocks and coefficients, parasitic spreads after their
// values; every refusal located at file:line:col.

import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DiagnosticList, formatDiagnostic } from '../../src/model/diagnostics.js';
import { loadLibrary } from '../../src/model/library.js';
import { readPart, type Part } from '../../src/model/part.js';
import { parseYamlSource } from '../../src/model/source.js';

function read(yaml: string): { part?: Part; messages: string[] } {
  const diagnostics = new DiagnosticList();
  const source = parseYamlSource('parts/p.yaml', yaml, diagnostics);
  const part = source ? readPart({ source, diagnostics }) : undefined;
  return { part, messages: diagnostics.sorted().map(formatDiagnostic) };
}

const CAP = (extra: string) => `id: C1\nkind: capacitor\nnominal: 10u\n${extra}`;

describe('tolerance', () => {
  it('a plain ratio is symmetric; `tolerance` keeps its larger side', () => {
    const { part, messages } = read(CAP('tolerance: 10%\n'));
    expect(messages).toEqual([]);
    expect(part!.spread.tolerance).toEqual({ minus: 0.1, plus: 0.1 });
    expect(part!.tolerance).toBe(0.1);
  });

  it('+80%/-20% is asymmetric, as class 2 and 3 ceramics and electrolytics are sold (common practice)', () => {
    const { part, messages } = read(CAP('tolerance: +80%/-20%\n'));
    expect(messages).toEqual([]);
    expect(part!.spread.tolerance).toEqual({ minus: 0.2, plus: 0.8 });
    expect(part!.tolerance).toBe(0.8);
  });

  it.each([
    ['tolerance: +80%/+20%', 'parts/p.yaml:4:12: tolerance: expected one side above (+) and one below (-), e.g. +80%/-20%, found "+80%/+20%"'],
    ['tolerance: 150%', 'parts/p.yaml:4:12: tolerance: a tolerance of ±150% would take the value to zero or below; write an asymmetric tolerance such as +150%/-20% if that is what the part is sold at'],
    ['tolerance: +80/-20%', 'parts/p.yaml:4:12: tolerance: expected a spread such as 10%, ±10% or +80%/-20%, found "+80/-20%": a bare number is the fraction itself, so "80" would mean 8000%; write 80% if 80 percent is meant'],
  ])('%s is refused where it is written', (line, message) => {
    expect(read(CAP(`${line}\n`)).messages).toEqual([message]);
  });
});

describe('temperature characteristic', () => {
  it('an EIA class 2 code gives its range and largest change', () => {
    const { part } = read(CAP('dielectric: X7R\n'));
    expect(part!.spread.temperature).toMatchObject({ kind: 'range', fromC: -55, toC: 125, minus: 0.15, plus: 0.15, code: 'X7R', at: { line: 4, column: 13 } });
  });

  it('a class 1 code gives its coefficient with its tolerance, rated −55 °C to 125 °C', () => {
    const { part } = read(CAP('dielectric: C0G\n'));
    expect(part!.spread.temperature).toMatchObject({ kind: 'coefficient', lowPerK: -30e-6, highPerK: 30e-6, rated: { fromC: -55, toC: 125 } });
  });

  it('free words say nothing about temperature', () => {
    expect(read(CAP('dielectric: aluminium polymer\n')).part!.spread.temperature).toBeUndefined();
  });

  it('an explicit block is the part\'s own data and goes before its dielectric\'s class', () => {
    const { part, messages } = read(CAP('dielectric: X5R\ntemperature: {from: -55°C, to: 105°C, change: +5%/-12%}\n'));
    expect(messages).toEqual([]);
    expect(part!.spread.temperature).toMatchObject({ kind: 'range', fromC: -55, toC: 105, minus: 0.12, plus: 0.05, from: 'temperature' });
  });

  it('inductors and resistors give a coefficient', () => {
    const { part, messages } = read('id: L1\nkind: inductor\nnominal: 10u\ntc: 200ppm/K\n');
    expect(messages).toEqual([]);
    expect(part!.spread.temperature).toMatchObject({ kind: 'coefficient', lowPerK: -200e-6, highPerK: 200e-6, from: 'tc' });
  });

  it.each([
    [CAP('temperature: {from: 125°C, to: -55°C, change: 15%}\n'), 'parts/p.yaml:4:32: temperature.to: expected a temperature above temperature.from (125 °C), found −55 °C'],
    [CAP('temperature: {from: -55, to: 125°C, change: 15%}\n'), 'parts/p.yaml:4:21: temperature.from: expected a temperature with its unit, e.g. -55°C, 125 °C or 398K, found "-55": write °C (or K) after the number'],
    [CAP('temperature: {from: -55°C, to: 125°C}\n'), 'parts/p.yaml:4:14: missing field "temperature.change"'],
    [CAP('temperature: {from: -55°C, to: 125°C, change: 15%}\ntc: 30ppm/K\n'), 'parts/p.yaml:5:5: tc: give the temperature characteristic once: either "temperature" (a change over a range) or "tc" (a coefficient), not both'],
    ['id: R1\nkind: resistor\nnominal: 1k\ntc: lots\n', 'parts/p.yaml:4:5: tc: expected a temperature coefficient such as 200ppm/K (either sign), ±200ppm/K or -150ppm/K, found "lots"'],
    [CAP('dielectric: X7Q\n'), 'parts/p.yaml:4:13: dielectric: expected an EIA dielectric code such as C0G, X7R or X5R, found "X7Q": its last letter "Q" is none of A, B, C, D, E, F, P, R, S, T, U, V (the largest change of a class 2 code)'],
  ])('refused where written: %#', (text, message) => {
    expect(read(text).messages).toEqual([message]);
  });
});

describe('parasitic spreads', () => {
  it('follow their values: "18m +50%/-30%", "0.45n ±10%"', () => {
    const { part, messages } = read(CAP('parasitics: {esr: 18m +50%/-30%, esl: 0.45n ±10%, epr: 100M}\n'));
    expect(messages).toEqual([]);
    expect(part!.parameters).toEqual({ esr: 18e-3, esl: 0.45e-9, epr: 100e6 });
    expect(part!.spread.parasitics).toEqual({ esr: { minus: 0.3, plus: 0.5 }, esl: { minus: 0.1, plus: 0.1 } });
  });

  it('and on a bead\'s model', () => {
    const { part, messages } = read('id: FB\nkind: bead\nmodel: {rdc: 50m, r: 600 ±25%, l: 1.2u, c: 1.5p}\n');
    expect(messages).toEqual([]);
    expect(part!.spread.parasitics).toEqual({ r: { minus: 0.25, plus: 0.25 } });
  });

  it.each([
    [CAP('parasitics: {esr: 18m +50%/+30%}\n'), 'parts/p.yaml:4:19: parasitics.esr: expected one side above (+) and one below (-), e.g. +80%/-20%, found "+50%/+30%" after the value'],
    [CAP('parasitics: {esr: 1e300 ±5%}\n'), 'parts/p.yaml:4:19: parasitics.esr: expected a resistance from 1 nΩ to 1e15 Ω, the range zfolio computes with, found "1e300"'],
  ])('refused where written: %#', (text, message) => {
    expect(read(text).messages).toEqual([message]);
  });
});

describe('operating temperatures', () => {
  const roots: string[] = [];
  afterAll(() => roots.forEach((r) => rmSync(r, { recursive: true, force: true })));
  function library(folio: string, parts: Record<string, string>, plans: Record<string, string> = {}) {
    const root = mkdtempSync(join(tmpdir(), 'zfolio-spread-'));
    roots.push(root);
    mkdirSync(join(root, 'parts'));
    writeFileSync(join(root, 'folio.yaml'), folio);
    for (const [name, text] of Object.entries(parts)) writeFileSync(join(root, 'parts', name), text);
    if (Object.keys(plans).length) mkdirSync(join(root, 'plans'));
    for (const [name, text] of Object.entries(plans)) writeFileSync(join(root, 'plans', name), text);
    return loadLibrary(root);
  }

  it('folio.yaml states them; a part whose code does not cover them is warned at its dielectric', () => {
    const { library: lib, diagnostics } = library('temperature: {from: -40°C, to: 85°C}\n', { 'z.yaml': CAP('dielectric: Z5U\n'), 'x.yaml': CAP('dielectric: X5R\n').replace('C1', 'C2') });
    expect(lib!.settings.temperature).toEqual({ fromC: -40, toC: 85 });
    expect(diagnostics.map(formatDiagnostic)).toEqual([
      'parts/z.yaml:4:13: warning: dielectric: Z5U is specified from 10 °C to 85 °C only, not all of the library\'s operating temperatures (folio.yaml "temperature") (−40 °C to 85 °C); beyond it the change is not known and its corners may be optimistic',
    ]);
  });

  const PLAN = 'rail: V\nvoltage: 1V\ntarget: 10m\nband: {from: 1M, to: 10M}\nmounting: 0.3n\ncapacitors: [{part: C1, count: 2}]\n';

  it('a plan may narrow them', () => {
    const { library: lib, diagnostics } = library('temperature: {from: -40°C, to: 85°C}\n', { 'c.yaml': CAP('voltage: 6.3V\ndielectric: X7R\n') }, { 'v.yaml': `${PLAN}temperature: {from: 0°C, to: 50°C}\n` });
    expect(diagnostics).toEqual([]);
    expect(lib!.plans[0].temperature).toEqual({ fromC: 0, toC: 50 });
  });

  it('but not widen them', () => {
    const { diagnostics } = library('temperature: {from: -40°C, to: 85°C}\n', { 'c.yaml': CAP('voltage: 6.3V\ndielectric: X7R\n') }, { 'v.yaml': `${PLAN}temperature: {from: -55°C, to: 50°C}\n` });
    expect(diagnostics.map(formatDiagnostic)).toEqual([
      'plans/v.yaml:7:21: temperature.from: expected a range within the library\'s operating temperatures (folio.yaml "temperature", −40 °C to 85 °C), found −55 °C to 50 °C; widen the library\'s range first',
    ]);
  });
});
