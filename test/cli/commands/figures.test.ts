// zfolio figures against closed forms, on the invented parts of test/fixtures/good-library.
// Sweep there: 1 kHz to 10 GHz, 50 points a decade, default band criterion 10%.

import { describe, expect, it } from 'vitest';
import { BAD_LIBRARY, GOOD_LIBRARY, run } from '../fake-io.js';

interface Figures {
  id: string;
  kind: string;
  nominal: number | null;
  resonances: { frequencyHz: number; type: 'series' | 'parallel'; impedanceOhm: number; extremum: { frequencyHz: number; impedanceOhm: number; atSweepEnd: boolean } }[];
  usableBand: { fromHz: number; toHz: number } | null;
  peakImpedance: { frequencyHz: number; impedanceOhm: number; atSweepEnd: boolean };
}

const TWO_PI = 2 * Math.PI;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

async function figuresJson(...args: string[]): Promise<Figures[]> {
  const r = await run(['figures', '--json', ...args]);
  expect(r.code).toBe(0);
  expect(r.err).toBe('');
  return JSON.parse(r.out) as Figures[];
}

describe('zfolio figures --json', () => {
  it('prints every part in file order with the documented keys', async () => {
    const all = await figuresJson();
    expect(all.map((f) => f.id)).toEqual(['BEAD-TEST-600R', 'CAP-TEST-100N', 'IND-TEST-10U', 'NET-TEST-BULK', 'RES-TEST-4K7']);
    for (const f of all) {
      expect(Object.keys(f)).toEqual(expect.arrayContaining(['id', 'kind', 'nominal', 'resonances', 'usableBand']));
      for (const r of f.resonances) {
        expect(Object.keys(r).sort()).toEqual(['extremum', 'frequencyHz', 'impedanceOhm', 'type']);
        expect(Object.keys(r.extremum).sort()).toEqual(['atSweepEnd', 'frequencyHz', 'impedanceOhm']);
      }
      expect(Object.keys(f.peakImpedance).sort()).toEqual(['atSweepEnd', 'frequencyHz', 'impedanceOhm']);
      if (f.usableBand) expect(Object.keys(f.usableBand)).toEqual(expect.arrayContaining(['fromHz', 'toHz']));
    }
  });

  it('series-RLC capacitor: SRF = 1/(2π√(LC)), |Z| there = ESR, band edge = SRF·√(1 − 1/1.1)', async () => {
    // Series resonance: Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., §14.5.
    // Band edge: C_eff = C/(1 − (f/SRF)²) reaches 1.1·C at f = SRF·√(1 − 1/1.1) (from X = ωL − 1/(ωC)).
    const [cap] = await figuresJson('CAP-TEST-100N');
    const L = 0.45e-9;
    const C = 100e-9;
    const srf = 1 / (TWO_PI * Math.sqrt(L * C));
    expect(cap).toMatchObject({ id: 'CAP-TEST-100N', kind: 'capacitor', nominal: C });
    expect(cap.resonances).toHaveLength(1);
    expect(cap.resonances[0].type).toBe('series');
    expect(rel(cap.resonances[0].frequencyHz, srf)).toBeLessThan(1e-9);
    expect(rel(cap.resonances[0].impedanceOhm, 0.02)).toBeLessThan(1e-9);
    // The band reaches down to the sweep's start; its top edge is refined by root finding.
    expect(cap.usableBand!.fromHz).toBe(1e3);
    // Edges are root-found to BAND_EDGE_TOLERANCE = 1e-9 relative (DESIGN.md asks for 1e-6).
    expect(rel(cap.usableBand!.toHz, srf * Math.sqrt(1 - 1 / 1.1))).toBeLessThan(1e-9);
  });

  it('inductor: parallel resonance at ω² = 1/(L·Cp) − (dcr/L)², |Z| = 1/G there', async () => {
    // Im Y = 0 for Y = 1/(dcr + jωL) + jωCp + 1/Rp (derived from the parallel law, A&S §9.7; the lossy
    // tank of A&S §14.6). At that ω, Y is real: G = dcr/(dcr² + ω²L²) + 1/Rp.
    const [ind] = await figuresJson('IND-TEST-10U');
    const [L, dcr, cp, rp] = [10e-6, 0.12, 2e-12, 50e3];
    const w0 = Math.sqrt(1 / (L * cp) - (dcr / L) ** 2);
    const g = dcr / (dcr ** 2 + (w0 * L) ** 2) + 1 / rp;
    expect(ind.resonances).toHaveLength(1);
    expect(ind.resonances[0].type).toBe('parallel');
    expect(rel(ind.resonances[0].frequencyHz, w0 / TWO_PI)).toBeLessThan(1e-9);
    expect(rel(ind.resonances[0].impedanceOhm, 1 / g)).toBeLessThan(1e-6);
  });

  it('bead: core resonance 1/(2π√(lc)) with |Z| = rdc + r; absorbing band at the half-power edges', async () => {
    // Parallel RLC (A&S §14.6): ω₀ = 1/√(LC); G = |B| at ω₁,₂ = ∓1/(2RC) + √((1/(2RC))² + 1/(LC)).
    const [bead] = await figuresJson('BEAD-TEST-600R');
    const [rdc, r, l, c] = [0.15, 600, 1.2e-6, 1.5e-12];
    expect(bead.resonances).toHaveLength(1);
    expect(bead.resonances[0].type).toBe('parallel');
    expect(rel(bead.resonances[0].frequencyHz, 1 / (TWO_PI * Math.sqrt(l * c)))).toBeLessThan(1e-9);
    expect(rel(bead.resonances[0].impedanceOhm, rdc + r)).toBeLessThan(1e-9);
    const a = 1 / (2 * r * c);
    const root = Math.sqrt(a * a + 1 / (l * c));
    expect(rel(bead.usableBand!.fromHz, (root - a) / TWO_PI)).toBeLessThan(1e-9);
    expect(rel(bead.usableBand!.toHz, (root + a) / TWO_PI)).toBeLessThan(1e-9);
  });

  it('network behaving as a capacitor: series resonance at ω² = 1/(LC) − 1/(R·C)² for L + (C ‖ R)', async () => {
    // Im Z = ωL − ωR²C/(1 + (ωRC)²) = 0 (A&S §9.7 parallel law), with the 5 mΩ series R adding only to Re Z.
    const [net] = await figuresJson('NET-TEST-BULK');
    const [L, C, R] = [1.1e-9, 10e-6, 50e6];
    const w0 = Math.sqrt(1 / (L * C) - 1 / (R * C) ** 2);
    expect(net.resonances).toHaveLength(1);
    expect(net.resonances[0].type).toBe('series');
    expect(rel(net.resonances[0].frequencyHz, w0 / TWO_PI)).toBeLessThan(1e-9);
    expect(rel(net.resonances[0].impedanceOhm, 5e-3 + R / (1 + (w0 * R * C) ** 2))).toBeLessThan(1e-6);
  });

  it('resistor: (R + ls) ‖ cp has no reactance zero when R² > ls/cp, so no resonance', async () => {
    // X = 0 needs ω² = 1/(ls·cp) − (R/ls)², negative for 4.7 kΩ, 1 nH, 0.2 pF.
    const [res] = await figuresJson('RES-TEST-4K7');
    expect(res.resonances).toEqual([]);
    expect(res.usableBand!.fromHz).toBe(1e3);
  });

  it('selects a part by its file path', async () => {
    const byFile = await figuresJson('parts/capacitor.yaml');
    expect(byFile.map((f) => f.id)).toEqual(['CAP-TEST-100N']);
  });

  it('--from/--to/--per-decade narrow the sweep: the band then starts at the new sweep start', async () => {
    const [cap] = await figuresJson('CAP-TEST-100N', '--from', '1M', '--to', '100M', '--per-decade', '20');
    expect(cap.usableBand!.fromHz).toBe(1e6);
    expect(rel(cap.resonances[0].frequencyHz, 1 / (TWO_PI * Math.sqrt(0.45e-9 * 100e-9)))).toBeLessThan(1e-9);
  });
});

