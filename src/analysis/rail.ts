// A power rail's impedance: the regulator, the plane and every decoupling placement in parallel, checked
// against a target impedance across a band.
//
// Target impedance Z_t = V·ripple/ΔI (L. D. Smith, R. E. Anderson, D. W. Forehand, T. J. Pelc, T. Roy,
// "Power distribution system design methodology and capacitor selection for modern CMOS technology",
// IEEE Trans. Advanced Packaging 22(3), 1999). Branches add as admittances (parallel law); N identical
// placements carry N times the admittance of one, i.e. Z/N.

import { inductor, series, type Element, capacitor, resistor } from '../circuit/element.js';
import { addAdmittance, addAdmittanceSlope } from '../circuit/admittance.js';
import { impedanceSweepInto } from '../circuit/impedance.js';
import { admittanceSlope, impedanceSlopeAt, impedanceSlopeInto, type ImpedanceSlope } from '../circuit/slope.js';
import { naturalFrequencies, type ComplexFrequency, type FrequencyRange } from '../circuit/natural-frequencies.js';
import { featureGrid, sweepRange, sweepIndices } from './feature-grid.js';
import { impedancePeaks } from './peaks.js';
import { hypot } from '../circuit/hypot.js';

/** Z_t = V·ripple/ΔI, Ω (Smith et al., 1999). */
export function targetImpedance(voltageV: number, ripple: number, stepA: number): number {
  return (voltageV * ripple) / stepA;
}

/** Margin to target in dB: positive while |Z| is under the target. */
export function marginDb(targetOhm: number, impedanceOhm: number): number {
  return 20 * Math.log10(targetOhm / impedanceOhm);
}

export type BranchKind = 'regulator' | 'plane' | 'capacitor';

export interface RailBranch {
  kind: BranchKind;
  label: string;
  /** One placement's model: for a capacitor, the part (at its biased capacitance) plus its mounting inductance. */
  element: Element;
  /** Identical placements in parallel. */
  count: number;
}

/** The regulator's output as seen by the rail: R + L (either may be absent). */
export function regulatorElement(rOhm: number | undefined, lH: number | undefined): Element {
  const parts = [rOhm ? resistor(rOhm) : undefined, lH ? inductor(lH) : undefined].filter((e): e is Element => e !== undefined);
  if (parts.length === 0) throw new RangeError('a regulator needs an output resistance or inductance');
  return series(...parts);
}

/** Plane capacitance with its own series resistance (absent: lossless). */
export function planeElement(cF: number, rOhm: number | undefined): Element {
  return rOhm ? series(capacitor(cF), resistor(rOhm)) : capacitor(cF);
}

/** A placed part: its model in series with the mounting (pad and via loop) inductance. */
export function placementElement(model: Element, mountingH: number): Element {
  return mountingH > 0 ? series(model, inductor(mountingH)) : model;
}

export interface RailPeak {
  frequencyHz: number;
  impedanceOhm: number;
  marginDb: number;
  /** The branch with the largest positive susceptance there: the capacitive side of the anti-resonance. */
  capacitiveBranch: number | null;
  /** The branch with the largest negative susceptance there: the inductive side. */
  inductiveBranch: number | null;
  /** |Y_b/Y| per branch: the current each branch carries per ampere drawn by the load (above 1 where branches circulate current). */
  currentRatio: number[];
}

export interface RailEvaluation {
  targetOhm: number;
  frequencies: Float64Array;
  /** |Z| of the rail at each frequency, Ω. */
  magnitude: Float64Array;
  /** |Z| of each branch (all its placements together) at each frequency; empty unless asked for. */
  branchMagnitude: Float64Array[];
  peaks: RailPeak[];
  /** Where |Z| comes closest to (or goes furthest over) the target: an end of the band or a refined peak. */
  worst: { frequencyHz: number; impedanceOhm: number; marginDb: number };
  /** |Z| ≤ target at every sweep point and every refined peak. */
  pass: boolean;
}

const slopeScratch = new Float64Array(4);
const railScratch = new Float64Array(4);

/** Y and dY/dω of the whole rail at one frequency (for peak refinement: no per-branch objects). */
export function railSlopeAt(branches: readonly RailBranch[], frequencyHz: number): ImpedanceSlope {
  const omega = 2 * Math.PI * frequencyHz;
  railScratch.fill(0);
  for (const branch of branches) {
    impedanceSlopeInto(branch.element, omega, slopeScratch);
    addAdmittanceSlope(slopeScratch[0], slopeScratch[1], slopeScratch[2], slopeScratch[3], branch.count, railScratch);
  }
  return { re: railScratch[0], im: railScratch[1], dRe: railScratch[2], dIm: railScratch[3] };
}

