// A part's downloads hold its sweep once: sweep.csv, the independent columns only (frequency, R and X, at
// SWEEP_CSV_DIGITS significant digits). Everything else a part chart draws is a closed form of R and X
// (|Z| = √(R² + X²), phase = atan2(X, R), G = R/|Z|², B = −X/|Z|²), so the chart specs offered for download
// compute it with vega-lite `calculate` transforms instead of reading it from the file. Those specs are the
// same for every part: one file per chart at the site's top (`assets/specs/`), not a copy in every part
// folder, reading "sweep.csv" by relative URL, so saved beside any part's sweep.csv they open in a vega-lite
// tool, offline too. They draw the curves with vega-lite's own axes; the page's charts (and the PDF's) keep
// what is drawn for one part only: its usable band, spread, resonance labels and key.

/** Significant digits of every value in a part's sweep.csv (README, "What the folio holds", says why 6). */
export const SWEEP_CSV_DIGITS = 6;

export const SWEEP_CSV = 'sweep.csv';

/** Where the shared chart specs live, from the site's top. */
export const SPEC_FOLDER = 'assets/specs';

type Json = Record<string, unknown>;

/** The CSV as vega-lite reads it: every column a number. */
const CSV_DATA: Json = { url: SWEEP_CSV, format: { type: 'csv', parse: { frequency_Hz: 'number', R_ohm: 'number', X_ohm: 'number' } } };

/** The columns a part chart draws, from R and X (closed forms; see the top of this file). */
const DERIVED: Json[] = [
  { calculate: 'datum.R_ohm * datum.R_ohm + datum.X_ohm * datum.X_ohm', as: 'Zsq' },
  { calculate: 'sqrt(datum.Zsq)', as: 'Zmag_ohm' },
  { calculate: 'atan2(datum.X_ohm, datum.R_ohm) * 180 / PI', as: 'phase_deg' },
  { calculate: 'datum.R_ohm / datum.Zsq', as: 'G_S' },
  { calculate: '-datum.X_ohm / datum.Zsq', as: 'B_S' },
];

/** Axis labels with an SI prefix and the unit, "10 kHz", "100 mΩ" (d3-format's "~s", which vega's format uses). */
function siLabels(unit: string): string {
  const s = "format(datum.value, '~s')";
  return `test(/[0-9]$/, ${s}) ? ${s} + ' ${unit}' : slice(${s}, 0, -1) + ' ' + slice(${s}, -1) + '${unit}'`;
}

/** On a log axis, a label at each power of ten only (vega ticks every 1, 2 … 9 of a decade). */
function decadeLabels(unit: string): Json {
  const decade = 'abs(log(datum.value) / LN10 - round(log(datum.value) / LN10)) < 1e-9';
  return { labelExpr: `${decade} ? (${siLabels(unit)}) : ''`, gridOpacity: 0.5 };
}

const FREQUENCY_X: Json = { field: 'frequency_Hz', type: 'quantitative', scale: { type: 'log' }, axis: { title: 'Frequency', ...decadeLabels('Hz') } };

/** A series' colour and its name in the legend. */
function series(names: Record<string, string>): Json {
  return { field: 's', type: 'nominal', title: null, scale: { domain: Object.values(names) }, legend: { labelLimit: 0 } };
}

/**
 * Fold columns into rows {frequency_Hz, s, v}, each series named for the legend. A log axis takes positive
 * values only: anything else becomes null, which breaks the line (the marks' `invalid` mode), as a gap does
 * on the page, rather than joining the stretches either side of it.
 */
function folded(columns: Record<string, string>): Json[] {
  return [
    { fold: Object.keys(columns), as: ['column', 'v'] },
    { calculate: Object.entries(columns).reduceRight((rest, [column, name]) => `datum.column === '${column}' ? '${name}' : ${rest}`, "''"), as: 's' },
    { calculate: 'datum.v > 0 ? datum.v : null', as: 'v' },
  ];
}

