import { describe, expect, it } from 'vitest';
import { decadeOf, logAxis, logTicks, niceLogDomain, positiveExtent, signedLog, signedLogInverse, signedLogTicks } from '../../src/charts/scales.js';

describe('log domains and ticks', () => {
  it('rounds a range out to whole decades, exact powers of ten staying put', () => {
    expect(niceLogDomain(0.018, 1592)).toEqual([0.01, 10000]);
    expect(niceLogDomain(1e3, 1e10)).toEqual([1e3, 1e10]);
    expect(niceLogDomain(5, 5)).toEqual([1, 10]);
    expect(niceLogDomain(10, 10)).toEqual([1, 100]);
    // 1e-3 is 0.001 exactly; floor(log10(0.001)) is -3 in IEEE doubles, and 1000 must not slip to 100.
    expect(decadeOf(1000)).toBe(3);
    expect(decadeOf(0.001)).toBe(-3);
    expect(decadeOf(999.999)).toBe(2);
  });

  it('labels every decade in engineering notation when there is room', () => {
    const t = logTicks([1e3, 1e10], 540, 'Hz', 58);
    expect(t.labels).toEqual(['1 kHz', '10 kHz', '100 kHz', '1 MHz', '10 MHz', '100 MHz', '1 GHz', '10 GHz']);
    expect(t.values).toEqual([1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10]);
    // 77 px per decade ≥ 40: minor grid at 2…9 × each decade, 8 per decade, 7 decades.
    expect(t.minor).toHaveLength(56);
    expect(t.minor.slice(0, 3)).toEqual([2000, 3000, 4000]);
  });

  it('labels every second (even) decade when decades are narrow, and keeps a grid line at the others', () => {
    const t = logTicks([1e-9, 1e3], 250, 'S', 22); // 20.8 px per decade
    expect(t.labels).toEqual(['10 nS', '1 µS', '100 µS', '10 mS', '1 S', '100 S']);
    expect(t.minor).toEqual([1e-9, 1e-7, 1e-5, 1e-3, 1e-1, 10, 1000]);
  });

  it('maps values to px on a log axis', () => {
    const a = logAxis([1e3, 1e10], 700);
    expect(a.toPx(1e3)).toBe(0);
    expect(a.toPx(1e6)).toBeCloseTo(300, 9);
    expect(a.toPx(1e10)).toBeCloseTo(700, 9);
  });

  it('limits an extent to the given number of decades below its top', () => {
    expect(positiveExtent([[0, -1, 1e-20, 5, NaN, Infinity, 1e4]], 12)).toEqual([1e-8, 1e4]);
    expect(positiveExtent([[3, 0.5]], 12)).toEqual([0.5, 3]);
  });
});

describe('signed-log scale', () => {
  it('is linear near zero, logarithmic far out, odd, and inverted exactly', () => {
    const c = 0.01;
    // Near 0: log10(1 + x) = (x − x²/2 + …)/ln 10 (Taylor series), so s(v) ≈ v/(c·ln 10) to relative v/(2c).
    expect(signedLog(1e-6, c) / (1e-6 / (c * Math.LN10)) - 1).toBeLessThan(1e-4);
    expect(signedLog(-10, c)).toBeCloseTo(-Math.log10(1001), 12);
    expect(signedLog(0, c)).toBe(0);
    for (const v of [-1234.5, -0.02, 0, 3e-4, 42]) expect(signedLogInverse(signedLog(v, c), c)).toBeCloseTo(v, 9);
  });

  it('puts ticks at 0 and ±c·10^k, labelled with the value they stand for', () => {
    const c = 0.01;
    const t = signedLogTicks([signedLog(-1000, c), signedLog(10, c)], c, 300, 'Ω', 10); // 37.5 px per unit: ±c sits 11 px from 0
    expect(t.labels).toEqual(['−1 kΩ', '−100 Ω', '−10 Ω', '−1 Ω', '−100 mΩ', '−10 mΩ', '0 Ω', '10 mΩ', '100 mΩ', '1 Ω', '10 Ω']);
    t.values.forEach((s, k) => expect(signedLogInverse(s, c)).toBeCloseTo([-1000, -100, -10, -1, -0.1, -0.01, 0, 0.01, 0.1, 1, 10][k], 9));
  });

  it('leaves ±c unlabelled when it would crowd the 0 label', () => {
    const c = 1;
    const t = signedLogTicks([signedLog(-1e9, c), signedLog(1e9, c)], c, 200, 'Ω', 20);
    expect(t.labels).not.toContain('1 Ω');
    expect(t.minor).toContain(signedLog(1, c));
  });
});
