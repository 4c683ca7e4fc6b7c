// √(a² + b²) of two numbers, bit for bit what Math.hypot gives for two arguments on Node's engine (V8): the
// larger magnitude taken out, the squares of the two ratios added, the root scaled back. Written out so that
// the optimising compiler inlines it: Math.hypot is a call into a builtin that takes its arguments as a list
// and allocates on every call (a heap profile of a build's main thread put about a sixth of all it allocated
// there: a |Z| at every point of every sweep). test/circuit/hypot.test.ts checks it against Math.hypot.

/** √(a² + b²) without overflow or underflow; Infinity if either is infinite, else NaN if either is NaN. */
export function hypot(a: number, b: number): number {
  const x = Math.abs(a);
  const y = Math.abs(b);
  if (x === Infinity || y === Infinity) return Infinity;
  if (x !== x || y !== y) return NaN;
  const max = x > y ? x : y;
  if (max === 0) return 0;
  const p = x / max;
  const q = y / max;
  // The engine adds the squares with Kahan's compensation, which is exactly 0 after the first of two terms.
  return Math.sqrt(p * p + q * q) * max;
}
