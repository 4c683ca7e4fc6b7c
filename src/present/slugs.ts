// The folder each page gets in the site, by one rule (pageName in src/model/page-names.ts, which the loader
// also uses to refuse two pages that would share a folder): a rail plan's from its rail name, a review's and
// a comparison's from its file name. A part's folder is its id, which the loader keeps to the same rule.

import { comparisonKey, type Comparison } from '../model/comparison.js';
import { fileStem, pageName } from '../model/page-names.js';

export function railSlug(rail: string): string {
  return pageName(rail);
}

export function reviewSlug(review: { source: { path: string } }): string {
  return pageName(fileStem(review.source.path, 'reviews'));
}

/** From its file name; automatic comparisons (part families) get "family-<kind>-…" folders from src/pages/families.ts. */
export function comparisonSlug(c: Comparison): string {
  return pageName(comparisonKey(c));
}
