// A build in a process of its own, for tests that stop builds: `node build-until.mjs LIBRARY OUT [STEP [pause]]`
// builds LIBRARY into OUT and, when STEP names a step of the swap (see src/build/output.ts), kills itself
// there with SIGKILL, as a power cut or `kill -9` would; with `pause`, it writes "paused" on stdout there
// instead and waits until a line arrives on stdin (or stdin closes) before it goes on. It runs the compiled
// build in dist/ (compiled from the sources under test before the run by test/setup/global.ts), so the
// process starts without compiling.

import { readSync } from 'node:fs';
import { buildFolio } from '../../../dist/build/build.js';

const [library, out, stopAt, how] = process.argv.slice(2);

/** Blocks this thread, as the build's own synchronous work would, until the test says go on. */
function pause() {
  process.stdout.write('paused\n');
  const byte = Buffer.alloc(1);
  while (readSync(0, byte, 0, 1, null) === 1 && byte[0] !== 10);
}

const result = await buildFolio({
  libraryRoot: library,
  outDir: out,
  cwd: library,
  workers: 0,
  onSwapStep: (step) => {
    if (step !== stopAt) return;
    if (how === 'pause') pause();
    else process.kill(process.pid, 'SIGKILL');
  },
});
process.stdout.write(result.ok ? 'built\n' : 'failed\n');
