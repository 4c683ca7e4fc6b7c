// One build of a library in a process of its own, for the scale bench: prints one JSON line with the
// build's seconds, the process's peak RSS and how many parts were carried over. It runs the compiled
// dist/ in plain node, as `zfolio build` does, so the TypeScript loader's memory and start-up (in this thread
// and in every chart worker) are not counted; the scale bench compiles dist/ first.
// Its CPU time (every thread's, user and system) is printed too: the system share tells a build slowed by the
// file system (files made soon after many were deleted, DEVELOPERS.md) from one slowed by its own work.
// Usage: node bench/scale-build.mjs LIBRARY OUT

import { buildFolio } from '../dist/build/build.js';

const [libraryRoot, outDir] = process.argv.slice(2);
const started = performance.now();
const result = await buildFolio({ libraryRoot, outDir });
const seconds = (performance.now() - started) / 1000;
const usage = process.resourceUsage();
// maxRSS is in kilobytes (getrusage).
console.log(JSON.stringify({ ok: result.ok, seconds, peakRssBytes: usage.maxRSS * 1024, cpu: { userSeconds: usage.userCPUTime / 1e6, systemSeconds: usage.systemCPUTime / 1e6 }, reused: result.reused, pages: result.pages, work: result.work, unitsKept: result.unitsKept, unitsLinked: result.unitsLinked, error: result.diagnostics.find((d) => d.severity === 'error')?.message }));
