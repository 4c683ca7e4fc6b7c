// A warning as a page shows it: a sentence a reader can act on (what, which part, what to do), with the
// file:line:col it comes from kept small beside it. The command line prints the same warning as one
// located line (formatDiagnostic); this is its form for pages and PDFs.

import { formatPosition, type Diagnostic } from '../model/diagnostics.js';

export interface WarningNote {
  /** What is wrong, as a sentence. */
  text: string;
  /** What to do about it, or '' when the text already says. */
  advice: string;
  /** "plans/vdd-3v3.yaml:24:12". */
  location: string;
}

/** The field path a located message starts with ("capacitors[2].part: ", "mounting-by-package: "). */
const FIELD_LABEL = /^[A-Za-z][\w-]*(\[\d+\])?(\.[\w-]+(\[\d+\])?)*: /;

export function warningNote(d: Diagnostic): WarningNote {
  const bare = d.message.replace(FIELD_LABEL, '');
  const text = bare.charAt(0).toUpperCase() + bare.slice(1);
  return { text: /[.!?]$/.test(text) ? text : `${text}.`, advice: d.advice ?? '', location: formatPosition(d) };
}
