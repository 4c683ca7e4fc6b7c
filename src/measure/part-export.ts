// A part's model as files for other tools: a one-port Touchstone file (S11 re 50 Ω, real–imaginary, over a
// sweep) and a SPICE subcircuit of its element tree, each opening with comments that name the part, its
// model and where it came from.

import type { Element } from '../circuit/element.js';
import { impedanceSweep, type ImpedanceArrays } from '../circuit/impedance.js';
import { formatEng } from '../units/format.js';
import { reflectionOf } from './fixtures.js';
import { ascii, writeSubcircuit } from './spice-write.js';
import { writeTouchstone } from './touchstone-write.js';

/** What an export needs of a part (the library's Part has all of it). */
export interface ExportablePart {
  id: string;
  kind: string;
  title: string;
  network: Element;
  source: { path: string; hash: string };
}

/** The reference impedance of exported S-parameters, Ω (the usual analyser port). */
export const EXPORT_REFERENCE_OHM = 50;

/** The first comment of every Touchstone file zfolio writes, by which it knows a file as its own. */
export const TOUCHSTONE_MARK = 'zfolio export';

/**
 * The model as a formula of its leaves: "ESR + ESL + (C || EPR)"; unnamed leaves by value. `parallelSign`
 * joins parallel branches ('||' in files for other tools, '‖' on pages).
 */
export function treeFormula(e: Element, parallelSign = '||'): string {
  const formula = (x: Element, inside?: 'series' | 'parallel'): string => {
    switch (x.type) {
      case 'R':
        return x.name ?? formatEng(x.ohms, 'resistance');
      case 'L':
        return x.name ?? formatEng(x.henries, 'inductance');
      case 'C':
        return x.name ?? formatEng(x.farads, 'capacitance');
      case 'series':
      case 'parallel': {
        const text = x.parts.map((p) => formula(p, x.type)).join(x.type === 'series' ? ' + ' : ` ${parallelSign} `);
        return inside && inside !== x.type ? `(${text})` : text;
      }
    }
  };
  return formula(e);
}

/** "C = 100 nF, ESR = 18 mΩ, …" for the named leaves of a tree, in tree order. */
export function namedValues(e: Element): string {
  const out: string[] = [];
  const walk = (x: Element) => {
    if (x.type === 'series' || x.type === 'parallel') x.parts.forEach(walk);
    else if (x.name) out.push(`${x.name} = ${formatEng(x.type === 'R' ? x.ohms : x.type === 'L' ? x.henries : x.farads, x.type === 'R' ? 'resistance' : x.type === 'L' ? 'inductance' : 'capacitance', { digits: 4 })}`);
  };
  walk(e);
  return out.join(', ');
}

function header(part: ExportablePart, what: string): string[] {
  const values = namedValues(part.network);
  return [
    `${part.id}: ${part.title} (${part.kind})`,
    `model: ${treeFormula(part.network)}${values ? `; ${values}` : ''}`,
    what,
    `source: ${part.source.path} (sha256:${part.source.hash})`,
    'a small-signal, linear model at room temperature; voltage, current and power ratings are not in it',
  ].map(ascii);
}

/**
 * A version 1 one-port file: the model's S11 re 50 Ω, RI, at each frequency of `frequencies` (Hz), each
 * number in full, or with `impedanceDigits` the fewest decimals that keep the impedance read back from it
 * to that many significant digits (see `impedanceDecimals`). `z` is the model at `frequencies`, given by a
 * caller that has it already.
 */
export function partTouchstone(part: ExportablePart, frequencies: Float64Array, sweepText: string, impedanceDigits?: number, z: ImpedanceArrays = impedanceSweep(part.network, frequencies)): string {
  const re = new Float64Array(frequencies.length);
  const im = new Float64Array(frequencies.length);
  const decimals = impedanceDigits === undefined ? undefined : new Uint8Array(frequencies.length);
  for (let k = 0; k < frequencies.length; k++) {
    [re[k], im[k]] = reflectionOf(z.re[k], z.im[k], EXPORT_REFERENCE_OHM);
    if (decimals) decimals[k] = impedanceDecimals(re[k], im[k], impedanceDigits!);
  }
  const comments = [TOUCHSTONE_MARK, ...header(part, `one-port S-parameters of the model, reference ${EXPORT_REFERENCE_OHM} ohm, ${ascii(sweepText)}`)];
  // Rounded S keeps |Z|, not each of R and X: where one is a millionth of |Z| (a capacitor's ESR far
  // below its SRF) it reads back as noise, and a reader of the file should know.
  if (impedanceDigits !== undefined) comments.push(`S11 to the decimals that keep |Z| read back to ${impedanceDigits} significant digits; an R or X below about 1e-${impedanceDigits} of |Z| is lost (sweep.csv keeps each to ${impedanceDigits})`);
  return writeTouchstone({ version: 1, ports: 1, parameter: 'S', format: 'RI', unit: 'Hz', reference: EXPORT_REFERENCE_OHM, frequencies, re, im, comments, decimals });
}

/**
 * Decimals of S = sr + j·si that keep Z = Z0 (1 + S)/(1 − S) to `digits` significant digits. An error δ in
 * S moves Z by dZ = 2 Z0 δ/(1 − S)², so |dZ|/|Z| = 2|δ|/|1 − S²|; rounding both parts to d decimals makes
 * |δ| at most 10^-d/√2, and |dZ| stays within half a unit of the last digit, 10^(1-digits)/2 · |Z|, when
 * 10^-d ≤ 10^(1-digits) |1 − S²| / (2√2). Near |Z| = Z0 that is `digits` decimals; far from it (S near
 * ±1, where 1 − S² is small) more, up to the 17 a double holds. Shorter than a fixed count of significant
 * digits where |Z| is near Z0, and never less faithful where it is far.
 */
export function impedanceDecimals(sr: number, si: number, digits: number): number {
  // |1 − S²| = |1 − S|·|1 + S|, each factor without cancellation.
  const gap = Math.hypot(1 - sr, si) * Math.hypot(1 + sr, si);
  const d = Math.ceil(digits - 1 + Math.log10((2 * Math.SQRT2) / gap));
  return Number.isFinite(d) ? Math.min(17, Math.max(0, d)) : 17;
}

/** A SPICE subcircuit of the part's element tree, pins 1 and 2. */
export function partSubcircuit(part: ExportablePart): string {
  return writeSubcircuit({ name: part.id, element: part.network, comments: header(part, 'SPICE subcircuit of the model between pins 1 and 2') });
}
