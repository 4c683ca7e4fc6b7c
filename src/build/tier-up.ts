// How soon V8 optimizes a function, set for the process as a build starts (earlyChartWorkers) and before any
// chart worker starts.
//
// V8 counts the bytecode a function runs and looks at it for optimization each time the count passes its
// interrupt budget (66 KB of bytecode by default in Node 20's V8 11.3); after a few such looks with stable
// type feedback, TurboFan compiles it on one of V8's background threads, and compiles it again after each
// deoptimization. A cold build of 1,000 parts runs three JavaScript threads (this one and two chart workers),
// each warming up the same large code on its own (vega's dataflow, the chart kinds' `draw`, the downloads'
// writers): V8's four background threads took 11.3 s of a 34.6 s build's CPU (per thread, from /proc), and
// perf counted a fifth of all its samples in TurboFan there. The chart kinds' `draw` functions alone were
// compiled 17 times, many of them after a deoptimization on an object of a shape not seen before.
//
// A budget BUDGET_FACTOR times the default lets type feedback settle before a function is compiled, and
// leaves code that runs briefly unoptimized. Cold builds of the generated 1,000 parts, four pairs run side by
// side (load 6 to 9): 37.6, 39.2, 38.0 and 34.0 s of CPU with the default, 35.6, 35.9, 34.9 and 30.4 s with
// it (8% less), the site byte-identical. Four and sixteen times the default gave about the same. A rebuild
// after one edit warms up too, in one thread: with the flag given to node, one-edit rebuilds alternated with
// and without it (load 6 to 8) took 2.21 s of CPU against 2.50 s at 1,000 parts (six pairs) and 3.19 s
// against 3.59 s at 10,000 (four and five); with the flag set here, 2.29 s against 2.55 s at 1,000 parts (six
// pairs, load about 4).
//
// V8's flags are the process's: the flag is set before the first worker starts (a worker's isolate is made
// with the flags as they are then) and stays set for this thread too.

import { setFlagsFromString } from 'node:v8';

/** V8 11.3's default interrupt budget, bytes of bytecode (`node --v8-options`). */
const DEFAULT_INTERRUPT_BUDGET = 66 * 1024;

/** The budget as a multiple of the default. */
export const BUDGET_FACTOR = 8;

let set = false;

/**
 * Raise V8's interrupt budget for the process (once; later calls do nothing), unless the process was started
 * with a budget of its own (`node --interrupt-budget=…` or NODE_OPTIONS).
 */
export function slowerTierUp(): void {
  if (set) return;
  set = true;
  if ([...process.execArgv, process.env.NODE_OPTIONS ?? ''].some((arg) => arg.includes('interrupt-budget'))) return;
  setFlagsFromString(`--interrupt-budget=${DEFAULT_INTERRUPT_BUDGET * BUDGET_FACTOR}`);
}
