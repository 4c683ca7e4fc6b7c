// zfolio build: the whole folio — a static, offline site, and PDFs with --pdf.

import { relative, resolve } from 'node:path';
import { formatDiagnostic } from '../../model/diagnostics.js';
import { buildFolio, DEFAULT_OUT_DIR, type BuildResult } from '../../build/build.js';
import { terminalProgress } from '../../build/progress.js';
import { commandOptions, LIBRARY_OPTION, libraryRoot, type Parsed } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_MISUSE, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { RevisionError } from '../../history/git-revision.js';
import { plural } from '../report.js';
import { PAPER_SIZES, type PaperSize } from '../../model/settings.js';

export const buildHelp = `Usage: zfolio build [--library DIR] [--out DIR] [--pdf] [--chrome PATH]
                    [--paper A4|Letter] [--workers N] [--since REV]

Builds the folio: a datasheet page per part, comparison pages, rail plans and
reviews, and an index, as a static site that works offline and from the file
system. The site is built in a staging folder and swapped in whole: a library
with problems leaves the previous site untouched. The output folder must be a
site zfolio built, an empty folder or a new path; anything else is refused.

Options:
  --out DIR           where the site goes (default: ${DEFAULT_OUT_DIR} under the library)
  --pdf               also print a PDF per part and a pack per review
                      (needs Chromium)
  --chrome PATH       the Chromium to print with (default: $ZFOLIO_CHROME,
                      then the usual paths)
  --paper SIZE        A4 or Letter (default: folio.yaml, else A4)
  --workers N         threads drawing charts (default: one per core)
  --since REV         add a "Changes since REV" page: what changed in the
                      library since git revision REV, with |Z| before and after
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

export const BUILD_OPTIONS = {
  ...LIBRARY_OPTION,
  out: { type: 'string', short: 'o' },
  pdf: { type: 'boolean' },
  chrome: { type: 'string' },
  paper: { type: 'string' },
  workers: { type: 'string' },
  since: { type: 'string' },
} as const;

export function workersOption(value: unknown): number | undefined {
  if (typeof value !== 'string') return undefined;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 0 || n > 64) throw new UsageError(`--workers: expected a whole number from 0 to 64, found ${JSON.stringify(value)}`);
  return n;
}

export function paperOption(value: unknown): PaperSize | undefined {
  if (value === undefined) return undefined;
  const match = PAPER_SIZES.find((p) => p.toLowerCase() === String(value).toLowerCase());
  if (!match) throw new UsageError(`--paper: expected one of ${PAPER_SIZES.join(', ')}, found ${JSON.stringify(value)}`);
  return match;
}

/** How many parts a build carried over from the last site, as the summary line says it (empty for none). */
export const carriedText = (result: BuildResult) => (result.reused > 0 ? ` (${result.reused} unchanged, carried over)` : '');

/** Print problems and a summary; the exit code for a build result. */
export function reportBuild(result: BuildResult, io: CommandIO): number {
  for (const d of result.diagnostics) io.err(formatDiagnostic(d) + '\n');
  if (!result.ok) {
    const errors = result.diagnostics.filter((d) => d.severity === 'error').length;
    io.err(`${plural(errors, 'error')} in the library; nothing was written (${relative(io.cwd, result.outDir) || '.'} is as it was)\n`);
    return EXIT_BAD_INPUT;
  }
  const pdfs = result.pdfs.length > 0 ? `, ${plural(result.pdfs.length, 'PDF')} (${result.pdfs.reduce((n, p) => n + p.pages, 0)} pages)` : '';
  const kept = result.keptPdfs > 0 ? `, ${plural(result.keptPdfs, 'PDF')} of the last build kept` : '';
  io.out(`built ${plural(result.parts, 'part')}${carriedText(result)}, ${plural(result.pages, 'page')}${pdfs}${kept} in ${result.seconds.toFixed(1)} s: ${relative(io.cwd, result.outDir) || '.'}/index.html\n`);
  if (result.removedPdfs.length > 0) io.err(`zfolio build: ${removedPdfsText(result.removedPdfs)}\n`);
  if (result.pdfProblem) {
    io.err(`zfolio build: the site was written, but no PDFs. ${result.pdfProblem}\n`);
    return EXIT_BAD_INPUT;
  }
  return EXIT_OK;
}

/** One line on the PDFs of the last build that a build without printing did not keep. */
export function removedPdfsText(paths: string[]): string {
  const names = paths.slice(0, 2).join(', ') + (paths.length > 2 ? ` and ${paths.length - 2} more` : '');
  return `removed ${plural(paths.length, 'PDF')} of the last build whose inputs changed (${names}); build --pdf prints them again`;
}

/** Where a build from the command line writes (--out), and the folders it may not replace: build and serve. */
export function outputOptions(values: Parsed['values'], io: CommandIO): { outDir?: string; cwd: string; home?: string } {
  return { outDir: typeof values.out === 'string' ? resolve(io.cwd, values.out) : undefined, cwd: io.cwd, home: io.env.HOME };
}

export async function build(args: string[], io: CommandIO): Promise<number> {
  const values = commandOptions('build', args, BUILD_OPTIONS, buildHelp, io);
  if (!values) return EXIT_OK;
  const root = libraryRoot(values, io);
  let result: BuildResult;
  try {
    result = await buildFolio({
      libraryRoot: root,
      ...outputOptions(values, io),
      workers: workersOption(values.workers),
      progress: terminalProgress((text) => io.err(text), io.isTTY),
      pdf: values.pdf ? { chrome: typeof values.chrome === 'string' ? resolve(io.cwd, values.chrome) : undefined, env: io.env, paper: paperOption(values.paper) } : undefined,
      since: typeof values.since === 'string' ? values.since : undefined,
    });
  } catch (error) {
    // --since names a revision git cannot give: said in one line before anything is written.
    if (!(error instanceof RevisionError)) throw error;
    io.err(`zfolio build: --since: ${error.message}\n`);
    return error.misuse ? EXIT_MISUSE : EXIT_BAD_INPUT;
  }
  return reportBuild(result, io);
}
