// No file in src/ over 300 lines (DEVELOPERS.md, Conventions): a file that grows past it is split by concern.

import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { filesUnder, REPO } from './site-helpers.js';

const LIMIT = 300;

describe('src/', () => {
  it(`holds no file over ${LIMIT} lines`, () => {
    const files = filesUnder(join(REPO, 'src'));
    expect(files.length).toBeGreaterThan(100);
    const lines = (file: string) => {
      const text = readFileSync(join(REPO, 'src', file), 'utf8');
      return text.split('\n').length - (text.endsWith('\n') ? 1 : 0);
    };
    const over = files.map((f) => ({ file: f, lines: lines(f) })).filter((f) => f.lines > LIMIT);
    expect(over).toEqual([]);
    // The count is wc -l's (coreutils: newlines) on the longest file.
    const longest = files.map((f) => ({ file: f, lines: lines(f) })).sort((a, b) => b.lines - a.lines)[0];
    expect(Number(execFileSync('wc', ['-l', join(REPO, 'src', longest.file)], { encoding: 'utf8' }).trim().split(/\s+/)[0])).toBe(longest.lines);
  });
});
