// Titles and text alternatives of a rail plan's charts: the rail's impedance against its target, and the load
// step (the voltage, and each branch's share of the current). Screen readers read these; they are also the
// charts' captions in text-only views.

import { formatEng } from '../units/format.js';
import type { ChartText } from './chart-descriptions.js';

/** What the rail chart's description reads (the rail chart's data fits). */
export interface DescribedRail {
  rail?: string;
  frequencies: ArrayLike<number>;
  target: number | ArrayLike<number>;
  branches: readonly { label: string }[];
  peaks: readonly { frequencyHz: number; impedanceOhm: number }[];
  band: { fromHz: number; toHz: number } | null;
  /** The range of the rail's |Z| over nominal and its corners, when evaluated. */
  envelope?: { minOhm: ArrayLike<number>; maxOhm: ArrayLike<number>; corners: number } | null;
}

/** What the load-step charts' descriptions read (the charts' data extends it); SI units (s, V, A/A). */
export interface DescribedLoadStep {
  rail?: string;
  /** Ascending times after the step begins, s (all > 0). */
  timesS: ArrayLike<number>;
  budgetV: number;
  /** The settled deviation, V; null when the rail keeps falling. */
  finalV: number | null;
  riseS: number;
  stepA: number;
  droop: { atS: number; droopV: number };
  settleS: number | null;
  /** Each branch's share of the load current at each time. */
  branches: readonly { label: string; share: ArrayLike<number> }[];
}

/** Title and text alternative of a rail chart. */
export function describeRail(data: DescribedRail): ChartText {
  const n = data.frequencies.length;
  const name = data.rail ?? 'the rail';
  const target = typeof data.target === 'number' ? `the target ${formatEng(data.target, 'Ω')}` : 'its target (varying with frequency)';
  const peaks = [...data.peaks].sort((a, b) => a.frequencyHz - b.frequencyHz).map((p) => `${formatEng(p.impedanceOhm, 'Ω')} at ${formatEng(p.frequencyHz, 'Hz')}`);
  const band = data.band ? `The band ${formatEng(data.band.fromHz, 'Hz')} to ${formatEng(data.band.toHz, 'Hz')} is shaded. ` : '';
  return {
    title: `${name}: impedance against target`,
    description:
      `Log-log chart of the impedance |Z| of ${name} from ${formatEng(data.frequencies[0], 'Hz')} to ${formatEng(data.frequencies[n - 1], 'Hz')} against ${target}, ` +
      `with ${data.branches.length} branch curve${data.branches.length === 1 ? '' : 's'} (${data.branches.map((b) => b.label).join(', ')}). ` +
      band +
      (peaks.length > 0 ? `Peaks: ${peaks.join('; ')}.` : 'No peaks.') +
      envelopeText(data),
  };
}

/** " A tinted band … its highest point 56.4 mΩ at 14.9 MHz." or nothing. */
function envelopeText(data: DescribedRail): string {
  const e = data.envelope;
  if (!e || e.maxOhm.length === 0) return '';
  let top = 0;
  for (let i = 1; i < e.maxOhm.length; i++) if (e.maxOhm[i] > e.maxOhm[top]) top = i;
  return ` A tinted band behind the curves is the range of the rail's |Z| over nominal and ${e.corners.toLocaleString('en-GB')} corners of its parts' spreads; its highest point on the sweep is ${formatEng(e.maxOhm[top], 'Ω')} at ${formatEng(data.frequencies[top], 'Hz')}.`;
}

/** Titles and text alternatives of the two charts. */
export function describeLoadStep(data: DescribedLoadStep): { voltage: ChartText; share: ChartText } {
  const name = data.rail ?? 'the rail';
  const t = data.timesS;
  const span = `from ${formatEng(t[0], 's')} to ${formatEng(t[t.length - 1], 's')} after the step begins (log time axis)`;
  const final = data.finalV === null ? 'It has no DC path and keeps falling.' : `It settles at ${formatEng(data.finalV, 'V')}${data.settleS !== null ? `, within 10% by ${formatEng(data.settleS, 's')}` : ''}.`;
  return {
    voltage: {
      title: `${name}: voltage after a ${formatEng(data.stepA, 'A')} load step`,
      description:
        `The deviation of ${name} from its DC voltage ${span}, for a load current ramping by ${formatEng(data.stepA, 'A')} over ${formatEng(data.riseS, 's')}, ` +
        `against a budget of ±${formatEng(data.budgetV, 'V')}. The deepest dip is ${formatEng(data.droop.droopV, 'V')} at ${formatEng(data.droop.atS, 's')}. ${final}`,
    },
    share: {
      title: `${name}: who carries the load step`,
      description: `Each branch's share of the ${formatEng(data.stepA, 'A')} load current ${span}: ${data.branches.map((b) => `${b.label} ends at ${shareText(b.share[b.share.length - 1])}`).join('; ')}.`,
    },
  };
}

/** A share as a percentage to one decimal: "100%", "−0.1%", "0%". */
function shareText(x: number): string {
  const text = String(Number((x * 100).toFixed(1)));
  return `${text === '-0' ? '0' : text.replace('-', '−')}%`;
}
