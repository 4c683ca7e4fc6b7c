// The readers of a plan file's own fields: the target (given, or from ripple and step), the band, the
// mounting by package, and each placement's part and count.

import { formatEng } from '../units/format.js';
import { quote, type SourcePosition } from './diagnostics.js';
import { missingTarget, readQuantity, scalarText, type Fields, type ReadContext } from './fields.js';
import type { Part } from './part.js';
import type { Plan, PlanTarget } from './plan.js';
import { closest } from './suggest.js';

/**
 * Either an explicit target impedance, or ripple and step current for Z_t = V·ripple/ΔI; not both, not
 * neither. An explicit target may come with a step (for the load-step check, whose budget is then target × step).
 */
export function readTarget(root: Fields): PlanTarget | undefined {
  const explicit = root.has('target');
  const fromRipple = root.has('ripple') || root.has('step');
  if (explicit && root.has('ripple')) {
    root.error('target', `give either "target" or "ripple" and "step" (Z_t = V·ripple/ΔI), not both`);
    return undefined;
  }
  if (explicit) {
    const ohms = root.quantity('target', 'resistance');
    const stepA = root.has('step') ? root.quantity('step', 'current') : undefined;
    if (ohms === undefined || (root.has('step') && stepA === undefined)) return undefined;
    return stepA === undefined ? { kind: 'explicit', ohms } : { kind: 'explicit', ohms, stepA };
  }
  if (!fromRipple) {
    root.error(undefined, 'missing the target impedance: give "ripple" and "step" (Z_t = V·ripple/ΔI, e.g. ripple: 3% and step: 6A) or "target" (e.g. target: 4.5m)');
    return undefined;
  }
  const ripple = root.ratio('ripple');
  const stepA = root.quantity('step', 'current');
  if (!root.has('ripple')) root.error(undefined, 'missing field "ripple" (the allowed ripple as a fraction of the voltage, e.g. 3%), needed with "step"');
  if (!root.has('step')) root.error(undefined, 'missing field "step" (the load\'s step current ΔI, e.g. 6A), needed with "ripple"');
  if (ripple !== undefined && ripple >= 1) {
    root.error('ripple', `expected a fraction of the rail voltage below 100%, found ${quote(scalarText(root.valueNode('ripple')) ?? '')}`);
    return undefined;
  }
  return ripple !== undefined && stepA !== undefined ? { kind: 'ripple', ripple, stepA } : undefined;
}

export function readBand(root: Fields): Plan['band'] | undefined {
  const band = root.map('band');
  if (!band) return undefined;
  band.expect(['from', 'to'], ['from', 'to']);
  const fromHz = band.quantity('from', 'frequency');
  const toHz = band.quantity('to', 'frequency');
  if (fromHz === undefined || toHz === undefined) return undefined;
  if (!(toHz > fromHz)) {
    band.error('to', `expected a frequency above band.from (${formatEng(fromHz, 'Hz')}), found ${formatEng(toHz, 'Hz')}: the band is empty`);
    return undefined;
  }
  return { fromHz, toHz };
}

/** `mounting-by-package: {"0402": 0.25nH, ...}`; a package no part in the library has is a warning. */
export function readMountingByPackage(root: Fields, partsById: ReadonlyMap<string, Part>, warn: (at: SourcePosition, message: string, advice?: string) => void): Record<string, number> {
  const table = root.map('mounting-by-package');
  // No prototype: a package named "constructor" or "__proto__" is a key like any other.
  const out: Record<string, number> = Object.create(null) as Record<string, number>;
  if (!table) return out;
  const packages = new Set([...partsById.values()].flatMap((p) => (p.package !== undefined ? [p.package] : [])));
  for (const name of table.keys) {
    const value = table.quantity(name, 'inductance', { allowZero: true });
    if (value === undefined) continue;
    out[name] = value;
    if (!packages.has(name)) {
      const guess = closest(name, packages);
      warn(
        table.keyPosition(name),
        `mounting-by-package: no part in the library has package ${quote(name)}${guess ? `; did you mean "${guess}"?` : ''}`,
        'Write the package as the part files write it, or remove the entry: as it stands it sets no placement\'s mounting.',
      );
    }
  }
  return out;
}

export function readPlacedPart(entry: Fields, partsById: ReadonlyMap<string, Part>): Part | undefined {
  const id = entry.text('part');
  if (id === undefined) return undefined;
  const part = partsById.get(id);
  if (!part) {
    entry.error('part', missingTarget(entry.ctx, 'parts', 'part with id', id, partsById.keys()));
    return undefined;
  }
  if (part.behavesAs !== 'capacitor' || part.nominal === undefined) {
    const article = (word: string) => (/^[aeiou]/.test(word) ? `an ${word}` : `a ${word}`);
    const what = part.kind === 'network' ? `a network that behaves as ${part.behavesAs ? article(part.behavesAs) : 'nothing declared'}` : article(part.kind);
    entry.error('part', `${part.id} is ${what}; a plan places capacitors (or networks with "behaves-as: capacitor")`);
    return undefined;
  }
  return part;
}

/** Placements of one part on one rail; more is no board, and N in parallel divides Z by N. */
export const MAX_COUNT = 10_000;

export function readCount(ctx: ReadContext, entry: Fields): number | undefined {
  if (!entry.has('count')) return undefined;
  const node = entry.valueNode('count');
  const value = readQuantity(ctx, node, entry.label('count'), 'ratio', { allowZero: true, allowNegative: true });
  if (value === undefined) return undefined;
  if (!Number.isInteger(value) || value < 1 || value > MAX_COUNT) {
    entry.error('count', `expected a whole number of placements from 1 to ${MAX_COUNT}, found ${quote(scalarText(node) ?? '')}`);
    return undefined;
  }
  return value;
}
