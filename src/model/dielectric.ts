// EIA-198 ceramic dielectric codes (decoded in src/units/eia-dielectric.ts): class 2/3 "X7R" (low
// temperature, high temperature, change) and class 1 "C0G". A part file may also name a dielectric in words
// ("polymer", "film PP"); only three-character codes are held to EIA-198.

import { decodeEiaDielectric, looksLikeEiaCode } from '../units/eia-dielectric.js';

/** A class 2 ceramic ("X7R", "X5R", "Y5V"): its capacitance falls with DC bias, temperature and age. */
export function isClass2Dielectric(code: string): boolean {
  const decoded = decodeEiaDielectric(code);
  return decoded.ok && decoded.dielectric.class === 2;
}

/** Whether a dielectric as a part file writes it is acceptable: an EIA-198 code, NP0, or words. */
export function isAcceptedDielectric(code: string): boolean {
  return !looksLikeEiaCode(code) || decodeEiaDielectric(code).ok;
}
