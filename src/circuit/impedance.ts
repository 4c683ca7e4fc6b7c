// Complex impedance of an element tree, over a sweep (typed arrays) or at one frequency.
// Element laws: Z_R = R, Z_L = jωL, Z_C = 1/(jωC) = −j/(ωC); series adds impedances, parallel adds
// admittances Y = 1/Z (any circuit-analysis text, e.g. Alexander & Sadiku, Fundamentals of Electric
// Circuits, 6th ed., ch. 9).
//
// Each tree is compiled once into a straight-line kernel: one loop over the sweep, the whole tree evaluated
// in local variables at each point, no object per complex number and no intermediate arrays. The generated
// code holds only numbers taken from the (already validated) tree, never text from a file.

import type { Element } from './element.js';

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

/** The generated source of a tree's kernel body (exported for tests and curiosity). */
export function kernelSource(element: Element): string {
  const lines: string[] = [];
  let next = 0;
  const fresh = (stem: string) => `${stem}${next++}`;
  const num = (v: number) => {
    if (!Number.isFinite(v)) throw new RangeError(`element value ${v} is not finite`);
    return `(${String(v)})`;
  };

  // Emits statements computing Z of `e` at angular frequency `w`; returns the names of its re and im.
  const emit = (e: Element): [string, string] => {
    switch (e.type) {
      case 'R':
        return [num(e.ohms), '0'];
      case 'L': {
        const im = fresh('x');
        lines.push(`const ${im} = w * ${num(e.henries)};`);
        return ['0', im];
      }
      case 'C': {
        const im = fresh('x');
        lines.push(`const ${im} = -1 / (w * ${num(e.farads)});`);
        return ['0', im];
      }
      case 'series': {
        const re = fresh('r');
        const im = fresh('x');
        lines.push(`let ${re} = 0, ${im} = 0;`);
        for (const part of e.parts) {
          const [pr, pi] = emit(part);
          if (pr !== '0') lines.push(`${re} += ${pr};`);
          if (pi !== '0') lines.push(`${im} += ${pi};`);
        }
        return [re, im];
      }
      case 'parallel': {
        // Accumulate Y = G + jB; leaves add their admittance directly (G = 1/R, B = −1/(ωL), B = ωC).
        // A branch whose impedance is exactly 0 (a series resonance hit exactly, without loss) shorts the
        // group: Z = 0. A total admittance of exactly 0 (a lossless parallel resonance) is an open: Z = ∞.
        const g = fresh('g');
        const b = fresh('b');
        const shorted = fresh('s');
        lines.push(`let ${g} = 0, ${b} = 0, ${shorted} = false;`);
        for (const part of e.parts) {
          if (part.type === 'R') lines.push(`${g} += 1 / ${num(part.ohms)};`);
          else if (part.type === 'L') lines.push(`${b} -= 1 / (w * ${num(part.henries)});`);
          else if (part.type === 'C') lines.push(`${b} += w * ${num(part.farads)};`);
          else {
            const [pr, pi] = emit(part);
            const d = fresh('d');
            lines.push(`const ${d} = ${pr} * ${pr} + ${pi} * ${pi};`, `if (${d} === 0) ${shorted} = true;`, `else { ${g} += ${pr} / ${d}; ${b} -= ${pi} / ${d}; }`);
          }
        }
        const d = fresh('d');
        const re = fresh('r');
        const im = fresh('x');
        lines.push(
          `const ${d} = ${g} * ${g} + ${b} * ${b};`,
          `const ${re} = ${shorted} ? 0 : ${d} === 0 ? Infinity : ${g} / ${d};`,
          `const ${im} = ${shorted} || ${d} === 0 ? 0 : -${b} / ${d};`,
        );
        return [re, im];
      }
    }
  };

  const [re, im] = emit(element);
  return [
    'const n = omega.length;',
    'for (let i = 0; i < n; i++) {',
    '  const w = omega[i];',
    ...lines.map((l) => '  ' + l),
    `  re[i] = ${re};`,
    `  im[i] = ${im};`,
    '}',
  ].join('\n');
}

function compileKernel(element: Element): Kernel {
  return new Function('omega', 're', 'im', kernelSource(element)) as Kernel;
}
