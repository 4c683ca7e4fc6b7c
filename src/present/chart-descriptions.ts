// Titles and text alternatives of a part's charts: what is plotted, on which axes, and the figures a reader
// would take from the picture (end values, extremes, resonances, the band). Screen readers read these; they
// are also the charts' captions in text-only views.

import type { UsableBand } from '../analysis/band.js';
import type { Resonance } from '../analysis/resonance.js';
import type { ImpedanceFigures } from '../circuit/quantities.js';
import { formatDegrees, formatEng, formatPercent } from '../units/format.js';
import { bandCaption, bandRange } from './band-words.js';
import { resonanceLabel } from './resonance-words.js';

export type PartChartKind = 'impedance' | 'phase' | 'plane' | 'admittance';

/** A chart's title and its text alternative (the finished SVG's <title> and <desc>). */
export interface ChartText {
  title: string;
  description: string;
}

/** What a part's chart descriptions read: a PartAnalysis fits. */
export interface DescribedPart {
  part: { id: string; behavesAs?: string };
  frequencies: Float64Array;
  /** The columns over `frequencies` (src/circuit/quantities.ts). */
  columns: Pick<ImpedanceFigures, 'resistanceOhm' | 'reactanceOhm' | 'magnitudeOhm' | 'phaseDeg' | 'conductanceS'>;
  resonances: readonly Resonance[];
  selfResonance?: Resonance;
  usableBand: UsableBand | null;
  within?: number;
  /** The range of |Z| over the part's spread, when it has one. */
  spread?: { min: ArrayLike<number>; max: ArrayLike<number> } | null;
}

/** The tinted band of the |Z| chart in words, or nothing. */
function spreadText(input: DescribedPart): string {
  const s = input.spread;
  if (!s || s.min.length === 0) return '';
  let widest = 0;
  for (let i = 0; i < s.min.length; i++) if (s.min[i] > 0 && s.max[i] / s.min[i] > widest) widest = s.max[i] / s.min[i];
  return ` A tinted band behind the curves is the range of |Z| over the part's spread (tolerance, temperature and parasitic spreads); where it is widest, its greatest |Z| is ${Number(widest.toPrecision(3))} times its least.`;
}

function sweepText(input: DescribedPart): string {
  const f = input.frequencies;
  return `${formatEng(f[0], 'Hz')} to ${formatEng(f[f.length - 1], 'Hz')}`;
}

function resonanceText(input: DescribedPart): string {
  if (input.resonances.length === 0) return 'No resonance in the sweep.';
  const list = input.resonances.map((r) => `${resonanceLabel(r, input.selfResonance)} (${r.type}, |Z| = ${formatEng(r.impedanceOhm, 'Ω')})`);
  return `Resonances: ${list.join('; ')}.`;
}

function bandText(input: DescribedPart): string {
  return input.usableBand ? `Shaded: ${bandCaption(input.part.behavesAs, input.within)}, ${bandRange(input.usableBand)}.` : 'No usable band in the sweep.';
}

/** Index and value of the least and greatest of `n` values. */
function extremes(n: number, value: (i: number) => number): { min: number; minAt: number; max: number; maxAt: number } {
  let min = Infinity;
  let max = -Infinity;
  let minAt = 0;
  let maxAt = 0;
  for (let i = 0; i < n; i++) {
    const v = value(i);
    if (v < min) [min, minAt] = [v, i];
    if (v > max) [max, maxAt] = [v, i];
  }
  return { min, minAt, max, maxAt };
}

