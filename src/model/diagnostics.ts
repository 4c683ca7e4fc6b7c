// Problems found in a library, each tied to a place in a file: what was expected, what was found.

import { quote } from '../units/quote.js';

export { QUOTE_LIMIT, quote } from '../units/quote.js';

export type Severity = 'error' | 'warning';

export interface SourcePosition {
  /** Path as the user should see it: relative to the library root, forward slashes. */
  file: string;
  /** 1-based. */
  line: number;
  /** 1-based, in characters. */
  column: number;
}

export interface Diagnostic extends SourcePosition {
  severity: Severity;
  message: string;
  /** What to do about it, as a sentence, where a page shows the problem as a note (the command line prints the message alone). */
  advice?: string;
}

/** `file:line:col: message`, with "warning: " before the message of a warning. */
export function formatDiagnostic(d: Diagnostic): string {
  return `${displayPath(d.file)}:${d.line}:${d.column}: ${d.severity === 'warning' ? 'warning: ' : ''}${d.message}`;
}

// C0 and C1 control characters, DEL, and the line and paragraph separators: none may reach a terminal as is.
const UNPRINTABLE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]/;

/** A path as messages print it: as is, unless it holds a control character or a colon-confusing newline; then quoted. */
export function displayPath(path: string): string {
  return UNPRINTABLE.test(path) ? quote(path, 200) : path;
}

/** "file:line:col" of a position, for messages that point at a second place. */
export function formatPosition(at: SourcePosition): string {
  return `${displayPath(at.file)}:${at.line}:${at.column}`;
}

/** Diagnostics in file, line, column order (then by message), as reports list them. */
export function sortedDiagnostics(list: readonly Diagnostic[]): Diagnostic[] {
  return [...list].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0) || a.line - b.line || a.column - b.column || (a.message < b.message ? -1 : a.message > b.message ? 1 : 0));
}

/** The most problems listed for one file; the rest are counted in one closing line. */
export const PER_FILE_LIMIT = 100;
/** A last guard on message length: every found value is quoted short, but ids and paths are the user's. */
const MESSAGE_LIMIT = 600;

/** Collects problems across a whole library so that one run reports them all. */
export class DiagnosticList {
  private readonly items: Diagnostic[] = [];
  private readonly perFile = new Map<string, number>();
  private readonly unlisted = new Map<string, { errors: number; warnings: number; at: SourcePosition }>();
  private errors = 0;

  error(at: SourcePosition, message: string): void {
    this.add(at, 'error', message);
  }

  warning(at: SourcePosition, message: string): void {
    this.add(at, 'warning', message);
  }

  private add(at: SourcePosition, severity: Severity, message: string): void {
    if (severity === 'error') this.errors++;
    const count = (this.perFile.get(at.file) ?? 0) + 1;
    this.perFile.set(at.file, count);
    if (count > PER_FILE_LIMIT) {
      const rest = this.unlisted.get(at.file) ?? { errors: 0, warnings: 0, at };
      if (severity === 'error') rest.errors++;
      else rest.warnings++;
      this.unlisted.set(at.file, rest);
      return;
    }
    const text = message.length > MESSAGE_LIMIT ? `${message.slice(0, MESSAGE_LIMIT - 1)}…` : message;
    this.items.push({ file: at.file, line: at.line, column: at.column, severity, message: text });
  }

  get errorCount(): number {
    return this.errors;
  }

  get warningCount(): number {
    let n = 0;
    for (const count of this.perFile.values()) n += count;
    return n - this.errors;
  }

  /** In file, line, column order, so reports are stable from run to run; a file over the limit ends with a count of the rest. */
  sorted(): Diagnostic[] {
    const rest: Diagnostic[] = [...this.unlisted].map(([file, r]) => {
      const last = this.items.filter((d) => d.file === file).reduce((a, b) => (b.line > a.line || (b.line === a.line && b.column > a.column) ? b : a));
      const what = [r.errors ? `${r.errors} more error${r.errors === 1 ? '' : 's'}` : '', r.warnings ? `${r.warnings} more warning${r.warnings === 1 ? '' : 's'}` : ''].filter(Boolean).join(' and ');
      return { file, line: last.line, column: last.column, severity: r.errors ? 'error' : 'warning', message: `and ${what} in this file, not listed (at most ${PER_FILE_LIMIT} are listed per file)` };
    });
    const order = (a: Diagnostic, b: Diagnostic) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0) || a.line - b.line || a.column - b.column || (a.message < b.message ? -1 : a.message > b.message ? 1 : 0);
    const listed = [...this.items].sort(order);
    // The closing count goes after the file's last listed problem.
    for (const r of rest) {
      let i = listed.length;
      while (i > 0 && listed[i - 1].file > r.file) i--;
      listed.splice(i, 0, r);
    }
    return listed;
  }
}
