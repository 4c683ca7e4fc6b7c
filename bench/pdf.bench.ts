// PDFs (issue: printable datasheets and review packs): a review pack of about 40 pages printed with the
// browser's start counted, against the 10 s goal; and the demo library's per-part datasheets printed by one
// browser, per page, with the browser's start-up measured on its own so the per-page figure excludes it.
// The review, its rails and its parts are generated and invented.

import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { findChrome, launchChrome } from '../src/print/browser.js';
import { buildFolio, type BuildResult } from '../src/build/build.js';
import { mulberry32, writeGeneratedLibrary } from './generate.js';
import type { BenchSection } from './measure.js';

const PACK_GOAL_S = 10;
const REPO = fileURLToPath(new URL('..', import.meta.url));
const DATE = new Date('2026-12-01T00:00:00Z');

const s = (seconds: number) => `${seconds.toFixed(2)} s`;
const load = () => loadavg().map((x) => x.toFixed(2)).join(' ');
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Capacitor ids of a generated library (every fifth part is a capacitor; see generate.ts). */
const capacitorId = (n: number) => `GEN-${String(n * 5).padStart(5, '0')}`;
const partId = (i: number) => `GEN-${String(i).padStart(5, '0')}`;

/**
 * A generated library with one invented design review covering 4 rails, 3 comparisons and 11 parts: a pack
 * of about 40 pages (cover, contents, decisions, 2 pages a rail, 1 a comparison, 2 a datasheet, cautions,
 * sources).
 */
export function writeReviewLibrary(): string {
  const root = writeGeneratedLibrary(60, 11);
  const random = mulberry32(404);
  mkdirSync(join(root, 'plans'));
  mkdirSync(join(root, 'comparisons'));
  mkdirSync(join(root, 'reviews'));
  const rails = ['BENCH_CORE', 'BENCH_IO', 'BENCH_ANALOG', 'BENCH_MEM'];
  rails.forEach((rail, r) => {
    const placed = [0, 1, 2, 3].map((k) => `  - {part: ${capacitorId((r * 3 + k) % 12)}, count: ${2 + Math.floor(random() * 8)}}`).join('\n');
    writeFileSync(
      join(root, 'plans', `${rail.toLowerCase()}.yaml`),
      `rail: ${rail}\ntitle: Generated rail ${r + 1} (invented)\nvoltage: ${[0.9, 3.3, 1.8, 1.2][r]}V\nripple: 3%\nstep: ${1 + r}A\nband: {from: 100k, to: 50M}\nmounting: 0.4nH\nregulator: {r: 1m, l: 20nH}\nplane: {c: 10nF, r: 2m}\ncapacitors:\n${placed}\n`,
    );
  });
  const comparisons = ['bench-low', 'bench-mid', 'bench-high'];
  comparisons.forEach((stem, c) => {
    const ids = [0, 1, 2, 3].map((k) => `  - ${partId(c * 4 + k)}`).join('\n');
    writeFileSync(join(root, 'comparisons', `${stem}.yaml`), `title: Generated comparison ${c + 1} (invented)\nparts:\n${ids}\n`);
  });
  const parts = Array.from({ length: 11 }, (_, i) => `    - ${partId(i * 5 + 1)}`).join('\n');
  writeFileSync(
    join(root, 'reviews', 'bench-review.yaml'),
    `title: Generated board review (invented, for the benchmark)\ndate: 2026-11-30\nboard: Generated benchmark board rev A\nreviewers:\n  - {name: A. Reviewer, role: chair}\n  - {name: B. Reviewer}\nsummary: An invented review generated for the PDF benchmark.\ncovers:\n  plans: [${rails.join(', ')}]\n  comparisons: [${comparisons.join(', ')}]\n  parts:\n${parts}\ndecisions:\n  - The generated rails are **accepted** as generated.\nopen-points:\n  - {text: Nothing real is decided here., owner: A. Reviewer, due: 2026-12-31}\n`,
  );
  return root;
}

async function printOnly(libraryRoot: string, select: { parts?: Set<string>; reviews?: Set<string> }): Promise<BuildResult> {
  // Built outside the library (the demo library is the repository), with no cache, and thrown away.
  const scratch = mkdtempSync(join(tmpdir(), 'zfolio-pdf-bench-'));
  try {
    const result = await buildFolio({ libraryRoot, outDir: join(scratch, 'site'), cache: false, pdf: { env: process.env, date: DATE, select } });
    if (!result.ok) throw new Error(`pdf bench: build failed: ${result.diagnostics[0]?.message}`);
    if (result.pdfProblem) throw new Error(`pdf bench: ${result.pdfProblem}`);
    return result;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

export const pdfBench: BenchSection = {
  name: 'pdf',
  async run() {
    const lines: string[] = [];
    const chrome = findChrome(undefined, process.env);
    if ('problem' in chrome) return [`no Chromium (${chrome.problem}): nothing measured`];
    lines.push(`load average before: ${load()} (${availableParallelism()} cores); Chromium: ${chrome.path}`);

    // The browser on its own: start, open a tab, close; the median of three.
    const starts: number[] = [];
    for (let i = 0; i < 3; i++) {
      const t0 = performance.now();
      const browser = await launchChrome(chrome.path);
      await (await browser.newPage()).close();
      await browser.close();
      starts.push((performance.now() - t0) / 1000);
    }
    const start = median(starts);
    lines.push(`browser start-up alone (launch, one tab, close; median of 3): ${s(start)}`);

    // (a) The review pack: only it is printed (no datasheets); the PDF stage counts the browser's start.
    const reviewRoot = writeReviewLibrary();
    try {
      const pack = await printOnly(reviewRoot, { parts: new Set() });
      const [file] = pack.pdfs;
      const seconds = pack.timings.pdf.seconds;
      lines.push(
        `(a) review pack, ${file.pages} pages (${Object.keys(file.sectionPages ?? {}).length} sections; printed, numbered from its outline, printed again), browser start counted: ` +
          `${s(seconds)} = ${(seconds / PACK_GOAL_S).toFixed(2)} of the ${PACK_GOAL_S} s goal; ${((seconds - start) / file.pages * 1000).toFixed(0)} ms per page after the start-up`,
      );
    } finally {
      rmSync(reviewRoot, { recursive: true, force: true });
    }

    // (b) Every datasheet of the demo library, one browser, two tabs.
    const sheets = await printOnly(REPO, { reviews: new Set() });
    const pages = sheets.pdfs.reduce((sum, p) => sum + p.pages, 0);
    const total = sheets.timings.pdf.seconds;
    const perPage = (total - start) / pages;
    lines.push(
      `(b) demo datasheets: ${sheets.pdfs.length} PDFs, ${pages} pages in ${s(total)} with one browser started once ` +
        `(start-up ${((start / total) * 100).toFixed(0)}% of it); ${(perPage * 1000).toFixed(0)} ms per page after the start-up, ${(((total - start) / sheets.pdfs.length) * 1000).toFixed(0)} ms per datasheet; ` +
        `a browser per datasheet would add about ${s(start * (sheets.pdfs.length - 1))} (${((start * (sheets.pdfs.length - 1)) / total).toFixed(1)}× this run)`,
    );
    lines.push(`load average after: ${load()}`);
    return lines;
  },
};
