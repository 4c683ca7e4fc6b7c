// The impedance of an element tree and its derivative with respect to angular frequency, at one frequency.
// Used to place extrema of |Z| by root finding on an exact slope instead of on sampled magnitudes: near a
// smooth maximum |Z| changes by only ~(δf/f)² so its position cannot be found to better than about
// √ε ≈ 1e-8 from magnitudes alone, while the slope crosses zero linearly. The kernel is the sweep's
// (kernel.ts) with the derivative's lines added, so its Z is the sweep's to the bit.

import type { Element } from './element.js';
import { addAdmittanceSlope } from './admittance.js';
import { kernelLines, shapeKernel } from './kernel.js';

/** Z = re + j·im (Ω) and dZ/dω = dRe + j·dIm (Ω·s). */
export interface ImpedanceSlope {
  re: number;
  im: number;
  dRe: number;
  dIm: number;
}

// Each tree is compiled once: peak refinement evaluates whole rails dozens of times per peak.
type SlopeKernel = (omega: number, out: Float64Array) => void;
const slopeKernels = new WeakMap<Element, SlopeKernel>();
const scratch = new Float64Array(4);

/** Z and dZ/dω of `element` at angular frequency `omega` (rad/s). */
export function impedanceSlopeAt(element: Element, omega: number): ImpedanceSlope {
  slopeKernelOf(element)(omega, scratch);
  return { re: scratch[0], im: scratch[1], dRe: scratch[2], dIm: scratch[3] };
}

/** The same into `out` = [re, im, dRe, dIm], without allocating. */
export function impedanceSlopeInto(element: Element, omega: number, out: Float64Array): void {
  slopeKernelOf(element)(omega, out);
}

function slopeKernelOf(element: Element): SlopeKernel {
  let kernel = slopeKernels.get(element);
  if (!kernel) {
    const generated = kernelLines(element, true);
    const run = shapeKernel<(w: number, out: Float64Array, k: Float64Array) => void>(['w', 'out'], slopeBody(generated));
    const k = Float64Array.from(generated.constants);
    kernel = (w, out) => run(w, out, k);
    slopeKernels.set(element, kernel);
  }
  return kernel;
}

/** The generated body of a tree's slope kernel, reading the tree's values from `k` (exported for tests). */
export function slopeKernelSource(element: Element): string {
  return slopeBody(kernelLines(element, true));
}

function slopeBody({ lines, result }: ReturnType<typeof kernelLines>): string {
  return [...lines, ...result.map((v, k) => `out[${k}] = ${v};`)].join('\n');
}

/** From Z and Z' to Y = 1/Z and Y' = −Z'/Z² (and, symmetrically, from Y and Y' back to Z and Z'). */
export function admittanceSlope(z: ImpedanceSlope, count = 1): ImpedanceSlope {
  const y = new Float64Array(4);
  addAdmittanceSlope(z.re, z.im, z.dRe, z.dIm, count, y);
  return { re: y[0], im: y[1], dRe: y[2], dIm: y[3] };
}
