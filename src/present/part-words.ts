// A part's facts in words, as its page, the index, comparisons and the command line write them: its nominal
// value, its ratings, the sweep it was analysed over, and a model's deviation from its rating.

import type { Comparison } from '../model/comparison.js';
import { NOMINAL_DIMENSION, type Part } from '../model/part.js';
import { formatVoltageRating } from '../model/voltage-rating.js';
import { formatEng, formatPercent } from '../units/format.js';

/** "100 nF ±10%", "600 Ω at 100 MHz" (a bead's rated impedance), or "—". */
export function nominalText(part: Part): string {
  if (part.nominal === undefined || !part.behavesAs) return '—';
  const value = formatEng(part.nominal, NOMINAL_DIMENSION[part.behavesAs]);
  if (part.behavesAs === 'bead' && part.ratedAtHz !== undefined) return `${value} at ${formatEng(part.ratedAtHz, 'frequency')}`;
  return part.tolerance !== undefined ? `${value} ±${formatPercent(part.tolerance)}` : value;
}

/** Every rating of the part, comma-separated: "16 V DC, 310 V AC, 2 A". */
export function ratingText(part: Part): string {
  const parts: string[] = [];
  parts.push(...part.voltageRatings.map(formatVoltageRating));
  if (part.currentA !== undefined) parts.push(formatEng(part.currentA, 'current'));
  if (part.powerW !== undefined) parts.push(formatEng(part.powerW, 'power'));
  return parts.join(', ');
}

/** A node of `ratingTexts`' tree: the next value read leads to the next node, the last to the text. */
type RatingNode = Map<unknown, RatingNode | string>;

/**
 * `ratingText` remembered by the values it reads (each voltage rating's volts, kind and whether the kind was
 * stated, then the current and power ratings), for one pass over many parts: a library's thousands of parts
 * share a handful of ratings, and formatting the numbers is most of the text's cost. Those values are looked
 * up in a tree of maps (no text is made to find a text); a value read here that ratingText did not read would
 * only split a text in two, but one ratingText read and not this would give a part another's text: the two
 * must read the same fields (test/present/part-words.test.ts compares them over generated parts).
 */
export function ratingTexts(): (part: Part) => string {
  const root: RatingNode = new Map();
  const step = (node: RatingNode, value: unknown): RatingNode => {
    let next = node.get(value) as RatingNode | undefined;
    if (!next) node.set(value, (next = new Map()));
    return next;
  };
  return (part) => {
    let node = step(root, part.voltageRatings.length);
    for (const r of part.voltageRatings) node = step(step(step(node, r.volts), r.kind), r.stated);
    node = step(node, part.currentA);
    const last = part.powerW;
    const found = node.get(last);
    if (typeof found === 'string') return found;
    const text = ratingText(part);
    node.set(last, text);
    return text;
  };
}

/** "1 kHz to 3 GHz, 100 points per decade". */
export function sweepText(a: { fromHz: number; toHz: number; perDecade: number }): string {
  return `${formatEng(a.fromHz, 'frequency')} to ${formatEng(a.toHz, 'frequency')}, ${a.perDecade} points per decade`;
}

/** "1 kHz to 3 GHz": the ends of a sweep. */
export function sweepRangeText(fromHz: number, toHz: number): string {
  return `${formatEng(fromHz, 'Hz')} to ${formatEng(toHz, 'Hz')}`;
}

/** "+0.61%", "−1.83%": a model's deviation from a rating. */
export function signedPercent(ratio: number): string {
  return `${ratio < 0 ? '−' : '+'}${formatPercent(Math.abs(ratio))}`;
}

/** How a comparison chose its parts: "3 parts named in the file", "every part with kind capacitor, tags a + b". */
export function selectionText(c: Comparison): string {
  if (!c.filter) return `${c.parts.length} parts named in the file`;
  const f = c.filter;
  const words = [f.kind ? `kind ${f.kind}` : 'any kind', ...(f.tags.length ? [`tags ${f.tags.join(' + ')}`] : []), ...(f.package ? [`package ${f.package}`] : [])];
  return `every part with ${words.join(', ')}`;
}
