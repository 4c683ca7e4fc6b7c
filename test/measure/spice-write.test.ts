// SPICE export checked by reading the netlist back with a modified nodal solver written here: R and C cards
// stamp their admittance (1/R, jωC), each L card adds its branch current and equation (C.-W. Ho,
// A. E. Ruehli, P. A. Brennan, "The modified nodal approach to network analysis", IEEE Trans. Circuits
// Syst. 22, 1975), a unit current is driven into node 1 with node 2 as ground, and the system is solved by
// Gaussian elimination with partial pivoting in complex.js. Z = v1 must equal the
// engine's impedance of the same part to 1e-9 over the whole sweep, for every part of the demo library.

import { Complex } from 'complex.js';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../../src/circuit/element.js';
import { impedanceSweep } from '../../src/circuit/impedance.js';
import { logSweep } from '../../src/circuit/sweep.js';
import { SPICE_MARK, ascii, spiceNumber, writeSubcircuit } from '../../src/measure/spice-write.js';
import { loadLibrary } from '../../src/model/library.js';

const DEMO = fileURLToPath(new URL('../../', import.meta.url));

interface Card {
  type: 'R' | 'L' | 'C';
  a: string;
  b: string;
  value: number;
}

/** Parse a one-subcircuit netlist strictly: comments, .SUBCKT with two pins, R/L/C cards, .ENDS. */
function parseNetlist(text: string): { name: string; pins: [string, string]; cards: Card[] } {
  const lines = text.split('\n').filter((l) => l.trim() !== '' && !l.startsWith('*'));
  const head = /^\.SUBCKT\s+(\S+)\s+(\S+)\s+(\S+)$/.exec(lines[0]);
  if (!head) throw new Error(`no .SUBCKT line: ${lines[0]}`);
  if (!/^\.ENDS(\s+\S+)?$/.test(lines[lines.length - 1])) throw new Error('no .ENDS line');
  const cards = lines.slice(1, -1).map((line) => {
    const m = /^([RLC])(\w*)\s+(\S+)\s+(\S+)\s+(\S+)$/.exec(line);
    if (!m) throw new Error(`not an R, L or C card: ${line}`);
    // A plain number with an exponent; a scale suffix would be read differently by SPICE.
    if (!/^\d(\.\d+)?e[+-]\d+$/.test(m[5])) throw new Error(`value not in exponent form: ${m[5]}`);
    return { type: m[1] as Card['type'], a: m[3], b: m[4], value: Number(m[5]) };
  });
  return { name: head[1], pins: [head[2], head[3]], cards };
}

/**
 * Z between the two pins at frequency f by modified nodal analysis: node voltages and, for each inductor,
 * its branch current, with the branch equation v_a − v_b − jωL·i = 0 (so no 1/(jωL) entry grows without
 * bound at low frequencies and the system stays well scaled).
 */
function nodalImpedance(netlist: ReturnType<typeof parseNetlist>, f: number): Complex {
  const [port, ground] = netlist.pins;
  const nodes = [...new Set(netlist.cards.flatMap((c) => [c.a, c.b]))].filter((n) => n !== ground);
  const index = new Map(nodes.map((n, i) => [n, i]));
  const inductors = netlist.cards.filter((c) => c.type === 'L');
  const size = nodes.length + inductors.length;
  const y: Complex[][] = Array.from({ length: size }, () => Array.from({ length: size }, () => new Complex(0, 0)));
  const w = 2 * Math.PI * f;
  let branch = nodes.length;
  for (const c of netlist.cards) {
    const a = index.get(c.a);
    const b = index.get(c.b);
    if (c.type === 'L') {
      const k = branch++;
      if (a !== undefined) (y[a][k] = y[a][k].add(1)), (y[k][a] = y[k][a].add(1));
      if (b !== undefined) (y[b][k] = y[b][k].sub(1)), (y[k][b] = y[k][b].sub(1));
      y[k][k] = new Complex(0, -w * c.value);
      continue;
    }
    const g = c.type === 'R' ? new Complex(1 / c.value, 0) : new Complex(0, w * c.value);
    if (a !== undefined) y[a][a] = y[a][a].add(g);
    if (b !== undefined) y[b][b] = y[b][b].add(g);
    if (a !== undefined && b !== undefined) {
      y[a][b] = y[a][b].sub(g);
      y[b][a] = y[b][a].sub(g);
    }
  }
  const rhs = Array.from({ length: size }, (_, i) => new Complex(i === index.get(port) ? 1 : 0, 0));
  // Gaussian elimination with partial pivoting.
  for (let k = 0; k < size; k++) {
    let p = k;
    for (let i = k + 1; i < size; i++) if (y[i][k].abs() > y[p][k].abs()) p = i;
    [y[k], y[p]] = [y[p], y[k]];
    [rhs[k], rhs[p]] = [rhs[p], rhs[k]];
    for (let i = k + 1; i < size; i++) {
      const factor = y[i][k].div(y[k][k]);
      for (let j = k; j < size; j++) y[i][j] = y[i][j].sub(factor.mul(y[k][j]));
      rhs[i] = rhs[i].sub(factor.mul(rhs[k]));
    }
  }
  const v: Complex[] = new Array(size);
  for (let i = size - 1; i >= 0; i--) {
    let sum = rhs[i];
    for (let j = i + 1; j < size; j++) sum = sum.sub(y[i][j].mul(v[j]));
    v[i] = sum.div(y[i][i]);
  }
  return v[index.get(port)!];
}

