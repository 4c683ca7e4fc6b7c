// node scripts/tree-cpu.mjs COMMAND [ARGS...]: runs COMMAND and prints, when it ends, its wall time and the CPU
// time of it and of every process under it. Linux only (reads /proc).
//
// Why not /usr/bin/time: it adds up the processes that were waited for, and the time of Chromium's renderer
// processes does not reach it that way, so a page's layout, script and printing in a test's Chromium go
// uncounted. (A renderer kept busy for 30 s of CPU added 1.4 s to /usr/bin/time's figure for the Node
// process that started the browser.) Here every process is read from /proc every 100 ms
// (utime + stime, proc(5)) and known by its pid and start time, so one that outlives its parent still counts
// once seen. A process that lives less than 100 ms may be missed, and each one's last 100 ms is: the figure
// errs low by about that, alike for runs compared side by side.
//
// Below the total, the CPU time by program name (the kernel's name of the process: chromium, node, git,
// pdftotext...), largest first: in a test run, "chromium" is the browser tests' pages and prints.

import { spawn } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';

/** Clock ticks a second in /proc's times (USER_HZ): 100 on x86 and Arm Linux. */
const TICKS_PER_SECOND = 100;
const INTERVAL_MS = 100;

/** pid -> [parent pid, utime + stime in ticks, start time in ticks, name]; proc(5) fields 4, 14 + 15, 22 and 2. */
function processes() {
  const found = new Map();
  for (const name of readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    let stat;
    try {
      stat = readFileSync(`/proc/${name}/stat`, 'utf8');
    } catch {
      continue; // ended meanwhile
    }
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    found.set(Number(name), [Number(fields[1]), Number(fields[11]) + Number(fields[12]), Number(fields[19]), stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')'))]);
  }
  return found;
}

const [command, ...args] = process.argv.slice(2);
if (!command) {
  process.stderr.write('usage: node scripts/tree-cpu.mjs COMMAND [ARGS...]\n');
  process.exit(2);
}
const started = performance.now();
const child = spawn(command, args, { stdio: 'inherit' });
/** "pid start" -> [ticks at the last reading, name], for every process seen under the command. */
const seen = new Map();
const sample = () => {
  const all = processes();
  const ours = (pid) => {
    for (let p = pid, hops = 0; p > 1 && hops < 64; p = all.get(p)?.[0] ?? 0, hops++) {
      if (p === child.pid || seen.has(`${p} ${all.get(p)?.[2]}`)) return true;
    }
    return false;
  };
  for (const [pid, [, ticks, start, name]] of all) {
    const key = `${pid} ${start}`;
    if (seen.has(key) || ours(pid)) seen.set(key, [ticks, name]);
  }
};
const timer = setInterval(sample, INTERVAL_MS);
sample();
child.on('exit', (code, signal) => {
  clearInterval(timer);
  const cpu = [...seen.values()].reduce((sum, [ticks]) => sum + ticks, 0) / TICKS_PER_SECOND;
  const wall = (performance.now() - started) / 1000;
  const load = readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
  process.stderr.write(`tree-cpu: ${wall.toFixed(1)} s wall, ${cpu.toFixed(1)} s of CPU in ${seen.size} processes (load now ${load})\n`);
  const byName = new Map();
  for (const [ticks, name] of seen.values()) {
    const [sum, count] = byName.get(name) ?? [0, 0];
    byName.set(name, [sum + ticks, count + 1]);
  }
  for (const [name, [ticks, count]] of [...byName].sort((a, b) => b[1][0] - a[1][0])) {
    if (ticks >= 10) process.stderr.write(`tree-cpu: ${(ticks / TICKS_PER_SECOND).toFixed(1).padStart(7)} s ${name} (${count} ${count === 1 ? 'process' : 'processes'})\n`);
  }
  process.exitCode = code ?? 1;
  if (signal) process.exitCode = 1;
});
