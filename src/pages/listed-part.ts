// A part as the pages that list many parts show it: the index (its rows and row scripts) and a comparison's
// table. A build keeps this much of every part between builds (src/build/site-record.ts), so it can render
// a list page again without analysing the parts on it whose files did not change. A template that lists
// parts may read only these fields; to show another, add it here.

import type { PartPageData } from './site-data.js';

export interface ListedPart {
  id: string;
  kind: PartPageData['kind'];
  title: string;
  package: string;
  ratingText: string;
  mainsMark?: PartPageData['mainsMark'];
  tagsText: string;
  searchText: string;
  text: Pick<PartPageData['text'], 'kindLabel' | 'nominalText' | 'srfText' | 'bandText'>;
  sort: PartPageData['sort'];
  srfImpedanceText: string;
  /** For the PDF's furniture (print-jobs.ts). */
  sourceFile: string;
  sourceHash: string;
}

/** The listed fields of a part's page data (a new object: the page data is not kept alive through it). */
export function listedPart(p: ListedPart): ListedPart {
  const listed: ListedPart = {
    id: p.id,
    kind: p.kind,
    title: p.title,
    package: p.package,
    ratingText: p.ratingText,
    tagsText: p.tagsText,
    searchText: p.searchText,
    text: { kindLabel: p.text.kindLabel, nominalText: p.text.nominalText, srfText: p.text.srfText, bandText: p.text.bandText },
    sort: { ...p.sort },
    srfImpedanceText: p.srfImpedanceText,
    sourceFile: p.sourceFile,
    sourceHash: p.sourceHash,
  };
  if (p.mainsMark) listed.mainsMark = { ...p.mainsMark };
  return listed;
}
