// Everything zfolio states about a rail plan, as plain JSON-ready data in SI units: the target, |Z| of the
// rail and of each branch over the band, the peaks, the worst margin, the DC-bias derating of each part and
// the plan's warnings. `zfolio plan` prints it; a plan page lays it out.

import type { Element } from '../circuit/element.js';
import { logSweep } from '../circuit/sweep.js';
import type { Diagnostic } from '../model/diagnostics.js';
import type { Part } from '../model/part.js';
import type { MountingSource, Placement, Plan, PlanTarget } from '../model/plan.js';
import { biasFraction, scaleCapacitance, type BiasedCapacitance } from './dc-bias.js';
import { analyseLoadStep, type LoadStepFigures } from './load-step.js';
import { evaluateRail, placementElement, planeElement, regulatorElement, targetImpedance, type BranchKind, type RailBranch } from './rail.js';
import type { TemperatureRange } from '../model/spread.js';
import { cornerFigures, type CornerFigures } from './plan-corners.js';

export interface PlacedModel {
  /** One placement: the part at its biased capacitance, in series with the mounting inductance. */
  element: Element;
  bias: BiasedCapacitance;
  /** Capacitance at the rail voltage, F. */
  capacitanceF: number;
}

// Placement models are shared between analyses of the same part at the same bias and mounting, so their
// compiled sweep kernels are too.
const placedModels = new WeakMap<Element, Map<string, Element>>();

/** A part as placed on a rail at `voltageV` with mounting inductance `mountingH`. */
export function placedModel(part: Part, voltageV: number, mountingH: number): PlacedModel {
  const bias = biasFraction(part.dcBias, voltageV);
  let byKey = placedModels.get(part.network);
  if (!byKey) {
    byKey = new Map();
    placedModels.set(part.network, byKey);
  }
  const key = `${bias.fraction}/${mountingH}`;
  let element = byKey.get(key);
  if (!element) {
    element = placementElement(scaleCapacitance(part.network, bias.fraction), mountingH);
    byKey.set(key, element);
  }
  return { element, bias, capacitanceF: (part.nominal ?? NaN) * bias.fraction };
}

export function planTargetOhm(voltageV: number, target: PlanTarget): number {
  return target.kind === 'explicit' ? target.ohms : targetImpedance(voltageV, target.ripple, target.stepA);
}

/** The plan's sweep: the library's points per decade, over the plan's band. */
export function planSweep(plan: Plan, perDecade: number): Float64Array {
  return logSweep({ fromHz: plan.band.fromHz, toHz: plan.band.toHz, perDecade });
}

/** The branches that are the same whatever capacitors are placed: regulator and plane. */
export function fixedBranches(plan: Plan): RailBranch[] {
  const out: RailBranch[] = [];
  if (plan.regulator) out.push({ kind: 'regulator', label: 'regulator', element: regulatorElement(plan.regulator.rOhm, plan.regulator.lH), count: 1 });
  if (plan.plane) out.push({ kind: 'plane', label: 'plane', element: planeElement(plan.plane.cF, plan.plane.rOhm), count: 1 });
  return out;
}

export interface PlacementFigures {
  partId: string;
  title: string;
  /** The part's package, as its file writes it. */
  package: string | null;
  count: number;
  mountingH: number;
  /** Where the mounting comes from: the entry, the part file, the plan's package table or the rail default. */
  mountingFrom: MountingSource;
  nominalF: number;
  /** Capacitance at the rail voltage, F. */
  capacitanceF: number;
  /** capacitanceF / nominalF. */
  biasFraction: number;
  /** The capacitance comes from the part's DC-bias table (false: nominal, the part has no table). */
  biasFromTable: boolean;
  /** The rail voltage lies above the table's last point; that point's fraction was held (an extrapolation). */
  biasExtrapolated: boolean;
  /** The last voltage of the part's DC-bias table, V (null without a table). */
  biasTableEndV: number | null;
  voltageRatingV: number | null;
  cost: number | null;
}

export interface BranchFigures {
  kind: BranchKind;
  label: string;
  partId: string | null;
  count: number;
  /** |Z| of the branch (all its placements together) at each frequency, Ω. */
  impedanceOhm: number[];
}

export interface PeakFigures {
  frequencyHz: number;
  impedanceOhm: number;
  marginDb: number;
  /** Labels of the branches whose susceptances cancel there (the capacitive and the inductive side). */
  capacitiveBranch: string | null;
  inductiveBranch: string | null;
  /** |I_branch / I_load| per branch, in branch order. */
  currentRatio: number[];
}

export interface PlanFigures {
  rail: string;
  title: string;
  file: string;
  voltageV: number;
  targetOhm: number;
  target: PlanTarget;
  band: { fromHz: number; toHz: number };
  perDecade: number;
  /** The plan's default mounting inductance per placement, H. */
  mountingH: number;
  /** The plan's mounting inductance by package, H. */
  mountingByPackage: Readonly<Record<string, number>>;
  regulator: { rOhm: number | null; lH: number | null } | null;
  plane: { cF: number; rOhm: number | null } | null;
  pass: boolean;
  worstMarginDb: number;
  worstFrequencyHz: number;
  worstImpedanceOhm: number;
  peaks: PeakFigures[];
  placements: PlacementFigures[];
  /** Ids of parts whose capacitance at the rail voltage comes from their DC-bias table. */
  biasDerated: string[];
  totalPlacements: number;
  /** Sum of count × cost when every placed part has a cost, else null. */
  totalCost: number | null;
  frequenciesHz: number[];
  impedanceOhm: number[];
  branches: BranchFigures[];
  /** The load step against the ripple budget (load-step.ts); null when the plan gives no step or no branch. */
  transient: LoadStepFigures | null;
  /** The rail at the corners of its parts' spreads (plan-corners.ts); null when not asked for. */
  corners: CornerFigures | null;
  warnings: Diagnostic[];
}

