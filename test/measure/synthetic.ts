// Synthetic measurements for the fitting tests, made here and not by zfolio: the impedance of an element
// tree by complex.js (test/reference/impedance.ts) on a log sweep, with optional Gaussian noise on |Z| (in dB)
// and on the phase (in degrees) from a seeded generator (mulberry32 uniforms, Box–Muller normals: G. E. P.
// Box, M. E. Muller, Ann. Math. Statist. 29, 1958), so every run sees the same numbers.

import type { Element } from '../../src/circuit/element.js';
import { referenceZAt } from '../reference/impedance.js';

export interface SyntheticSweep {
  frequencies: Float64Array;
  re: Float64Array;
  im: Float64Array;
}

export function seededNormal(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

export function logFrequencies(fromHz: number, toHz: number, points: number): Float64Array {
  return Float64Array.from({ length: points }, (_, i) => fromHz * (toHz / fromHz) ** (i / (points - 1)));
}

export function synthesise(element: Element, frequencies: Float64Array, noise?: { db: number; deg: number; seed: number }): SyntheticSweep {
  const normal = noise ? seededNormal(noise.seed) : () => 0;
  const re = new Float64Array(frequencies.length);
  const im = new Float64Array(frequencies.length);
  frequencies.forEach((f, i) => {
    const z = referenceZAt(element, f);
    const size = z.abs() * 10 ** (((noise?.db ?? 0) * normal()) / 20);
    const phase = z.arg() + ((noise?.deg ?? 0) * normal() * Math.PI) / 180;
    re[i] = size * Math.cos(phase);
    im[i] = size * Math.sin(phase);
  });
  return { frequencies, re, im };
}
