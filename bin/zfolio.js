#!/usr/bin/env node
// Entry point: runs the compiled command line (dist/, built by `npm run build:ts` or on install).
import { main } from '../dist/cli/main.js';
import { processIO } from '../dist/cli/io.js';

main(process.argv.slice(2), processIO()).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    // main answers every failure itself; this is the last line of defence, still one line and exit 1.
    process.stderr.write(`zfolio: internal error: ${String(error && error.message ? error.message : error).split('\n', 1)[0]}\n`);
    process.exitCode = 1;
  },
);
