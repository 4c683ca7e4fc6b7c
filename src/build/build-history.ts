// The revisions a build compares with: `build --since REV` for the "Changes since REV" page, and each
// review's `since:` for its "What changed since REV" section. Each revision is read from git once.

import type { Diagnostic } from '../model/diagnostics.js';
import type { Library, LibraryReview } from '../model/library.js';
import { compareWithRevision, type RevisionComparison } from '../history/compare.js';
import { RevisionError } from '../history/git-revision.js';
import { untilDone } from '../on-exit.js';
import { reviewSlug } from '../present/slugs.js';

export interface BuildHistory {
  /** The comparison `--since` asked for. */
  since?: RevisionComparison;
  /** Each review's comparison, by review slug, for the reviews that say `since:`. */
  reviews: Map<string, RevisionComparison>;
  /** Problems: a review's revision git cannot give, or whose files have errors (and those errors). */
  diagnostics: Diagnostic[];
}

/**
 * Load and compare the revisions the build needs. A `since` git cannot give throws RevisionError (the
 * command line's misuse, exit 2); a review's is an error at its `since:` line.
 */
export function buildHistory(library: Library, since: string | undefined): BuildHistory {
  const history: BuildHistory = { reviews: new Map(), diagnostics: [] };
  const done = new Map<string, ReturnType<typeof compareWithRevision>>();
  const compare = (name: string) => {
    let result = done.get(name);
    if (!result) {
      result = compareWithRevision(library, name, untilDone);
      done.set(name, result);
    }
    return result;
  };
  if (since !== undefined) {
    const result = compare(since);
    history.since = result.comparison;
    history.diagnostics.push(...result.diagnostics);
  }
  for (const review of library.reviews) {
    if (review.since === undefined) continue;
    const comparison = reviewComparison(review, compare, history.diagnostics);
    if (comparison) history.reviews.set(reviewSlug(review), comparison);
  }
  return history;
}

function reviewComparison(review: LibraryReview, compare: (name: string) => ReturnType<typeof compareWithRevision>, diagnostics: Diagnostic[]): RevisionComparison | undefined {
  const at = review.sinceAt ?? review.at;
  const name = review.since!;
  let result: ReturnType<typeof compareWithRevision>;
  try {
    result = compare(name);
  } catch (error) {
    if (!(error instanceof RevisionError)) throw error;
    diagnostics.push({ ...at, severity: 'error', message: `since: ${error.message}` });
    return undefined;
  }
  if (!result.comparison) {
    const errors = result.diagnostics.filter((d) => d.severity === 'error').length;
    diagnostics.push({ ...at, severity: 'error', message: `since: the library at revision ${name} has ${errors === 1 ? '1 error' : `${errors} errors`} (listed as ${name}:file), so nothing can be compared with it` });
    // The revision's own errors, once however many reviews name it.
    for (const d of result.diagnostics) if (!diagnostics.some((x) => x.file === d.file && x.line === d.line && x.column === d.column && x.message === d.message)) diagnostics.push(d);
  }
  return result.comparison;
}
