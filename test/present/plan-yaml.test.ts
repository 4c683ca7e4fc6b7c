import { describe, expect, it } from 'vitest';
import { exactQuantityText } from '../../src/present/plan-yaml.js';
import { parseQuantity } from '../../src/units/parse.js';

// Printed values must read back to the same double (IEEE 754 equality), so a printed plan re-checks to the
// same margin; the reader is zfolio's own parser, the property is equality of what goes out and comes back.
describe('exactQuantityText', () => {
  const values = [1e-9, 0.4e-9, 0.25e-9, 0.3e-9, 0.8e-9, 4.0000000000000003e-10, 1e-9 / 3, 7.77e-10, 1.2345678901234e-9, 0, 2.5e-12, 5e-16];
  it.each(values)('%d reads back exactly', (value) => {
    const text = exactQuantityText(value, 'inductance');
    const back = parseQuantity(text, 'inductance');
    expect(back.ok && back.value).toBe(value);
  });
  it('uses engineering notation with no more digits than needed', () => {
    expect(exactQuantityText(1e-9, 'inductance')).toBe('1nH');
    expect(exactQuantityText(0.25e-9, 'inductance')).toBe('250pH');
    expect(exactQuantityText(0, 'inductance')).toBe('0H');
  });
});
