// With ZFOLIO_TEST_CPU=FILE, each test file appends one line to FILE: its path, and the CPU seconds its fork
// spent from the file's start (its imports included) to its end, the processes it started and waited for
// included (builds, Chromium, git, pdftotext: Linux counts a child's time to its parent when it is reaped).
// Wall times from the reporters are not comparable on a loaded machine; these are. Linux only.

import { appendFileSync, readFileSync } from 'node:fs';
import { relative } from 'node:path';
import { afterAll } from 'vitest';

/** Clock ticks a second in /proc's times (USER_HZ, sysconf(_SC_CLK_TCK), per proc(5)): 100 on x86 and Arm Linux. */
const TICKS_PER_SECOND = 100;

/** utime + stime + cutime + cstime of this process, in seconds (proc(5): fields 14 to 17 of /proc/self/stat). */
function cpuSeconds(): number {
  const stat = readFileSync('/proc/self/stat', 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return fields.slice(11, 15).reduce((sum, ticks) => sum + Number(ticks), 0) / TICKS_PER_SECOND;
}

const record = process.env.ZFOLIO_TEST_CPU;
if (record) {
  const start = cpuSeconds();
  afterAll(({}, suite) => {
    const cpu = Math.round((cpuSeconds() - start) * 100) / 100;
    appendFileSync(record, `${JSON.stringify({ file: relative(process.cwd(), suite.file.filepath), cpu })}\n`);
  });
}
