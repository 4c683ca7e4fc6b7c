// Every word zfolio says about spreads and corners, for pages, PDFs and the command line alike: what a
// corner is and leaves out, a part's spread in plain words, and a rail's two-line verdict.

import type { CornerFigures } from '../analysis/plan-corners.js';
import type { SpreadSummary } from '../analysis/summary.js';
import type { Part } from '../model/part.js';
import { isClass2Dielectric } from '../model/dielectric.js';
import { formatDecibels, formatEng, formatEngRange, formatPercent } from '../units/format.js';
import { NOMINAL_DIMENSION } from '../units/quantity.js';
import { formatCelsius } from '../units/temperature.js';

/** What a corner is and what it leaves out, for a rail (one sentence). */
export function railCornerSentence(temperature: { fromC: number; toC: number }): string {
  return `A corner puts every placed part at the low or the high end of its spread at once — its tolerance, its temperature change over ${celsiusSpan(temperature)} and its DC bias at the rail voltage — and leaves out ageing, which the maker's data must cover (class 2 ceramics lose a few percent of their capacitance per decade of hours, common practice).`;
}

/**
 * What a part's corners are and what they leave out (one sentence), in the terms that apply to it: DC bias
 * only for a part whose value a rail plan moves with its voltage (a DC-bias table or a class 2 dielectric),
 * and the usual ageing of class 2 ceramics only for one.
 */
export function partCornerSentence(temperature: { fromC: number; toC: number }, part: Pick<Part, 'dielectric' | 'dcBias'>): string {
  const class2 = part.dielectric !== undefined && isClass2Dielectric(part.dielectric);
  const leftOut = class2 || part.dcBias.length > 0 ? 'without DC bias (a rail plan applies it at its voltage) and without ageing' : 'without ageing';
  const ageing = class2 ? ' (class 2 ceramics lose a few percent of their capacitance per decade of hours, common practice)' : '';
  return `The spread is the model evaluated at every combination of the low and high end of each quantity that moves — tolerance and temperature change over ${celsiusSpan(temperature)} multiplied, and each parasitic's stated spread — ${leftOut}, which the maker's data must cover${ageing}.`;
}

export function celsiusSpan(t: { fromC: number; toC: number }): string {
  return `${formatCelsius(t.fromC)} to ${formatCelsius(t.toC)}`;
}

/** "±10%", "+80%/−20%". */
export function boundsText(b: { minus: number; plus: number }): string {
  return b.minus === b.plus ? `±${formatPercent(b.minus)}` : `+${formatPercent(b.plus)}/−${formatPercent(b.minus)}`;
}

/** "−15% … +15%": a change as fractions, signed. */
export function changeText(c: { low: number; high: number }): string {
  const signed = (x: number) => (x === 0 ? '0%' : `${x < 0 ? '−' : '+'}${formatPercent(Math.abs(x))}`);
  return `${signed(c.low)} … ${signed(c.high)}`;
}

/** Where the temperature change comes from, in words: "X7R, EIA-198 class 2, specified −55 °C to 125 °C". */
export function temperatureSourceText(part: Part): string | undefined {
  const t = part.spread.temperature;
  if (!t) return undefined;
  if (t.kind === 'range') return t.from === 'dielectric' ? `${t.code}, EIA-198 class 2, specified ${formatCelsius(t.fromC)} to ${formatCelsius(t.toC)}` : `as the part states, ${formatCelsius(t.fromC)} to ${formatCelsius(t.toC)}`;
  const ppm = (x: number) => `${x < 0 ? '−' : ''}${Number((Math.abs(x) * 1e6).toPrecision(4))}`;
  const coefficient =
    t.lowPerK === t.highPerK ? `${ppm(t.lowPerK)} ppm/K` : t.lowPerK === -t.highPerK ? `±${ppm(t.highPerK)} ppm/K` : `${ppm(t.lowPerK)} to ${ppm(t.highPerK)} ppm/K`;
  return t.from === 'dielectric' ? `${t.code}, EIA-198 class 1, ${coefficient} from 25 °C` : `tc ${coefficient} from 25 °C`;
}

/**
 * The line of a part's spread: "10 µF ±10%, −15% … +15% over −55 °C to 125 °C (X7R, EIA-198 class 2,
 * specified −55 °C to 125 °C): 7.65 µF to 12.7 µF".
 */
export function valueSpreadText(part: Part, s: SpreadSummary): string | undefined {
  if (!part.behavesAs || part.nominal === undefined) return undefined;
  const unit = NOMINAL_DIMENSION[part.behavesAs];
  const pieces = [formatEng(part.nominal, unit)];
  if (s.tolerance) pieces.push(boundsText(s.tolerance));
  let text = pieces.join(' ');
  if (s.temperatureChange) text += `, ${changeText(s.temperatureChange)} over ${celsiusSpan(s.temperature)} (${temperatureSourceText(part)})`;
  // As many digits as tell the two ends apart: a C0G's ±0.135% would read "3.3 pF to 3.3 pF" at three.
  if (s.nominalValue) text += `: ${formatEngRange(s.nominalValue.min, s.nominalValue.max, unit).join(' to ')}`;
  return text;
}

