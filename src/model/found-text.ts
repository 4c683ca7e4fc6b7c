// How a message names what it found and what was wanted: a YAML value as a person reads it, a near miss
// for a misspelt word, a reference to nothing the library could read, a dimension's expectation.

import { isMap, isScalar, isSeq, type Node } from 'yaml';
import { expectation } from '../units/parse.js';
import type { Dimension } from '../units/quantity.js';
import { quote } from './diagnostics.js';
import type { ReadContext } from './fields.js';
import { closest } from './suggest.js';

/** What to say about a reference to `name` that names nothing the library could read. */
export function missingTarget(ctx: ReadContext, kind: 'parts' | 'plans' | 'comparisons', noun: string, name: string, candidates: Iterable<string>): string {
  const file = ctx.unreadable?.[kind]?.get(name);
  if (file !== undefined) return `${noun} ${quote(name)} is defined in ${quote(file)}, which has errors (listed there); fix them first`;
  const guess = closest(name, candidates);
  return `no ${noun} ${quote(name)} in the library${guess ? `; did you mean "${guess}"?` : ''}`;
}

/** What a found value looks like in a message. */
export function describeNode(node: Node | null | undefined): string {
  if (node === null || node === undefined) return 'nothing';
  if (isScalar(node)) {
    // A quoted "" was written on purpose: show it; an empty plain value is nothing at all.
    const quoted = node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE';
    return node.value === null || (node.value === '' && !quoted) ? 'nothing' : quote(String(node.value));
  }
  if (isMap(node)) return node.items.length === 0 ? 'an empty mapping' : 'a mapping';
  if (isSeq(node)) return node.items.length === 0 ? 'an empty list' : 'a list';
  return 'an alias';
}

export function scalarText(node: Node | null | undefined): string | undefined {
  if (!isScalar(node)) return undefined;
  return node.value === null ? undefined : String(node.value);
}

/**
 * A "did you mean" candidate for a misspelt word. One-letter words get none unless only their case differs:
 * every one-letter word is one edit from "r", "l" and "c", so a guess would be noise.
 */
export function nearMiss(word: string, candidates: readonly string[]): string | undefined {
  // Two swapped neighbours ("titel") are one slip of the fingers but two edits to Levenshtein.
  const guess = closest(word, candidates) ?? candidates.find((c) => isTransposition(word.toLowerCase(), c.toLowerCase()));
  if (guess === undefined) return undefined;
  if ([...word].length <= 1 && guess.toLowerCase() !== word.toLowerCase()) return undefined;
  return guess;
}

function isTransposition(a: string, b: string): boolean {
  if (a.length !== b.length || a === b) return false;
  let i = 0;
  while (a[i] === b[i]) i++;
  return a[i] === b[i + 1] && a[i + 1] === b[i] && a.slice(i + 2) === b.slice(i + 2);
}

/** "an inductance in H, e.g. 0.45n or 0.45 nH": the expectation without nested brackets, for "(...)". */
export function expectationInBrackets(dim: Dimension): string {
  return expectation(dim).replace(' (e.g. ', ', e.g. ').replace(/\)$/, '');
}
