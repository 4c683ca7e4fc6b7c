// The words of a before-and-after chart: the subject, the revision, each curve's marks, a rail's targets.

import { describe, expect, it } from 'vitest';
import { describeChange } from '../../src/present/change-chart-descriptions.js';

const curve = (frequencyHz: number, impedanceOhm: number) => ({ marks: [{ frequencyHz, impedanceOhm }] });

describe('describeChange', () => {
  it('names the part, the revision and both marks in engineering notation', () => {
    const d = describeChange({ subject: 'TC-100N', kind: 'part', since: 'v1', before: curve(29.06e6, 0.02), after: curve(20.55e6, 0.02), markName: 'SRF' });
    expect(d.title).toBe('TC-100N: |Z| at v1 and now');
    expect(d.description).toBe('Log-log chart of the impedance magnitude |Z| of part TC-100N, at v1 (grey, dashed; SRF: 20 mΩ at 29.1 MHz) and now (solid; SRF: 20 mΩ at 20.6 MHz).');
  });

  it("states a rail's targets, and a curve that is absent", () => {
    const d = describeChange({ subject: 'VDD_T', kind: 'rail', since: 'v1', before: null, after: curve(1e8, 0.0457), target: { before: null, after: 0.025 }, markName: 'worst point' });
    expect(d.title).toBe('Rail VDD_T: |Z| at v1 and now');
    expect(d.description).toBe('Log-log chart of the impedance magnitude |Z| of rail VDD_T, absent at v1 and now (solid; worst point: 45.7 mΩ at 100 MHz). Target: none, 25 mΩ now.');
  });
});
