// A library folder at an earlier git revision: the revision resolved to a commit, and the library's files
// at that commit written into a temporary folder, so that the ordinary loader reads them with every check
// it makes on disk (kinds of entry, links only within the library, sizes, UTF-8). The `git` program on the
// PATH does the reading; the repository itself is never changed: a temporary index file of our own is
// filled from the revision's tree and checked out under a temporary prefix.

import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Why a revision cannot be read: the command line asked for something that is not there (exit 2), or git failed. */
export class RevisionError extends Error {
  constructor(
    message: string,
    readonly misuse: boolean,
  ) {
    super(message);
  }
}

export interface Revision {
  /** As the user wrote it: a tag, a branch, HEAD~3, a hash. */
  name: string;
  /** The full commit hash it names. */
  commit: string;
}

export interface RevisionCheckout extends Revision {
  /** The temporary folder holding the library's files at that revision. */
  folder: string;
  /** Removes the temporary folder; safe to call twice. */
  remove(): void;
}

// Longest revision text accepted; git's own names are far shorter.
const MAX_REVISION_LENGTH = 200;

interface GitResult {
  ok: boolean;
  stdout: string;
  stderr: string;
}

function git(args: string[], cwd: string, env: Record<string, string> = {}): GitResult {
  try {
    const stdout = execFileSync('git', args, {
      cwd,
      env: { ...process.env, GIT_TERMINAL_PROMPT: '0', ...env },
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'pipe'],
      maxBuffer: 64 * 1024 * 1024,
    });
    return { ok: true, stdout, stderr: '' };
  } catch (error) {
    const e = error as { code?: string; stdout?: string; stderr?: string };
    if (e.code === 'ENOENT') throw new RevisionError('the git program was not found on the PATH; install git to compare revisions', false);
    return { ok: false, stdout: String(e.stdout ?? ''), stderr: String(e.stderr ?? '') };
  }
}

function firstLine(text: string): string {
  return text.replace(/^(fatal|error): /m, '').split('\n', 1)[0].trim();
}

/** The top of the git work tree holding `root`, and the library's path inside it ('' at the top, else "a/b/"). */
export function workTreeOf(root: string): { top: string; prefix: string } {
  const result = git(['rev-parse', '--show-toplevel', '--show-prefix'], root);
  if (!result.ok) {
    const why = /not a git repository/i.test(result.stderr) ? 'is not in a git work tree' : `cannot be read with git (${firstLine(result.stderr)})`;
    throw new RevisionError(`the library folder ${root} ${why}; comparing with a revision needs the library under git`, true);
  }
  const [top, prefix = ''] = result.stdout.split('\n');
  if (!top) throw new RevisionError(`the library folder ${root} is inside a git folder but not in a work tree`, true);
  return { top, prefix };
}

/** The commit `name` names in the repository holding `root`; a RevisionError (misuse) when there is none. */
export function resolveRevision(root: string, name: string): Revision {
  if (name === '' || name.startsWith('-') || name.length > MAX_REVISION_LENGTH || /[\u0000-\u001f\u007f]/.test(name)) {
    throw new RevisionError(`${JSON.stringify(name.slice(0, 80))} is not a revision name`, true);
  }
  workTreeOf(root);
  const result = git(['rev-parse', '--verify', '--quiet', `${name}^{commit}`], root);
  const commit = result.stdout.trim();
  if (!result.ok || !/^[0-9a-f]{40,64}$/.test(commit)) {
    throw new RevisionError(`unknown revision ${JSON.stringify(name)}: git knows no commit by that name in this repository`, true);
  }
  return { name, commit };
}

/**
 * Registers work to undo should the process end early (the command line's on-exit tasks); returns the
 * function that unregisters it.
 */
export type ExitGuard = (task: () => void) => () => void;

const noGuard: ExitGuard = () => () => {};

/**
 * Write the library's files at revision `name` into a new temporary folder. The caller removes it; until
 * then its removal is registered with `guard`, so an early exit removes it too. A library folder the
 * revision does not hold is a RevisionError (misuse).
 */
export function checkoutRevision(root: string, name: string, guard: ExitGuard = noGuard): RevisionCheckout {
  const { top, prefix } = workTreeOf(root);
  const revision = resolveRevision(root, name);
  const folderName = prefix.replace(/\/$/, '');
  const treeish = prefix === '' ? `${revision.commit}^{tree}` : `${revision.commit}:${folderName}`;
  const tree = git(['rev-parse', '--verify', '--quiet', treeish], top);
  if (!tree.ok || git(['cat-file', '-t', tree.stdout.trim()], top).stdout.trim() !== 'tree') {
    throw new RevisionError(`revision ${JSON.stringify(name)} holds no folder ${folderName}: the library folder was not in git at that commit`, true);
  }
  const folder = mkdtempSync(join(tmpdir(), 'zfolio-revision-'));
  const done = guard(() => rmSync(folder, { recursive: true, force: true }));
  const remove = () => {
    rmSync(folder, { recursive: true, force: true });
    done();
  };
  try {
    const env = { GIT_INDEX_FILE: join(folder, 'index') };
    // The library keeps its place below the top of the work tree (tree/lib/...), so a link inside it that
    // climbs out and back in ("../../lib/parts/a.yaml") still lands on the same file. Only the library's own
    // files are written: a link to a file elsewhere in the repository leads to nothing and is refused, as
    // the loader refuses any link that leaves the library.
    const checkoutTop = join(folder, 'tree') + '/';
    const library = join(checkoutTop, folderName);
    const steps: string[][] = [
      prefix === '' ? ['read-tree', tree.stdout.trim()] : ['read-tree', `--prefix=${prefix}`, tree.stdout.trim()],
      // From the top of the work tree, so -a takes every entry of our index, not only those under the cwd.
      ['checkout-index', '--all', '--force', `--prefix=${checkoutTop}`],
    ];
    for (const args of steps) {
      const result = git(args, top, env);
      if (!result.ok) throw new RevisionError(`git could not read revision ${JSON.stringify(name)}: ${firstLine(result.stderr)}`, false);
    }
    // An empty tree checks out nothing; the loader then reports the missing parts/ folder.
    mkdirSync(library, { recursive: true });
    return { ...revision, folder: library, remove };
  } catch (error) {
    remove();
    throw error;
  }
}
