// Planning for the worst corner (`plan --suggest --corners`): the fewest placements (or the lowest cost)
// that hold the target, with the margin asked for, at nominal and at every corner of the chosen parts'
// spreads (plan-corners.ts evaluates the corners).
//
// By scenarios: plan with the scenarios found so far, evaluate the chosen set at its corners, and when its
// worst corner misses, add that corner as a scenario — every candidate at an end of its spread: the chosen
// parts as at the worst corner, the others at their low value and high parasitics (any ends would do) — and
// plan again. Restricted to the parts a set places, a scenario is one of that set's own corners, so a set
// that misses in a scenario misses at a corner: the scenarios rule out only sets that had to go. Hence the
// set returned holds at every corner evaluated, and when the last search is proven, no set with fewer
// placements (or a lower cost) holds at all of its corners. With more than 10 moving quantities the corners
// evaluated are a sample (rail-corners.ts), and the set is known to hold at those.

import type { SuggestCandidate } from '../model/plan-candidates.js';
import type { Placement, Plan } from '../model/plan.js';
import type { TemperatureRange } from '../model/spread.js';
import { cornerElement, cornerFigures, type CornerFigures } from './plan-corners.js';
import { spreadFactors } from './part-spread.js';
import { planSweep, planTargetOhm } from './plan-figures.js';
import { planDecoupling, type PlannerProblem, type PlannerResult, type PlannerScenario } from './planner.js';

/** Planner runs at most; each adds a corner the previous set missed at. */
export const MAX_CORNER_ROUNDS = 24;

export interface CornerRounds {
  /** Planner runs. */
  rounds: number;
  /** Corners added as scenarios. */
  scenarios: number;
  /** Why planning stopped: the set holds at its corners; no set meets the scenarios (or the budget ran out
   *  first); the worst corner was one already planned for (the planner's and the corners' peak searches
   *  disagree by rounding); or the rounds ran out. */
  stop: 'held' | 'no-set' | 'repeat' | 'rounds';
  /** The chosen set at its corners, as its last evaluation found them; null without a set. */
  corners: CornerFigures | null;
}

/** The corner as a scenario: every candidate's model at its end (see the header). */
function scenarioOf(plan: Plan, problem: PlannerProblem, candidates: readonly SuggestCandidate[], temperature: TemperatureRange, worst: CornerFigures): { key: string; scenario: PlannerScenario } {
  const sides: string[] = [];
  const elements = candidates.map((c) => {
    const factors = spreadFactors(c.part, temperature);
    const high = factors.map((f) => {
      const side = f.quantity === 'value' ? worst.extremes[c.part.id] : worst.parasiticExtremes[c.part.id]?.[f.quantity];
      return side === undefined ? f.quantity !== 'value' : side === 'high';
    });
    sides.push(`${c.label}:${high.map((h) => (h ? 1 : 0)).join('')}`);
    return cornerElement(c.part, factors, high, plan.voltageV, c.mountingH);
  });
  // The plan's regulator and plane do not move between corners.
  return { key: sides.join(' '), scenario: { fixed: problem.fixed, elements } };
}

/**
 * The planner's answer for `problem` held at the corners of what it chooses; `placementsOf` turns counts
 * into the placements they stand for.
 */
export function planAtCorners(
  plan: Plan,
  candidates: readonly SuggestCandidate[],
  problem: PlannerProblem,
  /** The library's operating temperatures (a plan's own narrow them, as for its corners). */
  temperature: TemperatureRange,
  marginDb: number,
  perDecade: number,
  placementsOf: (counts: readonly number[]) => Placement[],
): { result: PlannerResult; rounds: CornerRounds } {
  const scenarios: PlannerScenario[] = [];
  const seen = new Set<string>();
  const frequencies = planSweep(plan, perDecade);
  const targetOhm = planTargetOhm(plan.voltageV, plan.target);
  let nodes = 0;
  for (let round = 1; ; round++) {
    const result = planDecoupling({ ...problem, scenarios });
    nodes += result.nodes;
    const done = (stop: CornerRounds['stop'], corners: CornerFigures | null) => ({ result: { ...result, nodes }, rounds: { rounds: round, scenarios: scenarios.length, stop, corners } });
    if (!result.counts || !result.evaluation) return done('no-set', null);
    const corners = cornerFigures(plan, placementsOf(result.counts), temperature, targetOhm, frequencies, result.evaluation);
    // No placed part moves: the corners are the nominal rail, which the planner holds to the margin.
    if (corners.method === 'none' || corners.worstMarginDb >= marginDb) return done('held', corners);
    if (round >= MAX_CORNER_ROUNDS) return done('rounds', corners);
    const { key, scenario } = scenarioOf(plan, problem, candidates, plan.temperature ?? temperature, corners);
    if (seen.has(key)) return done('repeat', corners);
    seen.add(key);
    scenarios.push(scenario);
  }
}
