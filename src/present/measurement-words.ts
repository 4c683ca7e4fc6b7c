// A part's measurement in words, as its datasheet page writes it: the fixture, how far the model misses
// the measurement, why a fit left a parameter out, and a fitted value's difference from the typed one.

import type { LeftOut } from '../measure/fit.js';
import type { FitResidual } from '../measure/fit.js';
import type { FileHeader } from '../measure/touchstone-header.js';
import { formatEng } from '../units/format.js';

const FIXTURE_TEXT: Readonly<Record<string, string>> = {
  reflection: 'one-port reflection',
  'shunt-thru': 'two-port shunt-thru (part from the line to ground)',
  'series-thru': 'two-port series-thru (part in series between the ports)',
};

/** "two-port shunt-thru (part from the line to ground), against 50 Ω" */
export function fixtureText(fixture: string, byDefault: boolean, referenceOhm: number): string {
  return `${FIXTURE_TEXT[fixture] ?? fixture}${byDefault ? ', by default for this kind and port count' : ''}, against ${formatEng(referenceOhm, 'resistance')}`;
}

/** "385 points from 10 kHz to 3 GHz" */
export function pointsText(frequencies: ArrayLike<number>): string {
  return `${frequencies.length} points from ${formatEng(frequencies[0], 'frequency')} to ${formatEng(frequencies[frequencies.length - 1], 'frequency')}`;
}

/** "0.37 dB rms in |Z| (at most 0.71 dB, at 24.8 MHz) and 0.45° rms in phase"; without `worstHz`, no place. */
export function missText(r: FitResidual, worstHz?: number): string {
  const at = worstHz !== undefined ? `, at ${formatEng(worstHz, 'frequency')}` : '';
  return `${r.rmsDb.toFixed(2)} dB rms in |Z| (at most ${r.maxDb.toFixed(2)} dB${at}) and ${r.rmsDeg.toFixed(2)}° rms in phase`;
}

/** The limit folio.yaml sets, in words. */
export function limitText(warnDb: number): string {
  return `${warnDb} dB rms (folio.yaml measurements: warn-above)`;
}

/** How a model without a parameter writes it: "absent (open)" for a parallel element, "absent (0)" for a series one. */
export function absentText(absence: string): string {
  return absence === 'open' ? 'absent (open)' : absence === 'zero' ? 'absent (0)' : '—';
}

/** Why a fit left a parameter out, in a short clause. */
export function leftOutShort(l: LeftOut): string {
  const where = l.strongest === 'low-end' ? '; a sweep starting lower would show it' : l.strongest === 'high-end' ? '; a sweep reaching higher would show it' : '';
  if (l.why === 'no-effect') return `no visible effect in the measured range${where}`;
  if (l.why === 'uncertain') return `too uncertain in this data${where}`;
  return `no better fit with it than the noise explains${where}`;
}

/** A relative difference to a tenth of a percent, with its sign: "+8.2%", "−66.7%", "0.0%". */
export function signedPercent(ratio: number): string {
  const text = Math.abs(ratio * 100).toFixed(1);
  return text === '0.0' ? '0.0%' : `${ratio > 0 ? '+' : '−'}${text}%`;
}

/** A file's opening comments as one quotation, or undefined when it has none: "Sample 3, bench fixture … (2 more comment lines in the file)". */
export function headerText(h: FileHeader): string | undefined {
  if (h.lines.length === 0) return undefined;
  const rest = h.more > 0 ? ` … (${h.more} more comment line${h.more === 1 ? '' : 's'} in the file)` : '';
  return h.lines.join(' ') + rest;
}