/** Y and dY/dω of the whole rail at one frequency, and each branch's admittance there. */
export function railAdmittanceAt(branches: readonly RailBranch[], frequencyHz: number): { total: ImpedanceSlope; branch: ImpedanceSlope[] } {
  const omega = 2 * Math.PI * frequencyHz;
  const total = { re: 0, im: 0, dRe: 0, dIm: 0 };
  const branch = branches.map((b) => {
    const scaled = admittanceSlope(impedanceSlopeAt(b.element, omega), b.count);
    total.re += scaled.re;
    total.im += scaled.im;
    total.dRe += scaled.dRe;
    total.dIm += scaled.dIm;
    return scaled;
  });
  return { total, branch };
}

export interface RailOptions {
  /** Keep each branch's |Z| curve (for pages); default true. */
  branchCurves?: boolean;
}

/**
 * The zeros of the rail's impedance: a zero of Z is a pole of Y = Σ Y_branch, so the rail's zeros are the
 * zeros of its branches (each branch's series resonances, whatever the counts), found branch by branch.
 */
export function railZeros(branches: readonly RailBranch[], range: FrequencyRange): ComplexFrequency[] {
  return branches.flatMap((b) => naturalFrequencies(b.element, range).zeros);
}

/**
 * |Z(f)| of the rail over `frequencies` (the band's sweep), its peaks, worst margin and pass/fail.
 *
 * Peaks are searched on the sweep refined around every zero of the rail's impedance (railZeros,
 * feature-grid.ts). The poles of Z, its anti-resonances, alternate with its zeros along the frequency
 * axis when losses are light (Foster's reactance theorem), so with each zero's neighbourhood sampled at a
 * fraction of the distance to it, every anti-resonance shows as a local maximum of the samples between two
 * zeros and is refined there, however narrow, even when it sits inside one step of the band's sweep.
 */
export function evaluateRail(branches: readonly RailBranch[], targetOhm: number, frequencies: Float64Array, options: RailOptions = {}): RailEvaluation {
  const keepCurves = options.branchCurves ?? true;
  const grid = featureGrid(frequencies, railZeros(branches, sweepRange(frequencies)));
  const onSweep = grid === frequencies ? undefined : sweepIndices(grid, frequencies);
  const n = frequencies.length;
  const m = grid.length;
  const g = new Float64Array(m);
  const b = new Float64Array(m);
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  const branchMagnitude: Float64Array[] = [];
  for (const branch of branches) {
    impedanceSweepInto(branch.element, grid, re, im);
    addAdmittance(re, im, branch.count, g, b);
    if (keepCurves) {
      const curve = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const j = onSweep ? onSweep[i] : i;
        curve[i] = hypot(re[j], im[j]) / branch.count;
      }
      branchMagnitude.push(curve);
    }
  }
  const gridMagnitude = new Float64Array(m);
  for (let i = 0; i < m; i++) gridMagnitude[i] = 1 / hypot(g[i], b[i]);
  const magnitude = onSweep ? Float64Array.from(onSweep, (j) => gridMagnitude[j]) : gridMagnitude;

  const found = impedancePeaks(grid, gridMagnitude, (f) => railSlopeAt(branches, f));
  const peaks: RailPeak[] = found.map((p) => {
    const { total, branch } = railAdmittanceAt(branches, p.frequencyHz);
    const y = hypot(total.re, total.im);
    let capacitive: number | null = null;
    let inductive: number | null = null;
    branch.forEach((yb, j) => {
      if (yb.im > 0 && (capacitive === null || yb.im > branch[capacitive].im)) capacitive = j;
      if (yb.im < 0 && (inductive === null || yb.im < branch[inductive].im)) inductive = j;
    });
    return {
      frequencyHz: p.frequencyHz,
      impedanceOhm: p.impedanceOhm,
      marginDb: marginDb(targetOhm, p.impedanceOhm),
      capacitiveBranch: capacitive,
      inductiveBranch: inductive,
      currentRatio: branch.map((yb) => hypot(yb.re, yb.im) / y),
    };
  });

  // The maximum of |Z| over the band is at an end or at a (refined) interior maximum.
  let worst = { frequencyHz: frequencies[0], impedanceOhm: magnitude[0] };
  const consider = (frequencyHz: number, impedanceOhm: number) => {
    if (impedanceOhm > worst.impedanceOhm) worst = { frequencyHz, impedanceOhm };
  };
  consider(frequencies[n - 1], magnitude[n - 1]);
  for (const p of peaks) consider(p.frequencyHz, p.impedanceOhm);
  return {
    targetOhm,
    frequencies,
    magnitude,
    branchMagnitude,
    peaks,
    worst: { ...worst, marginDb: marginDb(targetOhm, worst.impedanceOhm) },
    pass: worst.impedanceOhm <= targetOhm,
  };
}
