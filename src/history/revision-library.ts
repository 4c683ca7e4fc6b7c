// Loading a library as it was at a git revision, with every check the loader makes on the work tree. The
// revision's files are checked out into a temporary folder (git-revision.ts), loaded there and the folder
// removed; problems name their file as REV:path, so they cannot be mistaken for problems of the work tree.

import type { Diagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import { checkoutRevision, type ExitGuard, type Revision } from './git-revision.js';

export interface RevisionLoad {
  revision: Revision;
  /** Present when the revision's library has no errors. Its `root` is the library folder as it is now. */
  library?: Library;
  /** Problems of the revision's files, each file written as REV:path. */
  diagnostics: Diagnostic[];
}

/**
 * The library in `root` as it was at revision `name`; throws RevisionError when git cannot give it. `guard`
 * registers the temporary folder's removal for an early exit (see checkoutRevision).
 */
export function loadLibraryAt(root: string, name: string, guard?: ExitGuard): RevisionLoad {
  const checkout = checkoutRevision(root, name, guard);
  try {
    const { library, diagnostics } = loadLibrary(checkout.folder);
    return {
      revision: { name: checkout.name, commit: checkout.commit },
      library: library && { ...library, root },
      diagnostics: diagnostics.map((d) => ({ ...d, file: `${name}:${d.file}` })),
    };
  } finally {
    checkout.remove();
  }
}
