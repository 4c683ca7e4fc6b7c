// A CommandIO that records what a command prints, so commands run in-process in tests.

import { fileURLToPath } from 'node:url';
import { main } from '../../src/cli/main.js';
import type { CommandIO } from '../../src/cli/io.js';

export const GOOD_LIBRARY = fileURLToPath(new URL('../fixtures/good-library/', import.meta.url));
export const BAD_LIBRARY = fileURLToPath(new URL('../fixtures/bad-parts/', import.meta.url));

export interface Run {
  code: number;
  out: string;
  err: string;
}

/** Run `zfolio ...argv` in-process with `cwd` as the current folder (and `env` as the environment). */
export async function run(argv: string[], cwd: string = GOOD_LIBRARY, env: Record<string, string> = {}): Promise<Run> {
  let out = '';
  let err = '';
  const io: CommandIO = {
    cwd,
    env,
    isTTY: false,
    out: (text) => {
      out += text;
    },
    err: (text) => {
      err += text;
    },
  };
  const code = await main(argv, io);
  return { code, out, err };
}
