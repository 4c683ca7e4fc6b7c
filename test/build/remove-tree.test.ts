// removeTree (src/build/remove-tree.ts) removes what rmSync(path, { recursive, force }) removes: a folder and
// everything under it, links themselves and not what they point at, a file, and nothing (without an error)
// when the path is missing. Checked against the file system (existsSync, lstat).

import { existsSync, linkSync, lstatSync, mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { removeTree } from '../../src/build/remove-tree.js';
import { tempDir } from '../site-helpers.js';

let top: string;
afterEach(() => rmSync(top, { recursive: true, force: true }));

describe('removeTree', () => {
  it('removes a folder tree, with hard and symbolic links in it, and leaves what the links point at', () => {
    top = tempDir('remove-tree');
    const tree = join(top, 'tree');
    mkdirSync(join(tree, 'a', 'b', 'c'), { recursive: true });
    mkdirSync(join(tree, 'empty'));
    writeFileSync(join(tree, 'a', 'one.txt'), '1');
    writeFileSync(join(tree, 'a', 'b', 'c', 'two.txt'), '2');
    const outside = join(top, 'outside');
    mkdirSync(outside);
    writeFileSync(join(outside, 'kept.txt'), 'kept');
    linkSync(join(outside, 'kept.txt'), join(tree, 'a', 'hard.txt'));
    symlinkSync(outside, join(tree, 'to-folder'));
    symlinkSync(join(top, 'nowhere'), join(tree, 'dangling'));
    removeTree(tree);
    expect(existsSync(tree)).toBe(false);
    expect(readFileSync(join(outside, 'kept.txt'), 'utf8')).toBe('kept');
    expect(lstatSync(join(outside, 'kept.txt')).nlink).toBe(1);
  });

  it('removes a file, and does nothing when the path is missing', () => {
    top = tempDir('remove-tree');
    const file = join(top, 'file.txt');
    writeFileSync(file, 'x');
    removeTree(file);
    expect(existsSync(file)).toBe(false);
    expect(() => removeTree(join(top, 'missing'))).not.toThrow();
    expect(existsSync(top)).toBe(true);
  });
});
