// zfolio diff: what changed in the library since a git revision, and which verdicts it moved.

import { formatDiagnostic, type Diagnostic } from '../../model/diagnostics.js';
import { loadLibrary, type Library } from '../../model/library.js';
import { RevisionError, type Revision } from '../../history/git-revision.js';
import { loadLibraryAt } from '../../history/revision-library.js';
import { untilDone } from '../../on-exit.js';
import { diffLibraries, type LibraryDiff } from '../../history/library-diff.js';
import { changeLines } from '../../present/diff-text.js';
import { LIBRARY_OPTION, libraryRoot, parseCommandLine } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_MISUSE, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { plural } from '../report.js';

export const diffHelp = `Usage: zfolio diff REV [TO] [--json] [--library DIR]

Compares the library as it is now (the work tree: uncommitted edits count)
with the library at git revision REV (a tag, a branch, HEAD~3, a hash), or
with revision TO when given. Both are loaded and checked. Prints one line a
change: rails whose verdict moved first, then rails whose margin moved,
folio.yaml, parts added, removed, renamed and changed (the fields as written,
and the figures that moved: SRF, usable band edges, ESR at SRF, effective
value at the band's middle), comparisons and reviews.

Options:
  --json              print the changes as JSON (SI units: Hz, Ω, F, H, dB)
  -l, --library DIR   the library folder, in a git work tree (default: the
                      current folder)
  -h, --help          show this help

Exit status: 0 compared; 1 a revision's files have errors (listed, with the
revision before each file name); 2 a wrong command line, a folder not in git
or a revision git does not know.
`;

/** Which revisions a diff compares, as its JSON states them; null revision and commit: the work tree. */
export interface DiffEnds {
  from: Revision;
  to: { name: string | null; commit: string | null };
}

export function diffJson(ends: DiffEnds, diff: LibraryDiff): Record<string, unknown> {
  return {
    from: { revision: ends.from.name, commit: ends.from.commit },
    to: { revision: ends.to.name, commit: ends.to.commit },
    ...diff,
  };
}

export function diffText(ends: DiffEnds, diff: LibraryDiff): string {
  const lines = changeLines(diff).map((l) => l.text);
  const to = ends.to.name === null ? 'the work tree' : `${ends.to.name} (${ends.to.commit!.slice(0, 12)})`;
  const head = `Changes from ${ends.from.name} (${ends.from.commit.slice(0, 12)}) to ${to}`;
  return [head + (lines.length === 0 ? ': none' : ''), ...lines].join('\n') + '\n';
}

export function diff(args: string[], io: CommandIO): number {
  const { values, positionals } = parseCommandLine(args, { ...LIBRARY_OPTION, json: { type: 'boolean' } }, true);
  if (values.help) {
    io.out(diffHelp);
    return EXIT_OK;
  }
  if (positionals.length === 0) throw new UsageError('name the revision to compare with, e.g. "zfolio diff HEAD~1" or "zfolio diff v1.2"');
  if (positionals.length > 2) throw new UsageError(`expected at most two revisions, found ${positionals.length}`);
  const root = libraryRoot(values, io);
  const [fromName, toName] = positionals;
  let loads: { label: string; library?: Library; diagnostics: Diagnostic[]; revision?: Revision }[];
  try {
    const from = loadLibraryAt(root, fromName, untilDone);
    const to = toName === undefined ? { ...loadLibrary(root), revision: undefined } : loadLibraryAt(root, toName, untilDone);
    loads = [
      { label: `revision ${fromName}`, ...from },
      { label: toName === undefined ? 'the work tree' : `revision ${toName}`, ...to },
    ];
  } catch (error) {
    if (!(error instanceof RevisionError)) throw error;
    io.err(`zfolio diff: ${error.message}\n`);
    return error.misuse ? EXIT_MISUSE : EXIT_BAD_INPUT;
  }
  const [before, after] = loads;
  if (!before.library || !after.library) {
    const summary: string[] = [];
    for (const load of loads) {
      const errors = load.diagnostics.filter((d) => d.severity === 'error').length;
      if (errors === 0) continue;
      for (const d of load.diagnostics) io.err(formatDiagnostic(d) + '\n');
      summary.push(`${plural(errors, 'error')} in ${load.label}`);
    }
    io.err(`${summary.join(', ')}; nothing was compared\n`);
    return EXIT_BAD_INPUT;
  }
  const ends: DiffEnds = { from: before.revision!, to: { name: after.revision?.name ?? null, commit: after.revision?.commit ?? null } };
  const { diff: changes } = diffLibraries(before.library, after.library);
  io.out(values.json ? JSON.stringify(diffJson(ends, changes), null, 2) + '\n' : diffText(ends, changes));
  return EXIT_OK;
}
