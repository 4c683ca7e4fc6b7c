// The comparisons as the index pages list them: those the library names, and the automatic part families
// grouped by kind, so that a library of thousands of parts lists a few hundred families under a few headings.

import type { PartKind } from '../model/part.js';
import { kindPlural } from '../present/kinds.js';
import { FAMILY_SIZE, KIND_ORDER } from './families.js';
import type { ComparisonPageData } from './site-data.js';

export interface FamilyKind {
  kind: PartKind;
  /** "Capacitors". */
  label: string;
  /** Parts of the kind, over all its families. */
  parts: number;
  families: ComparisonPageData[];
}

export interface ComparisonIndex {
  authoredComparisons: ComparisonPageData[];
  familyKinds: FamilyKind[];
  familySize: number;
}

export function comparisonIndex(comparisons: readonly ComparisonPageData[]): ComparisonIndex {
  const families = comparisons.filter((c) => c.family);
  const familyKinds = KIND_ORDER.map((kind) => {
    const ofKind = families.filter((c) => c.family!.kind === kind);
    const plural = kindPlural(kind);
    return { kind, label: plural[0].toUpperCase() + plural.slice(1), parts: ofKind.reduce((n, c) => n + c.parts.length, 0), families: ofKind };
  }).filter((k) => k.families.length > 0);
  return { authoredComparisons: comparisons.filter((c) => !c.family), familyKinds, familySize: FAMILY_SIZE };
}
