// EIA-198 ceramic dielectric codes: class 2/3 "X7R" (low temperature, high temperature, change) and class 1
// "C0G" (from memory of the EIA-198 tables: significant figure, multiplier, tolerance letters). A part file
// may also name a dielectric in words ("polymer", "film PP"); only three-character codes are held to EIA-198.

const EIA_CLASS_2 = /^[XYZ][4-9][PRSTUV]$/;
const EIA_CLASS_1 = /^[CBLAMPRSTUV][0-9][FGHJKLMN]$/;

/** A class 2 ceramic ("X7R", "X5R", "Y5V"): its capacitance falls with DC bias, temperature and age. */
export function isClass2Dielectric(code: string): boolean {
  return EIA_CLASS_2.test(code);
}

/** Whether a dielectric as a part file writes it is acceptable: an EIA-198 code, NP0, or words. */
export function isAcceptedDielectric(code: string): boolean {
  if (code.length !== 3 || code === 'NP0') return true;
  return EIA_CLASS_2.test(code) || EIA_CLASS_1.test(code);
}