/** Title and text alternative of one of a part's charts; `planeConstant` is the complex-plane chart's c. */
export function describePartChart(kind: PartChartKind, input: DescribedPart, planeConstant?: number): ChartText {
  const id = input.part.id;
  const f = input.frequencies;
  const n = f.length;
  const { resistanceOhm: re, reactanceOhm: im, magnitudeOhm, phaseDeg, conductanceS } = input.columns;
  const at = (i: number) => formatEng(f[i], 'Hz');
  switch (kind) {
    case 'impedance': {
      const m = (i: number) => magnitudeOhm[i];
      const e = extremes(n, m);
      return {
        title: `${id}: impedance |Z| and resistance R against frequency`,
        description:
          `Log-log chart of |Z| and R of ${id} from ${sweepText(input)}. ` +
          `|Z| is ${formatEng(m(0), 'Ω')} at ${at(0)} and ${formatEng(m(n - 1), 'Ω')} at ${at(n - 1)}; ` +
          `least ${formatEng(e.min, 'Ω')} near ${at(e.minAt)}, greatest ${formatEng(e.max, 'Ω')} near ${at(e.maxAt)}. ` +
          `R is ${formatEng(re[0], 'Ω')} at ${at(0)} and ${formatEng(re[n - 1], 'Ω')} at ${at(n - 1)}. ` +
          `${resonanceText(input)} ${bandText(input)}${spreadText(input)}`,
      };
    }
    case 'phase': {
      const p = (i: number) => phaseDeg[i];
      return {
        title: `${id}: phase of the impedance against frequency`,
        description:
          `Phase of Z for ${id} on a log frequency axis from ${sweepText(input)}, from −90° (capacitive) to +90° (inductive), with the 0° line. ` +
          `The phase is ${formatDegrees(p(0))} at ${at(0)} and ${formatDegrees(p(n - 1))} at ${at(n - 1)}; it crosses 0° at each resonance. ` +
          `${resonanceText(input)} ${bandText(input)}`,
      };
    }
    case 'plane': {
      if (planeConstant === undefined) throw new RangeError('the complex-plane chart is described with its signed-log constant');
      const c = planeConstant;
      const side = (x: number) => (x < 0 ? 'capacitive' : x > 0 ? 'inductive' : 'resistive');
      return {
        title: `${id}: path of Z = R + jX in the complex plane`,
        description:
          `Complex-plane path of the impedance of ${id} as frequency rises from ${sweepText(input)}: resistance R across, reactance X up. ` +
          `Both axes use a signed-log scale, sign(v)·log10(1 + |v|/c) with c = ${formatEng(c, 'Ω')}, linear within about ±${formatEng(c, 'Ω')} and logarithmic beyond. ` +
          `Dots mark each decade of frequency, arrowheads the direction of rising frequency. ` +
          `The path starts at R = ${formatEng(re[0], 'Ω')}, X = ${formatEng(im[0], 'Ω')} (${side(im[0])}) and ends at R = ${formatEng(re[n - 1], 'Ω')}, X = ${formatEng(im[n - 1], 'Ω')} (${side(im[n - 1])}), ` +
          `crossing X = 0 at each resonance. ${resonanceText(input)}`,
      };
    }
    case 'admittance': {
      const g = extremes(n, (i) => conductanceS[i]);
      return {
        title: `${id}: admittance G and B against frequency`,
        description:
          `Log-log chart of the admittance Y = 1/Z = G + jB of ${id} from ${sweepText(input)}: conductance G and the magnitude of the susceptance |B|, ` +
          `solid where B > 0 (capacitive) and dashed where B < 0 (inductive); |B| drops to zero at each resonance. ` +
          `G is greatest, ${formatEng(g.max, 'S')}, near ${at(g.maxAt)} and least, ${formatEng(g.min, 'S')}, near ${at(g.minAt)}. ` +
          `${resonanceText(input)} ${bandText(input)}`,
      };
    }
  }
}

/** Title and text alternative of a comparison; `title` is the comparison's own title when it has one. */
export function describeComparison(parts: readonly Pick<DescribedPart, 'part' | 'frequencies' | 'selfResonance'>[], title?: string): ChartText {
  const from = Math.min(...parts.map((p) => p.frequencies[0]));
  const to = Math.max(...parts.map((p) => p.frequencies[p.frequencies.length - 1]));
  const each = parts.map((p) => `${p.part.id} (${p.selfResonance ? `SRF ${formatEng(p.selfResonance.frequencyHz, 'Hz')}, |Z| ${formatEng(p.selfResonance.impedanceOhm, 'Ω')} there` : 'no SRF in the sweep'})`);
  return {
    title: title ?? `Impedance |Z| of ${parts.length} parts compared`,
    description:
      `Log-log chart of the impedance magnitude |Z| of ${parts.length} parts on common axes, ${formatEng(from, 'Hz')} to ${formatEng(to, 'Hz')}; ` +
      `each part has its own colour and dash pattern, its self-resonance marked by a dot. Parts: ${each.join('; ')}.`,
  };
}

/**
 * Title and text alternative of a capacitor's complex-plane chart, drawn as its admittance circle; `halfPower`
 * is [f1, f2] around the SRF when the sweep holds both.
 */
export function describeAdmittanceCircle(input: DescribedPart, halfPower: [number, number] | null): ChartText {
  const id = input.part.id;
  const srf = input.selfResonance;
  const circle = srf
    ? `At the SRF, ${formatEng(srf.frequencyHz, 'Hz')}, it reaches the circle's rightmost point, G = 1/ESR = ${formatEng(1 / srf.impedanceOhm, 'S')} (ESR ${formatEng(srf.impedanceOhm, 'Ω')}), the circle's diameter. `
    : 'The sweep holds no self-resonance, so the path is an arc of the circle. ';
  const q = srf && halfPower
    ? `The half-power points, where |X| = R and so |B| = G (the top and bottom of the circle), are at ${formatEng(halfPower[0], 'Hz')} and ${formatEng(halfPower[1], 'Hz')}: Q = f0/(f2 − f1) = ${formatNumber3(srf.frequencyHz / (halfPower[1] - halfPower[0]))}. `
    : '';
  return {
    title: `${id}: admittance Y = G + jB in the complex plane (the resonance circle)`,
    description:
      `Complex-plane path of the admittance Y = 1/Z = G + jB of ${id} as frequency rises from ${sweepText(input)}: conductance G across, susceptance B up, both linear. ` +
      `A capacitor's model is a series resonance with a nearly constant ESR, so its impedance path would be a vertical line; its admittance traces a circle through the origin instead, ` +
      `from near the origin above the axis (capacitive, B > 0) clockwise round to the origin below it (inductive, B < 0). ${circle}${q}Dots mark each decade of frequency.`,
  };
}

function formatNumber3(x: number): string {
  return Number(x.toPrecision(3)).toString();
}
