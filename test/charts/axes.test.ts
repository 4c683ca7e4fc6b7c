// Axes: domains and tick labels checked by hand (decades of a log axis; round steps of 1, 2 or 5 × 10^k on a
// linear one, common practice for chart axes).

import { describe, expect, it } from 'vitest';
import { frequencyAxis, linearValueAxis, logRangeAxis, logValueAxis, niceStep, sweepAxis } from '../../src/charts/axes.js';

describe('axes', () => {
  it('span a sweep exactly on the frequency axis, labelled at every decade', () => {
    const x = sweepAxis(Float64Array.from([1e3, 1e6, 1e10]), 540);
    expect(x.domain).toEqual([1e3, 1e10]);
    expect(x.ticks.labels).toEqual(['1 kHz', '10 kHz', '100 kHz', '1 MHz', '10 MHz', '100 MHz', '1 GHz', '10 GHz']);
    expect(x.map.toPx(1e3)).toBe(0);
    expect(x.map.toPx(1e10)).toBeCloseTo(540, 9);
    expect(frequencyAxis(1e3, 1e10, 540)).toEqual({ ...x, map: expect.anything() });
  });

  it('label a time axis in seconds', () => {
    expect(logRangeAxis(1e-9, 1e-3, 540, 's').ticks.labels).toContain('1 µs');
  });

  it('give a log value axis whole decades with headroom over the data', () => {
    // 1 Ω … 1 kΩ, a tenth of a decade of headroom each side: 100 mΩ … 10 kΩ.
    const y = logValueAxis(1, 1000, 250, 'Ω');
    expect(y.domain).toEqual([0.1, 10000]);
    expect(y.ticks.labels[0]).toBe('100 mΩ');
  });

  it('step a linear axis by 1, 2 or 5 × 10^k and label it in its unit, or as plain numbers', () => {
    expect(niceStep(0.07, 6)).toBeCloseTo(0.01, 15);
    expect(niceStep(40, 6)).toBeCloseTo(5, 15);
    const v = linearValueAxis(-0.031, 0.012, 260, 'V', 6);
    expect(v.domain[0]).toBeCloseTo(-0.035, 12);
    expect(v.domain[1]).toBeCloseTo(0.015, 12);
    expect(v.ticks.labels).toContain('0 V');
    expect(v.ticks.labels).toContain('−20 mV');
    const share = linearValueAxis(-0.05, 1.05, 220, '', 5);
    expect(share.ticks.labels).toEqual(['−0.2', '0', '0.2', '0.4', '0.6', '0.8', '1', '1.2']);
  });
});
