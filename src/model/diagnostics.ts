// Problems found in a library, each tied to a place in a file: what was expected, what was found.

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
}

/** `file:line:col: message`, with "warning: " before the message of a warning. */
export function formatDiagnostic(d: Diagnostic): string {
  return `${d.file}:${d.line}:${d.column}: ${d.severity === 'warning' ? 'warning: ' : ''}${d.message}`;
}

/** Collects problems across a whole library so that one run reports them all. */
export class DiagnosticList {
  private readonly items: Diagnostic[] = [];

  error(at: SourcePosition, message: string): void {
    this.items.push({ file: at.file, line: at.line, column: at.column, severity: 'error', message });
  }

  warning(at: SourcePosition, message: string): void {
    this.items.push({ file: at.file, line: at.line, column: at.column, severity: 'warning', message });
  }

  get errorCount(): number {
    return this.items.filter((d) => d.severity === 'error').length;
  }

  get warningCount(): number {
    return this.items.length - this.errorCount;
  }

  /** In file, line, column order, so reports are stable from run to run. */
  sorted(): Diagnostic[] {
    return [...this.items].sort(
      (a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0) || a.line - b.line || a.column - b.column || (a.message < b.message ? -1 : a.message > b.message ? 1 : 0),
    );
  }
}
