// What a rail-plan page shows: the target and how it was found, the verdict with the worst margin, the
// anti-resonance peaks, the placements with their capacitance at the rail voltage, and the warnings.

import type { PlacementFigures, PlanFigures } from '../analysis/plan-figures.js';
import { pageName } from '../model/page-names.js';
import { formatDiagnostic } from '../model/diagnostics.js';
import { formatDecibels, formatEng, formatNumber, formatPercent } from '../units/format.js';
import type { Row } from './part-page.js';
import type { ChartOnPage } from './site-data.js';
import { LOAD_STEP_CAUTION, NO_LOAD_STEP, loadStepFacts, loadStepMethod, loadStepStatus, loadStepVerdict } from './load-step-text.js';

export interface PlanPageData {
  slug: string;
  rail: string;
  title: string;
  notes?: string;
  sourceFile: string;
  sourceHash: string;
  pass: boolean;
  verdict: string;
  facts: Row[];
  peaks: { frequency: string; impedance: string; margin: string; between: string; over: boolean }[];
  placements: { partId: string; title: string; count: number; mounting: string; mountingFrom: string; nominal: string; atRail: string; rating: string; note: string }[];
  warnings: string[];
  biasNote: string;
  chart?: ChartOnPage;
  /** The load step against the ripple budget, beside the impedance verdict; null without a step. */
  loadStep: LoadStepPageData | null;
  /** Why there is no load step, when there is none. */
  loadStepNote: string;
}

export interface LoadStepPageData {
  pass: boolean;
  /** PASS, FAIL or NO VERDICT. */
  status: string;
  verdict: string;
  facts: Row[];
  method: string;
  caution: string;
  /** v(t) with the budget, then each branch's share of the load current. */
  charts: ChartOnPage[];
}

/** "4.5 mΩ = 0.9 V × 3% / 6 A" (Smith et al., 1999), or "4.5 mΩ as given". */
export function planTargetText(f: Pick<PlanFigures, 'target' | 'targetOhm' | 'voltageV'>): string {
  const t = f.target;
  const how = t.kind === 'explicit' ? 'as given' : `= ${formatEng(f.voltageV, 'V')} × ${formatPercent(t.ripple)} / ${formatEng(t.stepA, 'A')}`;
  return `${formatEng(f.targetOhm, 'Ω')} ${how}`;
}

/** "worst margin +2.10 dB at 31.6 MHz (|Z| 7.8 mΩ)": what the PASS or FAIL beside it rests on. */
export function planVerdict(f: PlanFigures): string {
  if (f.branches.length === 0) return 'nothing is on the rail yet';
  return `worst margin ${formatDecibels(f.worstMarginDb)} at ${formatEng(f.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(f.worstImpedanceOhm, 'Ω')})`;
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

export function railSlug(rail: string): string {
  return pageName(rail);
}

export function planPageData(f: PlanFigures, sourceHash: string, notes: string | undefined, chart: ChartOnPage | undefined): PlanPageData {
  const facts: Row[] = [
    { label: 'Rail voltage', value: formatEng(f.voltageV, 'V') },
    { label: 'Target impedance', value: planTargetText(f), note: f.target.kind === 'explicit' ? undefined : 'V · ripple / ΔI' },
    { label: 'Band checked', value: `${formatEng(f.band.fromHz, 'Hz')} to ${formatEng(f.band.toHz, 'Hz')}`, note: `${f.perDecade} points per decade, peaks refined` },
    { label: 'Mounting inductance', value: formatEng(f.mountingH, 'H'), note: 'per placement unless the entry, the part file or the package table sets its own' },
  ];
  if (f.regulator) {
    const r = [f.regulator.rOhm !== null ? formatEng(f.regulator.rOhm, 'Ω') : '', f.regulator.lH !== null ? formatEng(f.regulator.lH, 'H') : ''].filter(Boolean).join(' + ');
    facts.push({ label: 'Regulator output', value: r, note: 'series R + L' });
  }
  if (f.plane) facts.push({ label: 'Plane capacitance', value: [formatEng(f.plane.cF, 'F'), f.plane.rOhm !== null ? formatEng(f.plane.rOhm, 'Ω') : ''].filter(Boolean).join(' + ') });
  const byPackage = Object.entries(f.mountingByPackage);
  if (byPackage.length > 0) facts.push({ label: 'Mounting by package', value: byPackage.map(([name, h]) => `${name}: ${formatEng(h, 'H')}`).join(', ') });
  facts.push({ label: 'Placements', value: String(f.totalPlacements), note: f.totalCost !== null ? `total cost ${formatNumber(f.totalCost, 4)}` : undefined });

  const warnings = f.warnings.map(formatDiagnostic);
  return {
    slug: railSlug(f.rail),
    rail: f.rail,
    title: f.title,
    notes,
    sourceFile: f.file,
    sourceHash,
    pass: f.pass,
    verdict: planVerdict(f),
    facts,
    peaks: f.peaks.map((p) => ({
      frequency: formatEng(p.frequencyHz, 'Hz'),
      impedance: formatEng(p.impedanceOhm, 'Ω'),
      margin: formatDecibels(p.marginDb),
      between: p.capacitiveBranch && p.inductiveBranch ? `${p.capacitiveBranch} ↔ ${p.inductiveBranch}` : '',
      over: p.marginDb < 0,
    })),
    placements: f.placements.map((p) => ({
      partId: p.partId,
      title: p.title,
      count: p.count,
      mounting: formatEng(p.mountingH, 'H'),
      mountingFrom: mountingSourceText(p),
      nominal: formatEng(p.nominalF, 'F'),
      atRail: p.biasFromTable ? `${formatEng(p.capacitanceF, 'F')} (${formatPercent(p.biasFraction)})` : formatEng(p.nominalF, 'F'),
      rating: p.voltageRatingV !== null ? formatEng(p.voltageRatingV, 'V') : 'not rated',
      note: p.biasFromTable ? (p.biasExtrapolated ? `DC-bias table, extrapolated: the table ends at ${formatEng(p.biasTableEndV ?? NaN, 'V')}, its last fraction is held` : 'DC-bias table') : 'no DC-bias table: nominal',
    })),
    warnings,
    biasNote:
      f.biasDerated.length > 0
        ? `Capacitances at ${formatEng(f.voltageV, 'V')} come from the DC-bias tables of ${f.biasDerated.join(', ')} (linear between points, from 100% at 0 V unless the table gives 0 V${f.placements.some((p) => p.biasExtrapolated) ? '; above a table\'s last point its last fraction is held, which is likely optimistic' : ''}); other parts count at nominal.`
        : 'No placed part has a DC-bias table: every capacitance counts at nominal.',
    chart,
    loadStep: f.transient ? { pass: f.transient.pass, status: loadStepStatus(f) ?? '', verdict: loadStepVerdict(f), facts: loadStepFacts(f), method: loadStepMethod(f), caution: LOAD_STEP_CAUTION, charts: [] } : null,
    loadStepNote: f.transient ? '' : `${NO_LOAD_STEP[0].toUpperCase()}${NO_LOAD_STEP.slice(1)} ("step" beside "target" adds one).`,
  };
}
