// What a command may touch of the outside world, passed in so tests can run commands in-process.

export interface CommandIO {
  cwd: string;
  env: Readonly<Record<string, string | undefined>>;
  /** Standard output is an interactive terminal (progress may redraw in place). */
  isTTY: boolean;
  out(text: string): void;
  err(text: string): void;
}

export const EXIT_OK = 0;
/** The library (or a file named on the command line) has problems. */
export const EXIT_BAD_INPUT = 1;
/** The command line itself is wrong: unknown command or option, missing argument. */
export const EXIT_MISUSE = 2;

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
