// Suggesting the capacitors for a plan: the library's capacitors as candidates (by tag, within their
// voltage derating), the plan's regulator and plane kept, and the planner's optimal counts analysed like
// any plan. The capacitors the plan already lists are replaced, not added to.

import type { Part } from '../model/part.js';
import { voltageStress, type Placement, type Plan } from '../model/plan.js';
import { analysePlan, fixedBranches, placedModel, planSweep, planTargetOhm, type PlanFigures } from './plan-figures.js';
import { planDecoupling, type PlannerResult } from './planner.js';

export interface SuggestOptions {
  /** Each candidate is placed 0..maxCount times. */
  maxCount: number;
  /** Keep only parts carrying at least one of these tags (all capacitors when empty). */
  onlyTags: readonly string[];
  /** settings.derating: parts whose rating × derating is below the rail voltage are left out. */
  derating: number;
  perDecade: number;
  nodeLimit?: number;
}

export interface SkippedPart {
  partId: string;
  reason: 'over-rating' | 'above-derating';
}

export interface Suggestion {
  /** Fewest placements, or lowest total cost when every candidate states a cost. */
  objective: 'count' | 'cost';
  candidateIds: string[];
  /** Candidates placed without a voltage check (they state no rating). */
  unratedIds: string[];
  skipped: SkippedPart[];
  status: PlannerResult['status'];
  nodes: number;
  /** Frequencies between sweep points the search had to add (refined peaks that broke the target). */
  cutsHz: number[];
  placements: Placement[];
  /** The plan with the suggested placements, analysed in full; null when no set was found. */
  figures: PlanFigures | null;
}

/** Capacitor parts usable as candidates on this plan's rail, in library order. */
export function candidateParts(plan: Plan, parts: readonly Part[], options: Pick<SuggestOptions, 'onlyTags' | 'derating'>): { parts: Part[]; skipped: SkippedPart[] } {
  const chosen: Part[] = [];
  const skipped: SkippedPart[] = [];
  for (const part of parts) {
    if (part.behavesAs !== 'capacitor' || part.nominal === undefined) continue;
    if (options.onlyTags.length > 0 && !part.tags.some((t) => options.onlyTags.includes(t))) continue;
    const stress = voltageStress(part, plan.voltageV, options.derating);
    if (stress === 'over-rating' || stress === 'above-derating') skipped.push({ partId: part.id, reason: stress });
    else chosen.push(part);
  }
  return { parts: chosen, skipped };
}

export function suggestPlacements(plan: Plan, parts: readonly Part[], options: SuggestOptions): Suggestion {
  const { parts: candidates, skipped } = candidateParts(plan, parts, options);
  const objective = candidates.length > 0 && candidates.every((p) => p.cost !== undefined) ? 'cost' : 'count';
  const result = planDecoupling({
    fixed: fixedBranches(plan),
    candidates: candidates.map((part) => ({ label: part.id, element: placedModel(part, plan.voltageV, plan.mountingH).element, weight: part.cost ?? 1 })),
    targetOhm: planTargetOhm(plan.voltageV, plan.target),
    frequencies: planSweep(plan, options.perDecade),
    maxCount: options.maxCount,
    objective,
    nodeLimit: options.nodeLimit,
  });
  const placements: Placement[] = [];
  result.counts?.forEach((count, i) => {
    if (count > 0) placements.push({ part: candidates[i], count, mountingH: plan.mountingH, at: plan.at });
  });
  return {
    objective,
    candidateIds: candidates.map((p) => p.id),
    unratedIds: candidates.filter((p) => p.voltageV === undefined).map((p) => p.id),
    skipped,
    status: result.status,
    nodes: result.nodes,
    cutsHz: result.cuts,
    placements,
    figures: result.counts ? analysePlan(plan, options.perDecade, placements) : null,
  };
}
