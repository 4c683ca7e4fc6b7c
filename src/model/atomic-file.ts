// A file written whole: under a name of this process's beside it, then renamed into place, so that a reader
// (another build, say) finds the old text or the new one, never part of one.

import { rmSync, renameSync, writeFileSync } from 'node:fs';

/** The name `file` is written under by process `pid` before it is renamed into place. */
export const draftOf = (file: string, pid = process.pid) => `${file}.${pid}.tmp`;

/** Write `text` to `file` whole; when that fails, the draft is removed and the error thrown. */
export function writeAtomically(file: string, text: string): void {
  const draft = draftOf(file);
  try {
    writeFileSync(draft, text);
    renameSync(draft, file);
  } catch (error) {
    rmSync(draft, { force: true });
    throw error;
  }
}