function lineChart(title: string, transform: Json[], y: Json, colour?: Json): Json {
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: `${title}, drawn from the sweep.csv saved beside this file (frequency_Hz, R_ohm, X_ohm: a part's impedance Z = R + jX over its sweep).`,
    title,
    width: 480,
    height: 300,
    data: CSV_DATA,
    transform: [...DERIVED, ...transform],
    mark: { type: 'line', strokeWidth: 1.5, invalid: 'break-paths-filter-domains' },
    encoding: { x: FREQUENCY_X, y, ...(colour ? { color: colour } : {}), order: { field: 'frequency_Hz', type: 'quantitative' } },
  };
}

const IMPEDANCE = { Zmag_ohm: '|Z|', R_ohm: 'R' };
const ADMITTANCE = { G_S: 'G', Bc: 'B > 0 (capacitive)', Bl: '−B, B < 0 (inductive)' };

/** The plane charts: a path through the sweep, in frequency order. */
function planeChart(title: string, x: Json, y: Json): Json {
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    description: `${title}, drawn from the sweep.csv saved beside this file (frequency_Hz, R_ohm, X_ohm), in order of frequency.`,
    title,
    width: 400,
    height: 400,
    data: CSV_DATA,
    transform: DERIVED,
    mark: { type: 'line', strokeWidth: 1.5, point: { size: 8 } },
    encoding: { x, y, order: { field: 'frequency_Hz', type: 'quantitative' }, tooltip: [{ field: 'frequency_Hz', title: 'f (Hz)' }, { field: 'R_ohm' }, { field: 'X_ohm' }] },
  };
}

/** Signed values on a log-like scale (vega-lite's symlog, linear within 1 mΩ of zero), labelled with SI prefixes. */
const signedOhms = (title: string, field: string): Json => ({ field, type: 'quantitative', scale: { type: 'symlog', constant: 1e-3 }, axis: { title, labelExpr: siLabels('Ω') } });

/** Every shared spec, by file name. */
export const SWEEP_SPECS: Readonly<Record<string, Json>> = {
  'impedance.vl.json': lineChart('|Z| and R against frequency', folded(IMPEDANCE), { field: 'v', type: 'quantitative', scale: { type: 'log' }, axis: { title: '|Z| and R', ...decadeLabels('Ω') } }, series(IMPEDANCE)),
  'phase.vl.json': lineChart('Phase of Z against frequency', [], { field: 'phase_deg', type: 'quantitative', scale: { domain: [-90, 90] }, axis: { title: 'Phase (°)', values: [-90, -45, 0, 45, 90] } }),
  'admittance.vl.json': lineChart(
    'Admittance Y = G + jB against frequency',
    [{ calculate: 'datum.B_S > 0 ? datum.B_S : null', as: 'Bc' }, { calculate: 'datum.B_S < 0 ? -datum.B_S : null', as: 'Bl' }, ...folded(ADMITTANCE)],
    { field: 'v', type: 'quantitative', scale: { type: 'log' }, axis: { title: 'G and |B|', ...decadeLabels('S') } },
    series(ADMITTANCE),
  ),
  'plane-admittance.vl.json': planeChart(
    'Admittance plane, Y = G + jB',
    { field: 'G_S', type: 'quantitative', axis: { title: 'G', labelExpr: siLabels('S') } },
    { field: 'B_S', type: 'quantitative', axis: { title: 'B', labelExpr: siLabels('S') } },
  ),
  'plane-impedance.vl.json': planeChart('Impedance plane, Z = R + jX', signedOhms('R', 'R_ohm'), signedOhms('X', 'X_ohm')),
};

/** The shared spec a part chart's download link points at, from the site's top. */
export function partSpecPath(chartKey: string, admittancePlane: boolean): string {
  const name = chartKey === 'plane' ? (admittancePlane ? 'plane-admittance' : 'plane-impedance') : chartKey;
  const file = `${name}.vl.json`;
  if (!Object.hasOwn(SWEEP_SPECS, file)) throw new Error(`part chart "${chartKey}" has no shared spec`);
  return `${SPEC_FOLDER}/${file}`;
}
