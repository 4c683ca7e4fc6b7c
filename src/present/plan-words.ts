// A rail plan in words, as its page, the review pages and packs, and `zfolio plan` all say it: the target and
// how it was found, the verdict, the regulator and plane, and each placement's mounting and capacitance.

import type { PlacementFigures, PlanFigures } from '../analysis/plan-figures.js';
import { formatDecibels, formatEng, formatPercent } from '../units/format.js';

/** "4.5 mΩ = 0.9 V × 3% / 6 A" (Smith et al., 1999), or "4.5 mΩ as given". */
export function planTargetText(f: Pick<PlanFigures, 'target' | 'targetOhm' | 'voltageV'>): string {
  const t = f.target;
  const how = t.kind === 'explicit' ? 'as given' : `= ${formatEng(f.voltageV, 'V')} × ${formatPercent(t.ripple)} / ${formatEng(t.stepA, 'A')}`;
  return `${formatEng(f.targetOhm, 'Ω')} ${how}`;
}

/** "worst margin +2.10 dB at 31.6 MHz (|Z| 7.8 mΩ)": what the PASS or FAIL beside it rests on. */
export function planVerdict(f: Pick<PlanFigures, 'branches' | 'worstMarginDb' | 'worstFrequencyHz' | 'worstImpedanceOhm'>): string {
  if (f.branches.length === 0) return 'nothing is on the rail yet';
  return `worst margin ${formatDecibels(f.worstMarginDb)} at ${formatEng(f.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(f.worstImpedanceOhm, 'Ω')})`;
}

/** "PASS  worst margin …", "FAIL  nothing is on the rail yet": the verdict as the command line prints it. */
export function planResultLine(f: Pick<PlanFigures, 'pass' | 'branches' | 'worstMarginDb' | 'worstFrequencyHz' | 'worstImpedanceOhm'>): string {
  return `${f.pass && f.branches.length > 0 ? 'PASS' : 'FAIL'}  ${planVerdict(f)}`;
}

/** Where a placement's mounting comes from, in words: "plan entry", "part file", "package 0402", "rail default". */
export function mountingSourceText(p: Pick<PlacementFigures, 'mountingFrom' | 'package'>): string {
  switch (p.mountingFrom) {
    case 'entry':
      return 'plan entry';
    case 'part':
      return 'part file';
    case 'package':
      return `package ${p.package ?? ''}`.trim();
    case 'rail':
      return 'rail default';
  }
}

/** "2 mΩ + 15 nH": the regulator's output as the rail sees it (either may be absent). */
export function regulatorText(r: NonNullable<PlanFigures['regulator']>): string {
  return [r.rOhm !== null ? formatEng(r.rOhm, 'Ω') : '', r.lH !== null ? formatEng(r.lH, 'H') : ''].filter(Boolean).join(' + ');
}

/** "10 nF + 3 mΩ": the plane's capacitance and its series resistance. */
export function planeText(p: NonNullable<PlanFigures['plane']>): string {
  return [formatEng(p.cF, 'F'), p.rOhm !== null ? formatEng(p.rOhm, 'Ω') : ''].filter(Boolean).join(' + ');
}

/** The band a plan is checked over: "100 kHz to 100 MHz". */
export function planBandText(f: Pick<PlanFigures, 'band'>): string {
  return `${formatEng(f.band.fromHz, 'Hz')} to ${formatEng(f.band.toHz, 'Hz')}`;
}

/** A placement's capacitance at the rail, as its page's table gives it: "1.8 µF (82%)", or the nominal. */
export function atRailText(p: PlacementFigures): string {
  return p.biasFromTable ? `${formatEng(p.capacitanceF, 'F')} (${formatPercent(p.biasFraction)})` : formatEng(p.nominalF, 'F');
}

/** Where that capacitance comes from, as the page's table notes it. */
export function biasSourceText(p: PlacementFigures): string {
  if (!p.biasFromTable) return 'no DC-bias table: nominal';
  return p.biasExtrapolated ? `DC-bias table, extrapolated: the table ends at ${formatEng(p.biasTableEndV ?? NaN, 'V')}, its last fraction is held` : 'DC-bias table';
}

/** A placement's capacitance as the command line prints it: "1.8 µF at 3.3 V (82% of 2.2 µF, DC-bias table)". */
export function biasLine(p: PlacementFigures, voltageV: number): string {
  if (!p.biasFromTable) return `${formatEng(p.nominalF, 'F')} (no DC-bias table: nominal)`;
  const source = p.biasExtrapolated ? `extrapolated: the DC-bias table ends at ${formatEng(p.biasTableEndV ?? NaN, 'V')}` : 'DC-bias table';
  return `${formatEng(p.capacitanceF, 'F')} at ${formatEng(voltageV, 'V')} (${formatPercent(p.biasFraction)} of ${formatEng(p.nominalF, 'F')}, ${source})`;
}

/** The paragraph under a plan page's placements: which capacitances come from DC-bias tables, and how. */
export function biasNote(f: Pick<PlanFigures, 'biasDerated' | 'voltageV' | 'placements'>): string {
  if (f.biasDerated.length === 0) return 'No placed part has a DC-bias table: every capacitance counts at nominal.';
  const held = f.placements.some((p) => p.biasExtrapolated) ? "; above a table's last point its last fraction is held, which is likely optimistic" : '';
  return `Capacitances at ${formatEng(f.voltageV, 'V')} come from the DC-bias tables of ${f.biasDerated.join(', ')} (linear between points, from 100% at 0 V unless the table gives 0 V${held}); other parts count at nominal.`;
}
