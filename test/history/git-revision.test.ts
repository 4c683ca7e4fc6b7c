// Reading a library at a git revision: the revision resolved, the files written to a temporary folder the
// ordinary loader reads with all its checks, the repository left untouched.

import { existsSync, readFileSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RevisionError, checkoutRevision, resolveRevision, workTreeOf } from '../../src/history/git-revision.js';
import { loadLibraryAt } from '../../src/history/revision-library.js';
import { freshFolder, makeRepo, removeTestRepos, useGitEnv, type TestRepo } from './git-repo.js';
import { FOLIO, capacitor } from './scenario.js';

let restore: () => void;
let repo: TestRepo;
let first: string;

beforeAll(() => {
  restore = useGitEnv();
  repo = makeRepo('revision');
  repo.write('other/readme.txt', 'not the library\n');
  first = repo.commit('before the library');
  repo.write('lib/folio.yaml', FOLIO);
  repo.write('lib/parts/a.yaml', capacitor('TA', '1u', '10m', '0.5n'));
  // A link that climbs out of the library and back in: inside the library, so it is read.
  repo.write('lib/shared/b.yaml', capacitor('TB', '2u', '10m', '0.5n'));
  symlinkSync('../../lib/shared/b.yaml', join(repo.dir, 'lib/parts/b.yaml'));
  repo.commit('library');
  repo.git('tag', 'good');
  // A link to a file outside the library, and a file over the 5 MB limit: both refused on disk, so at a revision too.
  symlinkSync('../../other/readme.txt', join(repo.dir, 'lib/parts/outside.yaml'));
  repo.write('lib/parts/huge.yaml', `# ${'x'.repeat(5.5 * 1024 * 1024)}\n`);
  repo.commit('bad files');
  repo.git('tag', 'bad');
});

afterAll(() => {
  restore();
  removeTestRepos();
});

const expectMisuse = (fn: () => unknown, pattern: RegExp) => {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(RevisionError);
    expect((error as RevisionError).misuse).toBe(true);
    expect((error as Error).message).toMatch(pattern);
    expect((error as Error).message).not.toContain('\n');
    return;
  }
  expect.unreachable('expected a RevisionError');
};

describe('git revisions', () => {
  it('finds the top of the work tree and the library folder inside it', () => {
    expect(workTreeOf(join(repo.dir, 'lib'))).toEqual({ top: repo.dir, prefix: 'lib/' });
    expect(workTreeOf(repo.dir).prefix).toBe('');
  });

  it('resolves tags, HEAD~N and hashes to the full commit', () => {
    const lib = join(repo.dir, 'lib');
    expect(resolveRevision(lib, 'HEAD~2').commit).toBe(first);
    expect(resolveRevision(lib, first.slice(0, 10)).commit).toBe(first);
    expect(resolveRevision(lib, 'good').commit).toBe(repo.git('rev-parse', 'good').trim());
  });

  it('refuses an unknown revision, a name that looks like an option, and a folder outside git (misuse)', () => {
    expectMisuse(() => resolveRevision(join(repo.dir, 'lib'), 'no-such-tag'), /^unknown revision "no-such-tag"/);
    expectMisuse(() => resolveRevision(join(repo.dir, 'lib'), '--all'), /is not a revision name/);
    expectMisuse(() => resolveRevision(freshFolder('outside'), 'HEAD'), /is not in a git work tree/);
  });

  it('refuses a revision at which the library folder did not exist', () => {
    expectMisuse(() => checkoutRevision(join(repo.dir, 'lib'), 'HEAD~2'), /holds no folder lib/);
  });

  it('writes the revision files into a temporary folder and removes it, leaving the repository as it was', () => {
    const status = repo.git('status', '--porcelain');
    const checkout = checkoutRevision(join(repo.dir, 'lib'), 'good');
    expect(readFileSync(join(checkout.folder, 'parts/a.yaml'), 'utf8')).toBe(capacitor('TA', '1u', '10m', '0.5n'));
    expect(readFileSync(join(checkout.folder, 'parts/b.yaml'), 'utf8')).toContain('id: TB');
    expect(existsSync(join(checkout.folder, 'parts/huge.yaml'))).toBe(false);
    checkout.remove();
    expect(existsSync(checkout.folder)).toBe(false);
    expect(repo.git('status', '--porcelain')).toBe(status);
  });

  it("keeps the loader's checks: a link out of the library and an oversized file at a revision are errors named REV:path", () => {
    const load = loadLibraryAt(join(repo.dir, 'lib'), 'bad');
    expect(load.library).toBeUndefined();
    const lines = load.diagnostics.map((d) => `${d.file}:${d.line}:${d.column}: ${d.message}`);
    // Only the library's files are written, so the link's target (elsewhere in the repository) is not there.
    expect(lines).toContain('bad:parts/outside.yaml:1:1: a symbolic link to nothing (its target does not exist); remove it or point it at a file in the library');
    expect(lines.some((l) => /^bad:parts\/huge\.yaml:1:1: the file is 5\.5 MB; a library file may be at most 5 MB$/.test(l))).toBe(true);
    const good = loadLibraryAt(join(repo.dir, 'lib'), 'good');
    expect(good.diagnostics).toEqual([]);
    expect(good.library?.parts.map((p) => p.id)).toEqual(['TA', 'TB']);
    expect(good.library?.root).toBe(join(repo.dir, 'lib'));
  });
});
