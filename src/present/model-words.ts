// A part's model in words: the caption under its schematic, and what each named element of it stands for.

import type { Element } from '../circuit/element.js';
import { treeFormula } from '../measure/part-export.js';
import type { PartKind } from '../model/part.js';

const MODEL_OF: Readonly<Record<PartKind, string>> = {
  capacitor: 'Capacitor model',
  inductor: 'Inductor model',
  resistor: 'Resistor model',
  bead: 'Bead model',
  network: 'Network as written in the part file',
};

const PARAMETER_MEANING: Readonly<Record<string, string>> = {
  ESR: 'equivalent series resistance',
  ESL: 'equivalent series inductance',
  EPR: 'equivalent parallel (leakage) resistance',
  C: 'capacitance',
  L: 'inductance',
  R: 'resistance',
  DCR: 'winding (DC) resistance',
  Cp: 'parallel (winding) capacitance',
  Rp: 'parallel (core loss) resistance',
  Ls: 'series (lead and body) inductance',
  Rdc: 'DC resistance',
};

/**
 * The caption under a part's schematic: its model as the formula of the elements it has ("Capacitor model:
 * ESR + ESL + C."), so a part without the kind's optional elements (a capacitor's EPR, an inductor's Rp) is
 * not captioned with them.
 */
export function modelCaption(kind: PartKind, network: Element): string {
  return `${MODEL_OF[kind]}: ${treeFormula(network, '‖')}.`;
}

/** What a model element named `name` stands for ("equivalent series resistance"); '' for an unnamed one. */
export function parameterMeaning(name: string, kind: string): string {
  // A resistor's Cp is the capacitance between its terminals; it has no winding.
  if (kind === 'resistor' && name === 'Cp') return 'parallel (terminal-to-terminal) capacitance';
  const meaning = Object.hasOwn(PARAMETER_MEANING, name) ? PARAMETER_MEANING[name] : '';
  // A bead's R, L and C are its core's.
  return kind === 'bead' && (name === 'R' || name === 'L' || name === 'C') ? `core ${meaning}` : meaning;
}

const LEAF_WORD: Readonly<Record<'R' | 'L' | 'C', string>> = { R: 'resistance', L: 'inductance', C: 'capacitance' };

/**
 * What an unnamed element of a network stands for, by its kind and its place: "resistance, in series with L1
 * and C1", "capacitance, in parallel with R2 and a series branch"; alone, just "resistance".
 */
export function networkLeafMeaning(type: 'R' | 'L' | 'C', group: 'series' | 'parallel', others: readonly string[]): string {
  if (others.length === 0) return LEAF_WORD[type];
  const list = others.length === 1 ? others[0] : `${others.slice(0, -1).join(', ')} and ${others[others.length - 1]}`;
  return `${LEAF_WORD[type]}, in ${group} with ${list}`;
}
