// Turning an error no command expected into one line the user can act on. Exit codes stay 0–3 whatever
// happens: such a failure exits 1, like a library with problems (see io.ts).

import { DEBUG_ENV } from './io.js';

/** Longest message shown; the rest of a long one is cut (the whole of it, with the stack, under $ZFOLIO_DEBUG). */
const MAX_LENGTH = 160;

/** What the system's error codes mean, in words, for the ones a file-writing command meets. */
const ERRNO_WORDS: Record<string, string> = {
  ENOSPC: 'no space left on the device',
  EDQUOT: 'disk quota exceeded',
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'read-only file system',
  ENOENT: 'no such file or folder',
  ENOTDIR: 'a part of the path is not a folder',
  EISDIR: 'is a folder',
  EMFILE: 'too many open files',
  ENAMETOOLONG: 'file name too long',
  EIO: 'input/output error',
  EBUSY: 'busy',
  EXDEV: 'crosses file systems',
};

function cut(text: string): string {
  const line = text.split('\n', 1)[0].trim();
  return line.length > MAX_LENGTH ? `${line.slice(0, MAX_LENGTH - 1)}…` : line;
}

/** One line: what failed, and how to see more. */
export function failureLine(error: unknown): string {
  const e = error as NodeJS.ErrnoException | undefined;
  if (e && typeof e.code === 'string' && typeof e.syscall === 'string') {
    const words = ERRNO_WORDS[e.code] ?? e.code;
    return cut(`cannot ${e.syscall}${e.path ? ` ${e.path}` : ''}: ${words} (${e.code})`);
  }
  const message = error instanceof Error ? error.message : String(error);
  return `internal error: ${cut(message) || 'unknown'} (set ${DEBUG_ENV}=1 for details)`;
}

/** The whole story, for $ZFOLIO_DEBUG. */
export function failureDetails(error: unknown): string {
  return error instanceof Error && error.stack ? error.stack : String(error);
}
