// Suggesting the capacitors for a plan: the library's capacitors as candidates (by tag, within their
// voltage derating), the plan's regulator and plane kept, and the planner's optimal counts analysed like
// any plan. The capacitors the plan already lists are replaced, not added to.
//
// Each candidate is evaluated with the mounting it will be printed with: the mounting of the plan entries
// that name its part (one candidate per distinct mounting), else the part's default on this rail (the part
// file's own, the plan's package table, the rail's; model/plan.ts defaultMounting).

import type { Diagnostic } from '../model/diagnostics.js';
import type { Part } from '../model/part.js';
import { beyondBiasTable, defaultMounting, voltageStress, type Mounting, type Placement, type Plan } from '../model/plan.js';
import { formatEng } from '../units/format.js';
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
  const result = planDecoupling({
    fixed: fixedBranches(plan),
    candidates: candidates.map((c) => ({ label: c.label, element: placedModel(c.part, plan.voltageV, c.mountingH).element, weight: c.part.cost ?? 1 })),
    targetOhm: planTargetOhm(plan.voltageV, plan.target),
    frequencies: planSweep(plan, options.perDecade),
    maxCount: options.maxCount,
    objective,
    nodeLimit: options.nodeLimit,
  });
  const placements: Placement[] = [];
  result.counts?.forEach((count, i) => {
    const c = candidates[i];
    if (count > 0) placements.push({ part: c.part, count, mountingH: c.mountingH, mountingFrom: c.mountingFrom, at: plan.at });
  });
  return {
    objective,
    candidateIds: chosen.map((p) => p.id),
    candidates,
    unratedIds: chosen.filter((p) => p.voltageV === undefined).map((p) => p.id),
    skipped,
    status: result.status,
    nodes: result.nodes,
    cutsHz: result.cuts,
    placements,
    figures: result.counts ? analysePlan(plan, options.perDecade, placements, placementWarnings(plan, placements)) : null,
  };
}
