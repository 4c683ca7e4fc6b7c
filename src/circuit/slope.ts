// The impedance of an element tree and its derivative with respect to angular frequency, at one frequency.
// Used to place extrema of |Z| by root finding on an exact slope instead of on sampled magnitudes: near a
// smooth maximum |Z| changes by only ~(δf/f)² so its position cannot be found to better than about
// √ε ≈ 1e-8 from magnitudes alone, while the slope crosses zero linearly.
//
// Element laws and their derivatives: Z_R = R (dZ/dω = 0), Z_L = jωL (dZ/dω = jL), Z_C = −j/(ωC)
// (dZ/dω = j/(ω²C)); series: Z = ΣZ_i, Z' = ΣZ_i'; parallel: Y = Σ1/Z_i, Y' = −ΣZ_i'/Z_i², Z = 1/Y,
// Z' = −Y'/Y² = −Y'·Z² (the quotient rule applied to the laws in any circuit-analysis text, e.g. Alexander &
// Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9).

import type { Element } from './element.js';

/** Z = re + j·im (Ω) and dZ/dω = dRe + j·dIm (Ω·s). */
export interface ImpedanceSlope {
  re: number;
  im: number;
  dRe: number;
  dIm: number;
}

// Like the sweep kernels (impedance.ts), each tree is compiled once into straight-line code; peak
// refinement evaluates whole rails dozens of times per peak. The code holds only numbers from the tree.
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
    kernel = new Function('w', 'out', slopeKernelSource(element)) as SlopeKernel;
    slopeKernels.set(element, kernel);
  }
  return kernel;
}

/** The generated body of a tree's slope kernel (exported for tests). */
export function slopeKernelSource(element: Element): string {
  const lines: string[] = [];
  let next = 0;
  const fresh = () => `v${next++}`;
  const num = (v: number) => {
    if (!Number.isFinite(v)) throw new RangeError(`element value ${v} is not finite`);
    return `(${String(v)})`;
  };
  // Emits statements for Z and Z' of `e`; returns the names (or literals) of re, im, dRe, dIm.
  const emit = (e: Element): [string, string, string, string] => {
    switch (e.type) {
      case 'R':
        return [num(e.ohms), '0', '0', '0'];
      case 'L': {
        const x = fresh();
        lines.push(`const ${x} = w * ${num(e.henries)};`);
        return ['0', x, '0', num(e.henries)];
      }
      case 'C': {
        const x = fresh();
        const dx = fresh();
        lines.push(`const ${x} = -1 / (w * ${num(e.farads)});`, `const ${dx} = 1 / (w * w * ${num(e.farads)});`);
        return ['0', x, '0', dx];
      }
      case 'series': {
        const [r, x, dr, dx] = [fresh(), fresh(), fresh(), fresh()];
        lines.push(`let ${r} = 0, ${x} = 0, ${dr} = 0, ${dx} = 0;`);
        for (const part of e.parts) {
          const c = emit(part);
          [r, x, dr, dx].forEach((name, i) => {
            if (c[i] !== '0') lines.push(`${name} += ${c[i]};`);
          });
        }
        return [r, x, dr, dx];
      }
      case 'parallel': {
        // Y = Σ 1/Z_i, Y' = −Σ Z_i'·Y_i²; then Z = 1/Y, Z' = −Y'·Z².
        const [g, b, dg, db] = [fresh(), fresh(), fresh(), fresh()];
        lines.push(`let ${g} = 0, ${b} = 0, ${dg} = 0, ${db} = 0;`);
        const reciprocal = (zr: string, zi: string, dzr: string, dzi: string, into: [string, string, string, string], add: boolean) => {
          const [d, yr, yi, sr, si] = [fresh(), fresh(), fresh(), fresh(), fresh()];
          lines.push(
            `const ${d} = ${zr} * ${zr} + ${zi} * ${zi};`,
            `const ${yr} = ${zr} / ${d}, ${yi} = -${zi} / ${d};`,
            `const ${sr} = ${yr} * ${yr} - ${yi} * ${yi}, ${si} = 2 * ${yr} * ${yi};`,
          );
          const op = add ? '+=' : '=';
          lines.push(
            `${add ? '' : 'const '}${into[0]} ${op} ${yr};`,
            `${add ? '' : 'const '}${into[1]} ${op} ${yi};`,
            `${add ? '' : 'const '}${into[2]} ${op} -(${dzr} * ${sr} - ${dzi} * ${si});`,
            `${add ? '' : 'const '}${into[3]} ${op} -(${dzr} * ${si} + ${dzi} * ${sr});`,
          );
        };
        for (const part of e.parts) {
          const [zr, zi, dzr, dzi] = emit(part);
          reciprocal(zr, zi, dzr, dzi, [g, b, dg, db], true);
        }
        const out: [string, string, string, string] = [fresh(), fresh(), fresh(), fresh()];
        reciprocal(g, b, dg, db, out, false);
        return out;
      }
    }
  };
  const [r, x, dr, dx] = emit(element);
  return [...lines, `out[0] = ${r};`, `out[1] = ${x};`, `out[2] = ${dr};`, `out[3] = ${dx};`].join('\n');
}

/** From Z and Z' to Y = 1/Z and Y' = −Z'/Z² (and, symmetrically, from Y and Y' back to Z and Z'). */
export function admittanceSlope(z: ImpedanceSlope): ImpedanceSlope {
  const d = z.re * z.re + z.im * z.im;
  const yRe = z.re / d;
  const yIm = -z.im / d;
  // −Z'/Z² = −Z'·Y²
  const y2Re = yRe * yRe - yIm * yIm;
  const y2Im = 2 * yRe * yIm;
  return { re: yRe, im: yIm, dRe: -(z.dRe * y2Re - z.dIm * y2Im), dIm: -(z.dRe * y2Im + z.dIm * y2Re) };
}
