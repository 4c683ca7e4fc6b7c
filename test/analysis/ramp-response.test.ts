import { describe, expect, it } from 'vitest';
import { RampBasis, rampResponses } from '../../src/analysis/ramp-response.js';
import type { PartialFractions } from '../../src/analysis/partial-fractions.js';

// The ramp response of one term r/(s − p): the convolution of r·e^{pt} with the ramp ΔI·min(t/t_r, 1),
// (ΔI/t_r)·r·[G(t) − G(t − t_r)] with G(t) = (e^{pt} − 1 − pt)/p² for t > 0 (Laplace pairs of any
// circuit-analysis text, e.g. Alexander & Sadiku, ch. 15), written out plainly here for |p·t| well away from 0.
function reference(r: number, p: number, stepA: number, tr: number, t: number): number {
  const G = (x: number) => (x <= 0 ? 0 : (Math.exp(p * x) - 1 - p * x) / (p * p));
  return (stepA / tr) * r * (G(t) - G(t - tr));
}

describe('ramp response of one pole', () => {
  const f: PartialFractions = { poles: [{ re: -2e6, im: 0 }], residues: [{ re: 3e5, im: 0 }], constant: 0, proportional: 0 };
  const tr = 1e-6;
  it('matches the plain closed form during and after the ramp', () => {
    const times = [0.3e-6, 0.9e-6, 1e-6, 1.5e-6, 4e-6, 20e-6];
    const [y] = rampResponses([f], new RampBasis(f.poles, tr), 2, times);
    times.forEach((t, i) => expect(Math.abs(y[i] / reference(3e5, -2e6, 2, tr, t) - 1)).toBeLessThan(1e-12));
  });

  it('evenly spaced times (advanced by multiplication) agree with times taken one by one, to 1e-12', () => {
    const g: PartialFractions = {
      poles: [
        { re: -3e5, im: 2e7 },
        { re: -1e3, im: 0 },
        { re: -4e7, im: 9e8 },
      ],
      residues: [
        { re: 1e4, im: -3e3 },
        { re: 50, im: 0 },
        { re: 2e6, im: 7e5 },
      ],
      constant: 1e-3,
      proportional: 0,
    };
    const end = 50e-6;
    const even = Array.from({ length: 5001 }, (_, i) => (end * i) / 5000);
    const [stepped] = rampResponses([g], new RampBasis(g.poles, 5e-9), 1, even);
    // Backwards, every step is new: each time is computed afresh.
    const reversed = [...even].reverse();
    const [direct] = rampResponses([g], new RampBasis(g.poles, 5e-9), 1, reversed);
    let worst = 0;
    let size = 0;
    even.forEach((_, i) => {
      worst = Math.max(worst, Math.abs(stepped[i] - direct[even.length - 1 - i]));
      size = Math.max(size, Math.abs(direct[i]));
    });
    expect(worst / size).toBeLessThan(1e-12);
  });
});
