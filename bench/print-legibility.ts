// How legible the printed folio is: the size on paper of every word of every PDF, read back with poppler's
// `pdftotext -bbox`, and the pages that hold almost nothing.
// Usage: node --import tsx bench/print-legibility.ts SITE_OR_PDF ...   (a built site's pdf/ folder is searched)

import { execFileSync } from 'node:child_process';
import { readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { pathToFileURL } from 'node:url';

/**
 * pdftotext's word box spans the font's ascent to its descent, not the em. zfolio prints with DejaVu Sans and
 * DejaVu Sans Mono (the system fonts its CSS names first), whose ascent is 0.928 em and descent 0.236 em
 * (from the fonts' hhea tables, as pdffonts' embedded descriptors carry them): a box 1.164 em high. The
 * running head, set at 7.5 pt, reads back 8.73 pt high, which checks the ratio.
 */
export const BOX_PER_EM = 1.164;

export interface PrintedWord {
  page: number;
  text: string;
  /** Font size on paper, in points. */
  sizePt: number;
  /** The bottom of its box, in points from the top of the page. */
  bottomPt: number;
}

export interface PdfLegibility {
  file: string;
  pages: number;
  words: PrintedWord[];
  /** Words on each page (1-based page i at index i - 1). */
  wordsPerPage: number[];
  /** Height of each page, in points. */
  pageHeightsPt: number[];
}

const WORD = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/;

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * Text turned a quarter (a chart's vertical axis title) gives boxes whose width is the font's height and
 * whose height is the word's length: its size is its width. A word is taken as turned when a neighbour in
 * reading order has exactly its left and right edges and sits just above or below it, a word space apart
 * (less than half the box's width; rows of a table column are further apart than that), or when it stands
 * alone more than 12 pt high and under half as wide as high, which no upright word of a folio is (the largest
 * upright text, the part id, is about 17 pt and many letters wide).
 */
function turned(b: Box, neighbours: (Box | undefined)[]): boolean {
  const w = b.x1 - b.x0;
  const h = b.y1 - b.y0;
  const stacked = neighbours.some((n) => {
    if (!n || Math.abs(n.x0 - b.x0) > 0.01 || Math.abs(n.x1 - b.x1) > 0.01) return false;
    const gap = Math.max(n.y0 - b.y1, b.y0 - n.y1);
    return gap > 0 && gap < w / 2;
  });
  return stacked || (h > 12 * BOX_PER_EM && w < h / 2);
}

export function measurePdf(file: string): PdfLegibility {
  const html = execFileSync('pdftotext', ['-bbox', file, '-'], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  const read: { page: number; text: string; box: Box }[] = [];
  const wordsPerPage: number[] = [];
  const pageHeightsPt: number[] = [];
  for (const line of html.split('\n')) {
    if (line.includes('<page ')) {
      wordsPerPage.push(0);
      pageHeightsPt.push(Number(/height="([\d.]+)"/.exec(line)?.[1] ?? NaN));
      continue;
    }
    const m = WORD.exec(line);
    if (!m) continue;
    const [x0, y0, x1, y1] = [m[1], m[2], m[3], m[4]].map(Number);
    read.push({ page: wordsPerPage.length, text: m[5], box: { x0, y0, x1, y1 } });
    wordsPerPage[wordsPerPage.length - 1]++;
  }
  const words = read.map(({ page, text, box }, i): PrintedWord => {
    const around = [read[i - 1], read[i + 1]].map((n) => (n?.page === page ? n.box : undefined));
    const size = turned(box, around) ? box.x1 - box.x0 : box.y1 - box.y0;
    return { page, text, sizePt: size / BOX_PER_EM, bottomPt: box.y1 };
  });
  return { file, pages: wordsPerPage.length, words, wordsPerPage, pageHeightsPt };
}

/** Share of words under `pt` points. */
export function shareUnder(words: PrintedWord[], pt: number): number {
  return words.length === 0 ? 0 : words.filter((w) => w.sizePt < pt).length / words.length;
}

/** The bar for a page that is nearly empty: fewer words than this, furniture included. */
export const NEARLY_EMPTY_WORDS = 70;

export function nearlyEmptyPages(pdf: PdfLegibility): number[] {
  return pdf.wordsPerPage.flatMap((n, i) => (n < NEARLY_EMPTY_WORDS ? [i + 1] : []));
}

export function pdfFilesUnder(path: string): string[] {
  if (statSync(path).isFile()) return [path];
  return readdirSync(path, { recursive: true, encoding: 'utf8' })
    .filter((f) => f.endsWith('.pdf'))
    .sort()
    .map((f) => join(path, f));
}

function percent(x: number): string {
  return `${(100 * x).toFixed(1)}%`;
}

function report(paths: string[]): string[] {
  const files = paths.flatMap(pdfFilesUnder);
  const all = files.map(measurePdf);
  const words = all.flatMap((p) => p.words);
  const lines: string[] = [];
  for (const pdf of all) {
    const empty = nearlyEmptyPages(pdf);
    lines.push(
      `${relative(process.cwd(), pdf.file)}: ${pdf.pages} pages, ${pdf.words.length} words, under 6 pt ${percent(shareUnder(pdf.words, 6))}, ` +
        `under 6.5 pt ${percent(shareUnder(pdf.words, 6.5))}, under 7 pt ${percent(shareUnder(pdf.words, 7))}` +
        (empty.length ? `, nearly empty: page ${empty.join(', ')}` : ''),
    );
  }
  const pages = all.reduce((n, p) => n + p.pages, 0);
  const empty = all.reduce((n, p) => n + nearlyEmptyPages(p).length, 0);
  lines.push(
    `all: ${files.length} PDFs, ${pages} pages, ${words.length} words; under 6 pt ${percent(shareUnder(words, 6))}, ` +
      `under 6.5 pt ${percent(shareUnder(words, 6.5))}, under 7 pt ${percent(shareUnder(words, 7))}; ` +
      `pages under ${NEARLY_EMPTY_WORDS} words: ${empty}`,
  );
  return lines;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const paths = process.argv.slice(2);
  if (paths.length === 0) {
    console.error('usage: node --import tsx bench/print-legibility.ts SITE_OR_PDF ...');
    process.exit(2);
  }
  for (const line of report(paths)) console.log(line);
}
