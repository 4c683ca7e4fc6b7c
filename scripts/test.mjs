// npm test: the typecheck and the test files at once (the typecheck is one thread; the tests leave a core
// idle at times, while the shared demo builds and while a file waits on a browser or a process). Each one's
// output is kept whole; the exit status is the first failure's, else 0. Arguments go to vitest.

import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const bin = (path) => fileURLToPath(new URL(`../node_modules/${path}`, import.meta.url));

function run(name, args, buffered) {
  const child = spawn(process.execPath, args, { cwd: root, stdio: buffered ? ['ignore', 'pipe', 'pipe'] : 'inherit' });
  let text = '';
  if (buffered) {
    child.stdout.on('data', (chunk) => (text += chunk));
    child.stderr.on('data', (chunk) => (text += chunk));
  }
  return new Promise((done) => child.on('exit', (code, signal) => done({ name, code: code ?? 1, signal, text })));
}

const [tests, types] = await Promise.all([
  run('vitest', [bin('vitest/vitest.mjs'), 'run', ...process.argv.slice(2)], false),
  run('typecheck', [bin('typescript/bin/tsc'), '-p', 'tsconfig.json', '--noEmit'], true),
]);
process.stdout.write(types.code === 0 ? '\ntypecheck: no errors\n' : `\ntypecheck failed:\n${types.text}`);
process.exitCode = types.code || tests.code;
