// Axis domains and ticks, computed here rather than by vega so that every chart of a kind is drawn from the
// same rules, tick labels come from formatEng (the one formatter of the site), and the chart code knows the
// exact data-to-pixel mapping (for down-sampling, label placement and arrow directions).

import { formatEng } from '../units/format.js';

/** A one-dimensional mapping from data to px: `toPx(value)`. */
export interface AxisMap {
  domain: [number, number];
  rangePx: number;
  /** Pixel distance from the domain's low end; y callers flip it themselves. */
  toPx(value: number): number;
}

export interface Ticks {
  /** Labelled tick positions, in data units (ascending). */
  values: number[];
  labels: string[];
  /** Unlabelled grid positions between the labelled ones. */
  minor: number[];
}

const log10 = Math.log10;

/** floor(log10(x)) that does not slip below an exact power of ten. */
export function decadeOf(x: number): number {
  const d = Math.floor(log10(x));
  return 10 ** (d + 1) <= x * (1 + 1e-12) ? d + 1 : d;
}

/** The smallest power of ten ≤ lo and the largest ≥ hi: a log domain with whole decades. */
export function niceLogDomain(lo: number, hi: number): [number, number] {
  if (!(lo > 0) || !(hi > 0)) return [1, 10];
  let a = 10 ** decadeOf(lo);
  let b = 10 ** decadeOf(hi);
  if (b < hi * (1 - 1e-12)) b *= 10;
  if (a === b) {
    a /= 10;
    b *= 10;
  }
  return [a, b];
}

/** Headroom (a tenth of a decade) kept between the data and the plot's outline. */
const HEADROOM = 10 ** 0.1;

/**
 * A whole-decade log domain holding `lo..hi` with a little headroom, so that a curve never runs along the
 * plot's outline (a 1 kΩ resistor on a 10 Ω…1 kΩ axis would be hidden under it).
 */
export function paddedLogDomain(lo: number, hi: number): [number, number] {
  return niceLogDomain(lo / HEADROOM, hi * HEADROOM);
}

/**
 * Extent of the positive finite values of some arrays, at most `maxDecades` wide (the low end is raised
 * to meet it: curves that dive towards zero leave the plot at the bottom instead of squashing the rest).
 */
export function positiveExtent(arrays: ArrayLike<number>[], maxDecades: number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays) {
    for (let i = 0; i < a.length; i++) {
      const v = a[i];
      if (v > 0 && Number.isFinite(v)) {
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
    }
  }
  if (!(hi > 0)) return [1, 10];
  return [Math.max(lo, hi / 10 ** maxDecades), hi];
}

export function logAxis(domain: [number, number], rangePx: number): AxisMap {
  const l0 = log10(domain[0]);
  const span = log10(domain[1]) - l0;
  return { domain, rangePx, toPx: (v) => ((log10(v) - l0) / span) * rangePx };
}

export function linearAxis(domain: [number, number], rangePx: number): AxisMap {
  const span = domain[1] - domain[0];
  return { domain, rangePx, toPx: (v) => ((v - domain[0]) / span) * rangePx };
}

/**
 * Ticks of a log axis: labels at every `step`-th decade, where `step` keeps labels at least `minSpacingPx`
 * apart; minor grid at 2…9 × each decade when decades are wide enough to show it.
 */
export function logTicks(domain: [number, number], rangePx: number, unit: string, minSpacingPx: number): Ticks {
  const first = Math.ceil(log10(domain[0]) - 1e-9);
  const last = Math.floor(log10(domain[1]) + 1e-9);
  const decades = log10(domain[1] / domain[0]);
  const pxPerDecade = rangePx / decades;
  const step = Math.max(1, Math.ceil(minSpacingPx / pxPerDecade));
  const values: number[] = [];
  const labels: string[] = [];
  // Anchor the labelled decades on a multiple of `step` so neighbouring charts label the same decades.
  for (let d = Math.ceil(first / step) * step; d <= last; d += step) {
    const v = Number(`1e${d}`);
    values.push(v);
    labels.push(formatEng(v, unit));
  }
  const minor: number[] = [];
  const lo = domain[0] * (1 - 1e-12);
  const hi = domain[1] * (1 + 1e-12);
  if (pxPerDecade >= 40) {
    for (let d = first - 1; d <= last; d++) {
      for (let m = 2; m <= 9; m++) {
        const v = m * Number(`1e${d}`);
        if (v > lo && v < hi) minor.push(v);
      }
    }
  } else if (step > 1) {
    // Unlabelled decades still get a grid line.
    for (let d = first; d <= last; d++) if (d % step !== 0) minor.push(Number(`1e${d}`));
  }
  return { values, labels, minor };
}

/** Ticks of a linear axis at a fixed step, labelled with `label`. */
export function linearTicks(domain: [number, number], step: number, label: (v: number) => string): Ticks {
  const values: number[] = [];
  for (let k = Math.ceil(domain[0] / step - 1e-9); k * step <= domain[1] + 1e-9; k++) values.push(k * step);
  return { values, labels: values.map(label), minor: [] };
}

/**
 * Signed-log transform s(v) = sign(v)·log10(1 + |v|/c): linear within about ±c, logarithmic beyond, so a
 * quantity that changes sign and spans many decades can be read on one axis. With c a power of ten the
 * ticks at ±c·10^k sit (almost) one unit apart.
 */
export function signedLog(v: number, c: number): number {
  return Math.sign(v) * log10(1 + Math.abs(v) / c);
}

export function signedLogInverse(s: number, c: number): number {
  return Math.sign(s) * c * (10 ** Math.abs(s) - 1);
}

/**
 * Ticks of a signed-log axis, given in transformed units: 0, then ±c·10^k (k ≥ 0) inside the domain,
 * every `step`-th decade so labels stay `minSpacingPx` apart.
 */
export function signedLogTicks(domainS: [number, number], c: number, rangePx: number, unit: string, minSpacingPx: number): Ticks {
  const pxPerUnit = rangePx / (domainS[1] - domainS[0]);
  const step = Math.max(1, Math.ceil(minSpacingPx / pxPerUnit));
  const pairs: [number, string][] = [];
  const inside = (s: number) => s >= domainS[0] - 1e-9 && s <= domainS[1] + 1e-9;
  if (inside(0)) pairs.push([0, formatEng(0, unit)]);
  const minor: number[] = [];
  for (let k = 0; ; k++) {
    const v = c * 10 ** k;
    const s = signedLog(v, c);
    if (s > Math.max(Math.abs(domainS[0]), Math.abs(domainS[1])) + 1e-9) break;
    for (const sign of [1, -1]) {
      if (!inside(sign * s)) continue;
      // ±c sits only 0.3 units from 0: label it only when that leaves room.
      const labelled = k === 0 ? s * pxPerUnit >= minSpacingPx : k % step === 0;
      if (labelled) pairs.push([sign * s, formatEng(sign * v, unit)]);
      else minor.push(sign * s);
    }
  }
  pairs.sort((a, b) => a[0] - b[0]);
  return { values: pairs.map((p) => p[0]), labels: pairs.map((p) => p[1]), minor: minor.sort((a, b) => a - b) };
}
