// zfolio sweep: the impedance table of one part, as CSV, JSON or text.
// Reference values: Z = ESR + j(ωL − 1/(ωC)) for the series-RLC test capacitor (Alexander & Sadiku,
// Fundamentals of Electric Circuits, 6th ed., §9.7).

import { describe, expect, it } from 'vitest';
import { run } from '../fake-io.js';

const TWO_PI = 2 * Math.PI;
const rel = (a: number, b: number) => Math.abs(a / b - 1);
const [ESR, ESL, C] = [0.02, 0.45e-9, 100e-9];
const reactance = (f: number) => TWO_PI * f * ESL - 1 / (TWO_PI * f * C);
const RANGE = ['--from', '1k', '--to', '1M', '--per-decade', '10'];

describe('zfolio sweep --csv', () => {
  it('prints the header and one row per sweep point: 3 decades × 10 + 1 = 31', async () => {
    const r = await run(['sweep', 'CAP-TEST-100N', '--csv', ...RANGE]);
    expect(r.code).toBe(0);
    expect(r.err).toBe('');
    const [header, ...rows] = r.out.trimEnd().split('\n');
    expect(header).toBe('frequency_Hz,R_ohm,X_ohm,Zmag_ohm,phase_deg,G_S,B_S,Ymag_S,Q,Ceff_F,Leff_H');
    expect(rows).toHaveLength(31);
    for (const row of rows) expect(row.split(',')).toHaveLength(11);
  });

  it('rows are log-spaced from --from to --to and match the closed form', async () => {
    const r = await run(['sweep', 'CAP-TEST-100N', '--csv', ...RANGE]);
    const rows = r.out.trimEnd().split('\n').slice(1).map((line) => line.split(','));
    expect(Number(rows[0][0])).toBe(1e3);
    expect(Number(rows[30][0])).toBe(1e6);
    rows.forEach((cells, i) => {
      const f = Number(cells[0]);
      expect(rel(f, 10 ** (3 + i / 10))).toBeLessThan(1e-12);
      expect(rel(Number(cells[1]), ESR)).toBeLessThan(1e-12);
      expect(rel(Number(cells[2]), reactance(f))).toBeLessThan(1e-12);
      expect(rel(Number(cells[3]), Math.hypot(ESR, reactance(f)))).toBeLessThan(1e-12);
      // Below the SRF the part is capacitive: its effective inductance is undefined (empty cell).
      expect(cells[10]).toBe('');
    });
  });
});

describe('zfolio sweep --json', () => {
  it('prints one object of columns with the point count', async () => {
    const r = await run(['sweep', 'CAP-TEST-100N', '--json', ...RANGE]);
    expect(r.code).toBe(0);
    const data = JSON.parse(r.out) as { id: string; points: number; frequencyHz: number[]; reactanceOhm: number[]; sweep: object };
    expect(data.id).toBe('CAP-TEST-100N');
    expect(data.points).toBe(31);
    expect(data.sweep).toEqual({ fromHz: 1e3, toHz: 1e6, perDecade: 10 });
    expect(data.frequencyHz).toHaveLength(31);
    expect(data.reactanceOhm).toHaveLength(31);
    expect(rel(data.reactanceOhm[10], reactance(1e4))).toBeLessThan(1e-12);
  });
});

describe('zfolio sweep (text)', () => {
  it('prints a heading and a row per point', async () => {
    const r = await run(['sweep', 'CAP-TEST-100N', ...RANGE]);
    expect(r.code).toBe(0);
    const lines = r.out.trimEnd().split('\n');
    expect(lines[0]).toBe('CAP-TEST-100N: 31 points, 10 per decade');
    expect(lines).toHaveLength(2 + 31);
    expect(lines[2]).toMatch(/^\s+1 kHz\s+20 mΩ\s+−1\.59 kΩ\s+1\.59 kΩ\s+−90\.0°$/);
  });
});

describe('zfolio sweep: misuse', () => {
  it.each([
    [[], 'sweep takes exactly one part id or file, found 0'],
    [['CAP-TEST-100N', 'IND-TEST-10U'], 'sweep takes exactly one part id or file, found 2'],
    [['CAP-TEST-100N', '--csv', '--json'], 'choose one of --csv and --json'],
    [['CAP-TEST-100N', '--from', '10G', '--to', '1k'], 'the sweep must end above where it starts; found from 10 GHz to 1 kHz (--from and --to, or folio.yaml sweep)'],
    [['CAP-TEST-100N', '--per-decade', '2.5'], '--per-decade: expected a whole number from 1 to 10000'],
    [['IND-TEST-1OU'], 'no part with id or file "IND-TEST-1OU"; did you mean IND-TEST-10U?'],
  ])('sweep %j exits 2', async (args, message) => {
    const r = await run(['sweep', ...args]);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toBe(`zfolio sweep: ${message}\nRun "zfolio sweep --help" for usage.\n`);
  });
});
