// Complex impedance of an element tree, over a sweep (typed arrays) or at one frequency.
// Element laws: Z_R = R, Z_L = jωL, Z_C = 1/(jωC) = −j/(ωC); series adds impedances, parallel adds
// admittances Y = 1/Z (any circuit-analysis text, e.g. Alexander & Sadiku, Fundamentals of Electric
// Circuits, ch. 9).

import type { Element } from './element.js';

/** Z = re + j·im at each sweep point, in Ω. */
export interface ImpedanceArrays {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

const TWO_PI = 2 * Math.PI;

/** Impedance of `element` at every frequency of `frequencies` (Hz). */
export function impedanceSweep(element: Element, frequencies: Float64Array): ImpedanceArrays {
  const n = frequencies.length;
  const omega = new Float64Array(n);
  for (let i = 0; i < n; i++) omega[i] = TWO_PI * frequencies[i];
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  evaluate(element, omega, re, im);
  return { re, im };
}

function evaluate(element: Element, omega: Float64Array, re: Float64Array, im: Float64Array): void {
  const n = omega.length;
  switch (element.type) {
    case 'R':
      re.fill(element.ohms);
      im.fill(0);
      return;
    case 'L': {
      const l = element.henries;
      re.fill(0);
      for (let i = 0; i < n; i++) im[i] = omega[i] * l;
      return;
    }
    case 'C': {
      const c = element.farads;
      re.fill(0);
      for (let i = 0; i < n; i++) im[i] = -1 / (omega[i] * c);
      return;
    }
    case 'series': {
      re.fill(0);
      im.fill(0);
      let scratchRe: Float64Array | undefined;
      let scratchIm: Float64Array | undefined;
      for (const part of element.parts) {
        if (addLeafImpedance(part, omega, re, im)) continue;
        scratchRe ??= new Float64Array(n);
        scratchIm ??= new Float64Array(n);
        evaluate(part, omega, scratchRe, scratchIm);
        for (let i = 0; i < n; i++) {
          re[i] += scratchRe[i];
          im[i] += scratchIm[i];
        }
      }
      return;
    }
    case 'parallel': {
      // Accumulate the admittance Y = G + jB in re/im, then invert in place.
      re.fill(0);
      im.fill(0);
      let scratchRe: Float64Array | undefined;
      let scratchIm: Float64Array | undefined;
      for (const part of element.parts) {
        if (addLeafAdmittance(part, omega, re, im)) continue;
        scratchRe ??= new Float64Array(n);
        scratchIm ??= new Float64Array(n);
        evaluate(part, omega, scratchRe, scratchIm);
        for (let i = 0; i < n; i++) {
          const a = scratchRe[i];
          const b = scratchIm[i];
          const d = a * a + b * b;
          re[i] += a / d;
          im[i] -= b / d;
        }
      }
      for (let i = 0; i < n; i++) {
        const g = re[i];
        const b = im[i];
        const d = g * g + b * b;
        re[i] = g / d;
        im[i] = -b / d;
      }
      return;
    }
  }
}

/** Add a leaf's impedance without a scratch buffer; false when the part is not a leaf. */
function addLeafImpedance(part: Element, omega: Float64Array, re: Float64Array, im: Float64Array): boolean {
  const n = omega.length;
  switch (part.type) {
    case 'R': {
      const r = part.ohms;
      for (let i = 0; i < n; i++) re[i] += r;
      return true;
    }
    case 'L': {
      const l = part.henries;
      for (let i = 0; i < n; i++) im[i] += omega[i] * l;
      return true;
    }
    case 'C': {
      const c = part.farads;
      for (let i = 0; i < n; i++) im[i] -= 1 / (omega[i] * c);
      return true;
    }
    default:
      return false;
  }
}

/** Add a leaf's admittance (G = 1/R, B_L = −1/(ωL), B_C = ωC); false when the part is not a leaf. */
function addLeafAdmittance(part: Element, omega: Float64Array, g: Float64Array, b: Float64Array): boolean {
  const n = omega.length;
  switch (part.type) {
    case 'R': {
      const conductance = 1 / part.ohms;
      for (let i = 0; i < n; i++) g[i] += conductance;
      return true;
    }
    case 'L': {
      const l = part.henries;
      for (let i = 0; i < n; i++) b[i] -= 1 / (omega[i] * l);
      return true;
    }
    case 'C': {
      const c = part.farads;
      for (let i = 0; i < n; i++) b[i] += omega[i] * c;
      return true;
    }
    default:
      return false;
  }
}

/** Impedance at a single frequency, as [re, im] in Ω; same laws as the sweep, used by root finders. */
export function impedanceAt(element: Element, frequencyHz: number): [number, number] {
  return impedanceAtOmega(element, TWO_PI * frequencyHz);
}

function impedanceAtOmega(element: Element, omega: number): [number, number] {
  switch (element.type) {
    case 'R':
      return [element.ohms, 0];
    case 'L':
      return [0, omega * element.henries];
    case 'C':
      return [0, -1 / (omega * element.farads)];
    case 'series': {
      let re = 0;
      let im = 0;
      for (const part of element.parts) {
        const [a, b] = impedanceAtOmega(part, omega);
        re += a;
        im += b;
      }
      return [re, im];
    }
    case 'parallel': {
      let g = 0;
      let b = 0;
      for (const part of element.parts) {
        switch (part.type) {
          case 'R':
            g += 1 / part.ohms;
            break;
          case 'L':
            b -= 1 / (omega * part.henries);
            break;
          case 'C':
            b += omega * part.farads;
            break;
          default: {
            const [zr, zi] = impedanceAtOmega(part, omega);
            const d = zr * zr + zi * zi;
            g += zr / d;
            b -= zi / d;
          }
        }
      }
      const d = g * g + b * b;
      return [g / d, -b / d];
    }
  }
}
