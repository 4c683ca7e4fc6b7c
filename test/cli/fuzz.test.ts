// Fuzzing as a test: valid part, plan, comparison, review and folio files are mutated (values replaced by
// other types, keys that every JavaScript object has, denormal and huge numbers, ambiguous units, strings
// with control characters, stray YAML syntax characters) and dropped into a sound library. zfolio must
// answer each in under 2 s with exit 0 or 1 from check (and 0, or 3 for a failing rail, from figures and
// plan on what check accepts), every message located as file:line:col, and nothing that reads NaN,
// Infinity, undefined or [object Object]. A part that check accepts also has its four charts drawn, which
// must hold only finite numbers. The seed is fixed so CI is repeatable; FUZZ_SEED and FUZZ_RUNS change it.

import { cpSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { stringify } from 'yaml';
import { afterAll, describe, expect, it } from 'vitest';
import { analysePart } from '../../src/analysis/part-figures.js';
import { renderPartCharts } from '../../src/charts/part-charts.js';
import { loadLibrary } from '../../src/model/library.js';
import { CORPUS } from '../model/bad-inputs-run.js';
import { run } from './fake-io.js';

/** CPU time of this process since `started`, ms: "under 2 s a document" measured as work done, so that other
 *  processes on a loaded machine (a parallel test file, another build) do not count against it. */
function cpuMs(started: NodeJS.CpuUsage): number {
  const used = process.cpuUsage(started);
  return (used.user + used.system) / 1000;
}

type Value = string | Value[] | Map<string, Value>;

/** Valid documents of each kind, as nested Maps so that any key (even "__proto__") stays a plain key. */
const SEEDS: Record<string, { place: string; doc: object }> = {
  capacitor: {
    place: 'parts/fuzz.yaml',
    doc: { id: 'FUZZ-C', kind: 'capacitor', title: 'Fuzz capacitor', nominal: '4.7u', tolerance: '10%', voltage: '10V', dielectric: 'X5R', parasitics: { esr: '8m', esl: '0.5n', epr: '100M' }, 'dc-bias': { '0V': '100%', '5V': '60%' }, tags: ['decoupling'], cost: '0.02' },
  },
  inductor: { place: 'parts/fuzz.yaml', doc: { id: 'FUZZ-L', kind: 'inductor', nominal: '10u', current: '1A', parasitics: { dcr: '50m', cp: '2p', rp: '20k' } } },
  bead: { place: 'parts/fuzz.yaml', doc: { id: 'FUZZ-FB', kind: 'bead', nominal: '120R', at: '100M', model: { rdc: '50m', r: '180', l: '0.25u', c: '0.35p' } } },
  network: {
    place: 'parts/fuzz.yaml',
    doc: { id: 'FUZZ-N', kind: 'network', 'behaves-as': 'capacitor', nominal: '10.1u', network: { parallel: [{ series: [{ r: '4m' }, { l: '1.1n' }, { c: '10u' }] }, { series: [{ r: '30m' }, { l: '0.4n' }, { c: '100n' }] }] } },
  },
  plan: {
    place: 'plans/fuzz.yaml',
    doc: { rail: 'FUZZ_RAIL', voltage: '1V', ripple: '5%', step: '2A', band: { from: '100k', to: '100M' }, mounting: '0.3nH', regulator: { r: '2m', l: '5n' }, plane: { c: '10n', r: '3m' }, capacitors: [{ part: 'BASE-C-100N', count: '8' }, { part: 'BASE-C-10U', count: '2', mounting: '0.5nH' }] },
  },
  comparison: { place: 'comparisons/fuzz.yaml', doc: { title: 'Fuzz comparison', parts: ['BASE-C-100N', 'BASE-C-10U'] } },
  review: {
    place: 'reviews/fuzz.yaml',
    doc: { title: 'Fuzz review', date: '2026-03-18', board: 'Fuzz board (invented)', reviewers: [{ name: 'A. Person', role: 'power' }], covers: { plans: ['BASE_RAIL'], parts: ['BASE-C-100N'], comparisons: ['base-pair'] }, decisions: ['Accept **BASE_RAIL**.'], 'open-points': [{ text: 'Measure', owner: 'A. Person', due: '2026-04-01' }] },
  },
  folio: { place: 'folio.yaml', doc: { title: 'Fuzz folio', sweep: { from: '1k', to: '1G', 'per-decade': '20' }, band: { within: '10%' }, derating: '80%', paper: 'A4' } },
};

function toValue(x: unknown): Value {
  if (Array.isArray(x)) return x.map(toValue);
  if (x !== null && typeof x === 'object') return new Map(Object.entries(x).map(([k, v]) => [k, toValue(v)]));
  return String(x);
}

const PROTO_KEYS = ['__proto__', 'constructor', 'valueOf', 'hasOwnProperty', 'toString', 'prototype', 'isPrototypeOf'];
const NUMBERS = ['5e-324', '-5e-324', '1e-320', '2.2250738585072014e-308', '1e308', '-1e308', '1.7976931348623157e308', '1e309', '0', '-0', 'NaN', 'Infinity', '-1', '1e-300', '1e300', '0x10', '1_000'];
const UNITS = ['100mhz', '100m', '1MF', '1M', '2M2', '10', '150%', '4R7', '1e6u', '100 nH', '16A', '310V AC', '2026-02-30'];
const CONTROL = ['\u0000', '\u0007', '\u001b', '\r', '\u0085', '\u007f', '\u2028'];

const scalar: fc.Arbitrary<Value> = fc.oneof(
  fc.constantFrom(...NUMBERS, ...UNITS, ...PROTO_KEYS),
  fc.tuple(fc.string({ maxLength: 12 }), fc.constantFrom(...CONTROL), fc.string({ maxLength: 12 })).map(([a, c, b]) => a + c + b),
  fc.double().map(String),
  fc.string({ maxLength: 200 }),
);
const value: fc.Arbitrary<Value> = fc.oneof(
  { weight: 4, arbitrary: scalar },
  { weight: 1, arbitrary: fc.array(scalar, { maxLength: 3 }) },
  { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...PROTO_KEYS, 'r', 'l', 'c', 'series'), scalar).map(([k, v]) => new Map([[k, v]])) },
);

