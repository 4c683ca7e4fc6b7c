// Every word drawn on a chart: axis titles, key entries, notes in the plot and the labels beside marked
// points. The charts (src/charts) place them; their titles and text alternatives are in chart-descriptions.ts.

import { formatEng } from '../units/format.js';

export const AXIS_TITLE = {
  frequency: 'Frequency',
  impedance: 'Impedance |Z|',
  impedanceAndResistance: '|Z| and R',
  admittance: 'G and |B|',
  phase: 'Phase of Z',
  planeResistance: 'Resistance R (signed-log scale)',
  planeReactance: 'Reactance X (signed-log)',
  circleConductance: 'Conductance G',
  circleSusceptance: 'Susceptance B',
  time: 'Time after the load step begins (log scale)',
  deviation: 'Deviation from the DC voltage',
  share: 'Share of the load current',
} as const;

export const KEY_TEXT = {
  magnitude: '|Z|',
  resonance: 'resonance (X = 0)',
  conductance: 'G',
  susceptanceCapacitive: '|B|, B > 0 capacitive',
  susceptanceInductive: '|B|, B < 0 inductive',
  phase: 'phase of Z = R + jX',
  phaseResonance: 'resonance (0°)',
  /** Which side of 0° is which, when the plot has no room to say it beside the zero line. */
  phaseSides: 'above 0° inductive, below capacitive',
  path: 'Z = R + jX (arrows: rising f)',
  decade: 'decade of frequency',
  admittancePath: 'Y = G + jB, clockwise as f rises',
  /** Which half of the admittance circle is which, when the plot has no room to say it beside the zero line. */
  circleHalves: 'upper half capacitive (B > 0), lower inductive',
  resonanceAdmittance: 'SRF: G = 1/ESR',
  halfPower: 'half power, |X| = R',
  selfResonance: 'self-resonance (SRF)',
  railMagnitude: 'rail |Z|',
  peak: 'peak',
  peakOverTarget: 'peak above target',
  deepestDip: 'deepest dip',
  loadRamp: 'load ramp',
  now: 'now',
} as const;

/** Which sign of X means what, written beside a zero line (the phase chart's and the complex plane's). */
export const SIGN_NOTE = {
  phaseInductive: '↑ inductive (X > 0)',
  phaseCapacitive: '↓ capacitive (X < 0)',
  planeInductive: 'inductive (X > 0) ↑',
  planeCapacitive: 'capacitive (X < 0) ↓',
  circleCapacitive: 'capacitive (B > 0) ↑',
  circleInductive: 'inductive (B < 0) ↓',
} as const;

/** A half-power point on the admittance circle: its frequency. */
export function halfPowerLabel(frequencyHz: number): string {
  return formatEng(frequencyHz, 'Hz');
}

/** The resistance curve's key entry: a capacitor's R is its ESR. */
export function resistanceKeyText(behavesAs: string | undefined): string {
  return behavesAs === 'capacitor' ? 'R (ESR)' : 'R';
}

/** "rated |Z| 600 Ω at 100 MHz": a bead's rated point. */
export function ratedKeyText(impedanceOhm: number, frequencyHz: number): string {
  return `rated |Z| ${formatEng(impedanceOhm, 'Ω')} at ${formatEng(frequencyHz, 'Hz')}`;
}

/** "7.8 mΩ at 31.6 MHz": a peak or a marked point, beside it and in descriptions. */
export function pointText(impedanceOhm: number, frequencyHz: number): string {
  return `${formatEng(impedanceOhm, 'Ω')} at ${formatEng(frequencyHz, 'Hz')}`;
}

/** "band 100 kHz – 100 MHz": a rail's band in a key. */
export function bandKeyText(band: { fromHz: number; toHz: number }): string {
  return `band ${formatEng(band.fromHz, 'Hz')} – ${formatEng(band.toHz, 'Hz')}`;
}

/** "target 4.5 mΩ", or "target" when it varies with frequency. */
export function targetKeyText(target: number | undefined): string {
  return `target${target !== undefined ? ` ${formatEng(target, 'Ω')}` : ''}`;
}

/** "range of |Z| over the spread": a part's envelope in a key (corners, nominal and the values between). */
export function partSpreadKeyText(): string {
  return 'range of |Z| over the spread';
}

/** "range of rail |Z| over nominal and 1,024 corners": a rail's envelope in a key. */
export function railSpreadKeyText(corners: number): string {
  return `range of rail |Z| over nominal and ${corners.toLocaleString('en-GB')} corners`;
}

/** A decade mark on the complex plane: "1 MHz", or "1 kHz – 10 MHz" for decades drawn on one spot. */
export function decadeMarkText(fromHz: number, toHz: number): string {
  return fromHz === toHz ? formatEng(fromHz, 'Hz') : `${formatEng(fromHz, 'Hz')} – ${formatEng(toHz, 'Hz')}`;
}

/** Degrees with a true minus sign: "−90°", "0°", "90°" (the phase chart's ticks). */
export function degreesLabel(v: number): string {
  return `${v < 0 ? '−' : ''}${Math.abs(v)}°`;
}

/** The load step's key: the voltage curve, the budget, the final offset and the ramp. */
export const loadStepKey = {
  voltage: (stepA: number) => `v(t) for a ${formatEng(stepA, 'A')} step`,
  budget: (budgetV: number) => `budget ±${formatEng(budgetV, 'V')}`,
  final: (finalV: number) => `final ${formatEng(finalV, 'V')}`,
  ramp: (riseS: number) => `${KEY_TEXT.loadRamp}, ${formatEng(riseS, 's')}`,
};

/** "−14.5 mV at 1.37 µs": the deepest dip, beside it. */
export function dipLabel(droopV: number, atS: number): string {
  return `−${formatEng(droopV, 'V')} at ${formatEng(atS, 's')}`;
}

/** A before-and-after chart's key: the earlier curve, and a rail's targets then and now. */
export const changeKey = {
  before: (since: string) => `at ${since}`,
  targetBefore: (since: string, ohm: number) => `target at ${since} ${formatEng(ohm, 'Ω')}`,
  target: (ohm: number, since?: string) => `target ${since !== undefined ? `at ${since} ` : ''}${formatEng(ohm, 'Ω')}`,
};
