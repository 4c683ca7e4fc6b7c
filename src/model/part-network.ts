// A part's element tree: the model topology of each kind from its nominal value and parasitics (an absent
// series parasitic is 0, an absent parallel one open), a bead's model, and a network written out as nested
// series and parallel elements.

import { isMap, isSeq, type Node, type YAMLMap } from 'yaml';
import { capacitor, inductor, parallel, resistor, series, type Element } from '../circuit/element.js';
import type { Dimension } from '../units/quantity.js';
import { quote } from './diagnostics.js';
import { describeNode, expectationInBrackets, nearMiss, readQuantity, scalarText, type Fields, type ReadContext } from './fields.js';
import type { PartKind } from './part.js';
import { positionOf } from './source.js';
import { readSpreadQuantity, type Bounds } from './spread.js';

/** Parasitic fields by kind, with their dimension, in the order pages list them. */
export const PARASITICS: Readonly<Record<'capacitor' | 'inductor' | 'resistor', Readonly<Record<string, Dimension>>>> = {
  capacitor: { esr: 'resistance', esl: 'inductance', epr: 'resistance' },
  inductor: { dcr: 'resistance', cp: 'capacitance', rp: 'resistance' },
  resistor: { ls: 'inductance', cp: 'capacitance' },
};

export const BEAD_MODEL: Readonly<Record<string, Dimension>> = { rdc: 'resistance', r: 'resistance', l: 'inductance', c: 'capacitance' };

interface BuiltNetwork {
  network: Element;
  parameters: Record<string, number>;
}

/** The model topology of each kind (README, "A part"): an absent series parasitic is 0, an absent parallel one open. */
export function buildNetwork(root: Fields, kind: PartKind, nominal: number | undefined, spreads: Record<string, Bounds>): BuiltNetwork | undefined {
  if (kind === 'network') {
    if (!root.has('network')) return undefined;
    const network = readNetworkNode(root.ctx, root.valueNode('network'), 'network');
    return network ? { network, parameters: {} } : undefined;
  }
  if (kind === 'bead') {
    const model = root.map('model');
    if (!model) return undefined;
    model.expect(Object.keys(BEAD_MODEL), ['r', 'l'], (name) => expectationInBrackets(BEAD_MODEL[name]));
    const p = readParameters(model, BEAD_MODEL, spreads);
    if (p.r === undefined || p.l === undefined) return undefined;
    const core = parallel(...[resistor(p.r, 'R'), inductor(p.l, 'L'), p.c !== undefined ? capacitor(p.c, 'C') : undefined].filter(isElement));
    return { network: series(...[p.rdc !== undefined ? resistor(p.rdc, 'Rdc') : undefined, core].filter(isElement)), parameters: p };
  }
  const fields = PARASITICS[kind];
  const parasitics = root.map('parasitics');
  let p: Record<string, number> = {};
  if (parasitics) {
    parasitics.expect(Object.keys(fields));
    p = readParameters(parasitics, fields, spreads);
  }
  if (nominal === undefined) return undefined;
  let network: Element;
  switch (kind) {
    case 'capacitor': {
      // esr + esl + (C ‖ epr)
      const c = p.epr !== undefined ? parallel(capacitor(nominal, 'C'), resistor(p.epr, 'EPR')) : capacitor(nominal, 'C');
      network = series(...[p.esr !== undefined ? resistor(p.esr, 'ESR') : undefined, p.esl !== undefined ? inductor(p.esl, 'ESL') : undefined, c].filter(isElement));
      break;
    }
    case 'inductor': {
      // (dcr + L) ‖ cp ‖ rp
      const winding = series(...[p.dcr !== undefined ? resistor(p.dcr, 'DCR') : undefined, inductor(nominal, 'L')].filter(isElement));
      network = parallel(...[winding, p.cp !== undefined ? capacitor(p.cp, 'Cp') : undefined, p.rp !== undefined ? resistor(p.rp, 'Rp') : undefined].filter(isElement));
      break;
    }
    case 'resistor': {
      // (R + ls) ‖ cp
      const body = series(...[resistor(nominal, 'R'), p.ls !== undefined ? inductor(p.ls, 'Ls') : undefined].filter(isElement));
      network = parallel(...[body, p.cp !== undefined ? capacitor(p.cp, 'Cp') : undefined].filter(isElement));
      break;
    }
  }
  return { network, parameters: p };
}

function isElement(e: Element | undefined): e is Element {
  return e !== undefined;
}

function readParameters(fields: Fields, spec: Readonly<Record<string, Dimension>>, spreads: Record<string, Bounds>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [name, dim] of Object.entries(spec)) {
    const value = readSpreadQuantity(fields, name, dim, spreads);
    if (value !== undefined) out[name] = value;
  }
  return out;
}

const NETWORK_LEAVES: Readonly<Record<string, Dimension>> = { r: 'resistance', l: 'inductance', c: 'capacitance' };
const NETWORK_KEYS = ['series', 'parallel', ...Object.keys(NETWORK_LEAVES)];

/** A network node: {r: 5m}, {l: 1.1n}, {c: 10u}, {series: [...]} or {parallel: [...]}. */
export function readNetworkNode(ctx: ReadContext, node: Node | null | undefined, label: string): Element | undefined {
  const at = positionOf(ctx.source, node);
  if (!isMap(node) || (node as YAMLMap).items.length !== 1) {
    const keys = isMap(node) ? (node as YAMLMap<Node, Node | null>).items.map((p) => scalarText(p.key) ?? '?') : [];
    const found = keys.length > 1 ? `a mapping of ${keys.length} elements (${keys.join(', ')}); give each element its own list item` : describeNode(node);
    ctx.diagnostics.error(at, `${label}: expected one element such as {r: 5m}, {l: 1n}, {c: 10u}, {series: [...]} or {parallel: [...]}, found ${found}`);
    return undefined;
  }
  const pair = (node as YAMLMap<Node, Node | null>).items[0];
  const key = scalarText(pair.key) ?? '';
  // Own keys only: "constructor" or "valueOf" is no element, whatever plain objects inherit.
  if (Object.hasOwn(NETWORK_LEAVES, key)) {
    const value = readQuantity(ctx, pair.value, `${label}.${key}`, NETWORK_LEAVES[key]);
    if (value === undefined) return undefined;
    return key === 'r' ? resistor(value) : key === 'l' ? inductor(value) : capacitor(value);
  }
  if (key === 'series' || key === 'parallel') {
    if (!isSeq(pair.value) || pair.value.items.length === 0) {
      ctx.diagnostics.error(positionOf(ctx.source, pair.value ?? pair.key), `${label}.${key}: expected a list of one or more elements, found ${describeNode(pair.value)}`);
      return undefined;
    }
    const children: Element[] = [];
    let failed = false;
    pair.value.items.forEach((item, i) => {
      const child = readNetworkNode(ctx, item as Node, `${label}.${key}[${i}]`);
      if (child) children.push(child);
      else failed = true;
    });
    if (failed) return undefined;
    return key === 'series' ? series(...children) : parallel(...children);
  }
  const guess = nearMiss(key, NETWORK_KEYS);
  ctx.diagnostics.error(positionOf(ctx.source, pair.key), `${label}: unknown element ${quote(key)}; expected one of ${NETWORK_KEYS.join(', ')}${guess ? `; did you mean "${guess}"?` : ''}`);
  return undefined;
}
