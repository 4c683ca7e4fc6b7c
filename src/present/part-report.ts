// What `zfolio figures` and `zfolio sweep` print for a person: engineering notation with units (their --json
// and --csv forms are the analysis's own, src/analysis/summary.ts and sweep-table.ts).

import type { PartSummary } from '../analysis/summary.js';
import type { SweepColumns } from '../analysis/sweep-table.js';
import { formatDegrees, formatEng } from '../units/format.js';
import { bandRuleText, bandText } from './band-words.js';
import { extremumNote } from './resonance-words.js';
import { boundsText, celsiusSpan, changeText, parasiticSpreadText, spreadFigureTexts } from './corner-words.js';

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
  lines.push(...spreadLines(s));
  return lines.join('\n') + '\n';
}

/** "  spread  value 76.5 nF to 126 nF (±10%, −15% … +15% over −10 °C to 55 °C)" and the figures at the corners. */
function spreadLines(s: PartSummary): string[] {
  const sp = s.spread;
  if (!sp) return [];
  const texts = spreadFigureTexts(sp);
  const sources = [sp.tolerance ? boundsText(sp.tolerance) : '', sp.temperatureChange ? `${changeText(sp.temperatureChange)} over ${celsiusSpan(sp.temperature)}` : '', parasiticSpreadText(sp) ?? ''].filter(Boolean).join(', ');
  const value = sp.nominalValue && s.unit !== null ? `value ${formatEng(sp.nominalValue.min, s.unit)} to ${formatEng(sp.nominalValue.max, s.unit)} ` : '';
  const out = [`  spread       ${value}(${sources})`];
  if (texts.srf) out.push(`               SRF ${texts.srf}`);
  if (texts.bandTop) out.push(`               band top ${texts.bandTop}`);
  out.push(`               over ${texts.corners}`);
  return out;
}

/** A part's sweep as a table: frequency, R, X, |Z| and phase, one row per point, under a one-line heading. */
export function sweepTableText(id: string, perDecade: number, c: SweepColumns): string {
  const rows = [['f', 'R', 'X', '|Z|', 'phase']];
  for (let i = 0; i < c.frequencyHz.length; i++) {
    rows.push([formatEng(c.frequencyHz[i], 'Hz'), formatEng(c.resistanceOhm[i], 'Ω'), formatEng(c.reactanceOhm[i], 'Ω'), formatEng(c.magnitudeOhm[i], 'Ω'), formatDegrees(c.phaseDeg[i])]);
  }
  return `${id}: ${c.frequencyHz.length} points, ${perDecade} per decade\n` + rows.map((r) => r.map((cell) => cell.padStart(12)).join('')).join('\n') + '\n';
}
