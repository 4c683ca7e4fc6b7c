// Which revision of the library a review pack was made from, for its cover: the last commit that touched
// the pack's files, and whether any of them differs from it. Read with the `git` program; a library that is
// not in git, or a machine without git, simply has no revision to state.

import { execFileSync } from 'node:child_process';

export interface LibraryRevision {
  /** The last commit that changed any of the files (abbreviated to 12 hex digits). */
  commit: string;
  /** Its committer date, YYYY-MM-DD. */
  date: string;
  /** How many of the files differ from that commit (edited, or not yet committed). */
  uncommitted: number;
}

function git(args: string[], cwd: string): string | undefined {
  try {
    return execFileSync('git', args, { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], env: { ...process.env, GIT_TERMINAL_PROMPT: '0' }, maxBuffer: 16 * 1024 * 1024 });
  } catch {
    return undefined;
  }
}

/** `files` are library-relative paths; undefined when the library is not in a git work tree (or git is missing). */
export function libraryRevision(root: string, files: readonly string[]): LibraryRevision | undefined {
  if (files.length === 0 || git(['rev-parse', '--is-inside-work-tree'], root)?.trim() !== 'true') return undefined;
  const paths = files.map((f) => `:(literal)${f}`);
  const last = git(['log', '-1', '--format=%H %cs', '--', ...paths], root)?.trim();
  if (!last) return undefined;
  const [hash, date] = last.split(' ');
  const status = git(['status', '--porcelain', '--untracked-files=all', '--', ...paths], root);
  const uncommitted = status === undefined ? 0 : status.split('\n').filter(Boolean).length;
  return { commit: hash.slice(0, 12), date, uncommitted };
}
