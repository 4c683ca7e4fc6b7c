// The figures behind a part's safety cautions: the peak voltage its ratings allow, the energy it then holds,
// and the touch current a mains capacitor passes. Closed forms: a sine's peak is √2 times its r.m.s. value,
// E = ½·C·V², and an ideal capacitor passes I = 2π·f·C·V (any circuit-analysis text, e.g. Alexander &
// Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 6 and 9).

import type { VoltageRating } from '../model/voltage-rating.js';

/** A rating's peak voltage: an AC rating (r.m.s., sinusoidal) peaks at √2 times it; a DC rating is its peak. */
export function peakVolts(r: VoltageRating): number {
  return r.kind === 'AC' ? Math.SQRT2 * r.volts : r.volts;
}

/** The highest peak voltage the ratings allow, with the rating it comes from; undefined without a rating. */
export function ratedPeak(ratings: readonly VoltageRating[]): { volts: number; rating: VoltageRating } | undefined {
  let best: { volts: number; rating: VoltageRating } | undefined;
  for (const rating of ratings) {
    const volts = peakVolts(rating);
    if (!best || volts > best.volts) best = { volts, rating };
  }
  return best;
}

/** Energy a capacitance holds at a voltage: E = ½·C·V², J. */
export function storedEnergyJ(capacitanceF: number, volts: number): number {
  return 0.5 * capacitanceF * volts * volts;
}

/** Touch (leakage) current of a capacitance C at V r.m.s. and f: I = 2π·f·C·V, A. */
export function leakageCurrentA(capacitanceF: number, volts: number, frequencyHz: number): number {
  return 2 * Math.PI * frequencyHz * capacitanceF * volts;
}
