// What `zfolio plan` prints: the human form (engineering notation) and the JSON form (SI units).

import { planFiguresWithoutCurves, type PlanFigures } from '../analysis/plan-figures.js';
import type { Suggestion } from '../analysis/plan-suggest.js';
import type { SkippedPart } from '../model/plan-candidates.js';
import { formatDiagnostic } from '../model/diagnostics.js';
import type { Plan } from '../model/plan.js';
import { capacitorsYaml } from './plan-yaml.js';
import { formatDecibels, formatEng, formatPercent } from '../units/format.js';
import { mountingSourceText, planTargetText as targetLine } from '../folio/plan-page.js';
import { loadStepLines } from '../folio/load-step-text.js';

function resultLine(f: PlanFigures): string {
  if (f.branches.length === 0) return 'FAIL  nothing is on the rail yet';
  const verdict = f.pass ? 'PASS' : 'FAIL';
  return `${verdict}  worst margin ${formatDecibels(f.worstMarginDb)} at ${formatEng(f.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(f.worstImpedanceOhm, 'Ω')})`;
}

function branchLines(f: PlanFigures): string[] {
  const rows: [string, string][] = [];
  if (f.regulator) rows.push(['regulator', [f.regulator.rOhm !== null ? formatEng(f.regulator.rOhm, 'Ω') : '', f.regulator.lH !== null ? formatEng(f.regulator.lH, 'H') : ''].filter(Boolean).join(' + ')]);
  if (f.plane) rows.push(['plane', [formatEng(f.plane.cF, 'F'), f.plane.rOhm !== null ? formatEng(f.plane.rOhm, 'Ω') : ''].filter(Boolean).join(' + ')]);
  for (const p of f.placements) {
    const bias = p.biasFromTable
      ? `${formatEng(p.capacitanceF, 'F')} at ${formatEng(f.voltageV, 'V')} (${formatPercent(p.biasFraction)} of ${formatEng(p.nominalF, 'F')}, ${p.biasExtrapolated ? `extrapolated: the DC-bias table ends at ${formatEng(p.biasTableEndV ?? NaN, 'V')}` : 'DC-bias table'})`
      : `${formatEng(p.nominalF, 'F')} (no DC-bias table: nominal)`;
    rows.push([`${p.count} × ${p.partId}`, `${bias}, mounting ${formatEng(p.mountingH, 'H')} (${mountingSourceText(p)})`]);
  }
  if (rows.length === 0) return ['    none'];
  const width = Math.max(0, ...rows.map(([a]) => a.length));
  return rows.map(([a, b]) => `    ${a.padEnd(width)}  ${b}`);
}

function peakLines(f: PlanFigures): string[] {
  if (f.peaks.length === 0) return ['    none in the band'];
  return f.peaks.map((p) => {
    const between = p.capacitiveBranch && p.inductiveBranch ? `  between ${p.capacitiveBranch} and ${p.inductiveBranch}` : '';
    return `    ${formatEng(p.frequencyHz, 'Hz').padEnd(11)} |Z| ${formatEng(p.impedanceOhm, 'Ω').padEnd(9)} margin ${formatDecibels(p.marginDb).padEnd(10)}${between}`;
  });
}

/** "  load step  PASS dips …" and its continuation lines. */
function loadStepBlock(f: PlanFigures): string[] {
  const [first, ...more] = loadStepLines(f);
  return [`  load step  ${first}`, ...more.map((l) => `             ${l}`)];
}

/** The human form of one analysed plan. */
export function describePlan(f: PlanFigures): string {
  const lines = [`${f.rail}${f.title !== f.rail ? `  ·  ${f.title}` : ''}  (${f.file})`];
  lines.push(`  target     ${targetLine(f)}`);
  lines.push(`  band       ${formatEng(f.band.fromHz, 'Hz')} to ${formatEng(f.band.toHz, 'Hz')}, ${f.perDecade} points per decade, peaks refined`);
  lines.push(`  result     ${resultLine(f)}`, ...loadStepBlock(f));
  lines.push(`  branches`, ...branchLines(f));
  lines.push(`  peaks`, ...peakLines(f));
  if (f.biasDerated.length > 0) lines.push(`  DC bias    capacitance at ${formatEng(f.voltageV, 'V')} from the DC-bias table of ${f.biasDerated.join(', ')}`);
  if (f.warnings.length > 0) lines.push('  warnings', ...f.warnings.map((w) => `    ${formatDiagnostic(w)}`));
  return lines.join('\n') + '\n';
}

/** The JSON form: every figure of the plan except the curves (SI units). */
export const planJson = planFiguresWithoutCurves;

