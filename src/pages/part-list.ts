// The parts index in pages: index.html holds the first INDEX_PAGE_SIZE parts (in id order) and
// list/2.html ... the rest, each linking every other, so the whole list reads without script and the first
// screen of a 10,000-part library is as quick as a small one's. For sorting and filtering across pages the
// script loads the rows as a few script files (list/rows-N.js: a browser opening the site from the file
// system may load scripts beside a page, but not fetch data files).

import { join } from 'node:path';
import { escapeJsonMarkup } from '../present/escape.js';
import type { ListedPart } from './listed-part.js';

/** Rows on one page of the index: enough for a screenful of scrolling, little enough to render at once. */
export const INDEX_PAGE_SIZE = 200;
/**
 * Rows in one script file of the index's data. A rebuild after one edit writes again the file that holds the
 * part's row: at 10,000 parts, files of 1,000 rows rather than 2,000 made that 12 ms shorter (twelve
 * alternated pairs), for ten files for the browser to load instead of five.
 */
export const ROWS_PER_CHUNK = 1000;

export interface IndexPage {
  /** 1-based. */
  number: number;
  /** Site-relative: "index.html", "list/2.html". */
  file: string;
  /** From the page to the site's root: "" or "../". */
  root: string;
  /** From ... to (1-based) of the whole list. */
  first: number;
  last: number;
  parts: ListedPart[];
}

export interface PartList {
  pages: IndexPage[];
  /** Site-relative script files with every row, when there is more than one page. */
  chunks: string[];
  total: number;
  pageSize: number;
}

const byId = (a: ListedPart, b: ListedPart) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);

export function partList(parts: readonly ListedPart[], pageSize = INDEX_PAGE_SIZE, chunkSize = ROWS_PER_CHUNK): PartList {
  const sorted = [...parts].sort(byId);
  const count = Math.max(1, Math.ceil(sorted.length / pageSize));
  const pages = Array.from({ length: count }, (_, i) => {
    const rows = sorted.slice(i * pageSize, (i + 1) * pageSize);
    return { number: i + 1, file: i === 0 ? 'index.html' : `list/${i + 1}.html`, root: i === 0 ? '' : '../', first: i * pageSize + 1, last: i * pageSize + rows.length, parts: rows };
  });
  const chunks = count === 1 ? [] : Array.from({ length: Math.ceil(sorted.length / chunkSize) }, (_, i) => `list/rows-${i + 1}.js`);
  return { pages, chunks, total: sorted.length, pageSize };
}

/**
 * One row of the index as the script draws it; the order of fields is the script's (templates/assets/folio.js).
 * Sort values are numbers, or "" where there is none, as the table's data-value attributes.
 */
export function indexRow(p: ListedPart): (string | number)[] {
  return [
    p.id,
    p.title,
    p.kind,
    p.text.kindLabel,
    p.text.nominalText,
    p.sort.nominal,
    p.package,
    p.ratingText,
    p.sort.rating,
    p.text.srfText,
    p.sort.srf,
    p.text.bandText,
    p.sort.band,
    p.tagsText,
    p.searchText,
    p.mainsMark?.label ?? '',
    p.mainsMark?.title ?? '',
  ];
}

/** The rows of each script file of the index, by site-relative path. */
export function indexRowChunks(list: PartList): Map<string, ListedPart[]> {
  const chunks = new Map<string, ListedPart[]>();
  if (list.chunks.length === 0) return chunks;
  const sorted = list.pages.flatMap((p) => p.parts);
  const size = Math.ceil(sorted.length / list.chunks.length);
  list.chunks.forEach((file, i) => chunks.set(file, sorted.slice(i * size, (i + 1) * size)));
  return chunks;
}

/** A script file of the index's rows: it hands its rows to the page's script. */
export function indexRowScript(list: PartList, file: string, rows: readonly ListedPart[]): string {
  return `zfolioIndexRows(${list.chunks.indexOf(file)}, ${escapeJsonMarkup(JSON.stringify(rows.map(indexRow)))});\n`;
}

/** The script files of the index's rows, by site-relative path. */
export function indexRowFiles(list: PartList): Map<string, string> {
  return new Map([...indexRowChunks(list)].map(([file, rows]) => [file, indexRowScript(list, file, rows)]));
}

/** Write the index's row files into the site. */
export function writeIndexRows(list: PartList, siteDir: string, write: (path: string, text: string) => void): void {
  for (const [file, text] of indexRowFiles(list)) write(join(siteDir, file), text);
}
