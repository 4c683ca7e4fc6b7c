// zfolio check: read and validate the whole library, list every problem.

import { LIBRARY_OPTION, libraryRoot, parseCommandLine } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_OK, type CommandIO } from '../io.js';
import { loadReported, plural } from '../report.js';
import { railVerdicts } from '../../analysis/review-checks.js';
import { reviewWarnings } from '../../model/review-consistency.js';
import { formatDiagnostic, sortedDiagnostics } from '../../model/diagnostics.js';
import { buildHistory } from '../../build/build-history.js';
import { libraryMeasurements } from '../../measure/part-measurements.js';
import type { Part } from '../../model/part.js';

export const checkHelp = `Usage: zfolio check [--library DIR]

Reads folio.yaml and every part file under parts/ and reports each problem as
file:line:col: message. Exit 0 when the library is sound (warnings allowed),
1 when it has errors, 2 on a wrong command line.

Options:
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

export function check(args: string[], io: CommandIO): number {
  const { values } = parseCommandLine(args, LIBRARY_OPTION, false);
  if (values.help) {
    io.out(checkHelp);
    return EXIT_OK;
  }
  // Measurement files of the parts that read are checked also when other files have errors.
  const brokenMeasurements = (parts: readonly Part[]) => libraryMeasurements(parts, Infinity).diagnostics;
  const library = loadReported(libraryRoot(values, io), io, { warnings: true, alsoWhenBroken: brokenMeasurements });
  if (!library) return EXIT_BAD_INPUT;
  // Warnings that need the analysis: a review that accepts a rail failing its target.
  for (const d of reviewWarnings(library.reviews, () => railVerdicts(library))) io.err(formatDiagnostic(d) + '\n');
  // A review's `since:` must name a revision git can give, whose files load.
  const history = library.reviews.some((r) => r.since !== undefined) ? buildHistory(library, undefined).diagnostics : [];
  for (const d of history) io.err(formatDiagnostic(d) + '\n');
  const errors = history.filter((d) => d.severity === 'error').length;
  if (errors > 0) {
    io.err(`${plural(errors, 'error')} in the library's reviews\n`);
    return EXIT_BAD_INPUT;
  }
  // Measurement files, read as Touchstone and compared with their parts' models.
  const measured = libraryMeasurements(library.parts, library.settings.measurementWarnDb);
  for (const d of sortedDiagnostics(measured.diagnostics)) io.err(formatDiagnostic(d) + '\n');
  const measurementErrors = measured.diagnostics.filter((d) => d.severity === 'error').length;
  if (measurementErrors > 0) {
    io.err(`${plural(measurementErrors, 'error')} in the measurements\n`);
    return EXIT_BAD_INPUT;
  }
  const measurements = [...measured.byPart.values()].reduce((n, list) => n + list.length, 0);
  // Parts always; comparisons, plans and reviews when the library holds any.
  const held = [
    plural(library.parts.length, 'part'),
    ...(library.comparisons.length ? [plural(library.comparisons.length, 'comparison')] : []),
    ...(library.plans.length ? [plural(library.plans.length, 'rail plan')] : []),
    ...(library.reviews.length ? [plural(library.reviews.length, 'review')] : []),
    ...(measurements ? [plural(measurements, 'measurement')] : []),
  ];
  io.out(`ok: ${held.join(', ')} in ${plural(library.sources.length, 'file')}, no errors\n`);
  return EXIT_OK;
}
