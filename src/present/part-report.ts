// What `zfolio figures` and `zfolio sweep` print for a person: engineering notation with units (their --json
// and --csv forms are the analysis's own, src/analysis/summary.ts and sweep-table.ts).

import type { PartSummary } from '../analysis/summary.js';
import type { SweepColumns } from '../analysis/sweep-table.js';
import { formatDegrees, formatEng } from '../units/format.js';
import { bandRuleText, bandText } from './band-words.js';
import { extremumNote } from './resonance-words.js';

/** The human form: engineering notation with units. */
export function describeFigures(s: PartSummary): string {
  const lines: string[] = [];
  const nominal = s.nominal !== null && s.unit !== null ? formatEng(s.nominal, s.unit) : '';
  lines.push([s.id, s.kind, nominal, s.title !== s.id ? s.title : ''].filter(Boolean).join('  ·  '));
  const srf = s.selfResonanceHz !== null ? `SRF ${formatEng(s.selfResonanceHz, 'Hz')}` : `SRF none between ${formatEng(s.sweep.fromHz, 'Hz')} and ${formatEng(s.sweep.toHz, 'Hz')}`;
  lines.push(`  ${srf}`);
  for (const r of s.resonances) {
    const beside = extremumNote(r);
    lines.push(`  resonance    ${formatEng(r.frequencyHz, 'Hz').padEnd(11)} ${r.type.padEnd(8)} |Z| ${formatEng(r.impedanceOhm, 'Ω')}${beside ? ` (${beside})` : ''}`);
  }
  const rule = bandRuleText(s.behavesAs, s.within);
  if (s.behavesAs) lines.push(`  usable band  ${s.usableBand ? bandText(s.usableBand) + (rule ? ` (${rule})` : '') : 'none in the sweep'}`);
  else lines.push('  usable band  not defined (the network declares no behaves-as)');
  return lines.join('\n') + '\n';
}

/** A part's sweep as a table: frequency, R, X, |Z| and phase, one row per point, under a one-line heading. */
export function sweepTableText(id: string, perDecade: number, c: SweepColumns): string {
  const rows = [['f', 'R', 'X', '|Z|', 'phase']];
  for (let i = 0; i < c.frequencyHz.length; i++) {
    rows.push([formatEng(c.frequencyHz[i], 'Hz'), formatEng(c.resistanceOhm[i], 'Ω'), formatEng(c.reactanceOhm[i], 'Ω'), formatEng(c.magnitudeOhm[i], 'Ω'), formatDegrees(c.phaseDeg[i])]);
  }
  return `${id}: ${c.frequencyHz.length} points, ${perDecade} per decade\n` + rows.map((r) => r.map((cell) => cell.padStart(12)).join('')).join('\n') + '\n';
}
