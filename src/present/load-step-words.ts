// Everything zfolio says in words about a rail's load step: the verdict line, the facts of the plan page and
// the lines `zfolio plan` prints. One place, so the page, the review pack and the command line agree.

import type { LoadStepFigures } from '../analysis/load-step.js';
import type { PlanFigures } from '../analysis/plan-figures.js';
import { formatEng, formatPercent } from '../units/format.js';
import type { Row } from './row.js';

type Figures = Pick<PlanFigures, 'transient' | 'target' | 'voltageV' | 'targetOhm'>;

/** "PASS", "FAIL", "NO VERDICT" (not computed to its accuracy), or null when there is no load step. */
export function loadStepStatus(f: Figures): 'PASS' | 'FAIL' | 'NO VERDICT' | null {
  const t = f.transient;
  if (!t) return null;
  return !t.resolved ? 'NO VERDICT' : t.pass ? 'PASS' : 'FAIL';
}

/** Why there is no load step: a plan with an explicit target and no step. */
export const NO_LOAD_STEP = 'no load step: the plan gives its target without a step current';

/** "dips 14.5 mV at 1.37 µs (budget 27 mV), settles by 11.4 µs": what the PASS or FAIL beside it rests on. */
export function loadStepVerdict(f: Figures): string {
  const t = f.transient;
  if (!t) return NO_LOAD_STEP;
  if (!t.resolved) return `not computed: the rail's element values lie too far apart for its poles to be found to the method's accuracy (the impedance fit misses by ${t.fitError.toExponential(1)}); check the plan's values`;
  const dip = `dips ${formatEng(t.droopV, 'V')} at ${formatEng(t.atS, 's')} (budget ${formatEng(t.budgetV, 'V')})`;
  if (!t.dcPath) return `${dip} and keeps falling: no DC path holds the rail (no regulator, or its offset exceeds the rail voltage)`;
  const over = t.overshootV > t.budgetV ? `, rises ${formatEng(t.overshootV, 'V')} above it at ${formatEng(t.overshootAtS ?? NaN, 's')}` : '';
  return `${dip}${over}, ${settleText(t)}`;
}

function settleText(t: LoadStepFigures): string {
  return t.settleS === null ? `not settled within the ${formatEng(t.durationS, 's')} followed` : `settles by ${formatEng(t.settleS, 's')}`;
}

/** "27 mV = 0.9 V × 3%" or "25 mV = 10 mΩ × 2.5 A". */
export function budgetText(f: Figures): string {
  const t = f.transient;
  if (!t) return '';
  const how = f.target.kind === 'ripple' ? `${formatEng(f.voltageV, 'V')} × ${formatPercent(f.target.ripple)}` : `${formatEng(f.targetOhm, 'Ω')} × ${formatEng(t.stepA, 'A')}`;
  return `${formatEng(t.budgetV, 'V')} = ${how}`;
}

/** The rows of the plan page's load-step table. */
export function loadStepFacts(f: Figures): Row[] {
  const t = f.transient;
  if (!t || !t.resolved) return [];
  const rows: Row[] = [
    { label: 'Load step', value: `${formatEng(t.stepA, 'A')}, ramped over ${formatEng(t.riseS, 's')}`, note: t.riseFrom === 'band' ? 'rise time 0.35 / band top (common practice)' : 'rise time from the plan' },
    { label: 'Ripple budget', value: budgetText(f), note: 'either way from the DC value' },
    { label: 'Deepest dip', value: `${formatEng(t.droopV, 'V')} at ${formatEng(t.atS, 's')}`, note: `${formatPercent(t.droopV / t.budgetV)} of the budget` },
    { label: 'Highest rise', value: t.overshootAtS === null ? 'none above the DC value' : `${formatEng(t.overshootV, 'V')} at ${formatEng(t.overshootAtS, 's')}`, note: 'a release of the load dips this far' },
  ];
  if (t.dcPath) {
    rows.push({ label: 'Final offset', value: formatEng(t.finalV ?? NaN, 'V'), note: '−R·ΔI of the DC path' });
    rows.push({ label: 'Settling', value: t.settleS === null ? `not within ${formatEng(t.durationS, 's')}` : formatEng(t.settleS, 's'), note: 'last time the deviation from its final value exceeds 10% of its largest' });
  } else {
    rows.push({ label: 'Final offset', value: 'none: the rail keeps falling', note: 'no DC path holds it (no regulator, or its offset exceeds the rail voltage)' });
  }
  rows.push({ label: 'Followed for', value: formatEng(t.durationS, 's'), note: t.durationFrom === 'plan' ? 'duration from the plan' : 'until the slowest significant pole has decayed' });
  return rows;
}

/** The lines `zfolio plan` prints under "load step". */
export function loadStepLines(f: Figures): string[] {
  const t = f.transient;
  const status = loadStepStatus(f);
  if (!t || !status) return [NO_LOAD_STEP];
  const lines = [`${status}  ${loadStepVerdict(f)}`];
  if (!t.resolved) return lines;
  lines.push(`step ${formatEng(t.stepA, 'A')} over ${formatEng(t.riseS, 's')}${t.riseFrom === 'band' ? ' (0.35 / band top)' : ''}, budget ${budgetText(f)}`);
  const rise = t.overshootAtS === null ? 'no rise above the DC value' : `highest rise ${formatEng(t.overshootV, 'V')} at ${formatEng(t.overshootAtS, 's')}`;
  const final = t.dcPath ? `final offset ${formatEng(t.finalV ?? NaN, 'V')}` : 'no final value';
  lines.push(`${rise}, ${final}, followed for ${formatEng(t.durationS, 's')}`);
  return lines;
}

/** How the response was found, for the page: the method and its checked accuracy. */
export function loadStepMethod(f: Figures): string {
  const t = f.transient;
  if (!t || !t.resolved) return '';
  return (
    'Computed exactly for the same linear rail model as the impedance: its impedance Z(s) written in partial fractions on its ' +
    'natural frequencies, and each term\'s response to the ramp in closed form, so nanosecond ringing and microsecond settling ' +
    `are both resolved. The partial fractions reproduce Z(jω) to ${t.fitError.toExponential(0).replace('-', '−')} (relative, largest). ` +
    'The voltage scale is linear, the time scale logarithmic.'
  );
}

/** The caution the load step adds to a plan page. */
export const LOAD_STEP_CAUTION =
  'The load step uses the same model: the regulator is its output R + L, without its control loop, so what happens after the loop responds (about the inverse of the band\'s lower edge) is the model\'s, not the regulator\'s; the load is one linear ramp. Measure the rail\'s response to a real load step before relying on it.';
