// zfolio sweep: a part's impedance at every sweep point.

import { analysePart } from '../../analysis/part-figures.js';
import { sweepColumns, sweepCsv, sweepJson } from '../../analysis/sweep-table.js';
import { sweepTableText } from '../../present/part-report.js';
import { LIBRARY_OPTION, SWEEP_OPTIONS, libraryRoot, parseCommandLine, sweepWithOverrides } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { loadReported } from '../report.js';
import { selectParts } from '../select.js';

export const sweepHelp = `Usage: zfolio sweep ID|FILE [--csv|--json] [--library DIR] [--from F] [--to F]
                    [--per-decade N]

Prints the part's impedance at every sweep point: frequency, R, X, |Z| and phase
as a table; with --csv or --json also G, B, |Y|, Q and the effective C and L,
in SI units at full precision.

Options:
  --csv               comma-separated values with a header row
  --json              one JSON object of columns
  --from F, --to F    sweep range, e.g. --from 1k --to 3G (default: folio.yaml)
  --per-decade N      sweep points per decade (default: folio.yaml)
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

export function sweep(args: string[], io: CommandIO): number {
  const { values, positionals } = parseCommandLine(args, { ...LIBRARY_OPTION, ...SWEEP_OPTIONS, csv: { type: 'boolean' }, json: { type: 'boolean' } }, true);
  if (values.help) {
    io.out(sweepHelp);
    return EXIT_OK;
  }
  if (positionals.length !== 1) throw new UsageError(`sweep takes exactly one part id or file, found ${positionals.length}`);
  if (values.csv && values.json) throw new UsageError('choose one of --csv and --json');
  const library = loadReported(libraryRoot(values, io), io);
  if (!library) return EXIT_BAD_INPUT;
  const spec = sweepWithOverrides(library.settings.sweep, values);
  const [part] = selectParts(library, positionals, io.cwd);
  const analysis = analysePart(part, spec, library.settings.within);
  if (values.csv) io.out(sweepCsv(analysis));
  else if (values.json) io.out(JSON.stringify(sweepJson(analysis)) + '\n');
  else {
    io.out(sweepTableText(part.id, spec.perDecade, sweepColumns(analysis)));
  }
  return EXIT_OK;
}
