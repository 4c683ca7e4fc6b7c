// A rail plan's load step: the plan's step current ramped over its rise time, the rail's voltage deviation
// and its branches' currents in time (transient.ts), and the verdict against the ripple budget — as plain
// JSON-ready data in SI units, beside (not instead of) the impedance verdict.

import type { Plan, PlanTarget } from '../model/plan.js';
import type { RailBranch } from './rail.js';
import { railTransient, riseForBandwidth, transientCurves } from './transient.js';

export interface LoadStepCurves {
  /** Times after the step begins, s (log-spaced from a tenth of the rise time, with the marked points). */
  timesS: number[];
  /** The rail's deviation from its DC value at each time, V. */
  voltageV: number[];
  /** Each branch's share of the load current (i_branch/ΔI) at each time, in branch order. */
  shares: number[][];
}

export interface LoadStepFigures {
  stepA: number;
  riseS: number;
  /** The rise time is the plan's `rise`, or 0.35/band.to (common practice). */
  riseFrom: 'plan' | 'band';
  durationS: number;
  /** The plan's `duration`, or from the rail's slowest significant pole. */
  durationFrom: 'plan' | 'poles';
  /** Depth of the deepest dip below the DC value, V (≥ 0). */
  droopV: number;
  /** When it is deepest, s after the step begins. */
  atS: number;
  /** Highest rise above the DC value, V (a release of the load dips this far), and when. */
  overshootV: number;
  overshootAtS: number | null;
  /** Last time |v − v_final| exceeds 10% of its largest value, s; null when the rail does not settle. */
  settleS: number | null;
  /** Final deviation −R_dc·ΔI, V; null without a DC path. */
  finalV: number | null;
  /** The rail has a DC path (a regulator) whose offset stays below the rail voltage. */
  dcPath: boolean;
  /** Allowed excursion, V: V × ripple, or target × step for an explicit target. */
  budgetV: number;
  budgetFrom: 'ripple' | 'target';
  /** The rail settles and its largest excursion either way, max(droop, overshoot), is within the budget. */
  pass: boolean;
  /** Largest relative error of the partial-fraction fit of Z(jω) (a check on the method). */
  fitError: number;
  /**
   * The response was computed to the method's accuracy (fit within 1e-6, no growing pole). When false —
   * element values so far apart that the rail's poles cannot be found accurately — there is no verdict
   * (pass is false) and no curves.
   */
  resolved: boolean;
  curves: LoadStepCurves;
}

/** Points of the drawn curves. */
export const CURVE_POINTS = 600;

/** The ripple budget: V × ripple when the plan gives ripple and step, else target × step; null without a step. */
export function rippleBudget(voltageV: number, target: PlanTarget): { budgetV: number; from: 'ripple' | 'target' } | null {
  if (target.kind === 'ripple') return { budgetV: voltageV * target.ripple, from: 'ripple' };
  return target.stepA === undefined ? null : { budgetV: target.ohms * target.stepA, from: 'target' };
}

type LoadStepPlan = Pick<Plan, 'voltageV' | 'target' | 'band' | 'riseS' | 'durationS'>;

/** The load step of a plan on `branches`; null when the plan gives no step or nothing is on the rail. */
export function analyseLoadStep(plan: LoadStepPlan, branches: readonly RailBranch[]): LoadStepFigures | null {
  const budget = rippleBudget(plan.voltageV, plan.target);
  const stepA = plan.target.stepA;
  if (!budget || stepA === undefined || branches.length === 0) return null;
  const riseS = plan.riseS ?? riseForBandwidth(plan.band.toHz);
  const t = railTransient(branches, { stepA, riseS, durationS: plan.durationS, range: plan.band, collapseV: plan.voltageV });
  const marked = [t.droopAtS, t.overshootAtS, t.settleS, riseS].filter((x): x is number => x !== null && x > 0);
  const timesS = curveTimes(riseS / 10, t.durationS, marked);
  const { voltage, shares } = t.resolved ? transientCurves(t, timesS) : { voltage: new Float64Array(0), shares: [] };
  return {
    stepA,
    riseS,
    riseFrom: plan.riseS === undefined ? 'band' : 'plan',
    durationS: t.durationS,
    durationFrom: plan.durationS === undefined ? 'poles' : 'plan',
    droopV: t.droopV,
    atS: t.droopAtS,
    overshootV: t.overshootV,
    overshootAtS: t.overshootAtS,
    settleS: t.settleS,
    finalV: t.finalV,
    dcPath: t.dcPath,
    budgetV: budget.budgetV,
    budgetFrom: budget.from,
    pass: t.resolved && t.dcPath && Math.max(t.droopV, t.overshootV) <= budget.budgetV,
    fitError: t.fitError,
    resolved: t.resolved,
    curves: t.resolved ? { timesS, voltageV: Array.from(voltage), shares: shares.map((s) => Array.from(s)) } : { timesS: [], voltageV: [], shares: [] },
  };
}

/** Log-spaced times over [from, to] with the marked times inserted (each once). */
function curveTimes(from: number, to: number, marked: readonly number[]): number[] {
  const end = Math.max(to, from * 10);
  const out: number[] = [];
  for (let i = 0; i < CURVE_POINTS; i++) out.push(from * (end / from) ** (i / (CURVE_POINTS - 1)));
  out[CURVE_POINTS - 1] = end;
  for (const m of marked) if (m >= from && m <= end) out.push(m);
  return [...new Set(out)].sort((a, b) => a - b);
}
