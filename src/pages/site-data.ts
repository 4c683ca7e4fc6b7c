// The data every template reads, assembled once by the build: templates lay out, they never compute.

import { hasSafetyClass } from '../model/part-facts.js';
import type { PartAnalysis } from '../analysis/part-figures.js';
import type { Library } from '../model/library.js';
import type { PartKind } from '../model/part.js';
import { formatEng, formatPercent } from '../units/format.js';
import { kindPlural } from '../present/kinds.js';
import { modelCaption } from '../present/model-words.js';
import { ratingText, sweepText } from '../present/part-words.js';
import { VERSION } from '../version.js';
import { MAINS_LEGEND, mainsMark, type MainsMark } from '../present/mains.js';
import type { ComparisonIndex } from './comparison-index.js';
import { KIND_ORDER, partFamilies, type PartFamily } from './families.js';
import type { ListedPart } from './listed-part.js';
import type { PartList } from './part-list.js';
import { partPageText, type PartPageText } from './part-page.js';
import { SWEEP_CSV_DIGITS } from './spec-download.js';
import { schematicSvg } from './schematic.js';
import type { PlanPageData } from './plan-page.js';
import type { ReviewPageData } from './review-page.js';
import type { MeasurementPageData } from './measurement-page.js';

/** A chart as a page shows it: inline SVG, caption, and the file its vega-lite spec is written to. */
export interface ChartOnPage {
  key: string;
  title: string;
  description: string;
  svg: string;
  /** Relative to the page's folder. */
  specFile: string;
  /** A part chart's shared spec, from the site's top (spec-download.ts); other charts' specs are at `specFile`. */
  specPath?: string;
}

export interface PartPageData {
  id: string;
  kind: PartKind;
  title: string;
  notes?: string;
  package: string;
  ratingText: string;
  /** The index's mark of a mains (safety-class) part. */
  mainsMark?: MainsMark;
  tagsText: string;
  searchText: string;
  text: PartPageText;
  /** Numbers the index sorts by (SI units; empty string where there is none). */
  sort: { nominal: number | ''; rating: number | ''; srf: number | ''; band: number | '' };
  srfImpedanceText: string;
  schematic: string;
  modelCaption: string;
  charts: ChartOnPage[];
  sourceFile: string;
  sourceHash: string;
  sweepText: string;
  /** The model for simulators, beside the page. */
  modelFiles: { touchstone: string; spice: string };
  /** The part against each of its measurements (filled in by the build; empty without measurements). */
  measurements: MeasurementPageData[];
  /** Site-relative path of the part's PDF datasheet, when PDFs are built. */
  pdfFile?: string;
}

export interface ComparisonPageData {
  slug: string;
  title: string;
  description?: string;
  automatic: boolean;
  selection: string;
  sourceFile?: string;
  parts: ListedPart[];
  chart?: ChartOnPage;
  /** An automatic comparison's place among the part families (families.ts). */
  family?: { kind: PartKind; packageText: string; valuesText: string; subsetText: string };
}

/** The site's data; the comparison lists the index pages show come from comparison-index.ts. */
export interface FolioData extends ComparisonIndex {
  title: string;
  owner?: string;
  version: string;
  /** folio.yaml's notice line, shown under the index title. */
  notice?: string;
  sweepText: string;
  /** Significant digits of the values in each part's sweep.csv. */
  sweepCsvDigits: number;
  withinText: string;
  kindCounts: { kind: PartKind; label: string; count: number }[];
  /** The index's legend for mains marks, when the library holds a mains part. */
  mainsLegend?: string;
  /** Whether the site has rail plans and reviews (the masthead links to their lists); known before they are analysed. */
  hasPlans: boolean;
  hasReviews: boolean;
  /** Every part, as the pages that list parts show it. */
  parts: ListedPart[];
  /** The parts index in pages (part-list.ts). */
  partList: PartList;
  /** The parts whose pages this build renders (all but those carried over from the last build). */
  partPages: PartPageData[];
  comparisons: ComparisonPageData[];
  /** The comparisons whose pages this build renders (all but those carried over). */
  comparisonPages: ComparisonPageData[];
  /** The index pages this build renders (all but those carried over). */
  indexPages: PartList['pages'];
  plans: PlanPageData[];
  reviews: ReviewPageData[];
}

