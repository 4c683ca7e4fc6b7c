// Which dielectrics a part file may name, and which are class 2 ceramics (EIA-198-1, "Ceramic Dielectric
// Capacitors Classes I, II, III and IV": X7R, X5R, X6S and X8R are class II codes; Y5V and Z5U, class III
// in some editions, are written in the same letter-digit-letter table, which zfolio reads as one class
// whose capacitance falls with bias; C0G (formerly NP0) is class I; from memory of the standard as the
// trade reproduces it). Words are not EIA codes and are accepted.

import { describe, expect, it } from 'vitest';
import { isAcceptedDielectric, isClass2Dielectric } from '../../src/model/dielectric.js';

describe('dielectrics', () => {
  it.each(['X7R', 'X5R', 'X6S', 'Y5V', 'Z5U', 'X8R'])('%s is a class 2 ceramic', (code) => {
    expect(isClass2Dielectric(code)).toBe(true);
    expect(isAcceptedDielectric(code)).toBe(true);
  });

  it.each(['C0G', 'NP0', 'U2J'])('%s is a class 1 ceramic, not class 2', (code) => {
    expect(isClass2Dielectric(code)).toBe(false);
    expect(isAcceptedDielectric(code)).toBe(true);
  });

  it('accepts a dielectric in words, and none of them is class 2', () => {
    for (const words of ['polymer', 'film PP', 'tantalum', 'aluminium electrolytic']) {
      expect(isAcceptedDielectric(words), words).toBe(true);
      expect(isClass2Dielectric(words), words).toBe(false);
    }
  });

  it('refuses a three-character code that EIA-198 does not define', () => {
    // Q is no class 2 change letter, 3 no class 2 high-temperature digit; W is no class 1 figure letter.
    for (const code of ['X7Q', 'X3R', 'W0G']) expect(isAcceptedDielectric(code), code).toBe(false);
  });
});
