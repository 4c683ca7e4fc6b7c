// The names of part kinds, as pages, the index, comparisons and PDFs say them.

import type { Part, PartKind } from '../model/part.js';

const KIND_LABEL: Readonly<Record<PartKind, string>> = {
  capacitor: 'Capacitor',
  inductor: 'Inductor',
  resistor: 'Resistor',
  bead: 'Ferrite bead',
  network: 'Network',
};

const KIND_PLURAL: Readonly<Record<PartKind, string>> = {
  capacitor: 'capacitors',
  inductor: 'inductors',
  resistor: 'resistors',
  bead: 'ferrite beads',
  network: 'networks',
};

/** "Capacitor", "Ferrite bead", "Network (behaves as capacitor)". */
export function kindLabel(part: Pick<Part, 'kind' | 'behavesAs'>): string {
  if (part.kind === 'network') return part.behavesAs ? `Network (behaves as ${part.behavesAs})` : 'Network';
  return KIND_LABEL[part.kind];
}

/** "capacitors", "ferrite beads". */
export function kindPlural(kind: PartKind): string {
  return KIND_PLURAL[kind];
}
