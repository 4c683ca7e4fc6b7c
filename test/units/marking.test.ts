import { describe, expect, it } from 'vitest';
import { parseMarking } from '../../src/units/marking.js';

// IEC 60062:2016 clause 4 (numeric code): significant figures, then the power of ten; pF for capacitors,
// Ω for resistors. Inductors in µH and the multiplier digit 9 = 10^-1 are common practice (from memory).
describe('numeric marking codes', () => {
  it.each([
    ['104', 'capacitor', 100e-9],
    ['473', 'capacitor', 47e-9],
    ['220', 'capacitor', 22e-12],
    ['109', 'capacitor', 1e-12],
    ['472', 'resistor', 4.7e3],
    ['4702', 'resistor', 47e3],
    ['1000', 'resistor', 100],
    ['4R7', 'resistor', 4.7],
    ['101', 'inductor', 100e-6],
    ['4R7', 'inductor', 4.7e-6],
  ] as const)('%s on a %s = %d', (code, kind, expected) => {
    expect(parseMarking(code, kind)).toEqual({ ok: true, value: expected });
  });

  it('rejects what is not a code', () => {
    expect(parseMarking('10n', 'capacitor').ok).toBe(false);
    expect(parseMarking('12', 'capacitor').ok).toBe(false);
    expect(parseMarking('108', 'capacitor').ok).toBe(false);
  });
});
