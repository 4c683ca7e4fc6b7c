// The values zfolio computes with. Inside these ranges every element's impedance, R, ωL or 1/(ωC), lies
// between about 6e-18 Ω and 2e20 Ω at every frequency zfolio evaluates, so its square (the engine divides by
// |Z|² when it adds admittances) stays between 4e-35 and 4e40: far from overflow (1.8e308) and from the
// subnormal numbers below 2.2e-308, with room for the sums and resonant cancellations of a network. Values
// outside are refused where they are read, so nothing accepted can turn into NaN or Infinity.
//
//   ω·L    : 2π·1e-3 Hz · 1e-15 H = 6.3e-18 Ω   …   2π·1e12 Hz · 1e6 H = 6.3e18 Ω
//   1/(ω·C): 1/(2π·1e12 Hz · 1e4 F) = 1.6e-17 Ω  …   1/(2π·1e-3 Hz · 1e-18 F) = 1.6e20 Ω
//   R      : 1e-9 Ω … 1e15 Ω

import { formatEng } from './format.js';
import type { Dimension } from './quantity.js';

export interface ValueRange {
  min: number;
  max: number;
}

/** Inclusive ranges by dimension; a dimension not listed (ratio) is checked by its field. */
export const VALUE_RANGES: Readonly<Partial<Record<Dimension, ValueRange>>> = {
  capacitance: { min: 1e-18, max: 1e4 }, // 1 aF … 10 kF (the largest supercapacitors hold a few kF)
  inductance: { min: 1e-15, max: 1e6 }, // 1 fH … 1 MH
  resistance: { min: 1e-9, max: 1e15 }, // 1 nΩ … 1 PΩ (insulation resistances reach TΩ)
  frequency: { min: 1e-3, max: 1e12 }, // 1 mHz … 1 THz
  voltage: { min: 1e-6, max: 1e6 }, // 1 µV … 1 MV
  current: { min: 1e-9, max: 1e6 }, // 1 nA … 1 MA
  power: { min: 1e-9, max: 1e9 }, // 1 nW … 1 GW
  time: { min: 1e-15, max: 1e3 }, // 1 fs … 1000 s (a load step's edge and how long it is followed)
};

/** "from 1 aF to 10 kF" for messages and the README. */
export function rangeText(dim: Dimension): string {
  const range = VALUE_RANGES[dim];
  if (!range) return '';
  return `from ${formatEng(range.min, dim)} to ${formatEng(range.max, dim)}`;
}

/** Whether a non-zero magnitude lies in the range of its dimension (always true for unbounded ones). */
export function inRange(value: number, dim: Dimension): boolean {
  const range = VALUE_RANGES[dim];
  if (!range) return Number.isFinite(value);
  const magnitude = Math.abs(value);
  return magnitude >= range.min && magnitude <= range.max;
}
