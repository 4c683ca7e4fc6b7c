#!/usr/bin/env node
// Entry point: runs the compiled command line (dist/, built by `npm run build:ts` or on install).
import { main } from '../dist/cli/main.js';
import { processIO } from '../dist/cli/io.js';

main(process.argv.slice(2), processIO()).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    process.stderr.write(`zfolio: internal error: ${error && error.stack ? error.stack : error}\n`);
    process.exitCode = 70;
  },
);