/** The rail's branches for `placements` (which may differ from the plan's own, e.g. a suggested set). */
export function railBranches(plan: Plan, placements: readonly Placement[]): { branches: RailBranch[]; figures: PlacementFigures[] } {
  const branches = fixedBranches(plan);
  const figures: PlacementFigures[] = [];
  for (const p of placements) {
    const placed = placedModel(p.part, plan.voltageV, p.mountingH);
    branches.push({ kind: 'capacitor', label: `${p.count} × ${p.part.id}`, element: placed.element, count: p.count });
    figures.push({
      partId: p.part.id,
      title: p.part.title,
      package: p.part.package ?? null,
      count: p.count,
      mountingH: p.mountingH,
      mountingFrom: p.mountingFrom,
      nominalF: p.part.nominal ?? NaN,
      capacitanceF: placed.capacitanceF,
      biasFraction: placed.bias.fraction,
      biasFromTable: placed.bias.fromTable,
      biasExtrapolated: placed.bias.extrapolated,
      biasTableEndV: placed.bias.tableEndV,
      voltageRatingV: p.part.voltageV ?? null,
      cost: p.part.cost ?? null,
    });
  }
  return { branches, figures };
}

export interface AnalyseOptions {
  /** Compute the load step (default true); callers that read only the impedance verdict skip it. */
  loadStep?: boolean;
  /** The library's operating temperatures: evaluate the rail at its corners too (the plan may narrow them). */
  operating?: TemperatureRange;
}

/**
 * Analyse a plan (or the plan with other `placements`) over its band at `perDecade` points per decade.
 * `warnings` are the plan's own unless other placements bring theirs.
 */
export function analysePlan(
  plan: Plan,
  perDecade: number,
  placements: readonly Placement[] = plan.placements,
  warnings: readonly Diagnostic[] = plan.warnings,
  options: AnalyseOptions = {},
): PlanFigures {
  const targetOhm = planTargetOhm(plan.voltageV, plan.target);
  const frequencies = planSweep(plan, perDecade);
  const { branches, figures } = railBranches(plan, placements);
  const result = evaluateRail(branches, targetOhm, frequencies);
  const labelOf = (i: number | null) => (i === null ? null : branches[i].label);
  const costs = figures.map((f) => f.cost);
  return {
    rail: plan.rail,
    title: plan.title,
    file: plan.source.path,
    voltageV: plan.voltageV,
    targetOhm,
    target: plan.target,
    band: { ...plan.band },
    perDecade,
    mountingH: plan.mountingH,
    mountingByPackage: { ...plan.mountingByPackage },
    regulator: plan.regulator ? { rOhm: plan.regulator.rOhm ?? null, lH: plan.regulator.lH ?? null } : null,
    plane: plan.plane ? { cF: plan.plane.cF, rOhm: plan.plane.rOhm ?? null } : null,
    pass: result.pass,
    worstMarginDb: result.worst.marginDb,
    worstFrequencyHz: result.worst.frequencyHz,
    worstImpedanceOhm: result.worst.impedanceOhm,
    peaks: result.peaks.map((p) => ({
      frequencyHz: p.frequencyHz,
      impedanceOhm: p.impedanceOhm,
      marginDb: p.marginDb,
      capacitiveBranch: labelOf(p.capacitiveBranch),
      inductiveBranch: labelOf(p.inductiveBranch),
      currentRatio: p.currentRatio,
    })),
    placements: figures,
    biasDerated: [...new Set(figures.filter((f) => f.biasFromTable).map((f) => f.partId))],
    totalPlacements: figures.reduce((n, f) => n + f.count, 0),
    totalCost: costs.every((c) => c !== null) ? figures.reduce((sum, f) => sum + f.count * (f.cost ?? 0), 0) : null,
    frequenciesHz: Array.from(frequencies),
    impedanceOhm: Array.from(result.magnitude),
    branches: branches.map((b, i) => ({
      kind: b.kind,
      label: b.label,
      partId: b.kind === 'capacitor' ? figures[i - (branches.length - figures.length)].partId : null,
      count: b.count,
      impedanceOhm: Array.from(result.branchMagnitude[i]),
    })),
    transient: options.loadStep === false ? null : analyseLoadStep(plan, branches),
    corners: options.operating ? cornerFigures(plan, placements, options.operating, targetOhm, frequencies, result) : null,
    warnings: [...warnings],
  };
}

/** Every figure of a plan except the curves (SI units): what `zfolio plan --json` prints and pages offer. */
export function planFiguresWithoutCurves(f: PlanFigures): Record<string, unknown> {
  const out: Record<string, unknown> = { ...f };
  delete out.frequenciesHz;
  delete out.impedanceOhm;
  out.branches = f.branches.map((b) => ({ kind: b.kind, label: b.label, partId: b.partId, count: b.count }));
  if (f.corners) {
    const corners: Record<string, unknown> = { ...f.corners };
    delete corners.envelope;
    out.corners = corners;
  }
  if (f.transient) {
    const transient: Record<string, unknown> = { ...f.transient };
    delete transient.curves;
    out.transient = transient;
  }
  return out;
}