/** The model files beside a part's page, named for the part so a download keeps its name. */
export function modelFileNames(id: string): { touchstone: string; spice: string } {
  return { touchstone: `${id}.s1p`, spice: `${id}.subckt` };
}

export function partPageData(a: PartAnalysis, charts: ChartOnPage[]): PartPageData {
  const { part } = a;
  const text = partPageText(a);
  const rating = part.voltageV ?? part.voltageAcV ?? part.currentA ?? part.powerW;
  return {
    id: part.id,
    kind: part.kind,
    title: part.title,
    notes: part.notes,
    package: part.package ?? '',
    ratingText: ratingText(part),
    mainsMark: mainsMark(part),
    tagsText: part.tags.join(', '),
    searchText: [part.id, part.title, part.kind, part.package ?? '', part.dielectric ?? '', ...(part.safetyClass ? ['mains', part.safetyClass] : []), ...part.tags].join(' ').toLowerCase(),
    text,
    sort: {
      nominal: part.nominal ?? '',
      rating: rating ?? '',
      srf: a.selfResonance?.frequencyHz ?? '',
      band: a.usableBand ? a.usableBand.toHz : '',
    },
    srfImpedanceText: a.selfResonance ? formatEng(a.selfResonance.impedanceOhm, 'resistance') : '—',
    schematic: schematicSvg(part.network, `Model of ${part.id}`),
    modelCaption: modelCaption(part.kind, part.network),
    charts,
    sourceFile: part.source.path,
    sourceHash: part.source.hash,
    sweepText: sweepText(a.sweep),
    modelFiles: modelFileNames(part.id),
    measurements: [],
  };
}

/** The automatic comparisons: the library's part families, each one chart of at most FAMILY_SIZE parts. */
export function automaticComparisons(library: Library): PartFamily[] {
  return partFamilies(library.parts);
}

export function kindCounts(library: Library): FolioData['kindCounts'] {
  const counts = new Map<PartKind, number>();
  for (const { kind } of library.parts) counts.set(kind, (counts.get(kind) ?? 0) + 1);
  return KIND_ORDER.filter((kind) => counts.has(kind)).map((kind) => ({ kind, label: kindPlural(kind), count: counts.get(kind)! }));
}

/** What every page may read of the site besides its own data: known once the library is read. */
export type FolioHeader = Omit<FolioData, 'parts' | 'partList' | 'partPages' | 'comparisons' | 'comparisonPages' | 'indexPages' | 'plans' | 'reviews' | keyof ComparisonIndex>;

/** What the header reads of every part (kinds counted, a mains part looked for), once a library. */
const partSummaries = new WeakMap<Library, Pick<FolioHeader, 'kindCounts' | 'mainsLegend'>>();

function partSummary(library: Library): Pick<FolioHeader, 'kindCounts' | 'mainsLegend'> {
  let found = partSummaries.get(library);
  if (!found) partSummaries.set(library, (found = { kindCounts: kindCounts(library), mainsLegend: library.parts.some(hasSafetyClass) ? MAINS_LEGEND : undefined }));
  return found;
}

export function folioHeader(library: Library): FolioHeader {
  const s = library.settings;
  const { kindCounts, mainsLegend } = partSummary(library);
  return {
    title: s.title,
    owner: s.owner,
    notice: s.notice,
    version: VERSION,
    sweepText: sweepText(s.sweep),
    sweepCsvDigits: SWEEP_CSV_DIGITS,
    withinText: formatPercent(s.within),
    kindCounts: kindCounts.map((k) => ({ ...k })),
    mainsLegend,
    hasPlans: library.plans.length > 0,
    hasReviews: library.reviews.length > 0,
  };
}