function expectSameImpedance(element: Element, frequencies: Float64Array): void {
  const netlist = parseNetlist(writeSubcircuit({ name: 'PART', element, comments: ['test'] }));
  const engine = impedanceSweep(element, frequencies);
  frequencies.forEach((f, i) => {
    const z = nodalImpedance(netlist, f);
    const e = new Complex(engine.re[i], engine.im[i]);
    expect(z.sub(e).abs() / e.abs()).toBeLessThan(1e-9);
  });
}

describe('writeSubcircuit', () => {
  it('writes the capacitor model as cards between numbered nodes', () => {
    const text = writeSubcircuit({ name: 'CAP-1', element: series(resistor(0.018, 'ESR'), inductor(4.5e-10, 'ESL'), parallel(capacitor(1e-7, 'C'), resistor(1e9, 'EPR'))), comments: ['100 nF 16 V X7R 0402 — ESR + ESL + (C ‖ EPR)'] });
    expect(text).toBe(
      [SPICE_MARK, '* 100 nF 16 V X7R 0402 - ESR + ESL + (C || EPR)', '.SUBCKT CAP-1 1 2', 'RESR 1 3 1.8e-2', 'LESL 3 4 4.5e-10', 'C1 4 2 1e-7', 'REPR 4 2 1e+9', '.ENDS CAP-1', ''].join('\n'),
    );
  });

  it('reads back to the engine impedance for every part of the demo library, 100 Hz to 10 GHz', () => {
    const { library } = loadLibrary(DEMO);
    expect(library!.parts.length).toBeGreaterThan(20);
    const frequencies = logSweep({ fromHz: 100, toHz: 1e10, perDecade: 20 });
    for (const part of library!.parts) {
      try {
        expectSameImpedance(part.network, frequencies);
      } catch (e) {
        throw new Error(`${part.id}: ${(e as Error).message}\n${writeSubcircuit({ name: part.id, element: part.network, comments: [] })}`);
      }
    }
  });

  it('reads back nested networks with repeated role names and unnamed leaves', () => {
    const tree = series(resistor(5e-3), inductor(1.1e-9), parallel(series(capacitor(1e-5, 'C'), resistor(2e-3, 'ESR')), series(capacitor(1e-6, 'C'), resistor(4e-3, 'ESR'), inductor(3e-10)), resistor(5e7)));
    const text = writeSubcircuit({ name: 'N', element: tree, comments: [] });
    const names = parseNetlist(text).cards.map((c) => text.split('\n').find((l) => l.includes(` ${spiceNumber(c.value)}`))!.split(' ')[0]);
    expect(new Set(names).size).toBe(names.length);
    expectSameImpedance(tree, logSweep({ fromHz: 1e3, toHz: 1e9, perDecade: 10 }));
  });

  it('numbers: always an exponent, the same double when read back, never a scale suffix', () => {
    for (const v of [1e6, 2.2e6, 4.7e-9, 1, 0.1 + 0.2, 123456789.123, 1e-18, 1e15]) {
      const text = spiceNumber(v);
      expect(text).toMatch(/e[+-]\d+$/);
      expect(Number(text)).toBe(v);
    }
    expect(() => spiceNumber(0)).toThrow();
  });

  it('comments are ASCII', () => {
    expect(ascii('4.7 µF ±10% — 2 Ω ‖ 3 nH\u0007')).toBe('4.7 uF +/-10% - 2 ohm || 3 nH ');
  });
});
