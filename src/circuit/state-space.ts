// The equations of an element tree as a linear pencil (G + s·C)·x = e·I: modified nodal analysis, with the
// node voltages and the inductor currents as unknowns (C.-W. Ho, A. E. Ruehli, P. A. Brennan, "The modified
// nodal approach to network analysis", IEEE Trans. Circuits and Systems 22(6), 1975). The tree is driven at
// its port by a current I; Z(s) = x_port / I. By Cramer's rule Z(s) is the port cofactor over det(G + sC),
// so the poles of Z are the finite roots of det(G + sC) and its zeros those of the pencil with the port
// node shorted (its row and column removed).

import type { Element } from './element.js';

export interface NodalPencil {
  /** Unknowns: node voltages first (the port is node 0), then one current per inductor. */
  readonly size: number;
  /** Row-major size × size conductance and incidence matrix, S and dimensionless. */
  readonly g: Float64Array;
  /** Row-major size × size capacitance and (negated) inductance matrix, F and H. */
  readonly c: Float64Array;
}

/**
 * The same impedance with fewer elements: nested series (parallel) groups flattened, and the leaves of one
 * group merged by kind (series: R and L add, 1/C adds; parallel: 1/R and 1/L add, C adds). Z is unchanged
 * (exactly, in exact arithmetic) and redundant states (two inductors in series, two capacitors in parallel)
 * disappear from the pencil.
 */
export function mergedTree(element: Element): Element {
  if (element.type !== 'series' && element.type !== 'parallel') return element;
  const kind = element.type;
  const flat: Element[] = [];
  const collect = (e: Element) => {
    const m = mergedTree(e);
    if (m.type === kind) m.parts.forEach(collect);
    else flat.push(m);
  };
  element.parts.forEach(collect);
  let r = 0;
  let l = 0;
  let c = 0;
  const others: Element[] = [];
  for (const p of flat) {
    if (p.type === 'R') r += kind === 'series' ? p.ohms : 1 / p.ohms;
    else if (p.type === 'L') l += kind === 'series' ? p.henries : 1 / p.henries;
    else if (p.type === 'C') c += kind === 'series' ? 1 / p.farads : p.farads;
    else others.push(p);
  }
  const leaves: Element[] = [];
  if (r > 0) leaves.push({ type: 'R', ohms: kind === 'series' ? r : 1 / r });
  if (l > 0) leaves.push({ type: 'L', henries: kind === 'series' ? l : 1 / l });
  if (c > 0) leaves.push({ type: 'C', farads: kind === 'series' ? 1 / c : c });
  const parts = [...leaves, ...others];
  return parts.length === 1 ? parts[0] : { type: kind, parts };
}

/** The nodal pencil of `element` between its port (node 0) and ground. */
export function nodalPencil(element: Element): NodalPencil {
  const tree = mergedTree(element);
  // First pass: number the nodes and inductors.
  let nodes = 1;
  let inductors = 0;
  const stamps: { kind: 'R' | 'L' | 'C'; value: number; a: number; b: number }[] = [];
  const place = (e: Element, a: number, b: number) => {
    switch (e.type) {
      case 'R':
        stamps.push({ kind: 'R', value: e.ohms, a, b });
        return;
      case 'L':
        stamps.push({ kind: 'L', value: e.henries, a, b });
        inductors++;
        return;
      case 'C':
        stamps.push({ kind: 'C', value: e.farads, a, b });
        return;
      case 'series': {
        let from = a;
        e.parts.forEach((part, i) => {
          const to = i === e.parts.length - 1 ? b : nodes++;
          place(part, from, to);
          from = to;
        });
        return;
      }
      case 'parallel':
        for (const part of e.parts) place(part, a, b);
        return;
    }
  };
  const GROUND = -1;
  place(tree, 0, GROUND);

  const size = nodes + inductors;
  const g = new Float64Array(size * size);
  const c = new Float64Array(size * size);
  const add = (m: Float64Array, i: number, j: number, v: number) => {
    if (i !== GROUND && j !== GROUND) m[i * size + j] += v;
  };
  // Two-terminal admittance stamp of y between nodes a and b.
  const stamp = (m: Float64Array, a: number, b: number, y: number) => {
    add(m, a, a, y);
    add(m, b, b, y);
    add(m, a, b, -y);
    add(m, b, a, -y);
  };
  let k = nodes;
  for (const s of stamps) {
    if (s.kind === 'R') stamp(g, s.a, s.b, 1 / s.value);
    else if (s.kind === 'C') stamp(c, s.a, s.b, s.value);
    else {
      // Branch current i_k leaves a and enters b; its equation v_a − v_b − s·L·i_k = 0.
      add(g, s.a, k, 1);
      add(g, s.b, k, -1);
      add(g, k, s.a, 1);
      add(g, k, s.b, -1);
      c[k * size + k] = -s.value;
      k++;
    }
  }
  return { size, g, c };
}

/** The pencil with row and column `index` removed (an unknown held at zero). */
export function withoutUnknown(pencil: NodalPencil, index: number): NodalPencil {
  const n = pencil.size - 1;
  const g = new Float64Array(n * n);
  const c = new Float64Array(n * n);
  for (let i = 0, r = 0; i <= n; i++) {
    if (i === index) continue;
    for (let j = 0, q = 0; j <= n; j++) {
      if (j === index) continue;
      g[r * n + q] = pencil.g[i * (n + 1) + j];
      c[r * n + q] = pencil.c[i * (n + 1) + j];
      q++;
    }
    r++;
  }
  return { size: n, g, c };
}
