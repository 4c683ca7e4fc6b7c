// Suggesting the capacitors for a plan: the library's capacitors as candidates (by id or tag, within their
// voltage derating; mains parts and parts used above their DC-bias table only when asked for), the plan's
// regulator and plane kept, and the planner's optimal counts analysed like any plan. The capacitors the plan
// already lists are replaced, not added to. When no set meets the target, the closest set found is
// analysed instead, so the answer says how far off the rail is.
//
// Each candidate is evaluated with the mounting it will be printed with: the mounting of the plan entries
// that name its part (one candidate per distinct mounting), else the part's default on this rail (the part
// file's own, the plan's package table, the rail's; model/plan.ts defaultMounting).

import type { Diagnostic } from '../model/diagnostics.js';
import type { Part } from '../model/part.js';
import { beyondBiasTable, defaultMounting, voltageStress, type Mounting, type Placement, type Plan } from '../model/plan.js';
import { formatEng } from '../units/format.js';
import { analysePlan, fixedBranches, placedModel, planSweep, planTargetOhm, type PlanFigures } from './plan-figures.js';
import { closestSet } from './planner-closest.js';
import { planDecoupling, type PlannerProblem, type PlannerResult } from './planner.js';

export interface SuggestOptions {
  /** Each candidate is placed 0..maxCount times. */
  maxCount: number;
  /** Keep only parts with one of these ids or tags (every capacitor when empty). A part named here is a
   *  candidate even with a safety class or a DC-bias table that ends below the rail voltage. */
  only: readonly string[];
  /** Let parts with a safety class (X/Y, IEC 60384-14) be candidates without naming them in `only`. */
  allowSafetyClass?: boolean;
  /** Let parts whose DC-bias table ends below the rail voltage be candidates without naming them. */
  allowBiasExtrapolation?: boolean;
  /** Margin required under the target, dB (default 0): the search holds |Z| ≤ Z_t·10^(−margin/20). */
  marginDb?: number;
  /** settings.derating: parts whose rating × derating is below the rail voltage are left out. */
  derating: number;
  perDecade: number;
  nodeLimit?: number;
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
}

export interface Suggestion {
  /** Fewest placements, or lowest total cost when every candidate states a cost. */
  objective: 'count' | 'cost';
  candidateIds: string[];
  candidates: SuggestCandidate[];
  /** Candidates placed without a voltage check (they state no rating). */
  unratedIds: string[];
  skipped: SkippedPart[];
  status: PlannerResult['status'];
  nodes: number;
  /** Frequencies between sweep points the search had to add (refined peaks that broke the target). */
  cutsHz: number[];
  /** Margin required under the target, dB. */
  marginDb: number;
  placements: Placement[];
  /** The plan with the suggested placements, analysed in full; null when no set was found. */
  figures: PlanFigures | null;
  /** When no set was found: the set that came closest (best found by local search, not proven best), in full. */
  closest: { placements: Placement[]; figures: PlanFigures } | null;
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
export function candidateParts(plan: Plan, parts: readonly Part[], options: Pick<SuggestOptions, 'only' | 'derating' | 'allowSafetyClass' | 'allowBiasExtrapolation'>): { parts: Part[]; skipped: SkippedPart[] } {
  const chosen: Part[] = [];
  const skipped: SkippedPart[] = [];
  for (const part of parts) {
    if (part.behavesAs !== 'capacitor' || part.nominal === undefined) continue;
    const isNamed = options.only.length > 0 && named(part, options.only);
    if (options.only.length > 0 && !isNamed) continue;
    const stress = voltageStress(part, plan.voltageV, options.derating);
    const tableEnd = part.dcBias.length > 0 ? part.dcBias[part.dcBias.length - 1].voltageV : undefined;
    if (stress === 'over-rating' || stress === 'above-derating') skipped.push({ partId: part.id, reason: stress });
    else if (part.safetyClass && !isNamed && !options.allowSafetyClass) skipped.push({ partId: part.id, reason: 'safety-class', safetyClass: part.safetyClass });
    else if (tableEnd !== undefined && plan.voltageV > tableEnd && !isNamed && !options.allowBiasExtrapolation) skipped.push({ partId: part.id, reason: 'beyond-bias-table', tableEndV: tableEnd });
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
    for (const m of mountings) out.push({ part, ...m, label: mountings.length > 1 ? `${part.id} at ${formatEng(m.mountingH, 'H')}` : part.id });
  }
  return out;
}

/** Warnings about suggested placements (a rail above a part's DC-bias table), at the part's id. */
function placementWarnings(plan: Plan, placements: readonly Placement[]): Diagnostic[] {
  const out: Diagnostic[] = [];
  for (const part of new Set(placements.map((p) => p.part))) {
    const message = beyondBiasTable(part, plan.voltageV);
    if (message) out.push({ ...part.at, severity: 'warning', message });
  }
  return out;
}

export function suggestPlacements(plan: Plan, parts: readonly Part[], options: SuggestOptions): Suggestion {
  const { parts: chosen, skipped } = candidateParts(plan, parts, options);
  const candidates = candidateMountings(plan, chosen);
  const objective = chosen.length > 0 && chosen.every((p) => p.cost !== undefined) ? 'cost' : 'count';
  const marginDb = options.marginDb ?? 0;
  const problem: PlannerProblem = {
    fixed: fixedBranches(plan),
    candidates: candidates.map((c) => ({ label: c.label, element: placedModel(c.part, plan.voltageV, c.mountingH).element, weight: c.part.cost ?? 1 })),
    // The margin is required under the target: the search holds |Z| at or under the lowered target.
    targetOhm: planTargetOhm(plan.voltageV, plan.target) * 10 ** (-marginDb / 20),
    frequencies: planSweep(plan, options.perDecade),
    maxCount: options.maxCount,
    objective,
    nodeLimit: options.nodeLimit,
  };
  const result = planDecoupling(problem);
  const placementsOf = (counts: readonly number[]): Placement[] =>
    counts.flatMap((count, i) => {
      const c = candidates[i];
      return count > 0 ? [{ part: c.part, count, mountingH: c.mountingH, mountingFrom: c.mountingFrom, at: plan.at }] : [];
    });
  const analysed = (placements: Placement[]) => analysePlan(plan, options.perDecade, placements, placementWarnings(plan, placements));
  const placements = result.counts ? placementsOf(result.counts) : [];
  let closest: Suggestion['closest'] = null;
  if (!result.counts) {
    const near = placementsOf(closestSet(problem).counts);
    closest = { placements: near, figures: analysed(near) };
  }
  return {
    objective,
    candidateIds: chosen.map((p) => p.id),
    candidates,
    unratedIds: chosen.filter((p) => p.voltageV === undefined).map((p) => p.id),
    skipped,
    status: result.status,
    nodes: result.nodes,
    cutsHz: result.cuts,
    marginDb,
    placements,
    figures: result.counts ? analysed(placements) : null,
    closest,
  };
}