/** "esr +50%/−30%, esl ±10%": the parasitic spreads, or undefined. */
export function parasiticSpreadText(s: SpreadSummary): string | undefined {
  const parasitics = s.factors.filter((f) => f.quantity !== 'value');
  if (parasitics.length === 0) return undefined;
  return parasitics.map((f) => `${f.quantity.toUpperCase()} ${boundsText({ minus: 1 - f.low, plus: f.high - 1 })}`).join(', ');
}

/** "SRF 21.5 MHz to 26.4 MHz", "band top 6.5 MHz to 8 MHz" over the corners. */
export function spreadFigureTexts(s: SpreadSummary): { srf?: string; bandTop?: string; bandBottom?: string; corners: string } {
  // Figures the spread does not move (a bead's resonance under its rating's spread) print once.
  const span = (r: { min: number; max: number }) => (Math.abs(r.max / r.min - 1) < 1e-9 ? `${formatEng(r.min, 'Hz')}, the same at each corner` : formatEngRange(r.min, r.max, 'Hz').join(' to '));
  const band = s.usableBand;
  return {
    srf: s.srfHz ? span(s.srfHz) : undefined,
    bandTop: band ? span(band.toHz) : undefined,
    bandBottom: band ? span(band.fromHz) : undefined,
    corners: `${s.corners} corner${s.corners === 1 ? '' : 's'} (every combination of ${s.factors.map((f) => (f.quantity === 'value' ? 'the value' : f.quantity.toUpperCase())).join(', ')} at its low and high end)`,
  };
}

/** "ORV-C-A high, ORV-C-B low, ORV-C-B ESR low". */
export function extremesText(c: CornerFigures): string {
  const parts = Object.entries(c.extremes).map(([id, side]) => `${id} ${side}`);
  for (const [id, byQuantity] of Object.entries(c.parasiticExtremes)) for (const [q, side] of Object.entries(byQuantity)) parts.push(`${id} ${q.toUpperCase()} ${side}`);
  return parts.join(', ');
}

/** How the corners were chosen: "all 16 corners of 4 parts' spreads" or the sample. */
export function cornerMethodText(c: CornerFigures): string {
  const over = `over ${celsiusSpan(c.temperature)}`;
  switch (c.method) {
    case 'none':
      return 'no part placed here states a tolerance, temperature characteristic or parasitic spread';
    case 'all':
      return `all ${c.evaluated.toLocaleString('en-GB')} corners of ${c.factors.length} moving quantit${c.factors.length === 1 ? 'y' : 'ies'}, ${over}`;
    case 'sample':
      return `${c.evaluated.toLocaleString('en-GB')} of the 2^${c.factors.length} corners of ${c.factors.length} moving quantities: a random sample (seed ${c.seed}) with the all-low and all-high corners, ${over}`;
  }
}

/** The verdict line of the worst corner: "PASS  worst margin +0.22 dB at 14.7 MHz with … (all 16 corners …)". */
export function cornerVerdictText(c: CornerFigures): string {
  if (c.method === 'none') return `same as nominal: ${cornerMethodText(c)}`;
  const verdict = c.pass ? 'PASS' : `FAIL (${c.failing} of ${c.evaluated} corners miss the target)`;
  return `${verdict}  worst margin ${formatDecibels(c.worstMarginDb)} at ${formatEng(c.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(c.worstImpedanceOhm, 'Ω')}) with ${extremesText(c)}; ${cornerMethodText(c)}`;
}

/** One word for a review cover or an index: "PASS", "FAIL", or "—" without corners. */
export function cornerVerdictWord(c: CornerFigures | null): string {
  if (!c || c.method === 'none') return '—';
  return c.pass ? 'PASS' : 'FAIL';
}

/** A rail's worst corner as a page states it: the verdict word, the text after it, and how it was found. */
export interface CornerVerdictWords {
  pass: boolean;
  status: string;
  verdict: string;
  method: string;
  sentence: string;
}

/** The worst-corner line of a plan page, a plans index, a review and a pack's cover. */
export function cornerVerdictWords(c: CornerFigures, nominalPass: boolean, empty: boolean): CornerVerdictWords {
  const method = `${cornerMethodText(c)[0].toUpperCase()}${cornerMethodText(c).slice(1)}.`;
  const sentence = railCornerSentence(c.temperature);
  if (empty) return { pass: false, status: 'FAIL', verdict: 'nothing is on the rail yet', method, sentence };
  if (c.method === 'none') return { pass: nominalPass, status: nominalPass ? 'PASS' : 'FAIL', verdict: 'as nominal: no placed part states a spread', method, sentence };
  const failing = c.pass ? '' : `; ${c.failing} of ${c.evaluated.toLocaleString('en-GB')} corners miss the target`;
  return {
    pass: c.pass,
    status: c.pass ? 'PASS' : 'FAIL',
    verdict: `worst margin ${formatDecibels(c.worstMarginDb)} at ${formatEng(c.worstFrequencyHz, 'Hz')} (|Z| ${formatEng(c.worstImpedanceOhm, 'Ω')}) with ${extremesText(c)}${failing}`,
    method,
    sentence,
  };
}
