import { describe, expect, it } from 'vitest';
import { bandData, rangeBand, resonancesByImportance } from '../../src/charts/part-marks.js';
import { resonanceLabel } from '../../src/present/resonance-words.js';
import { analysed, capacitorPart, networkPart } from './fixtures.js';

describe('what every chart of a part marks', () => {
  it('names the self-resonance SRF and the others by type, self-resonance first', () => {
    // The first series resonance is the 10 µF branch's own, 1/(2π√(1.1 nH · 10 µF)) = 1.517 MHz; the others
    // come from the analysis (tested in test/analysis) and only their naming is checked here.
    const a = analysed(networkPart);
    expect(a.resonances.map((r) => r.type)).toEqual(['series', 'parallel', 'series']);
    const ordered = resonancesByImportance(a);
    expect(ordered[0]).toBe(a.selfResonance);
    expect(ordered.map((r) => resonanceLabel(r, a.selfResonance))).toEqual(['SRF 1.52 MHz', 'parallel 13.6 MHz', 'series 24.1 MHz']);
  });

  it('recognises the self-resonance in a copied input (another thread, JSON), by value', () => {
    const a = analysed(networkPart);
    const copy = { ...a, resonances: a.resonances.map((r) => ({ ...r })), selfResonance: JSON.parse(JSON.stringify(a.selfResonance)) };
    expect(copy.selfResonance).not.toBe(copy.resonances[0]);
    expect(resonancesByImportance(copy).map((r) => resonanceLabel(r, copy.selfResonance))[0]).toBe('SRF 1.52 MHz');
  });

  it('shades the band with its caption and range in the key, and an edge line only where the band ends inside the sweep', () => {
    const c = analysed(capacitorPart);
    // Capacitor band edge SRF·√(1 − 1/1.1) (see src/analysis/band.ts); SRF = 1/(2π√(LC)) = 23.72 MHz.
    expect(bandData(c).key).toEqual({ kind: 'band', text: 'usable band (±10%): up to 7.15 MHz' });
    expect(bandData(c).bandEdges).toHaveLength(1);
    expect(rangeBand({ fromHz: 1e5, toHz: 1e8 })).toEqual({ band: [{ f: 1e5, f2: 1e8 }], bandEdges: [{ f: 1e5 }, { f: 1e8 }] });
    expect(rangeBand(null)).toEqual({ band: [], bandEdges: [] });
  });
});
