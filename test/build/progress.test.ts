// What a build shows of its progress: a line redrawn in place on a terminal, with the time left once a step
// is done; in a pipe or CI, a plain line at each tenth; a stage of one step by its name, never "1/1". The
// clock is the test's own. The plain lines' rhythm (at most one line a tenth) is common practice for logs.

import { describe, expect, it } from 'vitest';
import { terminalProgress } from '../../src/build/progress.js';

function recorder(interactive: boolean) {
  let t = 0;
  const out: string[] = [];
  const progress = terminalProgress((text) => out.push(text), interactive, () => t);
  return { progress, out, advance: (ms: number) => (t += ms) };
}

describe('terminalProgress', () => {
  it('in a pipe: one line at each tenth, 10 lines for 1,000 steps', () => {
    const { progress, out } = recorder(false);
    progress.stage('parts', 1000);
    for (let i = 0; i < 1000; i++) progress.tick();
    // A line at 100, 200 … 900 and the end.
    expect(out).toEqual([100, 200, 300, 400, 500, 600, 700, 800, 900, 1000].map((n) => `parts ${n}/1000\n`));
  });

  it('on a terminal: the line is redrawn in place at most every 100 ms, with the time left', () => {
    const { progress, out, advance } = recorder(true);
    progress.stage('parts', 10);
    expect(out).toEqual(['\r\x1b[2Kparts 0/10']);
    advance(2000);
    progress.tick();
    // 2 s for the first step, 9 to go: about 18 s.
    expect(out.at(-1)).toBe('\r\x1b[2Kparts 1/10, about 18 s left');
    advance(50);
    progress.tick();
    expect(out).toHaveLength(2);
    advance(200);
    for (let i = 0; i < 8; i++) progress.tick();
    expect(out.at(-1)).toBe('\r\x1b[2Kparts 10/10\n');
  });

  it('a stage of one step shows its name, not "0/1" or "1/1"', () => {
    const terminal = recorder(true);
    terminal.progress.stage('pages', 1);
    terminal.progress.tick();
    expect(terminal.out).toEqual(['\r\x1b[2Kpages…', '\r\x1b[2Kpages: done\n']);
    const pipe = recorder(false);
    pipe.progress.stage('pages', 1);
    pipe.progress.tick();
    expect(pipe.out).toEqual(['pages…\n']);
    expect([...terminal.out, ...pipe.out].join('')).not.toMatch(/\d\/1\b/);
  });
});
