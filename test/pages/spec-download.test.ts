// A part's downloads hold its sweep once: sweep.csv rounded to the stated digits (checked against the
// model evaluated with complex.js, test/reference), and chart specs that read it by relative URL. Each
// spec is written beside its CSV in a temporary folder, compiled by vega-lite and run by vega reading the
// file from disk (as a vega-lite tool offline would), and the curve rows vega makes from the file are
// compared with the test's own reading of the same file.

import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loader, parse, View, type Spec as VegaSpec } from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { afterAll, describe, expect, it } from 'vitest';
import { sweepCsv } from '../../src/analysis/sweep-table.js';
import { renderPartCharts } from '../../src/charts/part-charts.js';
import { downloadSpec, readsSweep, SWEEP_CSV, SWEEP_CSV_DIGITS } from '../../src/pages/spec-download.js';
import { analysed, capacitorPart, inductorPart, networkPart } from '../charts/fixtures.js';
import { referenceZAt } from '../reference/impedance.js';

const folders: string[] = [];
afterAll(() => folders.forEach((f) => rmSync(f, { recursive: true, force: true })));

const SWEEP = { fromHz: 100, toHz: 1e10, perDecade: 40 };

/** The test's own reading of the CSV: one object per row, empty cells as NaN. */
function readCsv(text: string): Record<string, number>[] {
  const [header, ...rows] = text.trim().split('\n');
  const names = header.split(',');
  return rows.map((line) => Object.fromEntries(line.split(',').map((cell, i) => [names[i], cell === '' ? NaN : Number(cell)])));
}

/** The curve rows a chart's layer should draw from the CSV, by series: [f, v or null]. */
function expectedCurves(key: string, rows: Record<string, number>[]): Record<string, [number, number | null][]> {
  const positive = (v: number) => (v > 0 ? v : null);
  const by = (f: (r: Record<string, number>) => number | null) => rows.map((r) => [r.frequency_Hz, f(r)] as [number, number | null]);
  if (key === 'impedance') return { mag: by((r) => positive(r.Zmag_ohm)), res: by((r) => positive(r.R_ohm)) };
  if (key === 'phase') return { phase: by((r) => r.phase_deg) };
  return { g: by((r) => positive(r.G_S)), bc: by((r) => (r.B_S > 0 ? r.B_S : null)), bl: by((r) => (r.B_S < 0 ? -r.B_S : null)) };
}

/** Run a spec file with vega reading files beside it; every dataset of the compiled spec, by name. */
async function runSpec(folder: string, file: string): Promise<{ svg: string; datasets: Record<string, Record<string, unknown>[]>; warnings: string[] }> {
  const spec = JSON.parse(readFileSync(join(folder, file), 'utf8')) as TopLevelSpec;
  const warnings: string[] = [];
  const log = { level: () => log, error: (...a: unknown[]) => void warnings.push(a.join(' ')), warn: (...a: unknown[]) => void warnings.push(a.join(' ')), info: () => log, debug: () => log };
  const vg = compile(spec, { logger: log as never }).spec as VegaSpec;
  const view = new View(parse(vg), { renderer: 'none', loader: loader({ baseURL: `${folder}/`, mode: 'file' }) });
  await view.runAsync();
  const datasets = Object.fromEntries((vg.data ?? []).map((d) => [d.name, view.data(d.name) as Record<string, unknown>[]]));
  const svg = await view.toSVG();
  view.finalize();
  return { svg, datasets, warnings };
}

describe('a part\'s downloads', () => {
  for (const part of [capacitorPart, inductorPart, networkPart]) {
    it(`${part.id}: sweep.csv holds the model to ${SWEEP_CSV_DIGITS} significant digits`, () => {
      const a = analysed(part, SWEEP);
      const rows = readCsv(sweepCsv(a, SWEEP_CSV_DIGITS));
      expect(rows).toHaveLength(a.frequencies.length);
      // Rounding to 6 significant digits moves a value by at most half a unit in its 6th digit: at most 5e-6
      // of the value (when its digits are 1.00000); a little more allows for the reference's own rounding.
      const within = (value: number, exact: number) => expect(Math.abs(value - exact)).toBeLessThanOrEqual(5.0001e-6 * Math.abs(exact));
      rows.forEach((r, i) => {
        const f = a.frequencies[i];
        within(r.frequency_Hz, f);
        const z = referenceZAt(part.network, f);
        within(r.R_ohm, z.re);
        within(r.X_ohm, z.im);
        within(r.Zmag_ohm, z.abs());
      });
    });

    it(`${part.id}: chart specs draw their curves from sweep.csv beside them`, async () => {
      const a = analysed(part, SWEEP);
      const folder = mkdtempSync(join(tmpdir(), 'zfolio-spec-'));
      folders.push(folder);
      const csv = sweepCsv(a, SWEEP_CSV_DIGITS);
      writeFileSync(join(folder, SWEEP_CSV), csv);
      const charts = await renderPartCharts(a);
      for (const key of ['impedance', 'phase', 'admittance'] as const) {
        expect(readsSweep(key)).toBe(true);
        const spec = downloadSpec(key, charts[key].spec) as { datasets: Record<string, unknown> };
        const text = JSON.stringify(spec);
        expect(text).toContain(`"url":"${SWEEP_CSV}"`);
        expect(Object.keys(spec.datasets)).not.toContain('curves');
        // The rest of the chart stays in the spec: its axes' ticks, for one.
        expect(Object.keys(spec.datasets)).toContain('fMajor');
        writeFileSync(join(folder, `${key}.vl.json`), text);

        const { svg, datasets, warnings } = await runSpec(folder, `${key}.vl.json`);
        expect(warnings, key).toEqual([]);
        expect(svg).toContain('<path');
        const expected = expectedCurves(key, readCsv(csv));
        // The dataset vega drew the curves from: rows with a series s, a frequency f and a value v.
        const drawn = Object.values(datasets).find((rows) => rows.length > 0 && rows.every((r) => 's' in r && 'f' in r && 'v' in r) && rows.length === Object.values(expected).flat().length);
        expect(drawn, key).toBeDefined();
        const bySeries: Record<string, [number, number | null][]> = {};
        for (const r of drawn!) (bySeries[r.s as string] ??= []).push([r.f as number, r.v === null || Number.isNaN(r.v) ? null : (r.v as number)]);
        expect(bySeries, key).toEqual(expected);
      }
    });
  }

  it('leaves other charts\' specs as they are', () => {
    const spec = { layer: [{ data: { name: 'curves' } }], datasets: { curves: [{ f: 1, v: 2 }] } };
    expect(readsSweep('plane')).toBe(false);
    expect(downloadSpec('plane', spec)).toBe(spec);
    expect(downloadSpec('overlay', spec)).toBe(spec);
  });
});
