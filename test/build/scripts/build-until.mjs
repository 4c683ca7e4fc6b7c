// A build in a process of its own, for tests that kill builds: `node build-until.mjs LIBRARY OUT [STEP]`
// builds LIBRARY into OUT and, when STEP names a step of the swap (see src/build/output.ts), kills itself
// there with SIGKILL, as a power cut or `kill -9` would. It runs the compiled build in dist/ (compiled from
// the sources under test before the run by test/setup/global.ts), so the process starts without compiling.

import { buildFolio } from '../../../dist/build/build.js';

const [library, out, stopAt] = process.argv.slice(2);
const result = await buildFolio({
  libraryRoot: library,
  outDir: out,
  cwd: library,
  workers: 0,
  onSwapStep: (step) => {
    if (step === stopAt) process.kill(process.pid, 'SIGKILL');
  },
});
process.stdout.write(result.ok ? 'built\n' : 'failed\n');