/** One change to a document: replace a value, add a key, remove a key, or wrap a value in a list. */
type Mutation = { op: 'set' | 'add' | 'remove' | 'wrap'; pick: number; key: string; value: Value };
const mutation: fc.Arbitrary<Mutation> = fc.record({
  op: fc.constantFrom('set', 'add', 'remove', 'wrap'),
  pick: fc.nat(),
  key: fc.oneof(fc.constantFrom(...PROTO_KEYS), fc.string({ maxLength: 8 })),
  value,
});

/** Every Map and list in the document, so a mutation can pick any of them. */
function containers(v: Value, out: (Map<string, Value> | Value[])[] = []): (Map<string, Value> | Value[])[] {
  if (typeof v === 'string') return out;
  out.push(v);
  for (const child of v instanceof Map ? v.values() : v) containers(child, out);
  return out;
}

function mutate(doc: Value, m: Mutation): void {
  const all = containers(doc);
  const target = all[m.pick % all.length];
  if (target instanceof Map) {
    const keys = [...target.keys()];
    const key = keys.length > 0 ? keys[m.pick % keys.length] : m.key;
    if (m.op === 'set') target.set(key, m.value);
    else if (m.op === 'add') target.set(m.key, m.value);
    else if (m.op === 'remove') target.delete(key);
    else target.set(key, [target.get(key) ?? m.value]);
  } else {
    const i = target.length > 0 ? m.pick % target.length : 0;
    if (m.op === 'remove') target.splice(i, 1);
    else if (m.op === 'wrap') target[i] = [target[i] ?? m.value];
    else target.splice(i, m.op === 'set' ? 1 : 0, m.value);
  }
}

/** A character dropped into the YAML text itself, to break its syntax in the ways hands do. */
const textEdit = fc.option(fc.record({ at: fc.nat(), text: fc.constantFrom('\t', '\r', '\u0000', ': ', '- ', '{', '[', ']', '}', '!!float ', '&a ', '*a', '%YAML 1.1\n', '"', "'", '#', '|\n', '---\n', '\ufeff', '😀') }), { freq: 3 });

