#!/usr/bin/env node
// Entry point: runs the compiled command line (dist/, built by `npm run build:ts` or on install).
import { runProcess } from '../dist/cli/process.js';

runProcess(process.argv.slice(2));
