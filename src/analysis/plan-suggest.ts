// Suggesting the capacitors for a plan: the candidates the library's rules allow (src/model/plan-candidates.ts:
// by id or tag, within their voltage derating, mains parts and parts used above their DC-bias table only when
// asked for, each at the mounting it will be printed with), the plan's regulator and plane kept, and the
// planner's optimal counts analysed like any plan. The capacitors the plan already lists are replaced, not
// added to. When no set meets the target, the closest set found is analysed instead, so the answer says how
// far off the rail is.

import type { Diagnostic } from '../model/diagnostics.js';
import type { CandidateSelection, SkippedPart, SuggestCandidate } from '../model/plan-candidates.js';
import type { Placement, Plan } from '../model/plan.js';
import { analysePlan, fixedBranches, placedModel, planSweep, planTargetOhm, type PlanFigures } from './plan-figures.js';
import { closestSet } from './planner-closest.js';
import { planDecoupling, type PlannerProblem, type PlannerResult } from './planner.js';
import { planAtCorners, type CornerRounds } from './plan-suggest-corners.js';
import type { TemperatureRange } from '../model/spread.js';

export interface SuggestOptions {
  /** Each candidate is placed 0..maxCount times. */
  maxCount: number;
  /** Margin required under the target, dB (default 0): the search holds |Z| ≤ Z_t·10^(−margin/20). */
  marginDb?: number;
  perDecade: number;
  nodeLimit?: number;
  /** Plan for the worst corner of the chosen parts' spreads over these temperatures (plan-suggest-corners.ts). */
  corners?: TemperatureRange;
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
  /** When no set was found: the set that came closest (best found by local search, not proven best), in full but for its load step (transient null). */
  closest: { placements: Placement[]; figures: PlanFigures } | null;
  /** Planning for the worst corner (--corners): the rounds it took and why they stopped; null otherwise. */
  cornerRounds: CornerRounds | null;
}

/** Warnings about suggested placements (a rail above a part's DC-bias table), once per part, at its id. */
function placementWarnings(candidates: readonly SuggestCandidate[], placements: readonly Placement[]): Diagnostic[] {
  const out: Diagnostic[] = [];
  for (const part of new Set(placements.map((p) => p.part))) {
    const warning = candidates.find((c) => c.part === part)?.warning;
    if (warning) out.push(warning);
  }
  return out;
}

/** The best set of `selection`'s candidates for `plan` (selectCandidates in src/model/plan-candidates.ts). */
export function suggestPlacements(plan: Plan, selection: CandidateSelection, options: SuggestOptions): Suggestion {
  const { parts: chosen, candidates, skipped } = selection;
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
  const placementsOf = (counts: readonly number[]): Placement[] =>
    counts.flatMap((count, i) => {
      const c = candidates[i];
      return count > 0 ? [{ part: c.part, count, mountingH: c.mountingH, mountingFrom: c.mountingFrom, at: plan.at }] : [];
    });
  const atCorners = options.corners ? planAtCorners(plan, candidates, problem, options.corners, marginDb, options.perDecade, placementsOf) : null;
  // A set that holds at nominal but not at its corners (the rounds stopped first) is no answer to --corners,
  // and nothing was proven about the sets that would hold.
  const stopped = atCorners !== null && (atCorners.rounds.stop === 'repeat' || atCorners.rounds.stop === 'rounds');
  const result = atCorners ? { ...atCorners.result, ...(stopped ? { counts: null, status: 'unproven' as const } : {}) } : planDecoupling(problem);
  const analysed = (placements: Placement[], loadStep = true) =>
    analysePlan(plan, options.perDecade, placements, placementWarnings(candidates, placements), { loadStep, ...(options.corners ? { operating: options.corners } : {}) });
  const placements = result.counts ? placementsOf(result.counts) : [];
  let closest: Suggestion['closest'] = null;
  if (!result.counts) {
    // At corners, the set the last round chose holds at nominal and is the one to show; else the local search's.
    const near = atCorners?.result.counts ? placementsOf(atCorners.result.counts) : placementsOf(closestSet(problem).counts);
    // The closest set misses the target, so its load step is not asked for (transient: null): on a rail of
    // hundreds of distinct parts the poles of that network would cost many times the search itself.
    closest = { placements: near, figures: analysed(near, false) };
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
    cornerRounds: atCorners?.rounds ?? null,
  };
}
