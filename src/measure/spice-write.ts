// A part's element tree as a SPICE subcircuit: ".SUBCKT name 1 2", one R, L or C card a leaf, ".ENDS".
// Only the cards and syntax of the original Berkeley SPICE are used (element cards "Rname n+ n- value",
// numbered nodes, "*" comment lines; L. W. Nagel, "SPICE2: A computer program to simulate semiconductor
// circuits", UCB/ERL M520, 1975), so every SPICE-family simulator reads it. Values are written with an
// exponent and never a scale suffix: SPICE reads "M" as milli, so "1M" would be a thousandth.

import type { Element } from '../circuit/element.js';

export interface SubcircuitInput {
  /** The subcircuit's name (a part id: letters, digits, ".", "_", "-"). */
  name: string;
  element: Element;
  /** Comment lines for the head, without "*"; written in ASCII. */
  comments: readonly string[];
}

/** The first line of every netlist zfolio writes, by which it knows a file as its own. */
export const SPICE_MARK = '* zfolio export';

export function writeSubcircuit(input: SubcircuitInput): string {
  const cards: string[] = [];
  const used = new Set<string>();
  const counters: Record<string, number> = { R: 0, L: 0, C: 0 };
  let nextNode = 3;
  const cardName = (type: 'R' | 'L' | 'C', role?: string): string => {
    const fromRole = role ? `${type}${role.toUpperCase().replace(/[^A-Z0-9]/g, '')}` : '';
    if (fromRole.length > 1 && fromRole !== type + type && !used.has(fromRole)) {
      used.add(fromRole);
      return fromRole;
    }
    let name: string;
    do name = `${type}${++counters[type]}`;
    while (used.has(name));
    used.add(name);
    return name;
  };
  const emit = (e: Element, a: number, b: number): void => {
    switch (e.type) {
      case 'R':
        cards.push(`${cardName('R', e.name)} ${a} ${b} ${spiceNumber(e.ohms)}`);
        return;
      case 'L':
        cards.push(`${cardName('L', e.name)} ${a} ${b} ${spiceNumber(e.henries)}`);
        return;
      case 'C':
        cards.push(`${cardName('C', e.name)} ${a} ${b} ${spiceNumber(e.farads)}`);
        return;
      case 'series': {
        let from = a;
        e.parts.forEach((part, i) => {
          const to = i === e.parts.length - 1 ? b : nextNode++;
          emit(part, from, to);
          from = to;
        });
        return;
      }
      case 'parallel':
        for (const part of e.parts) emit(part, a, b);
        return;
    }
  };
  emit(input.element, 1, 2);
  return [SPICE_MARK, ...input.comments.map((c) => `* ${ascii(c)}`.trimEnd()), `.SUBCKT ${input.name} 1 2`, ...cards, `.ENDS ${input.name}`].join('\n') + '\n';
}

/** A value with an exponent and enough digits to read back the same double: 4.7e-9, 1e+7. */
export function spiceNumber(value: number): string {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`element value ${value} cannot be written`);
  return value.toExponential();
}

const ASCII: Readonly<Record<string, string>> = {
  '\u00b5': 'u', // µ micro sign
  '\u03bc': 'u', // μ Greek mu
  '\u03a9': 'ohm', // Ω Greek omega
  '\u2126': 'ohm', // Ω ohm sign
  '‖': '||',
  '—': '-',
  '–': '-',
  '·': '*',
  '°': ' deg',
  '±': '+/-',
  '≤': '<=',
  '≥': '>=',
  '×': 'x',
  '’': "'",
  '“': '"',
  '”': '"',
};

/** Comment text in plain ASCII: simulators differ in what they make of anything else. */
export function ascii(text: string): string {
  return [...text].map((c) => (c.charCodeAt(0) < 0x20 ? ' ' : c.charCodeAt(0) < 0x7f ? c : (ASCII[c] ?? '?'))).join('');
}
