// What `zfolio plan --suggest` prints for a person: the candidates and what was left out, the search's status,
// and the set found (or the closest set) with its verdict, branches, peaks and plan YAML.

import type { PlanFigures } from '../analysis/plan-figures.js';
import type { Suggestion } from '../analysis/plan-suggest.js';
import type { CornerRounds } from '../analysis/plan-suggest-corners.js';
import { formatDiagnostic } from '../model/diagnostics.js';
import type { SkippedPart } from '../model/plan-candidates.js';
import type { Plan } from '../model/plan.js';
import { formatDecibels, formatEng } from '../units/format.js';
import { branchLines, loadStepBlock, peakLines, verdictLines } from './plan-report.js';
import { planResultLine, planTargetText as targetLine } from './plan-words.js';
import { capacitorsYaml } from './plan-yaml.js';

export interface SuggestRequest {
  maxCount: number;
  only: readonly string[];
}

/** "under the target", or "3 dB under the target" when a margin is required. */
function underTarget(s: Suggestion): string {
  return s.marginDb === 0 ? 'under the target' : `${formatDecibels(s.marginDb).replace(/^\+/, '')} under the target`;
}

function statusLine(s: Suggestion, request: SuggestRequest): string {
  const nodes = `${s.nodes.toLocaleString('en-GB')} node${s.nodes === 1 ? '' : 's'}`;
  const of = `0 to ${request.maxCount} of each of ${s.candidateIds.length} candidate${s.candidateIds.length === 1 ? '' : 's'}`;
  switch (s.status) {
    case 'optimal':
      return `optimal, proven by search (${nodes})`;
    case 'unmeetable':
      return `cannot be met: no choice of ${of} keeps |Z| ${underTarget(s)} across the band${s.cornerRounds && s.cornerRounds.scenarios > 0 ? ' at nominal and at the corners added' : ''} (proven, ${nodes})`;
    case 'unproven':
      return s.placements.length > 0
        ? `best found in ${nodes}; a better set has not been ruled out (--nodes raises the budget)`
        : `no set keeping |Z| ${underTarget(s)} found in ${nodes}, and none ruled out (--nodes raises the budget)`;
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

/** How planning for the worst corner went. */
function cornerRoundsText(r: CornerRounds): string {
  const runs = `${r.rounds} search${r.rounds === 1 ? '' : 'es'}, ${r.scenarios} corner${r.scenarios === 1 ? '' : 's'} added`;
  switch (r.stop) {
    case 'held':
      return `planned for the worst corner: the set holds at every corner evaluated (${runs})`;
    case 'no-set':
      return r.scenarios === 0 ? `planned for the worst corner: no set holds even at nominal (${runs})` : `planned for the worst corner: no set holds at the corners added (${runs})`;
    case 'repeat':
      return `planned for the worst corner: stopped, the worst corner was one already added (${runs}); the set below holds at nominal only`;
    case 'rounds':
      return `planned for the worst corner: stopped after ${runs}; the set below holds at nominal only`;
  }
}

/**
 * Under a chosen set whose load step goes beyond its budget: why a set that holds the target can, and the
 * remedy. |Z| ≤ Z_t at every frequency bounds the response to a sinusoid, not to a step: the rail's ringing
 * between its anti-resonances adds up in time, so the excursion can exceed step × Z_t (a transfer function's
 * peak gain does not bound its step response; any signals-and-systems text).
 */
export function loadStepHint(f: PlanFigures, marginDb: number): string[] {
  const t = f.transient;
  if (!t || !t.resolved || Math.max(t.droopV, t.overshootV) <= t.budgetV) return [];
  const more = marginDb > 0 ? `a margin above ${formatDecibels(marginDb)}` : 'a margin under the target (--margin 1 or more)';
  return [
    '             (the search holds |Z| under the target, which does not bound a step: the rail rings between',
    `             its anti-resonances and the swings add up; ${more} buys a shallower dip for more placements)`,
  ];
}

/** "2 × A + 4 × B", or "no capacitors". */
function setText(f: PlanFigures): string {
  return f.placements.length === 0 ? 'no capacitors' : f.placements.map((p) => `${p.count} × ${p.partId}`).join(' + ');
}

/** The human form of a suggestion. */
export function describeSuggestion(plan: Plan, s: Suggestion, request: SuggestRequest): string {
  const goal = s.objective === 'cost' ? 'lowest total cost' : 'fewest placements';
  const margin = s.marginDb !== 0 ? `, ${formatDecibels(s.marginDb)} margin required` : '';
  const lines = [`${plan.rail}: suggested capacitors (${goal}${margin}; ${s.candidateIds.length} candidate${s.candidateIds.length === 1 ? '' : 's'}${request.only.length ? ` named ${request.only.join(' or ')}` : ''})`];
  lines.push(`  status     ${statusLine(s, request)}`);
  if (s.cornerRounds) lines.push(`  corners    ${cornerRoundsText(s.cornerRounds)}`);
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
    // The search weighs the impedance only; the chosen set's load step is shown for what it is, and when it
    // misses its budget, what to do about it.
    lines.push(...verdictLines(f), ...loadStepBlock(f), ...loadStepHint(f, s.marginDb));
    describeSet(f);
    lines.push('  as plan YAML', ...capacitorsYaml(s.placements, '    '));
  } else if (s.closest) {
    const f = s.closest.figures;
    lines.push(`  target     ${targetLine(f)}`);
    lines.push(`  closest    worst margin ${formatDecibels(f.worstMarginDb)} at ${formatEng(f.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(f.worstImpedanceOhm, 'Ω')}) with ${setText(f)}`);
    lines.push('             (the closest set a local search found, not proven the closest possible)');
    if (s.cornerRounds) lines.push(...verdictLines(f));
    describeSet(f);
  }
  return lines.join('\n') + '\n';
}
