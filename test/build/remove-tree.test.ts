// removeTree and removeTrees (src/build/remove-tree.ts) remove what rmSync(path, { recursive, force }) removes: a folder and
// everything under it, links themselves and not what they point at, a file, and nothing (without an error)
// when the path is missing. Checked against the file system (existsSync, lstat).

import { existsSync, linkSync, lstatSync, mkdirSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { removeTree, removeTrees } from '../../src/build/remove-tree.js';
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

describe('removeTrees', () => {
  it('removes several trees side by side, as removeTree does each: folders, links, a file, a missing path', async () => {
    top = tempDir('remove-trees');
    const outside = join(top, 'outside');
    mkdirSync(outside);
    writeFileSync(join(outside, 'kept.txt'), 'kept');
    const trees = ['one', 'two', 'three'].map((name) => join(top, name));
    trees.forEach((tree, i) => {
      // Deeper in each, with more files than the removals in flight.
      mkdirSync(join(tree, 'a', 'b'.repeat(i + 1), 'c'), { recursive: true });
      mkdirSync(join(tree, 'empty'));
      for (let f = 0; f < 20; f++) writeFileSync(join(tree, 'a', `f${f}.txt`), String(f));
      writeFileSync(join(tree, 'a', 'b'.repeat(i + 1), 'c', 'deep.txt'), 'deep');
      linkSync(join(outside, 'kept.txt'), join(tree, 'hard.txt'));
      symlinkSync(outside, join(tree, 'to-folder'));
    });
    const file = join(top, 'file.txt');
    writeFileSync(file, 'x');
    await removeTrees([...trees, file, join(top, 'missing')], 4);
    for (const path of [...trees, file]) expect(existsSync(path)).toBe(false);
    expect(readFileSync(join(outside, 'kept.txt'), 'utf8')).toBe('kept');
    expect(lstatSync(join(outside, 'kept.txt')).nlink).toBe(1);
  });

  it('removes a tree that changes while it is removed (a file added meanwhile), by rmSync', async () => {
    top = tempDir('remove-trees');
    const tree = join(top, 'tree');
    mkdirSync(join(tree, 'a'), { recursive: true });
    for (let f = 0; f < 50; f++) writeFileSync(join(tree, 'a', `f${f}.txt`), String(f));
    const removing = removeTrees([tree], 2);
    // Listed already (removeTrees lists before its first await): this file is not in the list, so the
    // folder's rmdir fails and rmSync removes what is left.
    writeFileSync(join(tree, 'a', 'late.txt'), 'late');
    await removing;
    expect(existsSync(tree)).toBe(false);
  });
});
