// The schematic drawn on a part page is the circuit of the part's model: the SVG is read back here as a
// drawing (wires from its paths, T-junctions where a wire's end lies on another wire, each symbol's two
// terminals, each value from its label), the drawing's nets found by union-find, and the impedance between
// the two terminal circles found by reducing that graph with complex.js (Z_R = R, Z_L = jωL, Z_C = 1/(jωC),
// series impedances and parallel admittances adding: Alexander & Sadiku, Fundamentals of Electric Circuits,
// ch. 9), then compared with the model's own impedance by the test's tree evaluator. Values invented, chosen
// to print exactly at three significant digits.

import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { schematicSvg } from '../../src/pages/schematic.js';
import { referenceZAt } from '../reference/impedance.js';
import { loadLibrary } from '../../src/model/library.js';

interface Point {
  x: number;
  y: number;
}
interface Segment {
  a: Point;
  b: Point;
}
interface Symbol {
  type: 'R' | 'L' | 'C';
  value: number;
  name: string;
  ends: [Point, Point];
}

const PREFIX: Record<string, number> = { f: 1e-15, p: 1e-12, n: 1e-9, µ: 1e-6, m: 1e-3, '': 1, k: 1e3, M: 1e6, G: 1e9 };
const TYPE_OF_UNIT: Record<string, Symbol['type']> = { Ω: 'R', H: 'L', F: 'C' };

const num = (s: string) => Number(s);
const attrs = (tag: string): Record<string, string> => Object.fromEntries([...tag.matchAll(/([\w-]+)="([^"]*)"/g)].map((m) => [m[1], m[2]]));
const unescape = (s: string) => s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&amp;/g, '&');

/** Straight strokes of a path made of M, H and V commands; null for any other path (an inductor's arcs). */
function strokes(d: string): Segment[] | null {
  if (/[^MHV\d\s.-]/.test(d)) return null;
  const out: Segment[] = [];
  let at: Point = { x: 0, y: 0 };
  for (const [, cmd, args] of d.matchAll(/([MHV])\s*([-\d.]+(?:\s+[-\d.]+)?)/g)) {
    const v = args.trim().split(/\s+/).map(num);
    if (cmd === 'M') at = { x: v[0], y: v[1] };
    else {
      const to = cmd === 'H' ? { x: v[0], y: at.y } : { x: at.x, y: v[0] };
      out.push({ a: at, b: to });
      at = to;
    }
  }
  return out;
}

/** The drawing read back from the SVG: wires, symbols with their values and names, the two terminals. */
function readDrawing(svg: string): { wires: Segment[]; symbols: Symbol[]; terminals: [Point, Point] } {
  const labels = [...svg.matchAll(/<text ([^>]*)>([^<]*)<\/text>/g)].map((m) => {
    const a = attrs(m[1]);
    const text = unescape(m[2]);
    const parsed = /^(.+) ([\d.]+(?:e-?\d+)?) ([fpnµmkMG]?)(Ω|H|F)$/.exec(text);
    expect(parsed, `label "${text}"`).not.toBeNull();
    const [, name, mantissa, prefix, unit] = parsed!;
    // A symbol's centre is 13 units below its label's baseline (the label sits above the symbol).
    return { name, type: TYPE_OF_UNIT[unit], value: num(mantissa) * PREFIX[prefix], centre: { x: num(a.x), y: num(a.y) + 13 } };
  });
  const near = (p: Point, q: Point) => Math.abs(p.x - q.x) < 0.06 && Math.abs(p.y - q.y) < 0.06;
  const wires: Segment[] = [];
  const symbols: Symbol[] = [];
  const drawn = (type: Symbol['type'], left: Point, right: Point) => {
    const label = labels.find((l) => l.type === type && near(l.centre, { x: (left.x + right.x) / 2, y: left.y }));
    expect(label, `a ${type} symbol at ${left.x},${left.y} without its label`).toBeDefined();
    symbols.push({ type, value: label!.value, name: label!.name, ends: [left, right] });
  };
  for (const m of svg.matchAll(/<rect ([^>]*)\/>/g)) {
    const a = attrs(m[1]);
    const y = num(a.y) + num(a.height) / 2;
    drawn('R', { x: num(a.x), y }, { x: num(a.x) + num(a.width), y });
  }
  for (const m of svg.matchAll(/<path d="([^"]*)"\/>/g)) {
    const d = m[1];
    const s = strokes(d);
    if (!s) {
      // An inductor: four arcs of 6 units from its left end.
      const start = /^M([-\d.]+) ([-\d.]+)/.exec(d)!;
      const left = { x: num(start[1]), y: num(start[2]) };
      expect((d.match(/a3 3 0 0 1 6 0/g) ?? []).length).toBe(4);
      drawn('L', left, { x: left.x + 24, y: left.y });
      continue;
    }
    // A capacitor's plates: two vertical strokes 6 units apart, centred on a capacitance label's symbol.
    if (s.length === 2 && s.every((g) => g.a.x === g.b.x) && Math.abs(s[1].a.x - s[0].a.x - 6) < 0.06) {
      const y = (s[0].a.y + s[0].b.y) / 2;
      const centre = { x: (s[0].a.x + s[1].a.x) / 2, y };
      if (labels.some((l) => l.type === 'C' && near(l.centre, centre))) {
        drawn('C', { x: s[0].a.x, y }, { x: s[1].a.x, y });
        continue;
      }
    }
    wires.push(...s);
  }
  const circles = [...svg.matchAll(/<circle ([^>]*)\/>/g)].map((m) => attrs(m[1])).map((a) => ({ x: num(a.cx), y: num(a.cy) }));
  expect(circles).toHaveLength(2);
  expect(symbols).toHaveLength(labels.length);
  return { wires, symbols, terminals: [circles[0], circles[1]] };
}

