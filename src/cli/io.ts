// What a command may touch of the outside world, passed in so tests can run commands in-process.

export interface CommandIO {
  cwd: string;
  env: Readonly<Record<string, string | undefined>>;
  /** Standard output is an interactive terminal (progress may redraw in place). */
  isTTY: boolean;
  out(text: string): void;
  err(text: string): void;
}

// zfolio exits with 0, 1, 2 or 3 and nothing else (3 is plan's: a rail misses its target).
export const EXIT_OK = 0;
/**
 * The library (or a file named on the command line) has problems; or the command failed for another reason
 * (a full disk, a Chromium that does not start, a fault in zfolio itself), said in one line.
 */
export const EXIT_BAD_INPUT = 1;
/**
 * The command cannot run as asked: unknown command or option, missing argument, or an output folder zfolio
 * will not replace (see build/output-guard.ts) or cannot write.
 */
export const EXIT_MISUSE = 2;

/** Set to any value to see the stack trace behind a one-line failure. */
export const DEBUG_ENV = 'ZFOLIO_DEBUG';

/** Thrown for command-line misuse; main prints the message and the command's usage hint. */
export class UsageError extends Error {}

export function processIO(): CommandIO {
  return {
    cwd: process.cwd(),
    env: process.env,
    isTTY: Boolean(process.stdout.isTTY) && !process.env.CI,
    out: (text) => process.stdout.write(text),
    err: (text) => process.stderr.write(text),
  };
}
