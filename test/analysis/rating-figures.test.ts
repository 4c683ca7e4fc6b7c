// The figures behind the safety cautions, against closed forms worked by hand: a sine peaks at √2 × its
// r.m.s. value, E = ½·C·V², I = 2π·f·C·V (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed.).

import { describe, expect, it } from 'vitest';
import { leakageCurrentA, peakVolts, ratedPeak, storedEnergyJ } from '../../src/analysis/rating-figures.js';
import { parseVoltageRating } from '../../src/model/voltage-rating.js';

const rating = (text: string) => {
  const r = parseVoltageRating(text);
  if (!r.ok) throw new Error(r.message);
  return r.rating;
};

describe('peak voltages', () => {
  it('a sinusoidal AC rating peaks at √2 × r.m.s.: 310 V AC → 438.4 V (closed form)', () => {
    expect(peakVolts(rating('310V AC'))).toBeCloseTo(310 * Math.sqrt(2), 9);
    expect(peakVolts(rating('310V AC'))).toBeCloseTo(438.406, 3);
    expect(peakVolts(rating('400V DC'))).toBe(400);
  });

  it('the highest peak of several ratings, with the rating it comes from; none without a rating', () => {
    // 310 V AC peaks at 438.4 V, above 400 V DC.
    const both = [rating('400V DC'), rating('310V AC')];
    expect(ratedPeak(both)?.rating).toBe(both[1]);
    expect(ratedPeak([rating('630V DC'), rating('310V AC')])?.volts).toBe(630);
    expect(ratedPeak([])).toBeUndefined();
  });
});

describe('stored energy and touch current', () => {
  it('100 nF at 438.4 V holds ½·C·V² = 9.61 mJ', () => {
    expect(storedEnergyJ(100e-9, 310 * Math.SQRT2)).toBeCloseTo(0.5 * 100e-9 * 2 * 310 * 310, 15);
    expect(storedEnergyJ(100e-9, 310 * Math.SQRT2)).toBeCloseTo(9.61e-3, 5);
  });

  it('4.7 nF at 250 V r.m.s. and 60 Hz passes 2π·60·4.7n·250 = 443 µA', () => {
    expect(leakageCurrentA(4.7e-9, 250, 60)).toBeCloseTo(2 * Math.PI * 60 * 4.7e-9 * 250, 15);
    expect(leakageCurrentA(4.7e-9, 250, 60)).toBeCloseTo(443e-6, 6);
  });
});