const base = mkdtempSync(join(tmpdir(), 'zfolio-fuzz-'));
cpSync(join(CORPUS, 'base'), base, { recursive: true });
mkdirSync(join(base, 'reviews'));
afterAll(() => rmSync(base, { recursive: true, force: true }));
const baseFolio = stringify({ title: 'Bad-input corpus base (invented)', sweep: { from: '1k', to: '1G', 'per-decade': '20' } });

const LOCATED = /^(?:[^\s:"]+|"(?:[^"\\]|\\.)*"):\d+:\d+: \S/;
const SUMMARY = /^\d+ errors?(?:, \d+ warnings?)? in the library; nothing was done$/;
const BAD_WORDS = ['NaN', 'Infinity', 'undefined', '[object Object]'];

/** Words of BAD_WORDS in `output` that the document itself did not contain (a quoted "NaN" it holds is fine). */
function badWords(output: string, document: string, words = BAD_WORDS): string[] {
  return words.filter((w) => output.includes(w) && !document.includes(w));
}

async function check(kind: string, mutations: Mutation[], edit: { at: number; text: string } | null): Promise<number> {
  const seed = SEEDS[kind];
  const doc = toValue(seed.doc);
  for (const m of mutations) mutate(doc, m);
  let text = stringify(doc, { lineWidth: 0 });
  if (edit) {
    const at = edit.at % (text.length + 1);
    text = text.slice(0, at) + edit.text + text.slice(at);
  }
  writeFileSync(join(base, seed.place), text);
  const started = process.cpuUsage();
  try {
    const checked = await run(['check'], base);
    const context = `${kind} document:\n${text}\n--- stderr:\n${checked.err}`;
    expect([0, 1], context).toContain(checked.code);
    const lines = checked.err.split('\n').filter((l) => l !== '');
    for (const line of lines) expect(LOCATED.test(line) || SUMMARY.test(line), `unlocated line "${line}" for ${context}`).toBe(true);
    expect(badWords(checked.out + checked.err, text), context).toEqual([]);
    if (checked.code === 0) {
      const figures = await run(['figures', '--json'], base);
      expect(figures.code, context).toBe(0);
      // JSON writes a non-finite number as null, so NaN could hide there; the charts below see the numbers.
      expect(badWords(figures.out + figures.err, text), context).toEqual([]);
      const plan = await run(['plan', '--json'], base);
      expect([0, 3], context).toContain(plan.code);
      expect(badWords(plan.out + plan.err, text), context).toEqual([]);
      if (seed.place.startsWith('parts/')) {
        const { library } = loadLibrary(base);
        const part = library!.parts.find((p) => p.source.path === seed.place)!;
        const charts = await renderPartCharts(analysePart(part, library!.settings.sweep, part.within ?? library!.settings.within));
        for (const chart of Object.values(charts)) expect(chart.svg, context).not.toMatch(/="[^"]*(NaN|Infinity|undefined)[^"]*"/);
      }
    }
    expect(cpuMs(started), context).toBeLessThan(2000);
    return checked.code;
  } finally {
    if (seed.place === 'folio.yaml') writeFileSync(join(base, 'folio.yaml'), baseFolio);
    else rmSync(join(base, seed.place), { force: true });
  }
}

const SEED = Number(process.env.FUZZ_SEED ?? 20260318);
const RUNS = Number(process.env.FUZZ_RUNS ?? 25);

describe('mutated library files', () => {
  it.each(Object.keys(SEEDS))('%s: never a crash, hang, unlocated message or non-finite number', async (kind) => {
    // The unmutated seed is sound: the mutations, not the seed, are what is tested.
    expect(await check(kind, [], null)).toBe(0);
    await fc.assert(
      fc.asyncProperty(fc.array(mutation, { minLength: 1, maxLength: 3 }), textEdit, async (mutations, edit) => {
        await check(kind, mutations, edit);
      }),
      { seed: SEED + kind.length, numRuns: RUNS, endOnFailure: true },
    );
  }, 60_000);
});

// Values inside the ranges zfolio accepts (src/units/ranges.ts), log-uniform and at the corners: what check
// accepts must analyse and draw with finite numbers only.
const within = (min: number, max: number) =>
  fc.oneof(
    fc.constantFrom(min, max),
    fc.double({ min: Math.log10(min), max: Math.log10(max), noNaN: true }).map((e) => Math.min(max, Math.max(min, 10 ** e))),
  ).map((v) => v.toPrecision(6));
const ohms = within(1e-9, 1e15);
const henries = within(1e-15, 1e6);
const farads = within(1e-18, 1e4);
const element: fc.Arbitrary<Value> = fc.oneof(ohms.map((v) => new Map([['r', v]])), henries.map((v) => new Map([['l', v]])), farads.map((v) => new Map([['c', v]])));
const tree: fc.Arbitrary<Value> = fc.letrec<{ node: Value }>((tie) => ({
  node: fc.oneof({ depthSize: 'small', withCrossShrink: true }, element, fc.tuple(fc.constantFrom('series', 'parallel'), fc.array(tie('node'), { minLength: 1, maxLength: 3 })).map(([k, kids]) => new Map([[k, kids]]) as Value)),
})).node;
const inRangeParts: fc.Arbitrary<Value> = fc.oneof(
  fc.tuple(farads, ohms, henries, ohms).map(([c, esr, esl, epr]) => toValue({ id: 'FUZZ-C', kind: 'capacitor', nominal: c, parasitics: { esr, esl, epr } })),
  fc.tuple(henries, ohms, farads, ohms).map(([l, dcr, cp, rp]) => toValue({ id: 'FUZZ-L', kind: 'inductor', nominal: l, parasitics: { dcr, cp, rp } })),
  fc.tuple(ohms, henries, farads).map(([r, ls, cp]) => toValue({ id: 'FUZZ-R', kind: 'resistor', nominal: r, parasitics: { ls, cp } })),
  fc.tuple(ohms, ohms, henries, farads).map(([rdc, r, l, c]) => toValue({ id: 'FUZZ-FB', kind: 'bead', model: { rdc, r, l, c } })),
  tree.map((network) => new Map<string, Value>([['id', 'FUZZ-N'], ['kind', 'network'], ['network', network]])),
);
const sweeps = fc.tuple(within(1e-3, 1e12), within(1e-3, 1e12)).filter(([a, b]) => Number(a) !== Number(b)).map(([a, b]) => (Number(a) < Number(b) ? [a, b] : [b, a]));

describe('values anywhere inside the accepted ranges', () => {
  it('analyse and draw with finite numbers only', async () => {
    await fc.assert(
      fc.asyncProperty(inRangeParts, sweeps, async (doc, [from, to]) => {
        writeFileSync(join(base, 'folio.yaml'), stringify({ title: 'Fuzz folio', sweep: { from, to, 'per-decade': '5' } }));
        writeFileSync(join(base, 'parts', 'fuzz.yaml'), stringify(doc, { lineWidth: 0 }));
        try {
          const text = stringify(doc, { lineWidth: 0 });
          const started = process.cpuUsage();
          const checked = await run(['check'], base);
          const context = `part:\n${text}\nsweep ${from} to ${to}\n--- stderr:\n${checked.err}`;
          expect(checked.code, context).toBe(0);
          const id = ['FUZZ-C', 'FUZZ-L', 'FUZZ-R', 'FUZZ-FB', 'FUZZ-N'].find((name) => text.includes(name))!;
          const figures = await run(['figures', id, '--json'], base);
          expect(figures.code, context).toBe(0);
          expect(badWords(figures.out + figures.err, text), context).toEqual([]);
          const { library } = loadLibrary(base);
          const part = library!.parts.find((p) => p.source.path === 'parts/fuzz.yaml')!;
          const charts = await renderPartCharts(analysePart(part, library!.settings.sweep, library!.settings.within));
          for (const chart of Object.values(charts)) expect(chart.svg, context).not.toMatch(/="[^"]*(NaN|Infinity|undefined)[^"]*"/);
          expect(cpuMs(started), context).toBeLessThan(2000);
        } finally {
          writeFileSync(join(base, 'folio.yaml'), baseFolio);
          rmSync(join(base, 'parts', 'fuzz.yaml'), { force: true });
        }
      }),
      { seed: SEED, numRuns: RUNS * 2, endOnFailure: true },
    );
  }, 60_000);
});
