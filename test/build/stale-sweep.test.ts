// Clearing a spare version of what the new site no longer has: files outside the kept units that the staging
// folder lacks go, folders left empty go unless the staging folder has them, units already removed are
// passed over, and each folder is listed once, from the listing handed in.

import { mkdirSync, readdirSync, rmSync, writeFileSync, type Dirent } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { removeStale } from '../../src/build/stale-sweep.js';
import { PathsByFolder } from '../../src/build/writable.js';
import { tempDir } from '../site-helpers.js';

const root = tempDir('stale-sweep');
afterAll(() => rmSync(root, { recursive: true, force: true }));

function files(dir: string, at = ''): string[] {
  return readdirSync(join(dir, at), { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? [`${at}${e.name}/`, ...files(dir, `${at}${e.name}/`)] : [`${at}${e.name}`])).sort();
}

function write(dir: string, paths: string[]): void {
  for (const path of paths) {
    mkdirSync(dirname(join(dir, path)), { recursive: true });
    if (!path.endsWith('/')) writeFileSync(join(dir, path), path);
    else mkdirSync(join(dir, path), { recursive: true });
  }
}

describe('removeStale', () => {
  it('removes what the new site lacks outside the kept units, listing each folder once', () => {
    const target = join(root, 'spare');
    const staging = join(root, 'staging');
    write(target, ['index.html', 'old.html', 'parts/A/index.html', 'parts/B/index.html', 'parts/C/index.html', 'parts/C/sweep.csv', 'list/2.html', 'list/3.html', 'gone/x.html', 'emptied/y.html', 'assets/folio.css']);
    write(staging, ['index.html', 'parts/C/index.html', 'list/2.html', 'emptied/', 'assets/folio.css']);
    // parts/B was a unit whose key changed: removed before the sweep (the listing still names it).
    const listed = new Map<string, number>();
    const memo = new Map<string, Dirent[]>();
    const list = (dir: string) => {
      listed.set(relative(target, dir), (listed.get(relative(target, dir)) ?? 0) + 1);
      if (!memo.has(dir)) memo.set(dir, readdirSync(dir, { withFileTypes: true }));
      return memo.get(dir)!;
    };
    list(join(target, 'parts'));
    rmSync(join(target, 'parts', 'B'), { recursive: true });
    const empty = removeStale({ target, staging, kept: new PathsByFolder(['parts/A']), gone: new PathsByFolder(['parts/B']), list }, '');
    expect(empty).toBe(false);
    // Kept: the kept unit whole, files the staging folder has (moved over them later), and a folder left
    // empty that the staging folder holds; gone: the rest.
    expect(files(target)).toEqual(['assets/', 'assets/folio.css', 'emptied/', 'index.html', 'list/', 'list/2.html', 'parts/', 'parts/A/', 'parts/A/index.html', 'parts/C/', 'parts/C/index.html']);
    // The kept unit is not listed; every other folder once, parts/ included though listed before the sweep.
    expect([...listed.entries()].sort()).toEqual([['', 1], ['assets', 1], ['emptied', 1], ['gone', 1], ['list', 1], ['parts', 2], ['parts/C', 1]].sort());
    expect(memo.size).toBe(7);
  });
});
