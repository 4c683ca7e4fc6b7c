// A build in a process of its own that waits at one step of the swap: `node build-paused.mjs LIBRARY OUT STEP`
// builds LIBRARY into OUT, and at STEP (see src/build/output.ts) writes "paused" on stdout and waits until a
// line arrives on stdin before it goes on; then it writes "built" or "failed". Tests use it to hold a build
// in the middle of its work. It runs the compiled build in dist/, as build-until.mjs does.

import { readSync } from 'node:fs';
import { buildFolio } from '../../../dist/build/build.js';

const [library, out, pauseAt] = process.argv.slice(2);
const result = await buildFolio({
  libraryRoot: library,
  outDir: out,
  cwd: library,
  workers: 0,
  onSwapStep: (step) => {
    if (step !== pauseAt) return;
    process.stdout.write('paused\n');
    // Blocks this thread, as the build's own synchronous work would, until the test says go on.
    const byte = Buffer.alloc(1);
    while (readSync(0, byte, 0, 1, null) === 1 && byte[0] !== 10);
  },
});
process.stdout.write(result.ok ? 'built\n' : 'failed\n');
