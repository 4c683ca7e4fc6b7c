// zfolio as a process: whatever happens, it ends with 0, 1, 2 or 3 (io.ts) and at most one line about why.
// A reader that stops reading (`zfolio sweep ID --csv | head`) ends it quietly with 0; Ctrl+C (or TERM, HUP)
// ends it with 1 after removing its staging folder and stopping its Chromium; a fault nothing caught is one
// line and 1. `serve` handles its own signals: it stops serving and exits 0.

import { runExitTasks } from '../on-exit.js';
import { failureLine } from './failure.js';
import { EXIT_BAD_INPUT, EXIT_OK, processIO } from './io.js';
import { COMMANDS, main } from './main.js';

const SIGNALS = ['SIGINT', 'SIGTERM', 'SIGHUP'] as const;

export function runProcess(argv: string[]): void {
  const name = argv[0];
  const command = name !== undefined && Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  const label = command ? `zfolio ${name}` : 'zfolio';
  let ending = false;
  const end = (code: number, line?: string) => {
    if (ending) return;
    ending = true;
    runExitTasks();
    if (line) process.stderr.write(`${label}: ${line}\n`);
    process.exit(code);
  };

  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    // Whoever read the output has what they wanted: stop, quietly.
    if (error.code === 'EPIPE') end(EXIT_OK);
    else end(EXIT_BAD_INPUT, failureLine(error));
  });
  // Nobody reading the messages is no reason to stop the work.
  process.stderr.on('error', () => {});
  process.on('uncaughtException', (error) => end(EXIT_BAD_INPUT, failureLine(error)));
  process.on('unhandledRejection', (error) => end(EXIT_BAD_INPUT, failureLine(error)));
  if (!command?.ownsSignals) {
    for (const signal of SIGNALS) process.on(signal, () => end(EXIT_BAD_INPUT, `stopped by ${signal}`));
  }

  main(argv, processIO()).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => end(EXIT_BAD_INPUT, failureLine(error)),
  );
}
