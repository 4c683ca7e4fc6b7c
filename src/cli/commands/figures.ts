// zfolio figures: resonances, self-resonant frequency and usable band of parts.

import { analysePart } from '../../analysis/part-figures.js';
import { partSummary, type PartSummary } from '../../analysis/summary.js';
import { describeFigures } from '../../present/part-report.js';
import { LIBRARY_OPTION, SWEEP_OPTIONS, libraryRoot, parseCommandLine, sweepWithOverrides } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_OK, type CommandIO } from '../io.js';
import { loadReported } from '../report.js';
import { selectParts } from '../select.js';

export const figuresHelp = `Usage: zfolio figures [ID|FILE ...] [--json] [--library DIR] [--from F] [--to F]
                      [--per-decade N]

Prints each part's resonances, self-resonant frequency (SRF) and usable band,
and the same over its spread: its value, SRF and band edges at every corner of
its tolerance, temperature change over folio.yaml's "temperature" and stated
parasitic spreads. With no ID or FILE, every part in the library.

Options:
  --json              print a JSON array (SI units: Hz, Ω) instead of text
  --from F, --to F    sweep range, e.g. --from 1k --to 3G (default: folio.yaml)
  --per-decade N      sweep points per decade (default: folio.yaml)
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

export function figures(args: string[], io: CommandIO): number {
  const { values, positionals } = parseCommandLine(args, { ...LIBRARY_OPTION, ...SWEEP_OPTIONS, json: { type: 'boolean' } }, true);
  if (values.help) {
    io.out(figuresHelp);
    return EXIT_OK;
  }
  const root = libraryRoot(values, io);
  const library = loadReported(root, io);
  if (!library) return EXIT_BAD_INPUT;
  const sweep = sweepWithOverrides(library.settings.sweep, values);
  const parts = selectParts(library, positionals, io.cwd);
  const summaries = parts.map((p) => partSummary(analysePart(p, sweep, library.settings.within, library.settings.temperature)));
  if (values.json) io.out(JSON.stringify(summaries, null, 2) + '\n');
  else io.out(summaries.map(describeFigures).join('\n'));
  return EXIT_OK;
}
