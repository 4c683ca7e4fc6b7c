// zfolio print: PDFs of a few parts or reviews, without touching the built site.

import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, renameSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join, relative, resolve, sep } from 'node:path';
import { buildFolio } from '../../build/build.js';
import { terminalProgress } from '../../build/progress.js';
import { railSlug, reviewSlug } from '../../present/slugs.js';
import { OutputRefused } from '../../build/output-guard.js';
import { madeByZfolio } from '../../print/pdf.js';
import { alive } from '../../build/output.js';
import { closest } from '../../model/suggest.js';
import { LIBRARY_OPTION, libraryRoot, parseCommandLine } from '../args.js';
import { EXIT_BAD_INPUT, EXIT_OK, UsageError, type CommandIO } from '../io.js';
import { loadReported, plural } from '../report.js';
import { paperOption } from './build.js';

export const printHelp = `Usage: zfolio print ID|RAIL|REVIEW ... [--out DIR] [--library DIR]
                    [--chrome PATH] [--paper A4|Letter]

Prints the datasheet of each part named by id, the plan of each rail named by
its name or plan file (plans/NAME.yaml), and the review pack of each review
named by its file (reviews/NAME.yaml) or NAME, to NAME.pdf in the output
folder. The built site is left alone. Needs Chromium. An existing file of the
same name is replaced only if it is a PDF zfolio made.

Options:
  --out DIR           where the PDFs go (default: the current folder)
  --chrome PATH       the Chromium to print with (default: $ZFOLIO_CHROME,
                      then the usual paths)
  --paper SIZE        A4 or Letter (default: folio.yaml, else A4)
  -l, --library DIR   the library folder (default: the current folder)
  -h, --help          show this help
`;

export async function print(args: string[], io: CommandIO): Promise<number> {
  const { values, positionals } = parseCommandLine(args, { ...LIBRARY_OPTION, out: { type: 'string', short: 'o' }, chrome: { type: 'string' }, paper: { type: 'string' } }, true);
  if (values.help) {
    io.out(printHelp);
    return EXIT_OK;
  }
  if (positionals.length === 0) throw new UsageError('name at least one part id, rail or review to print');
  const root = libraryRoot(values, io);
  const paper = paperOption(values.paper);
  const library = loadReported(root, io);
  if (!library) return EXIT_BAD_INPUT;

  const reviewsBySlug = new Map(library.reviews.map((r) => [reviewSlug(r), r]));
  const parts = new Set<string>();
  const reviews = new Set<string>();
  const plans = new Set<string>();
  for (const name of positionals) {
    const asFile = relative(root, resolve(io.cwd, name)).split(sep).join('/');
    const review = library.reviews.find((r) => r.source.path === asFile) ?? reviewsBySlug.get(basename(name).replace(/\.ya?ml$/i, ''));
    const plan = library.plans.find((p) => p.rail === name || p.source.path === asFile);
    if (library.partsById.has(name)) parts.add(name);
    else if (plan) plans.add(plan.rail);
    else if (review) reviews.add(reviewSlug(review));
    else {
      const guess = closest(name, [...library.partsById.keys(), ...library.plans.map((p) => p.rail), ...reviewsBySlug.keys()]);
      throw new UsageError(`no part, rail or review called ${JSON.stringify(name)}${guess ? `; did you mean ${guess}?` : ''}`);
    }
  }

  const outDir = resolve(io.cwd, typeof values.out === 'string' ? values.out : '.');
  await guardPdfFolder(outDir, [...parts, ...reviews, ...[...plans].map(railSlug)].map((name) => `${name}.pdf`));

  removeDeadScratch();
  const scratch = mkdtempSync(join(tmpdir(), `${SCRATCH_PREFIX}${process.pid}-`));
  try {
    const result = await buildFolio({
      libraryRoot: root,
      outDir: join(scratch, 'site'),
      spareCopy: false,
      cwd: io.cwd,
      progress: terminalProgress((text) => io.err(text), io.isTTY),
      pdf: { chrome: typeof values.chrome === 'string' ? resolve(io.cwd, values.chrome) : undefined, env: io.env, paper, select: { parts, reviews, plans } },
    });
    if (!result.ok) return EXIT_BAD_INPUT;
    if (result.pdfProblem) {
      io.err(`zfolio print: ${result.pdfProblem}\n`);
      return EXIT_BAD_INPUT;
    }
    mkdirSync(outDir, { recursive: true });
    for (const pdf of result.pdfs) {
      const target = join(outDir, basename(pdf.pdfFile));
      // Copied beside the target and renamed over it, so a reader never sees half a file.
      const temp = join(outDir, `.${basename(target)}.${process.pid}.tmp`);
      try {
        copyFileSync(join(result.outDir, pdf.pdfFile), temp);
        renameSync(temp, target);
      } finally {
        rmSync(temp, { force: true });
      }
      io.out(`${relative(io.cwd, target) || target}  ${plural(pdf.pages, 'page')}\n`);
    }
    return EXIT_OK;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

/**
 * Print adds files to a folder rather than replacing it, so the folder may be any folder; but a file already
 * there under a name print writes is replaced only when it is a PDF zfolio made. Checked before printing.
 */
async function guardPdfFolder(outDir: string, names: string[]): Promise<void> {
  const kind = (path: string) => {
    try {
      const s = statSync(path);
      return s.isDirectory() ? 'folder' : s.isFile() ? 'file' : 'other';
    } catch {
      return 'none';
    }
  };
  const folder = kind(outDir);
  if (folder === 'none') return;
  if (folder !== 'folder') throw new OutputRefused(`will not write PDFs to ${outDir}: it is not a folder; choose another --out`);
  for (const name of names) {
    const target = join(outDir, name);
    const found = kind(target);
    if (found === 'none') continue;
    if (found !== 'file' || !(await madeByZfolio(readFileSync(target)))) {
      throw new OutputRefused(`will not replace ${target}: it is not a PDF zfolio made; move it or choose another --out`);
    }
  }
}

/** print builds in a scratch folder named with its process id; one a killed print left is removed by the next. */
const SCRATCH_PREFIX = 'zfolio-print-';

function removeDeadScratch(): void {
  let names: string[] = [];
  try {
    names = readdirSync(tmpdir());
  } catch {
    return;
  }
  for (const name of names) {
    const pid = new RegExp(`^${SCRATCH_PREFIX}(\\d+)-\\w+$`).exec(name)?.[1];
    if (pid === undefined || alive(Number(pid))) continue;
    try {
      rmSync(join(tmpdir(), name), { recursive: true, force: true });
    } catch {
      // another user's, or gone already
    }
  }
}
