// What `zfolio plan` prints for a person about a plan: the target, the verdict, the load step, the branches and
// the peaks, in engineering notation (its --json form is the analysis's own, src/cli/plan-json.ts).

import type { PlanFigures } from '../analysis/plan-figures.js';
import { formatDiagnostic } from '../model/diagnostics.js';
import { formatDecibels, formatEng } from '../units/format.js';
import { biasLine, mountingSourceText, planBandText, planResultLine, planTargetText as targetLine, planeText, regulatorText } from './plan-words.js';
import { loadStepLines } from './load-step-words.js';
import { cornerVerdictText } from './corner-words.js';

/** The rail's branches, one line each, aligned. */
export function branchLines(f: PlanFigures): string[] {
  const rows: [string, string][] = [];
  if (f.regulator) rows.push(['regulator', regulatorText(f.regulator)]);
  if (f.plane) rows.push(['plane', planeText(f.plane)]);
  for (const p of f.placements) rows.push([`${p.count} × ${p.partId}`, `${biasLine(p, f.voltageV)}, mounting ${formatEng(p.mountingH, 'H')} (${mountingSourceText(p)})`]);
  if (rows.length === 0) return ['    none'];
  const width = Math.max(0, ...rows.map(([a]) => a.length));
  return rows.map(([a, b]) => `    ${a.padEnd(width)}  ${b}`);
}

/** The rail's peaks, one line each. */
export function peakLines(f: PlanFigures): string[] {
  if (f.peaks.length === 0) return ['    none in the band'];
  return f.peaks.map((p) => {
    const between = p.capacitiveBranch && p.inductiveBranch ? `  between ${p.capacitiveBranch} and ${p.inductiveBranch}` : '';
    return `    ${formatEng(p.frequencyHz, 'Hz').padEnd(11)} |Z| ${formatEng(p.impedanceOhm, 'Ω').padEnd(9)} margin ${formatDecibels(p.marginDb).padEnd(10)}${between}`;
  });
}

/** The impedance verdict: nominal, and the worst corner when the rail was evaluated at its corners. */
export function verdictLines(f: PlanFigures): string[] {
  if (!f.corners) return [`  result     ${planResultLine(f)}`];
  return [`  nominal    ${planResultLine(f)}`, `  corners    ${f.branches.length === 0 ? planResultLine(f) : cornerVerdictText(f.corners)}`];
}

/** "  load step  PASS dips …" and its continuation lines. */
export function loadStepBlock(f: PlanFigures): string[] {
  const [first, ...more] = loadStepLines(f);
  return [`  load step  ${first}`, ...more.map((l) => `             ${l}`)];
}

/** The human form of one analysed plan. */
export function describePlan(f: PlanFigures): string {
  const lines = [`${f.rail}${f.title !== f.rail ? `  ·  ${f.title}` : ''}  (${f.file})`];
  lines.push(`  target     ${targetLine(f)}`);
  lines.push(`  band       ${planBandText(f)}, ${f.perDecade} points per decade, peaks refined`);
  lines.push(...verdictLines(f), ...loadStepBlock(f));
  lines.push(`  branches`, ...branchLines(f));
  lines.push(`  peaks`, ...peakLines(f));
  if (f.biasDerated.length > 0) lines.push(`  DC bias    capacitance at ${formatEng(f.voltageV, 'V')} from the DC-bias table of ${f.biasDerated.join(', ')}`);
  if (f.warnings.length > 0) lines.push('  warnings', ...f.warnings.map((w) => `    ${formatDiagnostic(w)}`));
  return lines.join('\n') + '\n';
}
