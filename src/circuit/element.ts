// Element trees: the one circuit description every part, plan and network is reduced to.
// Values are in SI base units (Ω, H, F) and strictly positive; an absent parasitic is simply not in the tree.

// A leaf may carry the name of its role in a part model ("ESR", "Cp"), for schematics and tables.
export type Element =
  | { readonly type: 'R'; readonly ohms: number; readonly name?: string }
  | { readonly type: 'L'; readonly henries: number; readonly name?: string }
  | { readonly type: 'C'; readonly farads: number; readonly name?: string }
  | { readonly type: 'series'; readonly parts: readonly Element[] }
  | { readonly type: 'parallel'; readonly parts: readonly Element[] };

export const resistor = (ohms: number, name?: string): Element => (name ? { type: 'R', ohms, name } : { type: 'R', ohms });
export const inductor = (henries: number, name?: string): Element => (name ? { type: 'L', henries, name } : { type: 'L', henries });
export const capacitor = (farads: number, name?: string): Element => (name ? { type: 'C', farads, name } : { type: 'C', farads });

/** Series connection; a single part stands for itself. */
export function series(...parts: Element[]): Element {
  return parts.length === 1 ? parts[0] : { type: 'series', parts };
}

/** Parallel connection; a single part stands for itself. */
export function parallel(...parts: Element[]): Element {
  return parts.length === 1 ? parts[0] : { type: 'parallel', parts };
}

/** Impedance of a tree at DC, as a limit: 0 for a short, Infinity for an open. */
export function dcResistance(element: Element): number {
  switch (element.type) {
    case 'R':
      return element.ohms;
    case 'L':
      return 0;
    case 'C':
      return Infinity;
    case 'series':
      return element.parts.reduce((sum, p) => sum + dcResistance(p), 0);
    case 'parallel': {
      let conductance = 0;
      for (const p of element.parts) {
        const r = dcResistance(p);
        if (r === 0) return 0;
        conductance += 1 / r;
      }
      return 1 / conductance;
    }
  }
}

/**
 * The same tree with its impedance multiplied by `factor` at every frequency: R·k, L·k, C/k. With
 * k = 1/N it is N identical copies in parallel (a rail branch of N placements) as one tree.
 */
export function scaledImpedance(element: Element, factor: number): Element {
  if (factor === 1) return element;
  switch (element.type) {
    case 'R':
      return { ...element, ohms: element.ohms * factor };
    case 'L':
      return { ...element, henries: element.henries * factor };
    case 'C':
      return { ...element, farads: element.farads / factor };
    case 'series':
    case 'parallel':
      return { type: element.type, parts: element.parts.map((p) => scaledImpedance(p, factor)) };
  }
}
