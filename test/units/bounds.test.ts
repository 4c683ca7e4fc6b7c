import { describe, expect, it } from 'vitest';
import { parseBounds, splitValueAndSpread } from '../../src/units/bounds.js';

describe('spreads beside a value', () => {
  it.each([
    ['10%', 0.1, 0.1, true],
    ['0.05', 0.05, 0.05, true],
    ['±20%', 0.2, 0.2, true],
    ['+-20%', 0.2, 0.2, true],
    ['+80%/-20%', 0.2, 0.8, false],
    ['-20%/+80%', 0.2, 0.8, false],
    ['−20% / +80%', 0.2, 0.8, false],
    ['+50%', 0, 0.5, false],
    ['-30%', 0.3, 0, false],
  ] as const)('%s', (text, minus, plus, symmetric) => {
    const parsed = parseBounds(text);
    expect(parsed).toEqual({ ok: true, bounds: { minus: expect.closeTo(minus, 15), plus: expect.closeTo(plus, 15) }, symmetric });
  });

  it.each([
    ['+80%/+20%', 'one side above (+) and one below (-)'],
    ['10', 'would mean 1000%'],
    ['-100%', 'less than 100% below'],
    ['±120%', 'less than 100% below'],
    ['ten', 'expected a spread such as'],
    ['10%/20%', 'expected a spread such as'],
  ])('refuses %s', (text, message) => {
    const parsed = parseBounds(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toContain(message);
  });

  it('splits a value from the spread written after it', () => {
    expect(splitValueAndSpread('18m +50%/-30%')).toEqual({ value: '18m', spread: '+50%/-30%' });
    expect(splitValueAndSpread('0.45 nH ±10%')).toEqual({ value: '0.45 nH', spread: '±10%' });
    expect(splitValueAndSpread('18m')).toEqual({ value: '18m' });
    expect(splitValueAndSpread('1e-3')).toEqual({ value: '1e-3' });
    expect(splitValueAndSpread('100 nF')).toEqual({ value: '100 nF' });
  });
});
