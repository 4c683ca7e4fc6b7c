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

/** A tree's compiled sweep (one function per tree shape, kernel.ts) and the leaf values it reads. */
interface Kernel {
  run: (omega: Float64Array, re: Float64Array, im: Float64Array, k: Float64Array) => void;
  k: Float64Array;
}

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
  const kernel = kernelOf(element);
  kernel.run(omegaOf(frequencies), re, im, kernel.k);
}

/**
 * The values of `element`'s leaves (Ω, H, F), one a leaf, in the order its kernel reads them: depth first, each
 * group's parts in their order (leavesOf). A new array, to change and hand to impedanceSweepWithValuesInto.
 */
export function leafValues(element: Element): Float64Array {
  return kernelOf(element).k.slice();
}

/**
 * The impedance of the tree `element` with its leaves' values replaced by `values` (in leafValues' order), into
 * `re` and `im`: the same bits as impedanceSweep of that tree built anew, without building it or its kernel
 * (a part's spread evaluates many models of one shape).
 */
export function impedanceSweepWithValuesInto(element: Element, values: Float64Array, frequencies: Float64Array, re: Float64Array, im: Float64Array): void {
  const kernel = kernelOf(element);
  if (values.length !== kernel.k.length) throw new RangeError(`${values.length} values for a tree of ${kernel.k.length} leaves`);
  for (const v of values) if (!Number.isFinite(v)) throw new RangeError(`element value ${v} is not finite`);
  kernel.run(omegaOf(frequencies), re, im, values);
}

/** Impedance at a single frequency, as [re, im] in Ω; the same kernel as the sweep, so the same bits. */
export function impedanceAt(element: Element, frequencyHz: number): [number, number] {
  const omega = new Float64Array(1);
  omega[0] = TWO_PI * frequencyHz;
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  const kernel = kernelOf(element);
  kernel.run(omega, re, im, kernel.k);
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
  const run = shapeKernel<Kernel['run']>(['omega', 're', 'im'], sweepBody(generated));
  return { run, k: Float64Array.from(generated.constants) };
}

/** The leaves of a tree in the order its kernel reads their values (leafValues): depth first, parts in order. */
export function leavesOf(element: Element): Extract<Element, { type: 'R' | 'L' | 'C' }>[] {
  return element.type === 'series' || element.type === 'parallel' ? element.parts.flatMap(leavesOf) : [element];
}
