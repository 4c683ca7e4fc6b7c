// Loading a library for a command, and telling the user about its problems.

import { formatDiagnostic, sortedDiagnostics, type Diagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import type { CommandIO } from './io.js';

/**
 * Load and report. Problems go to stderr, one per line; undefined means the library has errors. Warnings
 * are printed by the commands that judge the whole library (check, build); the others print them only
 * alongside errors, so `figures` on one part is not drowned in warnings about a rail plan.
 */
export function loadReported(root: string, io: CommandIO, options: { warnings?: boolean; alsoWhenBroken?: (parts: readonly Part[]) => Diagnostic[] } = {}): Library | undefined {
  const loaded = loadLibrary(root);
  const { library } = loaded;
  // When other files have errors, a command that lists every problem (check) adds what it finds in the
  // parts that did read, so fixing one problem does not reveal the next.
  const diagnostics = library || !options.alsoWhenBroken ? loaded.diagnostics : sortedDiagnostics([...loaded.diagnostics, ...options.alsoWhenBroken(loaded.readParts)]);
  const errors = diagnostics.filter((d) => d.severity === 'error').length;
  for (const d of diagnostics) if (d.severity === 'error' || options.warnings || errors > 0) io.err(formatDiagnostic(d) + '\n');
  if (errors > 0) {
    const warnings = diagnostics.length - errors;
    io.err(`${plural(errors, 'error')}${warnings ? `, ${plural(warnings, 'warning')}` : ''} in the library; nothing was done\n`);
  }
  return library;
}

export function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}
