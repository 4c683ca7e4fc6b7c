// Does a review say it accepts a rail that fails its target? A decision ("Accept VCC_5V as placed") or the
// summary on the pack's cover that accepts a failing rail is a warning at the place it is written: the
// people signing the pack should not sign a PASS the analysis does not give.
//
// The reading is deliberately plain: each sentence or clause that names a rail and uses a word of
// acceptance (accept, approve, sign off, release, pass, meets, as placed/drawn, no change needed, ...) is an
// acceptance, unless it also negates, conditions or defers it (not, reject, rework, fails, until, unless,
// once, after, if, pending, would, will, proposed, trial) or says it waives the failure (waive, waiver,
// despite, although, deviation).

import { formatDecibels, formatEng } from '../units/format.js';
import type { Diagnostic, SourcePosition } from './diagnostics.js';

/** A rail's verdict, as its plan page states it. */
export interface RailVerdict {
  rail: string;
  /** The nominal impedance verdict: |Z| under the target over the band. */
  pass: boolean;
  worstMarginDb: number;
  worstFrequencyHz: number;
  /** The plan file, for the message. */
  file: string;
  /** The load-step verdict, when the plan gives a step (pass false also when the response has no verdict). */
  loadStep?: { pass: boolean; resolved: boolean; excursionV: number; budgetV: number } | null;
  /** The impedance verdict at the rail's corners, when its parts state a spread. */
  corners?: { pass: boolean; worstMarginDb: number; worstFrequencyHz: number; evaluated: number } | null;
}

/** The rail fails something a reviewer signs: its target at nominal or at a corner, or its load step. */
export function railFails(v: RailVerdict): boolean {
  return !v.pass || v.loadStep?.pass === false || v.corners?.pass === false;
}

/** Text a review states, with where it is written and what to call it in a message. */
export interface ReviewStatement {
  text: string;
  at: SourcePosition;
  /** "decisions[2]", "summary". */
  label: string;
}

const ACCEPTING =
  /\b(accept(s|ed|able)?|approv(e|es|ed|al)|sign(s|ed)?[ -]?off|releas(e|es|ed)|pass(es|ed)?|meets?|as (placed|drawn|designed|built|laid out|is)|no (change|action|rework)s?( (is |are )?(needed|required))?|ok|okay|good|fine|adequate|sufficient)\b/i;
// Negations, conditions, and the future or hypothetical ("would pass with the new set").
const NEGATING =
  /\b(not|never|no longer|reject(s|ed)?|rework(s|ed)?|redesign(s|ed)?|fail(s|ed|ing)?|fix(es|ed)?|until|unless|once|after|pending|if|provided|subject to|instead|would|could|should|will|proposed|trial)\b|n't\b/i;
const WAIVING = /\b(waive[sd]?|waiver|despite|although|though|deviation|exception)\b/i;

