// zfolio export: parts' models as files for simulators: one-port Touchstone (.s1p) or SPICE (.subckt).

import { relative, resolve } from 'node:path';
import { logSweep } from '../../circuit/sweep.js';
import { partSubcircuit, partTouchstone } from '../../measure/part-export.js';
import { sweepText } from '../../present/part-words.js';
import { quote } from '../../units/quote.js';
import { LIBRARY_OPTION, SWEEP_OPTIONS, libraryRoot, parseCommandLine, sweepWithOverrides } from '../args.js';
import { guardExportFolder, writeExport } from '../export-files.js';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { loadReported } from '../report.js';
import { selectParts } from '../select.js';

export const exportHelp = `Usage: zfolio export ID|FILE ... --format touchstone|spice [--out DIR]
                     [--library DIR] [--from F] [--to F] [--per-decade N]

Writes each part's model for other tools:
  touchstone  ID.s1p: one-port S-parameters of the model, reference 50 Ω,
              real and imaginary parts, over the library's sweep
  spice       ID.subckt: a .SUBCKT ID 1 2 of the model's R, L and C elements
Both open with comments naming the part, its model and its source file.
Without --out the one part named is printed; with --out each goes to
DIR/ID.s1p or DIR/ID.subckt. An existing file of that name is replaced only
if zfolio exported it.

Options:
  --format FORMAT     touchstone or spice
  --out DIR           the folder to write to (made if missing)
  --from F, --to F    sweep range of a Touchstone export (default: folio.yaml)
  --per-decade N      sweep points per decade (default: folio.yaml)
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

const FORMATS = { touchstone: '.s1p', spice: '.subckt' } as const;
type Format = keyof typeof FORMATS;

export function exportCommand(args: string[], io: CommandIO): number {
  const { values, positionals } = parseCommandLine(args, { ...LIBRARY_OPTION, ...SWEEP_OPTIONS, format: { type: 'string' }, out: { type: 'string', short: 'o' } }, true);
  if (values.help) {
    io.out(exportHelp);
    return EXIT_OK;
  }
  if (positionals.length === 0) throw new UsageError('name at least one part id or file to export');
  const format = values.format;
  if (format === undefined) throw new UsageError('--format is required: touchstone or spice');
  if (typeof format !== 'string' || !Object.hasOwn(FORMATS, format)) throw new UsageError(`--format: expected touchstone or spice, found ${quote(String(format))}`);
  const out = typeof values.out === 'string' ? resolve(io.cwd, values.out) : undefined;
  if (out === undefined && positionals.length > 1) throw new UsageError(`${positionals.length} parts named: give --out DIR to write one file each (without --out, export prints one part)`);
  const library = loadReported(libraryRoot(values, io), io);
  if (!library) return EXIT_BAD_INPUT;
  const sweep = sweepWithOverrides(library.settings.sweep, values);
  const parts = [...new Map(selectParts(library, positionals, io.cwd).map((p) => [p.id, p])).values()];
  const frequencies = format === 'touchstone' ? logSweep(sweep) : new Float64Array(0);
  const content = (part: (typeof parts)[number]) => (format === 'touchstone' ? partTouchstone(part, frequencies, sweepText(sweep)) : partSubcircuit(part));
  if (out === undefined) {
    io.out(content(parts[0]));
    return EXIT_OK;
  }
  const names = parts.map((p) => `${p.id}${FORMATS[format as Format]}`);
  guardExportFolder(out, names);
  parts.forEach((part, i) => {
    const target = writeExport(out, names[i], content(part));
    io.out(`${relative(io.cwd, target) || target}\n`);
  });
  return EXIT_OK;
}
