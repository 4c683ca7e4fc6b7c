// What the build record keeps of a part between builds: the fields the pages that list parts show
// (ListedPart), and, for a part a review shows, its whole page data (so the review pack can be rendered
// without analysing it again). Kept only when JSON gives it back exactly (finite numbers, no -0).

import type { CarriedPart, RecordedPage } from './assemble.js';
import { listedPart, type ListedPart } from '../pages/listed-part.js';
import type { PartPageData } from '../pages/site-data.js';

interface PartData {
  listed: ListedPart;
  page?: RecordedPage;
}

/** True when JSON keeps the value as it is. */
function faithful(value: unknown): boolean {
  let ok = true;
  JSON.stringify(value, (_key, v: unknown) => {
    if (typeof v === 'number' && (!Number.isFinite(v) || Object.is(v, -0))) ok = false;
    return v;
  });
  return ok;
}

/** A part's page data as a build records it for the next: all but its charts, PDF link and measurements. */
function recordedPage(page: PartPageData): RecordedPage {
  const { charts: _charts, pdfFile: _pdfFile, measurements: _measurements, ...rest } = page;
  return rest;
}

/** The carried part for what the record holds of it. */
export function carriedPart(recorded: unknown): CarriedPart {
  const data = recorded as Partial<PartData> | undefined;
  return data && typeof data === 'object' ? { listed: data.listed, page: data.page } : {};
}

/**
 * What to record of a part: the record's own data when it still serves (the same object, so its shard is
 * not written again), else made from its page data; undefined when JSON cannot keep it.
 */
export function partData(page: ListedPart | PartPageData, reviewed: boolean, recorded: unknown): unknown {
  const last = recorded as Partial<PartData> | undefined;
  if (last?.listed && (!reviewed || last.page)) return last;
  const data: PartData = { listed: listedPart(page) };
  if (reviewed && 'charts' in page) data.page = recordedPage(page);
  return faithful(data) ? data : undefined;
}
