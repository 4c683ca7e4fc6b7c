// One entry of the chart cache: a request's charts as gzip-compressed JSON, written by the thread that drew
// them and read by the chart pool.

import { readFileSync, writeFileSync } from 'node:fs';
import { gunzipSync, gzipSync } from 'node:zlib';
import type { DrawnChart } from './chart-maker.js';

/**
 * Write an entry: charts with their specs, or without them where no page offers them (a part's charts,
 * whose downloads are the site's shared specs). One that cannot be written is only charts drawn again next time, and one written in part
 * (a full disk) fails to read and is drawn again too: neither stops a build.
 */
export function writeCacheEntry(file: string, charts: readonly DrawnChart[]): void {
  try {
    writeFileSync(file, gzipSync(JSON.stringify(charts), { level: 1 }));
  } catch {
    // See above.
  }
}

/** Read an entry, as it was written (`T`: with or without specs); throws when it is missing or damaged. */
export function readCacheEntry<T extends DrawnChart>(file: string): T[] {
  return JSON.parse(gunzipSync(readFileSync(file)).toString('utf8')) as T[];
}
