// Keys of the pages that show many parts, so that a rebuild renders only those that show what changed.
// A page's key hashes what its template reads: the site key (code, templates, settings), the page's own
// fields, and each part it lists by the part's key (which fixes every figure the part's row shows). A
// template that starts reading more of the site's data must have it added here, as reuse.ts says of part
// pages; test/build/carry-over.test.ts compares a rebuild after an edit with a cold build, byte for byte.

import { sha256Hex } from '../model/sha256.js';
import { join } from 'node:path';
import type { ComparisonPageData, FolioData } from '../pages/site-data.js';
import type { ListedPart } from '../pages/listed-part.js';
import { indexRowChunks, indexRowScript } from '../pages/part-list.js';

type PartKeyOf = (id: string) => string;

const hash = (...parts: string[]) => sha256Hex(parts.join('\n')).slice(0, 32);

const keyLine = (id: string, partKey: PartKeyOf) => `${id} ${partKey(id)}`;
const idKeys = (ids: readonly string[], partKey: PartKeyOf) => ids.map((id) => keyLine(id, partKey)).join('\n');
const listedKeys = (parts: readonly ListedPart[], partKey: PartKeyOf) => parts.map((p) => keyLine(p.id, partKey)).join('\n');

/**
 * A comparison folder's key: its fields and its parts by id (the chart is drawn from the same parts and
 * title). Made from the ids, as the page's parts may not all be listed yet (assemble.ts).
 */
export function comparisonPageKey(site: string, fields: Omit<ComparisonPageData, 'chart' | 'parts'>, partIds: readonly string[], partKey: PartKeyOf): string {
  return hash('comparison', site, JSON.stringify(fields), idKeys(partIds, partKey));
}

/** Charts and their specs are made from data the keys already cover; they are left out of a page's key. */
const withoutCharts = (key: string, value: unknown) => (key === 'svg' || key === 'spec' ? undefined : value);

/**
 * What every index page shows besides its own rows: the header, the list's pages and scripts, the
 * comparisons (with their parts by id), plans, reviews and the changes line.
 */
export function indexGlobals(folio: FolioData & { changes?: unknown }): string {
  const byIds = ({ chart: _chart, ...c }: ComparisonPageData) => ({ ...c, parts: c.parts.map((p) => p.id) });
  const { parts, partList, partPages: _p, comparisons: _c, comparisonPages: _cp, indexPages: _ip, authoredComparisons, familyKinds, ...rest } = folio;
  return JSON.stringify(
    {
      ...rest,
      parts: parts.length,
      partList: { ...partList, pages: partList.pages.map(({ parts: rows, ...page }) => ({ ...page, rows: rows.length })) },
      authoredComparisons: authoredComparisons.map(byIds),
      familyKinds: familyKinds.map((k) => ({ ...k, families: k.families.map(byIds) })),
    },
    withoutCharts,
  );
}

/**
 * Decide which index pages and row scripts to make again: the index pages to render are left in
 * `folio.indexPages`, and the row scripts to write are written into `siteDir`. Returns how many of each.
 */
export function listPages(folio: FolioData, site: string, partKey: PartKeyOf, kept: (unit: string, key: string) => boolean, siteDir: string, write: (path: string, text: string) => void): number {
  const globals = hash('index', site, indexGlobals(folio));
  folio.indexPages = folio.partList.pages.filter((page) => {
    const { parts, ...fields } = page;
    return !kept(page.file, hash(globals, JSON.stringify(fields), listedKeys(parts, partKey)));
  });
  let scripts = 0;
  for (const [file, rows] of indexRowChunks(folio.partList)) {
    const key = hash('rows', site, file, String(folio.partList.chunks.length), listedKeys(rows, partKey));
    if (kept(file, key)) continue;
    write(join(siteDir, file), indexRowScript(folio.partList, file, rows));
    scripts++;
  }
  return folio.indexPages.length + scripts;
}
