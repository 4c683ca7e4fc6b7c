// Which change moved a rail: the rail as it was, with one change applied alone. When a plan's counts and a
// placed part's ESL both changed, each is evaluated on its own against the earlier state, so a reader sees
// which of them turned the verdict.

import { analysePlan } from '../analysis/plan-figures.js';
import type { Part } from '../model/part.js';
import { defaultMounting, type Placement, type Plan } from '../model/plan.js';

// The impedance verdict is what a change is judged by here; the load step's response is not needed.
const IMPEDANCE_ONLY = { loadStep: false };

/** `placements` with each part that `swap` names replaced; mountings that came from the part are taken anew. */
export function swapParts(plan: Plan, placements: readonly Placement[], swap: (part: Part) => Part | undefined): Placement[] {
  return placements.map((p) => {
    const other = swap(p.part);
    if (!other) return p;
    const mounting = p.mountingFrom === 'entry' ? { mountingH: p.mountingH, mountingFrom: p.mountingFrom } : defaultMounting(plan, other);
    return { ...p, ...mounting, part: other };
  });
}

export interface RailState {
  plan: Plan;
  perDecade: number;
}

/** The rail before, with the part that is `after` now in place of its earlier version: the part's change alone. */
export function withPartChange(before: RailState, earlierId: string, after: Part): { pass: boolean; worstMarginDb: number } {
  const placements = swapParts(before.plan, before.plan.placements, (p) => (p.id === earlierId ? after : undefined));
  const f = analysePlan(before.plan, before.perDecade, placements, before.plan.warnings, IMPEDANCE_ONLY);
  return { pass: f.pass, worstMarginDb: f.worstMarginDb };
}

/** The plan as it is now, with every placed part as it was (`earlier` of each current id): the plan's change alone. */
export function withPlanChange(after: RailState, earlier: (part: Part) => Part | undefined, perDecade: number): { pass: boolean; worstMarginDb: number } {
  const placements = swapParts(after.plan, after.plan.placements, earlier);
  const f = analysePlan(after.plan, perDecade, placements, after.plan.warnings, IMPEDANCE_ONLY);
  return { pass: f.pass, worstMarginDb: f.worstMarginDb };
}

/** The rail before, analysed with the points per decade folio.yaml gives now: the settings' change alone. */
export function withSettingsChange(before: RailState, perDecade: number): { pass: boolean; worstMarginDb: number } {
  const f = analysePlan(before.plan, perDecade, before.plan.placements, before.plan.warnings, IMPEDANCE_ONLY);
  return { pass: f.pass, worstMarginDb: f.worstMarginDb };
}
