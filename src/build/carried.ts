// What a build carries over from the last and what it counts of its own work: the types assembling a site
// shares with the build (build.ts, carry-over.ts, part-record.ts).

import type { Part } from '../model/part.js';
import type { ListedPart } from '../pages/listed-part.js';
import type { ComparisonPageData, PartPageData } from '../pages/site-data.js';

/** A part's page data as a build records it for the next: all but its charts and its PDF link. */
export type RecordedPage = Omit<PartPageData, 'charts' | 'pdfFile' | 'measurements'>;

/** What the last build recorded of a part carried over. */
export interface CarriedPart {
  listed?: ListedPart;
  /** Its whole page data, kept for the parts a review shows. */
  page?: RecordedPage;
}

export interface UnitKeys {
  comparison(fields: Omit<ComparisonPageData, 'chart' | 'parts'>, partIds: readonly string[]): string;
  /** True when the last site's unit with this key is kept (so nothing of it is made). */
  kept(unit: string, key: string): boolean;
  /** Keep the cached chart of a comparison whose page is kept (the chart is not read). */
  keepChart?(parts: readonly Part[], title: string): void;
}

/** Counts of the work a build did, to show that a rebuild does work in proportion to what changed. */
export interface BuildWork {
  /** Part files read and parsed (the others came from the part cache, src/model/part-cache.ts). */
  filesParsed: number;
  /** Parts analysed (their sweeps evaluated and figures found). */
  partsAnalysed: number;
  /** Part folders written (downloads and page). */
  partFolders: number;
  /** Comparison folders written. */
  comparisons: number;
  /** Index pages and row scripts of the index written. */
  listFiles: number;
  /** Pages eleventy rendered. */
  pagesRendered: number;
}
