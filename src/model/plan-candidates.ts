// Which library capacitors a suggestion may place on a plan's rail, and at which mountings: the library's
// rules (ratings, derating, safety classes, DC-bias tables, mounting resolution) applied before the search.
// The search itself (src/analysis/plan-suggest.ts) weighs what it is given and knows none of these rules.
//
// Each candidate is weighed with the mounting it will be printed with: the mounting of the plan entries
// that name its part (one candidate per distinct mounting), else the part's default on this rail (the part
// file's own, the plan's package table, the rail's; plan.ts defaultMounting).

import type { Diagnostic } from './diagnostics.js';
import type { Part } from './part.js';
import { beyondBiasTable, defaultMounting, voltageStress, type Mounting, type Plan } from './plan.js';
import { formatEng } from '../units/format.js';

export interface CandidateRules {
  /** Keep only parts with one of these ids or tags (every capacitor when empty). A part named here is a
   *  candidate even with a safety class or a DC-bias table that ends below the rail voltage. */
  only: readonly string[];
  /** settings.derating: parts whose rating × derating is below the rail voltage are left out. */
  derating: number;
  /** Let parts with a safety class (X/Y, IEC 60384-14) be candidates without naming them in `only`. */
  allowSafetyClass?: boolean;
  /** Let parts whose DC-bias table ends below the rail voltage be candidates without naming them. */
  allowBiasExtrapolation?: boolean;
}

export type SkipReason = 'over-rating' | 'above-derating' | 'safety-class' | 'beyond-bias-table';

export interface SkippedPart {
  partId: string;
  reason: SkipReason;
  /** For 'safety-class': the class (X2, Y1 ...). */
  safetyClass?: string;
  /** For 'beyond-bias-table': the last voltage of the part's DC-bias table, V. */
  tableEndV?: number;
}

/** A part at one mounting, as the planner weighs it and as it will be printed. */
export interface SuggestCandidate extends Mounting {
  part: Part;
  /** The part id, with the mounting when the plan places the part at more than one. */
  label: string;
  /** The warning a plan placing this part carries (its DC-bias table ends below the rail), at the part's id. */
  warning?: Diagnostic;
}

/** The candidates of one plan, and what the rules left out. */
export interface CandidateSelection {
  /** The capacitors that may be placed, in library order. */
  parts: Part[];
  /** Each of them at each mounting it is weighed at. */
  candidates: SuggestCandidate[];
  skipped: SkippedPart[];
}

/** Whether `only` names the part: by id, or by one of its tags. */
function named(part: Part, only: readonly string[]): boolean {
  return only.includes(part.id) || part.tags.some((t) => only.includes(t));
}

/**
 * Capacitor parts usable as candidates on this plan's rail, in library order, and those left out and why.
 * A part whose rating the rail exceeds, or whose derating limit it exceeds, is never a candidate. A part
 * with a safety class (a mains part) or whose DC-bias table ends below the rail voltage (its capacitance
 * there would be a guess) is one only when `only` names it or the matching allow flag is set.
 */
export function candidateParts(plan: Plan, parts: readonly Part[], rules: CandidateRules): { parts: Part[]; skipped: SkippedPart[] } {
  const chosen: Part[] = [];
  const skipped: SkippedPart[] = [];
  for (const part of parts) {
    if (part.behavesAs !== 'capacitor' || part.nominal === undefined) continue;
    const isNamed = rules.only.length > 0 && named(part, rules.only);
    if (rules.only.length > 0 && !isNamed) continue;
    const stress = voltageStress(part, plan.voltageV, rules.derating);
    const tableEnd = part.dcBias.length > 0 ? part.dcBias[part.dcBias.length - 1].voltageV : undefined;
    if (stress === 'over-rating' || stress === 'above-derating') skipped.push({ partId: part.id, reason: stress });
    else if (part.safetyClass && !isNamed && !rules.allowSafetyClass) skipped.push({ partId: part.id, reason: 'safety-class', safetyClass: part.safetyClass });
    else if (tableEnd !== undefined && plan.voltageV > tableEnd && !isNamed && !rules.allowBiasExtrapolation) skipped.push({ partId: part.id, reason: 'beyond-bias-table', tableEndV: tableEnd });
    else chosen.push(part);
  }
  return { parts: chosen, skipped };
}

/** Items of `only` that are neither the id nor a tag of any capacitor, and the tags capacitors do carry. */
export function unknownSelection(parts: readonly Part[], only: readonly string[]): { unknown: string[]; tags: string[] } {
  const capacitors = parts.filter((p) => p.behavesAs === 'capacitor' && p.nominal !== undefined);
  const tags = [...new Set(capacitors.flatMap((p) => p.tags))].sort();
  const ids = new Set(capacitors.map((p) => p.id));
  return { unknown: only.filter((item) => !ids.has(item) && !tags.includes(item)), tags };
}

/** Each part at the mountings the plan's entries give it, else at its default mounting on this rail. */
export function candidateMountings(plan: Plan, parts: readonly Part[]): SuggestCandidate[] {
  const out: SuggestCandidate[] = [];
  for (const part of parts) {
    const mountings: Mounting[] = [];
    for (const p of plan.placements) {
      if (p.part.id === part.id && !mountings.some((m) => m.mountingH === p.mountingH)) mountings.push({ mountingH: p.mountingH, mountingFrom: p.mountingFrom });
    }
    if (mountings.length === 0) mountings.push(defaultMounting(plan, part));
    const message = beyondBiasTable(part, plan.voltageV);
    const warning: Diagnostic | undefined = message ? { ...part.at, severity: 'warning', message } : undefined;
    for (const m of mountings) out.push({ part, ...m, label: mountings.length > 1 ? `${part.id} at ${formatEng(m.mountingH, 'H')}` : part.id, ...(warning ? { warning } : {}) });
  }
  return out;
}

/** The candidates a suggestion for `plan` weighs, by the library's rules. */
export function selectCandidates(plan: Plan, parts: readonly Part[], rules: CandidateRules): CandidateSelection {
  const { parts: chosen, skipped } = candidateParts(plan, parts, rules);
  return { parts: chosen, candidates: candidateMountings(plan, chosen), skipped };
}