/** Markdown emphasis and code marks out; clauses split at sentence ends, semicolons and ", but"/", while". */
export function clauses(text: string): string[] {
  const plain = text.replace(/[*`]+/g, ' ');
  return plain
    .split(/(?<=[.!?])\s+|;\s*|\n+|,?\s+(?:but|while|whereas)\s+/i)
    .map((c) => c.trim())
    .filter(Boolean);
}

// "both rails", "all the rails", "every rail plan": the rails the review covers.
const COLLECTIVE = /\b(all|both|every|each)\b( of)?( the)?( \w+)? (rails?|plans?|rail plans?)\b/i;

/**
 * The rails a clause names (case ignored, whole names only), in the order they appear; a collective
 * ("both rails") names every rail in `covered`.
 */
function railsNamed(clause: string, rails: readonly string[], covered: readonly string[]): string[] {
  const found = rails
    .map((rail) => ({ rail, at: clause.search(new RegExp(`(?<![A-Za-z0-9_.-])${rail.replace(/[.*+?^${}()|[\]\\-]/g, '\\$&')}(?![A-Za-z0-9_-])`, 'i')) }))
    .filter((r) => r.at >= 0);
  const collective = clause.search(COLLECTIVE);
  if (collective >= 0) for (const rail of covered) if (rails.includes(rail) && !found.some((r) => r.rail === rail)) found.push({ rail, at: collective });
  return found.sort((a, b) => a.at - b.at).map((r) => r.rail);
}

/** The rails (of `rails`) a statement accepts, in the order they are first named; see railsNamed for `covered`. */
export function railsAccepted(text: string, rails: readonly string[], covered: readonly string[] = []): string[] {
  const out: string[] = [];
  for (const clause of clauses(text)) {
    const named = railsNamed(clause, rails, covered);
    if (named.length === 0 || !ACCEPTING.test(clause)) continue;
    // "no change needed" accepts; the "change" in it must not read as a negation.
    const rest = clause.replace(new RegExp(ACCEPTING.source, 'gi'), ' ');
    if (NEGATING.test(rest) || WAIVING.test(clause)) continue;
    for (const rail of named) if (!out.includes(rail)) out.push(rail);
  }
  return out;
}

/** A statement that accepts a failing rail: which statement, which rail, and the warning to report. */
export interface AcceptedFailure {
  /** Index into the statements given. */
  statement: number;
  verdict: RailVerdict;
  warning: Diagnostic;
}

/** Every statement that accepts a failing rail, one entry per rail it accepts; `covered`: the review's rails. */
export function acceptedFailures(statements: readonly ReviewStatement[], verdicts: ReadonlyMap<string, RailVerdict>, covered: readonly string[] = []): AcceptedFailure[] {
  const failing = [...verdicts.values()].filter(railFails);
  if (failing.length === 0) return [];
  const out: AcceptedFailure[] = [];
  statements.forEach((s, statement) => {
    for (const rail of railsAccepted(s.text, failing.map((v) => v.rail), covered)) {
      const verdict = verdicts.get(rail)!;
      out.push({ statement, verdict, warning: { ...s.at, severity: 'warning', message: `${s.label}: ${acceptedFailureText(verdict)}; record the fix, or say that the failure is waived and why` } });
    }
  });
  return out;
}

/**
 * "accepts VCC_5V, which fails its target (worst margin −6.93 dB at 1.2 MHz, plans/vcc-5v.yaml)"; each
 * failing verdict is named: the target at nominal, the target at a corner, the load step.
 */
export function acceptedFailureText(v: RailVerdict): string {
  const what: string[] = [];
  if (!v.pass) what.push(`its target (worst margin ${formatDecibels(v.worstMarginDb)} at ${formatEng(v.worstFrequencyHz, 'Hz')}`);
  if (v.corners && !v.corners.pass) {
    const at = `worst margin ${formatDecibels(v.corners.worstMarginDb)} at ${formatEng(v.corners.worstFrequencyHz, 'Hz')} over ${v.corners.evaluated} corners`;
    what.push(v.pass ? `its target at a corner (${at}` : `also at a corner (${at}`);
  }
  if (v.loadStep && !v.loadStep.pass) {
    what.push(
      v.loadStep.resolved
        ? `its load step (the rail moves by up to ${formatEng(v.loadStep.excursionV, 'V')} against a budget of ${formatEng(v.loadStep.budgetV, 'V')}`
        : `its load step (no verdict: the rail's response could not be computed to the method's accuracy`,
    );
  }
  return `accepts ${v.rail}, which fails ${what.join('), ')}, ${v.file})`;
}

/** What a review states that a reader signs: its title, its summary (on the pack's cover) and its decisions. */
export function reviewStatements(review: { summary?: string; summaryAt?: SourcePosition; decisions: readonly string[]; decisionsAt: readonly SourcePosition[] }): ReviewStatement[] {
  const out: ReviewStatement[] = [];
  if (review.summary !== undefined && review.summaryAt) out.push({ text: review.summary, at: review.summaryAt, label: 'summary (on the pack\'s cover)' });
  review.decisions.forEach((text, i) => {
    const at = review.decisionsAt[i];
    if (at) out.push({ text, at, label: `decisions[${i}]` });
  });
  return out;
}

/**
 * A warning at each decision or cover summary that accepts a failing rail, in review order. `verdicts` is
 * asked for (the plans analysed, src/analysis/review-checks.ts) only when there is a review to check.
 */
export function reviewWarnings(
  reviews: readonly { summary?: string; summaryAt?: SourcePosition; decisions: readonly string[]; decisionsAt: readonly SourcePosition[]; plans: readonly { rail: string }[] }[],
  verdicts: () => ReadonlyMap<string, RailVerdict>,
): Diagnostic[] {
  if (reviews.length === 0) return [];
  const known = verdicts();
  return reviews.flatMap((review) => acceptedFailures(reviewStatements(review), known, review.plans.map((p) => p.rail)).map((f) => f.warning));
}
