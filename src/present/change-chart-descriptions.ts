// Title and text alternative of a before-and-after chart (src/charts/change-chart.ts): what is drawn, the
// revision compared with, each curve's marks and a rail's targets.

import { formatEng } from '../units/format.js';
import type { ChartText } from './chart-descriptions.js';

interface DescribedCurve {
  marks: readonly { frequencyHz: number; impedanceOhm: number }[];
}

/** What the description reads: a ChangeChartData fits. */
export interface DescribedChange {
  subject: string;
  kind: 'part' | 'rail';
  since: string;
  before: DescribedCurve | null;
  after: DescribedCurve | null;
  target?: { before: number | null; after: number | null };
  markName: string;
}

/** Title and text alternative of a before-and-after chart. */
export function describeChange(data: DescribedChange): ChartText {
  const markText = (c: DescribedCurve | null) => (c && c.marks.length > 0 ? c.marks.map((m) => `${formatEng(m.impedanceOhm, 'Ω')} at ${formatEng(m.frequencyHz, 'Hz')}`).join(', ') : 'none');
  const what = data.kind === 'part' ? `part ${data.subject}` : `rail ${data.subject}`;
  const then = data.before ? `at ${data.since} (grey, dashed; ${data.markName}: ${markText(data.before)})` : `absent at ${data.since}`;
  const now = data.after ? `now (solid; ${data.markName}: ${markText(data.after)})` : 'absent now';
  const t = data.target;
  const target = t ? ` Target: ${t.before !== null ? `${formatEng(t.before, 'Ω')} at ${data.since}` : 'none'}, ${t.after !== null ? `${formatEng(t.after, 'Ω')} now` : 'none now'}.` : '';
  return {
    title: `${data.kind === 'part' ? data.subject : `Rail ${data.subject}`}: |Z| at ${data.since} and now`,
    description: `Log-log chart of the impedance magnitude |Z| of ${what}, ${then} and ${now}.${target}`,
  };
}
