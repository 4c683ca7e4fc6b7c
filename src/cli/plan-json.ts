// What `zfolio plan --json` prints: every figure of a plan, or of a suggestion, in SI units.

import { planFiguresWithoutCurves } from '../analysis/plan-figures.js';
import type { Suggestion } from '../analysis/plan-suggest.js';
import type { Plan } from '../model/plan.js';
import { capacitorsYaml } from '../present/plan-yaml.js';

/** The JSON form: every figure of the plan except the curves (SI units). */
export const planJson = planFiguresWithoutCurves;

/** The JSON form of a suggestion (SI units). */
export function suggestionJson(plan: Plan, s: Suggestion): Record<string, unknown> {
  return {
    rail: plan.rail,
    objective: s.objective,
    status: s.status,
    proven: s.status !== 'unproven',
    nodes: s.nodes,
    cutsHz: s.cutsHz,
    candidates: s.candidateIds,
    skipped: s.skipped,
    unrated: s.unratedIds,
    candidateMountings: s.candidates.map((c) => ({ partId: c.part.id, mountingH: c.mountingH, mountingFrom: c.mountingFrom })),
    placements: s.placements.map((p) => ({ partId: p.part.id, count: p.count, mountingH: p.mountingH, mountingFrom: p.mountingFrom })),
    /** The chosen capacitors as plan YAML, exactly as the human form prints them (without its indent). */
    yaml: s.figures ? capacitorsYaml(s.placements).join('\n') + '\n' : null,
    plan: s.figures ? planJson(s.figures) : null,
    marginDb: s.marginDb,
    /** Planning for the worst corner (--corners): searches run, corners added, why it stopped; null without. */
    cornerRounds: s.cornerRounds ? { rounds: s.cornerRounds.rounds, scenarios: s.cornerRounds.scenarios, stop: s.cornerRounds.stop } : null,
    /** When no set was found: the closest set found by local search (not proven closest), analysed in full. */
    closest: s.closest
      ? {
          placements: s.closest.placements.map((p) => ({ partId: p.part.id, count: p.count, mountingH: p.mountingH, mountingFrom: p.mountingFrom })),
          worstMarginDb: s.closest.figures.worstMarginDb,
          worstFrequencyHz: s.closest.figures.worstFrequencyHz,
          plan: planJson(s.closest.figures),
        }
      : null,
  };
}
