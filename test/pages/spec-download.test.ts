// A part's downloads hold its sweep once: sweep.csv with frequency, R and X rounded to the stated digits,
// each row checked against the model evaluated at the row's own frequency with complex.js (test/reference).
// The site's shared chart specs are written beside such a CSV in a temporary folder, compiled by vega-lite
// and run by vega reading the file from disk (as a vega-lite tool offline would); the values vega derives
// from R and X (|Z|, phase, G, B) are compared with complex.js's abs, arg and inverse of R + jX from the
// test's own reading of the same file, and with the model itself.

import { Complex } from 'complex.js';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loader, parse, View, type Spec as VegaSpec } from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { afterAll, describe, expect, it } from 'vitest';
import { sweepPointsCsv } from '../../src/analysis/sweep-table.js';
import { partSpecPath, SPEC_FOLDER, SWEEP_CSV, SWEEP_CSV_DIGITS, SWEEP_SPECS } from '../../src/pages/spec-download.js';
import { analysed, capacitorPart, inductorPart, networkPart } from '../charts/fixtures.js';
import { referenceZAt } from '../reference/impedance.js';

const folders: string[] = [];
afterAll(() => folders.forEach((f) => rmSync(f, { recursive: true, force: true })));

const SWEEP = { fromHz: 100, toHz: 1e10, perDecade: 40 };
const PARTS = [capacitorPart, inductorPart, networkPart];

/** The test's own reading of the CSV: one object per row, empty cells as NaN. */
function readCsv(text: string): { header: string[]; rows: Record<string, number>[] } {
  const [header, ...rows] = text.trim().split('\n');
  const names = header.split(',');
  return { header: names, rows: rows.map((line) => Object.fromEntries(line.split(',').map((cell, i) => [names[i], cell === '' ? NaN : Number(cell)]))) };
}

/** Run a spec file with vega reading files beside it; every dataset of the compiled spec, by name. */
async function runSpec(folder: string, file: string): Promise<{ svg: string; rows: Record<string, unknown>[]; warnings: string[] }> {
  const spec = JSON.parse(readFileSync(join(folder, file), 'utf8')) as TopLevelSpec;
  const warnings: string[] = [];
  const log = { level: () => log, error: (...a: unknown[]) => void warnings.push(a.join(' ')), warn: (...a: unknown[]) => void warnings.push(a.join(' ')), info: () => log, debug: () => log };
  const vg = compile(spec, { logger: log as never }).spec as VegaSpec;
  const view = new View(parse(vg), { renderer: 'none', loader: loader({ baseURL: `${folder}/`, mode: 'file' }) });
  await view.runAsync();
  // The dataset the marks are drawn from: the one the CSV's rows went through every transform into.
  const rows = (vg.data ?? []).map((d) => view.data(d.name) as Record<string, unknown>[]).filter((r) => r.length > 0 && 'frequency_Hz' in r[0]).pop() ?? [];
  const svg = await view.toSVG();
  view.finalize();
  return { svg, rows, warnings };
}

/** Relative difference, against the larger magnitude. */
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));

describe('a part\'s sweep.csv', () => {
  for (const part of PARTS) {
    it(`${part.id}: frequency, R and X to ${SWEEP_CSV_DIGITS} significant digits, each row the model at its written frequency`, () => {
      const a = analysed(part, SWEEP);
      const { header, rows } = readCsv(sweepPointsCsv(a, SWEEP_CSV_DIGITS));
      expect(header).toEqual(['frequency_Hz', 'R_ohm', 'X_ohm']);
      expect(rows).toHaveLength(a.frequencies.length);
      // Rounding to 6 significant digits moves a value by at most half a unit in its 6th digit: at most 5e-6
      // of the value (when its digits are 1.00000); a little more allows for the reference's own rounding.
      const within = (value: number, exact: number) => expect(Math.abs(value - exact)).toBeLessThanOrEqual(5.0001e-6 * Math.abs(exact));
      rows.forEach((r, i) => {
        within(r.frequency_Hz, a.frequencies[i]);
        // The model at the frequency as written, not at the unrounded point: a row reads back as itself.
        const z = referenceZAt(part.network, r.frequency_Hz);
        within(r.R_ohm, z.re);
        within(r.X_ohm, z.im);
        // The text is the shortest that rounds so: no value has more than 6 significant digits.
        for (const v of [r.frequency_Hz, r.R_ohm, r.X_ohm]) expect(Number(v.toPrecision(SWEEP_CSV_DIGITS))).toBe(v);
      });
    });
  }
});

