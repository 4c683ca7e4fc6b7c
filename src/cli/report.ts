// Loading a library for a command, and telling the user about its problems.

import { formatDiagnostic } from '../model/diagnostics.js';
import { loadLibrary, type Library } from '../model/library.js';
import type { CommandIO } from './io.js';

/** Load and report. Problems go to stderr, one per line; undefined means the library has errors. */
export function loadReported(root: string, io: CommandIO): Library | undefined {
  const { library, diagnostics } = loadLibrary(root);
  for (const d of diagnostics) io.err(formatDiagnostic(d) + '\n');
  const errors = diagnostics.filter((d) => d.severity === 'error').length;
  if (errors > 0) {
    const warnings = diagnostics.length - errors;
    io.err(`${plural(errors, 'error')}${warnings ? `, ${plural(warnings, 'warning')}` : ''} in the library; nothing was done\n`);
  }
  return library;
}

export function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}
