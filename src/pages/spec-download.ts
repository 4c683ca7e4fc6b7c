// A part's downloads hold its sweep once: sweep.csv, at SWEEP_CSV_DIGITS significant digits, and chart specs
// whose curves read that file by relative URL instead of carrying the points. A spec so written opens in any
// vega-lite tool that can read the file beside it (offline too): its curves are drawn from every sweep point,
// while the page's SVG is drawn from the same points thinned in screen space. Axes, ticks, labels, the band,
// envelopes and the key stay written into the spec: they are the chart's own, not the sweep's.

import { SWEEP_COLUMNS } from '../analysis/sweep-table.js';

/**
 * Significant digits of every value in a part's sweep.csv. The page's figures are given to 3 or 4 digits
 * (band edges to as many as their width needs, from the analysis itself, not from the file) and a chart
 * resolves about 1 part in 1,000 of its height; 6 digits keep the file's R and X within 5 parts in 10^7 of
 * the model's, so anything derived from the file agrees with the page well below what it shows.
 */
export const SWEEP_CSV_DIGITS = 6;

export const SWEEP_CSV = 'sweep.csv';

type Json = Record<string, unknown>;

/** The CSV as vega-lite reads it: every column a number (an empty cell is null). */
const CSV_DATA: Json = { url: SWEEP_CSV, format: { type: 'csv', parse: Object.fromEntries(SWEEP_COLUMNS.map(([header]) => [header, 'number'])) } };

/** Log axes take positive values only; anything else breaks the line, as a gap does on the page. */
const POSITIVE = (field: string) => ({ calculate: `datum.${field} > 0 ? datum.${field} : null`, as: field });
const FREQUENCY = [
  { calculate: 'datum.frequency_Hz', as: 'f' },
  // The curve layers order their points by "i": in a sweep, frequency order.
  { calculate: 'datum.frequency_Hz', as: 'i' },
];

/**
 * For each part chart whose curves are columns of the sweep: the transforms that turn the CSV's rows into
 * the curve rows the chart's layer reads ({f, v, s, i} and, for admittance, the run "g"), series named as
 * the chart names them. The complex-plane chart draws Z on a compressed scale of its own and keeps its
 * points in the spec.
 */
const CURVES_FROM_SWEEP: Readonly<Record<string, Json[]>> = {
  impedance: [...FREQUENCY, { fold: ['Zmag_ohm', 'R_ohm'], as: ['column', 'v'] }, { calculate: "datum.column === 'Zmag_ohm' ? 'mag' : 'res'", as: 's' }, POSITIVE('v')],
  phase: [...FREQUENCY, { calculate: 'datum.phase_deg', as: 'v' }, { calculate: "'phase'", as: 's' }],
  admittance: [
    ...FREQUENCY,
    // G, and |B| as two series by the sign of B (capacitive where B > 0), each absent where B has the other sign.
    { calculate: 'datum.B_S > 0 ? datum.B_S : null', as: 'bc' },
    { calculate: 'datum.B_S < 0 ? -datum.B_S : null', as: 'bl' },
    { calculate: 'datum.G_S', as: 'g' },
    { fold: ['g', 'bc', 'bl'], as: ['s', 'v'] },
    POSITIVE('v'),
    { calculate: "datum.s === 'g' ? 0 : datum.s === 'bc' ? 1 : 2", as: 'g' },
  ],
};

/** Whether a chart of this key reads its curves from the sweep CSV when downloaded. */
export function readsSweep(key: string): boolean {
  return Object.hasOwn(CURVES_FROM_SWEEP, key);
}

/**
 * The spec offered for download: for a part chart whose curves are sweep columns, every layer reading the
 * "curves" dataset reads sweep.csv through the chart's transforms instead, and the dataset is dropped.
 * Other specs are returned as they are.
 */
export function downloadSpec(key: string, spec: object): object {
  const transforms = CURVES_FROM_SWEEP[key];
  if (!transforms) return spec;
  let replaced = 0;
  const visit = (node: unknown): unknown => {
    if (Array.isArray(node)) return node.map(visit);
    if (!node || typeof node !== 'object') return node;
    const layer = node as Json;
    const data = layer.data as Json | undefined;
    if (data && data.name === 'curves') {
      replaced++;
      return { ...layer, data: CSV_DATA, transform: [...transforms, ...((layer.transform as Json[] | undefined) ?? [])] };
    }
    return Array.isArray(layer.layer) ? { ...layer, layer: visit(layer.layer) } : layer;
  };
  const s = visit(spec) as Json;
  // A chart kind whose curve layer is named otherwise would keep its points: say so rather than write a spec without them.
  if (replaced === 0) throw new Error(`chart "${key}": no layer reads the "curves" dataset to point at ${SWEEP_CSV}`);
  const { curves: _dropped, ...datasets } = (s.datasets ?? {}) as Record<string, unknown>;
  return { ...s, datasets };
}