describe('zfolio figures (text)', () => {
  it('prints the SRF in engineering notation', async () => {
    const r = await run(['figures', 'CAP-TEST-100N']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('CAP-TEST-100N  ·  capacitor  ·  100 nF');
    // 1/(2π√(0.45 nH · 100 nF)) = 23.725 MHz, to three figures.
    expect(r.out).toContain('  SRF 23.7 MHz\n');
    expect(r.out).toContain('  usable band  ≤ 1 kHz to 7.15 MHz (value within 10% of nominal)');
  });

  it('says when a part has no resonance in the sweep', async () => {
    const r = await run(['figures', 'RES-TEST-4K7']);
    expect(r.out).toContain('SRF none between 1 kHz and 10 GHz');
  });
});

describe('zfolio figures: misuse and bad input', () => {
  it('an unknown id exits 2 with a "did you mean"', async () => {
    const r = await run(['figures', 'CAP-TEST-100M']);
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toBe('zfolio figures: no part with id or file "CAP-TEST-100M"; did you mean CAP-TEST-100N?\nRun "zfolio figures --help" for usage.\n');
  });

  it('a sweep ending below its start exits 2', async () => {
    const r = await run(['figures', '--from', '10G', '--to', '1k']);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')[0]).toBe('zfolio figures: the sweep must end above where it starts; found from 10 GHz to 1 kHz (--from and --to, or folio.yaml sweep)');
  });

  it('a bad library exits 1 and prints nothing on stdout', async () => {
    const r = await run(['figures', '--library', BAD_LIBRARY]);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err).toMatch(/errors in the library; nothing was done\n$/);
  });

  it('a frequency that is not one exits 2', async () => {
    const r = await run(['figures', '--from', '1 kF', '--library', GOOD_LIBRARY]);
    expect(r.code).toBe(2);
    expect(r.err.split('\n')[0]).toBe('zfolio figures: --from: expected a frequency in Hz (e.g. 10M or 10 MHz), found "1 kF" (a capacitance, in F)');
  });
});