/** Nets of the drawing: every point that matters, joined when a wire runs through it. */
function nets(wires: Segment[], points: Point[]): (p: Point) => number {
  const all = [...points, ...wires.flatMap((w) => [w.a, w.b])];
  const parent = all.map((_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
  const on = (p: Point, w: Segment) =>
    p.x >= Math.min(w.a.x, w.b.x) - 0.06 && p.x <= Math.max(w.a.x, w.b.x) + 0.06 && p.y >= Math.min(w.a.y, w.b.y) - 0.06 && p.y <= Math.max(w.a.y, w.b.y) + 0.06;
  for (const w of wires) {
    const members = all.map((p, i) => (on(p, w) ? i : -1)).filter((i) => i >= 0);
    for (const i of members.slice(1)) parent[find(i)] = find(members[0]);
  }
  return (p: Point) => {
    const i = all.findIndex((q) => Math.abs(p.x - q.x) < 0.06 && Math.abs(p.y - q.y) < 0.06);
    expect(i).toBeGreaterThanOrEqual(0);
    return find(i);
  };
}

/**
 * Impedance between the terminals of the drawn circuit at f, by reducing the drawn graph: two branches between
 * the same nets in parallel (1/Z = 1/Z₁ + 1/Z₂), two that meet at a net nothing else touches in series
 * (Z = Z₁ + Z₂), a branch hanging from a net nothing else touches dropped (it carries no current). Undefined
 * when the drawing does not reduce to one branch between the terminals.
 */
function drawnImpedance(svg: string, f: number, exact?: Record<string, number>): Complex | undefined {
  const { wires, symbols, terminals } = readDrawing(svg);
  const netOf = nets(wires, [...terminals, ...symbols.flatMap((s) => s.ends)]);
  const [a, b] = terminals.map(netOf);
  if (a === b) return new Complex(0, 0);
  const w = 2 * Math.PI * f;
  let edges = symbols.map((s) => {
    const value = exact?.[s.name] ?? s.value;
    const z = s.type === 'R' ? new Complex(value, 0) : s.type === 'L' ? new Complex(0, w * value) : new Complex(0, -1 / (w * value));
    return { u: netOf(s.ends[0]), v: netOf(s.ends[1]), z };
  });
  for (let changed = true; changed; ) {
    changed = false;
    // A branch with both ends on one net is shorted by the drawing: it carries nothing.
    const kept = edges.filter((e) => e.u !== e.v);
    changed ||= kept.length !== edges.length;
    edges = kept;
    for (let i = 0; i < edges.length && !changed; i++) {
      for (let j = i + 1; j < edges.length && !changed; j++) {
        const [p, q] = [edges[i], edges[j]];
        if ((p.u === q.u && p.v === q.v) || (p.u === q.v && p.v === q.u)) {
          edges[i] = { ...p, z: p.z.inverse().add(q.z.inverse()).inverse() };
          edges.splice(j, 1);
          changed = true;
        }
      }
    }
    const degree = new Map<number, number[]>();
    edges.forEach((e, i) => [e.u, e.v].forEach((n) => degree.set(n, [...(degree.get(n) ?? []), i])));
    for (const [net, at] of degree) {
      if (changed || net === a || net === b) continue;
      if (at.length === 1) {
        edges.splice(at[0], 1);
        changed = true;
      } else if (at.length === 2) {
        const [p, q] = [edges[at[0]], edges[at[1]]];
        const far = (e: typeof p) => (e.u === net ? e.v : e.u);
        edges[at[0]] = { u: far(p), v: far(q), z: p.z.add(q.z) };
        edges.splice(at[1], 1);
        changed = true;
      }
    }
  }
  const [only] = edges;
  return edges.length === 1 && ((only.u === a && only.v === b) || (only.u === b && only.v === a)) ? only.z : undefined;
}

const models: [string, Element, Record<string, number>][] = [
  ['a capacitor: ESR + ESL + (C ‖ EPR)', series(resistor(5e-3, 'ESR'), inductor(500e-12, 'ESL'), parallel(capacitor(10e-6, 'C'), resistor(1e6, 'EPR'))), { ESR: 5e-3, ESL: 500e-12, C: 10e-6, EPR: 1e6 }],
  ['an inductor: (DCR + L) ‖ Cp ‖ Rp', parallel(series(resistor(20e-3, 'DCR'), inductor(4.7e-6, 'L')), capacitor(2e-12, 'Cp'), resistor(10e3, 'Rp')), { DCR: 20e-3, L: 4.7e-6, Cp: 2e-12, Rp: 10e3 }],
  ['a bead: Rdc + (R ‖ L ‖ C)', series(resistor(50e-3, 'Rdc'), parallel(resistor(300, 'R'), inductor(1e-6, 'L'), capacitor(1.5e-12, 'C'))), { Rdc: 50e-3, R: 300, L: 1e-6, C: 1.5e-12 }],
  [
    'a network nested three deep, its leaves unnamed',
    parallel(series(resistor(2.2), parallel(capacitor(100e-9), series(inductor(3.3e-9), resistor(0.47))), inductor(10e-9)), series(capacitor(1e-6), inductor(1.2e-9)), resistor(1e3)),
    // Numbered by type in drawing order: down the first branch, then the second, then the third.
    { R1: 2.2, C1: 100e-9, L1: 3.3e-9, R2: 0.47, L2: 10e-9, C2: 1e-6, L3: 1.2e-9, R3: 1e3 },
  ],
  ['a single resistor', resistor(49.9, 'R'), { R: 49.9 }],
];

describe('schematicSvg draws the model’s circuit', () => {
  for (const [what, element, names] of models) {
    it(what, () => {
      const svg = schematicSvg(element, 'model');
      // Every leaf is drawn once, labelled with its role name (or its number) and its value.
      const labelled = Object.fromEntries(readDrawing(svg).symbols.map((s) => [s.name, s.value]));
      expect(Object.keys(labelled).sort()).toEqual(Object.keys(names).sort());
      for (const [name, value] of Object.entries(names)) expect(Math.abs(labelled[name] / value - 1), name).toBeLessThan(1e-12);
      for (const f of [1e3, 1e6, 37e6, 1e9]) {
        const drawn = drawnImpedance(svg, f);
        const model = referenceZAt(element, f);
        expect(drawn, `${f} Hz`).toBeDefined();
        expect(drawn!.sub(model).abs() / model.abs(), `${f} Hz`).toBeLessThan(1e-12);
      }
    });
  }

  it('every part of the demo library: labels within their three printed digits, the circuit exact', () => {
    const { library } = loadLibrary(fileURLToPath(new URL('../../', import.meta.url)));
    expect(library!.parts.length).toBeGreaterThan(30);
    for (const part of library!.parts) {
      // Each leaf's exact value by the name the schematic gives it: its role, else its type numbered in
      // depth-first order (the rule the schematic states).
      const exact: Record<string, number> = {};
      const counters: Record<string, number> = {};
      const walk = (e: Element): void => {
        if (e.type === 'series' || e.type === 'parallel') return e.parts.forEach(walk);
        counters[e.type] = (counters[e.type] ?? 0) + 1;
        exact[e.name ?? `${e.type}${counters[e.type]}`] = e.type === 'R' ? e.ohms : e.type === 'L' ? e.henries : e.farads;
      };
      walk(part.network);
      const svg = schematicSvg(part.network, part.id);
      const symbols = readDrawing(svg).symbols;
      expect(symbols.map((s) => s.name).sort(), part.id).toEqual(Object.keys(exact).sort());
      for (const s of symbols) expect(Math.abs(s.value / exact[s.name] - 1), `${part.id} ${s.name}`).toBeLessThanOrEqual(5e-3);
      for (const f of [1e3, 1e6, 37e6, 1e9]) {
        const model = referenceZAt(part.network, f);
        const drawn = drawnImpedance(svg, f, exact);
        expect(drawn, `${part.id} at ${f} Hz`).toBeDefined();
        expect(drawn!.sub(model).abs() / model.abs(), `${part.id} at ${f} Hz`).toBeLessThan(1e-12);
      }
    }
  });

  it('a drawing with two branches swapped at a junction would be told apart (the check can fail)', () => {
    // The same leaves, other topology: R ‖ (L + C) against (R ‖ L) + C.
    const a = parallel(resistor(10), series(inductor(1e-6), capacitor(1e-9)));
    const b = series(parallel(resistor(10), inductor(1e-6)), capacitor(1e-9));
    const za = drawnImpedance(schematicSvg(a, 'a'), 3e6)!;
    const zb = referenceZAt(b, 3e6);
    expect(za.sub(zb).abs() / zb.abs()).toBeGreaterThan(0.1);
  });

  it('the title is escaped and the labels are in the page’s units', () => {
    const svg = schematicSvg(resistor(1e3, 'R'), 'Model of <A&B>');
    expect(svg).toContain('<title>Model of &lt;A&amp;B&gt;</title>');
    expect(svg).toContain('>R 1 kΩ</text>');
  });
});
