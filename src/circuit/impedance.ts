// Complex impedance of an element tree, over a sweep (typed arrays) or at one frequency.
//
// Each tree is compiled once into a straight-line kernel (kernel.ts): one loop over the sweep, the whole tree
// evaluated in local variables at each point, no object per complex number and no intermediate arrays.

import type { Element } from './element.js';
import { kernelLines, shapeKernel } from './kernel.js';

/** Z = re + j·im at each sweep point, in Ω. */
export interface ImpedanceArrays {
  readonly re: Float64Array;
  readonly im: Float64Array;
}

type Kernel = (omega: Float64Array, re: Float64Array, im: Float64Array) => void;

const TWO_PI = 2 * Math.PI;
const kernels = new WeakMap<Element, Kernel>();
// A build sweeps every part over the same frequency array: its ω = 2πf is computed once.
const angularFrequencies = new WeakMap<Float64Array, Float64Array>();

function omegaOf(frequencies: Float64Array): Float64Array {
  let omega = angularFrequencies.get(frequencies);
  if (!omega) {
    omega = new Float64Array(frequencies.length);
    for (let i = 0; i < omega.length; i++) omega[i] = TWO_PI * frequencies[i];
    angularFrequencies.set(frequencies, omega);
  }
  return omega;
}

/** Impedance of `element` at every frequency of `frequencies` (Hz). */
export function impedanceSweep(element: Element, frequencies: Float64Array): ImpedanceArrays {
  const n = frequencies.length;
  // One allocation for both halves: allocating typed arrays costs more than evaluating a simple model.
  const buffer = new ArrayBuffer(16 * n);
  const z = { re: new Float64Array(buffer, 0, n), im: new Float64Array(buffer, 8 * n, n) };
  impedanceSweepInto(element, frequencies, z.re, z.im);
  return z;
}

/** The same into caller-owned arrays (length of `frequencies`), for loops that evaluate many times. */
export function impedanceSweepInto(element: Element, frequencies: Float64Array, re: Float64Array, im: Float64Array): void {
  kernelOf(element)(omegaOf(frequencies), re, im);
}

/** Impedance at a single frequency, as [re, im] in Ω; the same kernel as the sweep, so the same bits. */
export function impedanceAt(element: Element, frequencyHz: number): [number, number] {
  const omega = new Float64Array(1);
  omega[0] = TWO_PI * frequencyHz;
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  kernelOf(element)(omega, re, im);
  return [re[0], im[0]];
}

function kernelOf(element: Element): Kernel {
  let kernel = kernels.get(element);
  if (!kernel) {
    kernel = compileKernel(element);
    kernels.set(element, kernel);
  }
  return kernel;
}

/** The generated source of a tree's sweep kernel body, reading the tree's values from `k` (exported for tests and curiosity). */
export function kernelSource(element: Element): string {
  return sweepBody(kernelLines(element, false));
}

function sweepBody({ lines, result }: ReturnType<typeof kernelLines>): string {
  return ['const n = omega.length;', 'for (let i = 0; i < n; i++) {', '  const w = omega[i];', ...lines.map((l) => '  ' + l), `  re[i] = ${result[0]};`, `  im[i] = ${result[1]};`, '}'].join('\n');
}

function compileKernel(element: Element): Kernel {
  const generated = kernelLines(element, false);
  const run = shapeKernel<(omega: Float64Array, re: Float64Array, im: Float64Array, k: Float64Array) => void>(['omega', 're', 'im'], sweepBody(generated));
  const k = Float64Array.from(generated.constants);
  return (omega, re, im) => run(omega, re, im, k);
}
