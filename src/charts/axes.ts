// The axes charts share: a log axis over a range (frequency, time) with decade ticks, a log value axis with
// headroom over the data's extent, and a linear value axis at a round step. Each gives its domain, its ticks
// and its data-to-pixel map; the chart skeleton (xy-chart.ts) turns domain and ticks into parameters.

import { formatEng } from '../units/format.js';
import { linearAxis, logAxis, logTicks, paddedLogDomain, type AxisMap, type Ticks } from './scales.js';

/** Minimum distance between labelled ticks, px: about two label widths on x, one line on y. */
export const X_TICK_SPACING = 58;
export const Y_TICK_SPACING = 22;

/** At most this many decades on a log value axis; lower values leave the plot at the bottom. */
export const MAX_DECADES = 12;

export interface ChartAxis {
  domain: [number, number];
  ticks: Ticks;
  map: AxisMap;
}

/** A log axis over `[from, to]` exactly, with decade ticks labelled in `unit` (frequency: Hz, time: s). */
export function logRangeAxis(from: number, to: number, plotWidth: number, unit: string): ChartAxis {
  const domain: [number, number] = [from, to];
  return { domain, ticks: logTicks(domain, plotWidth, unit, X_TICK_SPACING), map: logAxis(domain, plotWidth) };
}

/** The frequency axis over `[from, to]` exactly, with decade ticks. */
export function frequencyAxis(fromHz: number, toHz: number, plotWidth: number): ChartAxis {
  return logRangeAxis(fromHz, toHz, plotWidth, 'Hz');
}

/** The frequency axis of a sweep. */
export function sweepAxis(frequencies: ArrayLike<number>, plotWidth: number): ChartAxis {
  return frequencyAxis(frequencies[0], frequencies[frequencies.length - 1], plotWidth);
}

/** A log value axis of whole decades holding `lo..hi` with a little headroom (see paddedLogDomain). */
export function logValueAxis(lo: number, hi: number, plotHeight: number, unit: string): ChartAxis {
  const domain = paddedLogDomain(lo, hi);
  return { domain, ticks: logTicks(domain, plotHeight, unit, Y_TICK_SPACING), map: logAxis(domain, plotHeight) };
}

/** 1, 2 or 5 × 10^k: the tick step nearest to `count` intervals over `span`. */
export function niceStep(span: number, count: number): number {
  const raw = span / count;
  const base = 10 ** Math.floor(Math.log10(raw));
  const m = raw / base;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * base;
}

/**
 * A linear value axis over `lo..hi` widened to whole steps of about `count` intervals, labelled in `unit`
 * (engineering notation), or as plain numbers with a true minus sign when `unit` is ''.
 */
export function linearValueAxis(lo: number, hi: number, plotHeight: number, unit: string, count: number): ChartAxis {
  const step = niceStep(hi - lo, count);
  const domain: [number, number] = [Math.floor(lo / step - 1e-9) * step, Math.ceil(hi / step + 1e-9) * step];
  const values: number[] = [];
  for (let k = Math.round(domain[0] / step); k * step <= domain[1] + step * 1e-9; k++) values.push(k * step);
  const labels = values.map((v) => (Math.abs(v) < step * 1e-9 ? `0${unit ? ' ' + unit : ''}` : unit ? formatEng(v, unit) : String(Number(v.toPrecision(3))).replace('-', '−')));
  return { domain, ticks: { values, labels, minor: [] }, map: linearAxis(domain, plotHeight) };
}
