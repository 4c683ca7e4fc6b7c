// Temporary git repositories for the tests, hermetic: no system or user git configuration is read (HOME
// points at an empty folder, GIT_CONFIG_NOSYSTEM is set), the author is given on each commit, and git
// never looks for a repository above the temporary folder.

import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';

const base = mkdtempSync(join(tmpdir(), 'zfolio-git-test-'));

/** The environment every git the tests run (and zfolio runs, through process.env) sees. */
export const GIT_ENV: Record<string, string> = {
  HOME: join(base, 'home'),
  GIT_CONFIG_NOSYSTEM: '1',
  GIT_CONFIG_GLOBAL: join(base, 'home', 'gitconfig'),
  GIT_CEILING_DIRECTORIES: base,
  GIT_AUTHOR_NAME: 'Test Person',
  GIT_AUTHOR_EMAIL: 'test@example.invalid',
  GIT_COMMITTER_NAME: 'Test Person',
  GIT_COMMITTER_EMAIL: 'test@example.invalid',
  GIT_AUTHOR_DATE: '2026-01-01T00:00:00Z',
  GIT_COMMITTER_DATE: '2026-01-01T00:00:00Z',
};
mkdirSync(GIT_ENV.HOME, { recursive: true });
writeFileSync(GIT_ENV.GIT_CONFIG_GLOBAL, '');

/** Put GIT_ENV into process.env (zfolio's git sees it); returns the function that restores the old values. */
export function useGitEnv(): () => void {
  const saved = Object.fromEntries(Object.keys(GIT_ENV).map((k) => [k, process.env[k]]));
  Object.assign(process.env, GIT_ENV);
  return () => {
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  };
}

/** A new empty folder under the tests' temporary base (outside any git repository). */
export function freshFolder(name: string): string {
  // Test files share this module within a fork, and each removes the base when it is done.
  mkdirSync(base, { recursive: true });
  return mkdtempSync(join(base, `${name}-`));
}

export interface TestRepo {
  dir: string;
  git(...args: string[]): string;
  write(path: string, text: string): void;
  remove(path: string): void;
  /** Stage everything and commit; returns the commit hash. */
  commit(message: string): string;
}

export function makeRepo(name = 'repo'): TestRepo {
  const dir = freshFolder(name);
  const git = (...args: string[]) =>
    execFileSync('git', ['-c', 'user.name=Test Person', '-c', 'user.email=test@example.invalid', '-c', 'init.defaultBranch=main', ...args], {
      cwd: dir,
      env: { ...process.env, ...GIT_ENV },
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'pipe'],
    });
  git('init', '-q');
  return {
    dir,
    git,
    write(path, text) {
      mkdirSync(dirname(join(dir, path)), { recursive: true });
      writeFileSync(join(dir, path), text);
    },
    remove(path) {
      rmSync(join(dir, path), { recursive: true, force: true });
    },
    commit(message) {
      git('add', '-A');
      git('commit', '-q', '--allow-empty', '-m', message);
      return git('rev-parse', 'HEAD').trim();
    },
  };
}

/** Remove every temporary repository (from afterAll). */
export function removeTestRepos(): void {
  rmSync(base, { recursive: true, force: true });
}
