// reviews/*.yaml: a design review — what it covers and what it decided. Each becomes a review page and a
// review pack PDF.
//
//   title: DL-3 main board, power integrity review
//   date: 2026-11-24
//   board: DL-3 main board, rev B
//   reviewers: [{name: A. Person, role: power}, ...]
//   covers: {parts: [ID, ...], comparisons: [file-stem, ...], plans: [RAIL, ...]}
//   decisions: ["text (short markdown)", ...]
//   open-points: [{text: ..., owner: ..., due: 2026-12-05}, ...]
//   since: v1.2          # optional: the git revision signed at the previous review; the page and pack
//                        # then say what changed since it

import { isSeq, type Node, type YAMLSeq } from 'yaml';
import { Fields, describeNode, missingTarget, scalarText, type ReadContext } from './fields.js';
import type { Part } from './part.js';
import { positionOf, type SourceFile } from './source.js';
import { quote, type SourcePosition } from './diagnostics.js';

export interface Reviewer {
  name: string;
  role?: string;
}

export interface OpenPoint {
  text: string;
  owner?: string;
  due?: string;
}

/** What a review may name, each by its own handle. */
export interface ReviewTargets<C, P> {
  parts: ReadonlyMap<string, Part>;
  /** By file stem: comparisons/decoupling-0402.yaml is "decoupling-0402". */
  comparisons: ReadonlyMap<string, C>;
  /** By rail name. */
  plans: ReadonlyMap<string, P>;
}

export interface Review<C, P> {
  title: string;
  /** ISO date, YYYY-MM-DD. */
  date: string;
  board: string;
  reviewers: Reviewer[];
  parts: Part[];
  comparisons: C[];
  plans: P[];
  decisions: string[];
  /** Where each decision is written, in the order of `decisions`. */
  decisionsAt: SourcePosition[];
  openPoints: OpenPoint[];
  summary?: string;
  /** Where the summary (shown on the pack's cover) is written. */
  summaryAt?: SourcePosition;
  /** The git revision of the previous review (a tag, a branch, a hash), as written; resolved by the build. */
  since?: string;
  sinceAt?: SourcePosition;
  source: SourceFile;
  at: SourcePosition;
}

const SINCE_PATTERN = /^(?!-)[^\s\u0000-\u001f\u007f]{1,200}$/;

const ISO_DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

export function readReview<C, P>(ctx: ReadContext, targets: ReviewTargets<C, P>): Review<C, P> | undefined {
  const before = ctx.diagnostics.errorCount;
  const root = Fields.of(ctx, ctx.source.document.contents as Node | null, '');
  if (!root) return undefined;
  root.expect(['title', 'date', 'board', 'reviewers', 'summary', 'covers', 'decisions', 'open-points', 'since'], ['title', 'date', 'board', 'covers']);
  const title = root.text('title');
  const date = readDate(root, 'date');
  const board = root.text('board');
  const summary = root.text('summary');
  // A revision name as git takes it: no spaces, no control characters, not an option.
  const since = root.text('since', { pattern: SINCE_PATTERN, patternHint: 'a git revision such as v1.2, a branch, HEAD~3 or a commit hash' });

  const reviewers = readEntries(ctx, root, 'reviewers', ['name', 'role'], (name, fields) => ({ name, role: fields?.text('role') }));

  const covers = root.map('covers');
  const pick = <T>(field: 'parts' | 'comparisons' | 'plans', map: ReadonlyMap<string, T>, what: string): T[] => {
    if (!covers?.has(field)) return [];
    const out: T[] = [];
    for (const item of covers.seq(field)?.items ?? []) {
      const key = scalarText(item as Node);
      const at = positionOf(ctx.source, item as Node);
      if (key === undefined) {
        ctx.diagnostics.error(at, `covers.${field}: expected ${what}, found ${describeNode(item as Node)}`);
        continue;
      }
      const target = map.get(key);
      if (target === undefined) {
        ctx.diagnostics.error(at, `covers.${field}: ${missingTarget(ctx, field, what, key, map.keys())}`);
        continue;
      }
      out.push(target);
    }
    return out;
  };
  covers?.expect(['parts', 'comparisons', 'plans']);
  const beforeCovers = ctx.diagnostics.errorCount;
  const parts = pick('parts', targets.parts, 'part with id');
  const comparisons = pick('comparisons', targets.comparisons, 'comparison file');
  const plans = pick('plans', targets.plans, 'rail plan');
  if (covers && parts.length + comparisons.length + plans.length === 0 && ctx.diagnostics.errorCount === beforeCovers) {
    covers.error(undefined, 'covers: a review must cover at least one part, comparison or rail plan');
  }

  const decisions = root.textList('decisions');
  const decisionNodes = root.has('decisions') ? (isSeq(root.valueNode('decisions')) ? (root.valueNode('decisions') as YAMLSeq<Node>).items : [root.valueNode('decisions')]) : [];
  const decisionsAt = decisionNodes.map((node) => positionOf(ctx.source, node as Node));
  const openPoints = readEntries(ctx, root, 'open-points', ['text', 'owner', 'due'], (text, fields) => ({
    text,
    owner: fields?.text('owner'),
    due: fields && readDate(fields, 'due'),
  }));

  if (ctx.diagnostics.errorCount > before || !title || !date || !board) return undefined;
  const summaryAt = summary !== undefined ? root.position('summary') : undefined;
  const sinceAt = since !== undefined ? root.position('since') : undefined;
  return { title, date, board, reviewers, parts, comparisons, plans, decisions, decisionsAt, openPoints, summary, summaryAt, since, sinceAt, source: ctx.source, at: root.position() };
}

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/** A calendar date written YYYY-MM-DD (ISO 8601): the form, then that the day exists in that month and year. */
export function readDate(fields: Fields, name: string): string | undefined {
  const text = fields.text(name, { pattern: ISO_DATE, patternHint: 'a date written YYYY-MM-DD' });
  if (text === undefined) return undefined;
  const [year, month, day] = text.split('-').map(Number);
  // Gregorian calendar: a leap year is divisible by 4, except centuries not divisible by 400.
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const days = [31, leap ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
  if (day > days) {
    fields.error(name, `expected a real date, found ${quote(text)}: ${MONTHS[month - 1]} ${year} has ${days} days`);
    return undefined;
  }
  return text;
}

/**
 * A list whose entries are either a plain text (the first field alone) or a mapping of `names`, the first of
 * them required: `reviewers: [A. Person, {name: B. Person, role: layout}]`. Optional fields of a plain-text
 * entry are absent; `make` builds each entry from its first field and, for a mapping, its other fields.
 */
function readEntries<T>(ctx: ReadContext, root: Fields, list: string, names: readonly string[], make: (first: string, fields?: Fields) => T): T[] {
  const out: T[] = [];
  for (const item of root.seq(list)?.items ?? []) {
    const plain = scalarText(item as Node);
    if (plain !== undefined) {
      out.push(make(plain));
      continue;
    }
    const fields = Fields.of(ctx, item as Node, `${list}[]`);
    if (!fields) continue;
    fields.expect(names, [names[0]]);
    const first = fields.text(names[0]);
    if (first) out.push(make(first, fields));
  }
  return out;
}