export interface SuggestRequest {
  maxCount: number;
  only: readonly string[];
}

/** "under the target", or "3 dB under the target" when a margin is required. */
function underTarget(s: Suggestion): string {
  return s.marginDb === 0 ? 'under the target' : `${formatDecibels(s.marginDb).replace(/^\+/, '')} under the target`;
}

function statusLine(s: Suggestion, request: SuggestRequest): string {
  const of = `0 to ${request.maxCount} of each of ${s.candidateIds.length} candidate${s.candidateIds.length === 1 ? '' : 's'}`;
  switch (s.status) {
    case 'optimal':
      return `optimal, proven by search (${s.nodes} nodes)`;
    case 'unmeetable':
      return `cannot be met: no choice of ${of} keeps |Z| ${underTarget(s)} across the band (proven, ${s.nodes} nodes)`;
    case 'unproven':
      return s.placements.length > 0
        ? `best found in ${s.nodes} nodes; a better set has not been ruled out (--nodes raises the budget)`
        : `no set keeping |Z| ${underTarget(s)} found in ${s.nodes} nodes, and none ruled out (--nodes raises the budget)`;
  }
}

function skippedText(k: SkippedPart): string {
  switch (k.reason) {
    case 'over-rating':
      return 'rated below the rail';
    case 'above-derating':
      return 'above derating';
    case 'safety-class':
      return `safety class ${k.safetyClass}`;
    case 'beyond-bias-table':
      return `DC-bias table ends at ${formatEng(k.tableEndV ?? NaN, 'V')}`;
  }
}

/** "2 × A + 4 × B", or "no capacitors". */
function setText(f: PlanFigures): string {
  return f.placements.length === 0 ? 'no capacitors' : f.placements.map((p) => `${p.count} × ${p.partId}`).join(' + ');
}

/** The human form of a suggestion. */
export function describeSuggestion(plan: Plan, s: Suggestion, request: SuggestRequest): string {
  const goal = s.objective === 'cost' ? 'lowest total cost' : 'fewest placements';
  const margin = s.marginDb !== 0 ? `, ${formatDecibels(s.marginDb)} margin required` : '';
  const lines = [`${plan.rail}: suggested capacitors (${goal}${margin}; ${s.candidateIds.length} candidates${request.only.length ? ` named ${request.only.join(' or ')}` : ''})`];
  lines.push(`  status     ${statusLine(s, request)}`);
  if (s.skipped.length > 0) {
    lines.push(`  left out   ${s.skipped.map((k) => `${k.partId} (${skippedText(k)})`).join(', ')}`);
    const flags = [
      s.skipped.some((k) => k.reason === 'safety-class') ? '--allow-safety-class' : '',
      s.skipped.some((k) => k.reason === 'beyond-bias-table') ? '--allow-bias-extrapolation' : '',
    ].filter(Boolean);
    if (flags.length > 0) lines.push(`             (to weigh these, name them with --only, or give ${flags.join(' or ')})`);
  }
  if (s.unratedIds.length > 0) {
    const one = s.unratedIds.length === 1;
    lines.push(`  unrated    ${s.unratedIds.join(', ')} ${one ? 'states' : 'state'} no DC voltage rating; check ${one ? 'it' : 'them'} against the rail by hand`);
  }
  const describeSet = (f: PlanFigures) => {
    lines.push(`  placements ${f.totalPlacements}${f.totalCost !== null ? `, total cost ${Number(f.totalCost.toPrecision(6))}` : ''}`, ...branchLines(f));
    lines.push(`  peaks`, ...peakLines(f));
    if (f.warnings.length > 0) lines.push('  warnings', ...f.warnings.map((w) => `    ${formatDiagnostic(w)}`));
  };
  if (s.figures) {
    const f = s.figures;
    lines.push(`  target     ${targetLine(f)}`);
    // The search weighs the impedance only; the chosen set's load step is shown for what it is.
    lines.push(`  result     ${resultLine(f)}`, ...loadStepBlock(f));
    describeSet(f);
    lines.push('  as plan YAML', ...capacitorsYaml(s.placements, '    '));
  } else if (s.closest) {
    const f = s.closest.figures;
    lines.push(`  target     ${targetLine(f)}`);
    lines.push(`  closest    worst margin ${formatDecibels(f.worstMarginDb)} at ${formatEng(f.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(f.worstImpedanceOhm, 'Ω')}) with ${setText(f)}`);
    lines.push('             (the closest set a local search found, not proven the closest possible)');
    describeSet(f);
  }
  return lines.join('\n') + '\n';
}

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
