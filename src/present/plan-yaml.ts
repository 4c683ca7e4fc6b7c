// Plan YAML as zfolio prints it (the capacitors a suggestion chose): every value written so that reading
// it back gives the same number, bit for bit, so a printed plan re-checks to the same margin.

import type { Placement } from '../model/plan.js';
import { formatEng } from '../units/format.js';
import { parseQuantity } from '../units/parse.js';
import type { Dimension } from '../units/quantity.js';

/** Engineering notation with as few digits as read back exactly ("1nH", "250pH"); else the shortest SI number. */
export function exactQuantityText(value: number, dim: Dimension): string {
  for (let digits = 3; digits <= 17; digits++) {
    const text = formatEng(value, dim, { digits, space: false });
    const back = parseQuantity(text, dim);
    if (back.ok && back.value === value) return text;
  }
  // A bare number is in SI base units, and String() gives the shortest text that reads back exactly.
  return String(value);
}

/** The `capacitors:` list of a plan, one flow mapping per entry, each with its mounting. */
export function capacitorsYaml(placements: readonly Placement[], indent = ''): string[] {
  return [
    `${indent}capacitors:`,
    ...placements.map((p) => `${indent}  - {part: ${p.part.id}, count: ${p.count}, mounting: ${exactQuantityText(p.mountingH, 'inductance')}}`),
  ];
}
