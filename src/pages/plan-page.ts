// What a rail-plan page shows: the target and how it was found, the verdict with the worst margin, the
// anti-resonance peaks, the placements with their capacitance at the rail voltage, and the warnings.

import type { PlacementFigures, PlanFigures } from '../analysis/plan-figures.js';
import { warningNote, type WarningNote } from '../present/warning-notes.js';
import { atRailText, biasNote, biasSourceText, mountingSourceText, planBandText, planTargetText, planVerdict, planeText, regulatorText } from '../present/plan-words.js';
import type { Row } from '../present/row.js';
import { railSlug } from '../present/slugs.js';
import { formatDecibels, formatEng, formatNumber } from '../units/format.js';
import type { ChartOnPage } from './site-data.js';
import { cornerVerdictWords, type CornerVerdictWords } from '../present/corner-words.js';
import { LOAD_STEP_CAUTION, NO_LOAD_STEP, loadStepFacts, loadStepMethod, loadStepStatus, loadStepVerdict } from '../present/load-step-words.js';

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
  /** The plan's warnings as notes a reader can act on, each with its file:line:col. */
  warnings: WarningNote[];
  biasNote: string;
  chart?: ChartOnPage;
  /** The load step against the ripple budget, beside the impedance verdict; null without a step. */
  loadStep: LoadStepPageData | null;
  /** Why there is no load step, when there is none. */
  loadStepNote: string;
  /** The worst corner of the placed parts' spreads, beside the nominal verdict; null when not evaluated. */
  corners: CornerVerdictWords | null;
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

export function planPageData(f: PlanFigures, sourceHash: string, notes: string | undefined, chart: ChartOnPage | undefined): PlanPageData {
  const facts: Row[] = [
    { label: 'Rail voltage', value: formatEng(f.voltageV, 'V') },
    { label: 'Target impedance', value: planTargetText(f), note: f.target.kind === 'explicit' ? undefined : 'V · ripple / ΔI' },
    { label: 'Band checked', value: planBandText(f), note: `${f.perDecade} points per decade, peaks refined` },
    { label: 'Mounting inductance', value: formatEng(f.mountingH, 'H'), note: 'per placement unless the entry, the part file or the package table sets its own' },
  ];
  if (f.regulator) facts.push({ label: 'Regulator output', value: regulatorText(f.regulator), note: 'series R + L' });
  if (f.plane) facts.push({ label: 'Plane capacitance', value: planeText(f.plane) });
  const byPackage = Object.entries(f.mountingByPackage);
  if (byPackage.length > 0) facts.push({ label: 'Mounting by package', value: byPackage.map(([name, h]) => `${name}: ${formatEng(h, 'H')}`).join(', ') });
  facts.push({ label: 'Placements', value: String(f.totalPlacements), note: f.totalCost !== null ? `total cost ${formatNumber(f.totalCost, 4)}` : undefined });

  const warnings = f.warnings.map(warningNote);
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
      atRail: atRailText(p),
      rating: p.voltageRatingV !== null ? formatEng(p.voltageRatingV, 'V') : 'not rated',
      note: biasSourceText(p),
    })),
    warnings,
    biasNote: biasNote(f),
    chart,
    loadStep: f.transient ? { pass: f.transient.pass, status: loadStepStatus(f) ?? '', verdict: loadStepVerdict(f), facts: loadStepFacts(f), method: loadStepMethod(f), caution: LOAD_STEP_CAUTION, charts: [] } : null,
    corners: f.corners ? cornerVerdictWords(f.corners, f.pass, f.branches.length === 0) : null,
    loadStepNote: f.transient ? '' : `${NO_LOAD_STEP[0].toUpperCase()}${NO_LOAD_STEP.slice(1)} ("step" beside "target" adds one).`,
  };
}
