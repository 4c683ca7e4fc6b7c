// What a review page and its pack show: the review's facts and decisions (short markdown, rendered inert),
// the sheets of everything it covers, the cautions that apply to them, and every source file with its hash.

import { sha256Hex } from '../model/sha256.js';
import { reviewSlug } from '../present/slugs.js';
import type { LibraryRevision } from '../history/library-revision.js';
import type { LibraryReview, Library } from '../model/library.js';
import type { ComparisonPageData, PartPageData } from './site-data.js';
import type { PlanPageData } from './plan-page.js';
import type { ChangesData } from './changes-page.js';
import { markdownBlock, markdownInline } from './markdown.js';
import { groupedCautions, type GroupedCaution } from '../present/cautions.js';
import { comparisonKey } from '../model/comparison.js';
import { acceptedFailureText, acceptedFailures, reviewStatements } from '../model/review-consistency.js';
import { railVerdicts } from '../analysis/review-checks.js';

export interface ReviewPageData {
  slug: string;
  title: string;
  date: string;
  board: string;
  sourceFile: string;
  reviewers: { name: string; role: string }[];
  summaryHtml: string;
  /** Warnings about the summary, shown beside it (e.g. it accepts a rail that fails its target). */
  summaryWarnings: string[];
  /** Each decision as inline HTML, with the warnings shown beside it. */
  decisions: { html: string; warnings: string[] }[];
  /** Each covered rail's verdict, stated beside the decisions and on the pack's cover. */
  railVerdicts: {
    rail: string;
    slug: string;
    pass: boolean;
    verdict: string;
    loadStep: { pass: boolean; status: string; verdict: string } | null;
    /** The rail at its corners: passes or not, and the worst corner. */
    corners: { pass: boolean; status: string; verdict: string } | null;
  }[];
  openPoints: { html: string; owner: string; due: string }[];
  coverText: string;
  parts: PartPageData[];
  comparisons: ComparisonPageData[];
  plans: PlanPageData[];
  /** Pack sections after the contents page, in order, with the ids the pack template gives them. */
  sections: { id: string; title: string }[];
  /** Each caution once, with the parts it applies to. */
  cautions: GroupedCaution[];
  sources: { file: string; hash: string }[];
  /** One hash over every source file listed (their paths and hashes), so the cover can name the library's state. */
  contentHash: string;
  /** The git revision of those files, when the library is in git (set by the build). */
  revision?: LibraryRevision;
  /** Site-relative path of the pack PDF, when PDFs are built. */
  pdfFile?: string;
  /** What changed since the revision the review names in `since:` (set by the build). */
  changes?: ChangesData;
}

/** The parts a review draws on: its own, and those of its comparisons and plans. */
function involvedParts(review: LibraryReview) {
  return [...new Set([...review.parts, ...review.comparisons.flatMap((c) => c.parts), ...review.plans.flatMap((p) => p.placements.map((x) => x.part))])];
}

/**
 * The files a review's pack is made from, by path, with their hashes: the review, folio.yaml, and every part,
 * comparison and plan it draws on. Its appendix lists them, and its cover states their content hash and git revision.
 */
export function reviewSources(review: LibraryReview, library: Library): { file: string; hash: string }[] {
  const files = new Map<string, string>();
  const add = (file: string, hash: string) => files.set(file, hash);
  add(review.source.path, review.source.hash);
  const folio = library.sources.find((s) => s.path === 'folio.yaml');
  if (folio) add(folio.path, folio.hash);
  for (const p of involvedParts(review)) add(p.source.path, p.source.hash);
  for (const c of review.comparisons) add(c.source.path, c.source.hash);
  for (const p of review.plans) add(p.source.path, p.source.hash);
  return [...files].map(([file, hash]) => ({ file, hash })).sort((a, b) => (a.file < b.file ? -1 : 1));
}

function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

export function reviewPageData(
  review: LibraryReview,
  library: Library,
  pages: { parts: ReadonlyMap<string, PartPageData>; comparisons: ReadonlyMap<string, ComparisonPageData>; plans: ReadonlyMap<string, PlanPageData> },
): ReviewPageData {
  const parts = review.parts.map((p) => pages.parts.get(p.id)!);
  const comparisons = review.comparisons.map((c) => pages.comparisons.get(comparisonKey(c))!);
  const plans = review.plans.map((p) => pages.plans.get(p.rail)!);

  const sections = [
    { id: 'pack-decisions', title: 'Decisions and open points' },
    ...plans.map((p, i) => ({ id: `pack-plan-${i + 1}`, title: `Rail plan ${p.rail}` })),
    ...comparisons.map((c, i) => ({ id: `pack-comparison-${i + 1}`, title: `Comparison: ${c.title}` })),
    ...parts.map((p, i) => ({ id: `pack-part-${i + 1}`, title: `${p.id} — ${p.title}` })),
    { id: 'pack-cautions', title: 'Cautions' },
    { id: 'pack-sources', title: 'Appendix: source files' },
  ];

  // Every part the review draws on, directly or through a plan or comparison, brings its cautions.
  const cautions = groupedCautions(involvedParts(review));

  // Statements that accept a rail failing its target, shown beside the statement (and warned by check/build).
  const statements = reviewStatements(review);
  const failures = acceptedFailures(statements, railVerdicts(library), review.plans.map((p) => p.rail));
  const warningsOf = (statement: number, what: string) => (statement < 0 ? [] : failures.filter((f) => f.statement === statement).map((f) => `${what} ${acceptedFailureText(f.verdict)}.`));

  const covered = [
    plans.length ? count(plans.length, 'rail plan', 'rail plans') : '',
    comparisons.length ? count(comparisons.length, 'comparison', 'comparisons') : '',
    parts.length ? count(parts.length, 'part', 'parts') : '',
  ].filter(Boolean);

  const sources = reviewSources(review, library);
  return {
    slug: reviewSlug(review),
    title: review.title,
    date: review.date,
    board: review.board,
    sourceFile: review.source.path,
    reviewers: review.reviewers.map((r) => ({ name: r.name, role: r.role ?? '' })),
    summaryHtml: review.summary ? markdownBlock(review.summary) : '',
    summaryWarnings: warningsOf(statements.findIndex((st) => st.at === review.summaryAt), 'The summary'),
    decisions: review.decisions.map((d, i) => ({ html: markdownInline(d), warnings: warningsOf(statements.findIndex((st) => st.at === review.decisionsAt[i]), 'This decision') })),
    railVerdicts: plans.map((p) => ({ rail: p.rail, slug: p.slug, pass: p.pass, verdict: p.verdict, loadStep: p.loadStep ? { pass: p.loadStep.pass, status: p.loadStep.status, verdict: p.loadStep.verdict } : null, corners: p.corners ? { pass: p.corners.pass, status: p.corners.status, verdict: p.corners.verdict } : null })),
    openPoints: review.openPoints.map((o) => ({ html: markdownInline(o.text), owner: o.owner ?? '', due: o.due ?? '' })),
    coverText: covered.join(', '),
    parts,
    comparisons,
    plans,
    sections,
    cautions,
    sources,
    contentHash: sha256Hex(sources.map((x) => `${x.hash}  ${x.file}\n`).join('')).slice(0, 16),
  };
}
