// Compiled kernels of an element tree: straight-line code evaluating Z, and with `slope` its derivative with
// respect to angular frequency dZ/dω, in local variables at one angular frequency `w`, generated once per
// tree. One walk of the tree writes both, so a sweep, a single point and a slope evaluation agree on Z bit
// for bit. The generated code holds no number of the tree: each element value is read from a constants
// array `k` (the same double as a literal would give, so the same bits), and the code depends only on the
// tree's shape. Trees of one shape (every part of a series, every tolerance corner of a part) share one
// compiled function (`shapeKernel`), which the engine compiles and optimises once instead of once a tree.
// The generated code never holds text from a file.
//
// Element laws and their derivatives: Z_R = R (dZ/dω = 0), Z_L = jωL (jL), Z_C = −j/(ωC) (j/(ω²C)); series
// adds impedances and their slopes; parallel adds admittances Y = 1/Z (leaves directly: G = 1/R,
// B = −1/(ωL) with dB/dω = 1/(ω²L), B = ωC with dB/dω = C; a nested group as Y = 1/Z, Y′ = −Z′·Y²), and then
// Z = 1/Y, Z′ = −Y′·Z² (the quotient rule applied to the laws of any circuit-analysis text, e.g. Alexander &
// Sadiku, Fundamentals of Electric Circuits, 6th ed., ch. 9). A branch whose impedance is exactly 0 (a series
// resonance hit exactly, without loss) shorts its group: Z = 0. A total admittance of exactly 0 (a lossless
// parallel resonance) is an open: Z = ∞.

import type { Element } from './element.js';

/** The names (or literals) of Z's real and imaginary parts and, with a slope, of dZ/dω's. */
type Parts = [re: string, im: string, dRe: string, dIm: string];

/**
 * Statements evaluating `element` at angular frequency `w`, the names holding the result, and the element
 * values the statements read as `k[0]`, `k[1]` … in the order they are listed.
 */
export function kernelLines(element: Element, slope: boolean): { lines: string[]; result: Parts; constants: number[] } {
  const lines: string[] = [];
  const constants: number[] = [];
  let next = 0;
  const fresh = (stem: string) => `${stem}${next++}`;
  const num = (v: number) => {
    if (!Number.isFinite(v)) throw new RangeError(`element value ${v} is not finite`);
    constants.push(v);
    return `k[${constants.length - 1}]`;
  };
  const emit = (e: Element): Parts => {
    switch (e.type) {
      case 'R':
        return [num(e.ohms), '0', '0', '0'];
      case 'L': {
        const im = fresh('x');
        lines.push(`const ${im} = w * ${num(e.henries)};`);
        return ['0', im, '0', slope ? num(e.henries) : '0'];
      }
      case 'C': {
        const im = fresh('x');
        lines.push(`const ${im} = -1 / (w * ${num(e.farads)});`);
        if (!slope) return ['0', im, '0', '0'];
        const dim = fresh('x');
        lines.push(`const ${dim} = 1 / (w * w * ${num(e.farads)});`);
        return ['0', im, '0', dim];
      }
      case 'series': {
        const sum: Parts = [fresh('r'), fresh('x'), slope ? fresh('r') : '0', slope ? fresh('x') : '0'];
        lines.push(`let ${sum.filter((s) => s !== '0').map((s) => `${s} = 0`).join(', ')};`);
        for (const part of e.parts) {
          emit(part).forEach((term, k) => {
            if (term !== '0' && sum[k] !== '0') lines.push(`${sum[k]} += ${term};`);
          });
        }
        return sum;
      }
      case 'parallel':
        return parallelGroup(e.parts);
    }
  };
  const parallelGroup = (parts: readonly Element[]): Parts => {
    const [g, b, shorted] = [fresh('g'), fresh('b'), fresh('s')];
    const [dg, db] = slope ? [fresh('g'), fresh('b')] : ['', ''];
    lines.push(`let ${g} = 0, ${b} = 0, ${shorted} = false${slope ? `, ${dg} = 0, ${db} = 0` : ''};`);
    for (const part of parts) {
      if (part.type === 'R') lines.push(`${g} += 1 / ${num(part.ohms)};`);
      else if (part.type === 'L') {
        lines.push(`${b} -= 1 / (w * ${num(part.henries)});`);
        if (slope) lines.push(`${db} += 1 / (w * w * ${num(part.henries)});`);
      } else if (part.type === 'C') {
        lines.push(`${b} += w * ${num(part.farads)};`);
        if (slope) lines.push(`${db} += ${num(part.farads)};`);
      } else {
        const [pr, pi, pdr, pdi] = emit(part);
        const d = fresh('d');
        lines.push(`const ${d} = ${pr} * ${pr} + ${pi} * ${pi};`, `if (${d} === 0) ${shorted} = true;`);
        if (!slope) lines.push(`else { ${g} += ${pr} / ${d}; ${b} -= ${pi} / ${d}; }`);
        else {
          // Y′ = −Z′·Y², with Y = 1/Z of this branch.
          const [yr, yi] = [fresh('y'), fresh('y')];
          lines.push(
            `else { const ${yr} = ${pr} / ${d}, ${yi} = -${pi} / ${d}; ${g} += ${yr}; ${b} += ${yi};`,
            `  ${dg} -= ${pdr} * (${yr} * ${yr} - ${yi} * ${yi}) - ${pdi} * (2 * ${yr} * ${yi});`,
            `  ${db} -= ${pdr} * (2 * ${yr} * ${yi}) + ${pdi} * (${yr} * ${yr} - ${yi} * ${yi}); }`,
          );
        }
      }
    }
    const [d, re, im] = [fresh('d'), fresh('r'), fresh('x')];
    lines.push(
      `const ${d} = ${g} * ${g} + ${b} * ${b};`,
      `const ${re} = ${shorted} ? 0 : ${d} === 0 ? Infinity : ${g} / ${d};`,
      `const ${im} = ${shorted} || ${d} === 0 ? 0 : -${b} / ${d};`,
    );
    if (!slope) return [re, im, '0', '0'];
    // Z′ = −Y′·Z².
    const [dre, dim] = [fresh('r'), fresh('x')];
    lines.push(
      `const ${dre} = -(${dg} * (${re} * ${re} - ${im} * ${im}) - ${db} * (2 * ${re} * ${im}));`,
      `const ${dim} = -(${dg} * (2 * ${re} * ${im}) + ${db} * (${re} * ${re} - ${im} * ${im}));`,
    );
    return [re, im, dre, dim];
  };
  const result = emit(element);
  return { lines, result, constants };
}

/** Compiled kernel bodies by their source: one function per tree shape and kernel kind. */
const byShape = new Map<string, unknown>();

/**
 * The function of a kernel body taking `params` and then the constants `k`, compiled once per distinct
 * body: a body holds only a tree's shape (kernelLines), so every tree of that shape calls the same function
 * with its own constants.
 */
export function shapeKernel<F>(params: readonly string[], body: string): F {
  const key = `${params.join(',')}\n${body}`;
  let compiled = byShape.get(key);
  if (!compiled) {
    compiled = new Function(...params, 'k', body);
    byShape.set(key, compiled);
  }
  return compiled as F;
}
