import { describe, expect, it } from 'vitest';
import { formatCelsius, parseTemperature, parseTemperatureCoefficient } from '../../src/units/temperature.js';

describe('temperatures', () => {
  it.each([
    ['-55°C', -55],
    ['125 °C', 125],
    ['85C', 85],
    ['−40 °C', -40],
    ['0 degC', 0],
    // 0 °C = 273.15 K (BIPM SI Brochure, 9th ed., 2.3.1).
    ['273.15K', 0],
    ['398.15 K', 125],
  ])('%s is %d °C', (text, celsius) => {
    const parsed = parseTemperature(text);
    expect(parsed.ok).toBe(true);
    if (parsed.ok) expect(parsed.celsius).toBeCloseTo(celsius, 10);
  });

  it.each([
    ['-55', 'write °C (or K) after the number'],
    ['-5 K', 'below 0 K'],
    ['900°C', 'from -270 °C to 500 °C'],
    ['warm', 'expected a temperature'],
  ])('refuses %s', (text, message) => {
    const parsed = parseTemperature(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toContain(message);
  });

  it('prints with a true minus sign', () => {
    expect(formatCelsius(-55)).toBe('−55 °C');
    expect(formatCelsius(125)).toBe('125 °C');
  });
});

describe('temperature coefficients', () => {
  it('a bare magnitude is either sign, a signed one is that sign (common practice for resistors)', () => {
    expect(parseTemperatureCoefficient('200ppm/K')).toEqual({ ok: true, lowPerK: -200e-6, highPerK: 200e-6 });
    expect(parseTemperatureCoefficient('±50 ppm/°C')).toEqual({ ok: true, lowPerK: -50e-6, highPerK: 50e-6 });
    expect(parseTemperatureCoefficient('+300ppm/K')).toEqual({ ok: true, lowPerK: 300e-6, highPerK: 300e-6 });
    expect(parseTemperatureCoefficient('-150ppm/K')).toEqual({ ok: true, lowPerK: -150e-6, highPerK: -150e-6 });
  });

  it.each(['200', '200ppm', '20000ppm/K', '±-5ppm/K'])('refuses %s', (text) => {
    expect(parseTemperatureCoefficient(text).ok).toBe(false);
  });
});
