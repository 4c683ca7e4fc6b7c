// The library now against the library at a revision: loaded, checked and compared in one step, for the
// pages that show what changed (build --since, a review's `since:`).

import type { Diagnostic } from '../model/diagnostics.js';
import type { Library } from '../model/library.js';
import type { ExitGuard, Revision } from './git-revision.js';
import { diffLibraries, type DiffAnalyses, type LibraryDiff } from './library-diff.js';
import { loadLibraryAt } from './revision-library.js';

export interface RevisionComparison {
  revision: Revision;
  diff: LibraryDiff;
  analyses: DiffAnalyses;
}

/**
 * Compare `now` with the same library at revision `name`. Throws RevisionError when git cannot give the
 * revision; returns the revision's problems (files named REV:path) when its files have errors.
 */
export function compareWithRevision(now: Library, name: string, guard?: ExitGuard): { comparison?: RevisionComparison; diagnostics: Diagnostic[] } {
  const load = loadLibraryAt(now.root, name, guard);
  if (!load.library) return { diagnostics: load.diagnostics };
  const { diff, analyses } = diffLibraries(load.library, now);
  return { comparison: { revision: load.revision, diff, analyses }, diagnostics: [] };
}
