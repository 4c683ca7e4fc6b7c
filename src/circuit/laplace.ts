// Z(s) and dZ/ds of an element tree at a complex frequency s = σ + jω (rad/s), off the jω axis: for
// polishing natural frequencies, where the sweep kernels (real ω only) cannot go. The element laws in the
// Laplace domain: Z_R = R, Z_L = sL, Z_C = 1/(sC); series adds Z, parallel adds Y = 1/Z; the derivatives by
// the quotient rule (Alexander & Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 15).

import type { Element } from './element.js';

/** Z = [re, im] and dZ/ds = [dRe, dIm]. */
export type LaplaceValue = [number, number, number, number];

const mul = (ar: number, ai: number, br: number, bi: number): [number, number] => [ar * br - ai * bi, ar * bi + ai * br];
const inv = (ar: number, ai: number): [number, number] => {
  const d = ar * ar + ai * ai;
  return [ar / d, -ai / d];
};

/** Z(s) and dZ/ds of `element` at s = sRe + j·sIm. */
export function laplaceImpedance(element: Element, sRe: number, sIm: number): LaplaceValue {
  switch (element.type) {
    case 'R':
      return [element.ohms, 0, 0, 0];
    case 'L':
      return [sRe * element.henries, sIm * element.henries, element.henries, 0];
    case 'C': {
      const [zr, zi] = inv(sRe * element.farads, sIm * element.farads);
      // d/ds (1/(sC)) = −1/(s²C) = −Z/s
      const [qr, qi] = mul(zr, zi, ...inv(sRe, sIm));
      return [zr, zi, -qr, -qi];
    }
    case 'series':
      return element.parts.reduce<LaplaceValue>(
        (sum, p) => {
          const v = laplaceImpedance(p, sRe, sIm);
          return [sum[0] + v[0], sum[1] + v[1], sum[2] + v[2], sum[3] + v[3]];
        },
        [0, 0, 0, 0],
      );
    case 'parallel': {
      // Y = Σ 1/Z_i, Y' = −Σ Z_i'/Z_i²; Z = 1/Y, Z' = −Y'/Y².
      let yr = 0;
      let yi = 0;
      let dyr = 0;
      let dyi = 0;
      for (const p of element.parts) {
        const [zr, zi, dzr, dzi] = laplaceImpedance(p, sRe, sIm);
        const [ur, ui] = inv(zr, zi);
        yr += ur;
        yi += ui;
        const [u2r, u2i] = mul(ur, ui, ur, ui);
        const [tr, ti] = mul(dzr, dzi, u2r, u2i);
        dyr -= tr;
        dyi -= ti;
      }
      const [zr, zi] = inv(yr, yi);
      const [z2r, z2i] = mul(zr, zi, zr, zi);
      const [tr, ti] = mul(dyr, dyi, z2r, z2i);
      return [zr, zi, -tr, -ti];
    }
  }
}
