// Resonances in words: a chart's label ("SRF 23.7 MHz"), and the note beside a resonance in the figures
// table and the command line (where X = 0, and the |Z| extremum beside it).

import { isSelfResonance, type Resonance } from '../analysis/resonance.js';
import { formatEng } from '../units/format.js';

/** "SRF 23.7 MHz" for the self-resonance, "series 1.2 GHz" / "parallel 45 MHz" for the others. */
export function resonanceLabel(r: Resonance, self: Resonance | undefined): string {
  const name = isSelfResonance(r, self) ? 'SRF' : r.type;
  return `${name} ${formatEng(r.frequencyHz, 'Hz')}`;
}

/** "190 MHz": the frequency alone, where a chart has no room for "series 190 MHz" (its dot says what it marks). */
export function resonanceShortLabel(r: Resonance): string {
  return formatEng(r.frequencyHz, 'Hz');
}

/** "X = 0 with |Z| 1.12 Ω; |Z| max 1.34 Ω at 95.2 MHz": where X = 0, and the |Z| extremum beside it. */
export function resonanceNote(r: Resonance): string {
  const atZero = `|Z| ${formatEng(r.impedanceOhm, 'resistance')} where X = 0`;
  const beside = extremumNote(r);
  return beside ? `${atZero}; ${beside}` : atZero;
}

/** "|Z| max 1.34 Ω at 95.2 MHz" where the extremum differs visibly from the X = 0 point, else undefined. */
export function extremumNote(r: Resonance): string | undefined {
  const e = r.extremum;
  if (Math.abs(e.frequencyHz / r.frequencyHz - 1) < 1e-3 && Math.abs(e.impedanceOhm / r.impedanceOhm - 1) < 1e-3) return undefined;
  const what = r.type === 'series' ? 'min' : 'max';
  return `|Z| ${what} ${formatEng(e.impedanceOhm, 'resistance')} at ${formatEng(e.frequencyHz, 'frequency')}${e.atSweepEnd ? ' (sweep end)' : ''}`;
}
