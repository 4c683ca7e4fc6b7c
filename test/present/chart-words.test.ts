// Words drawn on charts: the ones made from figures, checked by hand.

import { describe, expect, it } from 'vitest';
import { bandKeyText, changeKey, decadeMarkText, degreesLabel, dipLabel, loadStepKey, partSpreadKeyText, pointText, railSpreadKeyText, ratedKeyText, resistanceKeyText, targetKeyText } from '../../src/present/chart-words.js';

describe('chart words', () => {
  it('write degrees with a true minus sign', () => {
    expect([-90, 0, 30].map(degreesLabel)).toEqual(['−90°', '0°', '30°']);
  });

  it('name points, bands, targets and decades in engineering notation', () => {
    expect(pointText(7.8e-3, 31.6e6)).toBe('7.8 mΩ at 31.6 MHz');
    expect(ratedKeyText(600, 100e6)).toBe('rated |Z| 600 Ω at 100 MHz');
    expect(bandKeyText({ fromHz: 1e5, toHz: 1e8 })).toBe('band 100 kHz – 100 MHz');
    expect(targetKeyText(4.5e-3)).toBe('target 4.5 mΩ');
    expect(targetKeyText(undefined)).toBe('target');
    expect(decadeMarkText(1e6, 1e6)).toBe('1 MHz');
    expect(decadeMarkText(1e3, 1e7)).toBe('1 kHz – 10 MHz');
    expect(resistanceKeyText('capacitor')).toBe('R (ESR)');
    expect(resistanceKeyText('bead')).toBe('R');
  });

  it('count the corners of a spread, thousands grouped', () => {
    expect(partSpreadKeyText()).toBe('range of |Z| over the spread');
    expect(railSpreadKeyText(1024)).toBe('range of rail |Z| over nominal and 1,024 corners');
  });

  it('word the load step and the before-and-after charts', () => {
    expect(loadStepKey.voltage(2.5)).toBe('v(t) for a 2.5 A step');
    expect(loadStepKey.budget(0.027)).toBe('budget ±27 mV');
    expect(loadStepKey.ramp(1e-6)).toBe('load ramp, 1 µs');
    expect(dipLabel(0.0145, 1.37e-6)).toBe('−14.5 mV at 1.37 µs');
    expect(changeKey.before('v1')).toBe('at v1');
    expect(changeKey.target(0.01, 'v1')).toBe('target at v1 10 mΩ');
    expect(changeKey.target(0.01)).toBe('target 10 mΩ');
  });
});
