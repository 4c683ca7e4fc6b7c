// Run with --allow-natives-syntax (and tsx): prints how many calls a small hot function took before V8
// marked it for optimization (or optimized it), after calling slowerTierUp when the first argument is "raise".
const { slowerTierUp } = await import('../../../src/build/tier-up.ts');
if (process.argv[2] === 'raise') slowerTierUp();

function hot(x) {
  let s = 0;
  for (let i = 0; i < 8; i++) s += (x * i) % 7;
  return s;
}

// V8's optimization status bits (src/runtime/runtime.h, OptimizationStatus): optimized, marked for
// optimization, marked for concurrent optimization, optimizing concurrently.
const TIERING = (1 << 4) | (1 << 8) | (1 << 9) | (1 << 10);
let calls = 0;
let sum = 0;
while (calls < 5_000_000 && (%GetOptimizationStatus(hot) & TIERING) === 0) {
  sum += hot(calls);
  calls++;
}
console.log(JSON.stringify({ calls, sum }));