describe('sweep.csv of many parts in one thread', () => {
  it('writes each frequency as its own value, also when the caller reuses one array and changes it', () => {
    // The frequency column is kept between calls (the same for every part of a library): a changed array
    // must not be written with the last one's cells. Reference: String(Number(f.toPrecision(6))), ECMA-262.
    const a = analysed(capacitorPart, SWEEP);
    const f = Float64Array.from([1000, 2000.004, 3e6]);
    const cells = (text: string) => text.trim().split('\n').slice(1).map((line) => Number(line.split(',')[0]));
    const expected = (digits: number) => Array.from(f, (v) => Number(v.toPrecision(digits)));
    expect(cells(sweepPointsCsv(a, SWEEP_CSV_DIGITS, f))).toEqual([1000, 2000, 3e6]);
    f[1] = 123456.7;
    expect(cells(sweepPointsCsv(a, SWEEP_CSV_DIGITS, f))).toEqual(expected(SWEEP_CSV_DIGITS));
    expect(cells(sweepPointsCsv(a, 3, f))).toEqual(expected(3));
    expect(expected(3)[1]).toBe(123000);
  });
});

describe('the shared chart specs', () => {
  for (const part of PARTS) {
    it(`${part.id}: each spec draws the sweep.csv beside it, |Z|, phase, G and B derived from R and X as complex.js derives them`, async () => {
      const a = analysed(part, SWEEP);
      const folder = mkdtempSync(join(tmpdir(), 'zfolio-spec-'));
      folders.push(folder);
      const csv = sweepPointsCsv(a, SWEEP_CSV_DIGITS);
      writeFileSync(join(folder, SWEEP_CSV), csv);
      const expected = readCsv(csv).rows.map((r) => ({ f: r.frequency_Hz, z: new Complex(r.R_ohm, r.X_ohm), model: referenceZAt(part.network, r.frequency_Hz) }));
      const at = (f: unknown) => expected.find((e) => e.f === f)!;
      for (const [file, spec] of Object.entries(SWEEP_SPECS)) {
        const text = JSON.stringify(spec);
        expect(text).toContain(`"url":"${SWEEP_CSV}"`);
        writeFileSync(join(folder, file), text);
        const { svg, rows, warnings } = await runSpec(folder, file);
        expect(warnings, file).toEqual([]);
        expect(svg, file).toContain('<path');
        expect(rows.length, file).toBeGreaterThanOrEqual(expected.length);
        for (const row of rows) {
          const e = at(row.frequency_Hz);
          expect(e, file).toBeDefined();
          // The closed forms on the CSV's own values agree with complex.js to rounding (1e-12 of the value).
          expect(rel(row.Zmag_ohm as number, e.z.abs())).toBeLessThan(1e-12);
          expect(Math.abs((row.phase_deg as number) - (e.z.arg() * 180) / Math.PI)).toBeLessThan(1e-10);
          const y = e.z.inverse();
          expect(rel(row.G_S as number, y.re)).toBeLessThan(1e-12);
          expect(rel(row.B_S as number, y.im)).toBeLessThan(1e-12);
          // And with the model: R and X within 5e-6 each keep |Z| and |Y| within 1e-5 of it.
          expect(rel(row.Zmag_ohm as number, e.model.abs())).toBeLessThan(1e-5);
        }
        if (file === 'impedance.vl.json') {
          // Two series, |Z| and R, one row of each per point (both are positive for these parts).
          expect(rows.filter((r) => r.s === '|Z|').map((r) => r.v)).toEqual(rows.filter((r) => r.s === '|Z|').map((r) => r.Zmag_ohm));
          expect(rows.filter((r) => r.s === 'R').map((r) => r.v)).toEqual(rows.filter((r) => r.s === 'R').map((r) => r.R_ohm));
          expect(rows).toHaveLength(2 * expected.length);
          // Axis labels with SI prefixes (d3-format's "~s"): the sweep runs from 100 Hz to 10 GHz.
          expect(svg).toContain('100 Hz');
          expect(svg).toContain('10 GHz');
        }
        if (file === 'admittance.vl.json') {
          // G, and |B| as two series by the sign of B, each null where B has the other sign (a break in its line).
          for (const r of rows) {
            const b = r.B_S as number;
            if (r.s === 'G') expect(r.v).toBe(r.G_S);
            else if (r.s === 'B > 0 (capacitive)') expect(r.v).toBe(b > 0 ? b : null);
            else expect(r.v).toBe(b < 0 ? -b : null);
          }
        }
      }
    });
  }

  it('a part chart links the plane spec its page draws: a capacitor\'s admittance circle, other kinds\' impedance path', () => {
    expect(partSpecPath('plane', true)).toBe(`${SPEC_FOLDER}/plane-admittance.vl.json`);
    expect(partSpecPath('plane', false)).toBe(`${SPEC_FOLDER}/plane-impedance.vl.json`);
    for (const key of ['impedance', 'phase', 'admittance']) expect(partSpecPath(key, true)).toBe(`${SPEC_FOLDER}/${key}.vl.json`);
    expect(() => partSpecPath('residual', false)).toThrow(/no shared spec/);
  });
});
