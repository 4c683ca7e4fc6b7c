// One entry of the chart cache: a request's charts, written by the thread that drew them and read by the
// chart pool. A part's SVGs also wait in a file until their page is rendered (svg-spill.ts); the thread that
// draws them writes that file too, a hard link to the cache entry when there is one, so that the SVGs are
// neither sent to the thread that asked for them nor written twice.
//
// Format (CHART_FILE_FORMAT, part of every cache key): UTF-8 text, NUL-separated; first the charts without
// their SVGs as JSON, each with the length of its SVG (`svgLength`), then each SVG in chart order. XML allows
// no NUL character and JSON.stringify escapes one, so NUL never occurs inside a part. Not compressed: the
// SVGs are most of it, and gzip at its fastest level cost more than writing five times the bytes.

import { linkSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { threadId } from 'node:worker_threads';
import type { DrawnChart } from './chart-maker.js';

/** The format of chart files; a new format is a new cache key, so an entry of another one is never read. */
export const CHART_FILE_FORMAT = 2;

/** The extension of a cache entry's file (files of other names are pruned, chart-cache-ledger.ts). */
export const CACHE_ENTRY_EXTENSION = '.charts';

const SEPARATOR = '\0';

/** The text of a chart file. */
export function chartFileText(charts: readonly DrawnChart[]): string {
  const head = charts.map(({ svg, ...rest }) => ({ ...rest, svgLength: svg.length }));
  let text = JSON.stringify(head);
  for (const chart of charts) text += SEPARATOR + chart.svg;
  return text;
}

/** The charts of a chart file's text; throws when it is not one (damaged, or written in part). */
export function chartsOfText<T extends DrawnChart>(text: string): T[] {
  const parts = text.split(SEPARATOR);
  const head = JSON.parse(parts[0]) as (Omit<T, 'svg'> & { svgLength: number })[];
  if (!Array.isArray(head) || head.length !== parts.length - 1) throw new Error('chart file: not as many SVGs as charts');
  return head.map(({ svgLength, ...rest }, i) => {
    if (parts[i + 1].length !== svgLength) throw new Error('chart file: an SVG of another length than written');
    return { ...rest, svg: parts[i + 1] } as unknown as T;
  });
}

/** The SVGs of a chart file, in chart order; throws when it is not one. */
export function readChartFileSvgs(file: string): string[] {
  return chartsOfText(readFileSync(file, 'utf8')).map((c) => c.svg);
}

/** Read a cache entry, as it was written (`T`: with or without specs); throws when it is missing or damaged. */
export function readCacheEntry<T extends DrawnChart>(file: string): T[] {
  return chartsOfText<T>(readFileSync(file, 'utf8'));
}

/**
 * Store charts where they are wanted: in the cache entry `cacheFile` (charts with their specs, or without
 * them where no page offers them: a part's charts link the site's shared specs) and in `svgFile`, the file a
 * page's SVGs wait in until it is rendered (a hard link to the entry when the entry could be written and
 * linked). An entry that cannot be written is only charts drawn again next time, and neither stops a build;
 * `svgFile` must be written (it throws when it cannot be).
 *
 * An entry is written under a name of its own and renamed into place, so no file of that name is ever seen
 * in part, and no entry is changed once written (a spill linked to it, in this build or a concurrent one,
 * keeps what it linked).
 */
export function storeCharts(charts: readonly DrawnChart[], cacheFile: string | undefined, svgFile: string | undefined): void {
  if (!cacheFile && !svgFile) return;
  const text = chartFileText(charts);
  let linked = false;
  if (cacheFile) {
    const temporary = `${cacheFile}.${process.pid}-${threadId}.part`;
    try {
      writeFileSync(temporary, text);
      if (svgFile) {
        try {
          linkSync(temporary, svgFile);
          linked = true;
        } catch {
          // Another file system, or one without hard links: written apart below.
        }
      }
      renameSync(temporary, cacheFile);
    } catch {
      rmSync(temporary, { force: true });
    }
  }
  if (svgFile && !linked) writeFileSync(svgFile, text);
}

/** Make `svgFile` the chart file of charts read from the cache entry `entryFile`: a hard link, else written. */
export function placeChartFile(entryFile: string, charts: readonly DrawnChart[], svgFile: string): void {
  try {
    linkSync(entryFile, svgFile);
  } catch {
    writeFileSync(svgFile, chartFileText(charts));
  }
}

/** Charts whose SVGs wait in a file: what the thread that asked for them is given back. */
export function withoutSvgs<T extends DrawnChart>(charts: readonly T[]): T[] {
  return charts.map((c) => ({ ...c, svg: '' }));
}
