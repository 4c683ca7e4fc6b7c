// A unit's stamp: what a hand edit of a unit of a built site would change, recorded with the unit
// (site-record.ts) and compared by the next build before it keeps the unit (carry-over.ts).

import { statSync } from 'node:fs';
import { join } from 'node:path';

/**
 * What a hand edit of a unit would change: for a folder, its own mtime and inode (a file added, removed or
 * replaced by rename) and its page's size, mtime and inode (the page edited in place); for a file, its size,
 * mtime and inode. Empty when it is missing.
 */
export function unitStamp(path: string, folder: boolean): number[] {
  try {
    const s = statSync(path, { throwIfNoEntry: false });
    if (!s) return [];
    if (!folder) return s.isFile() ? [s.size, s.mtimeMs, s.ino] : [];
    if (!s.isDirectory()) return [];
    const page = statSync(join(path, 'index.html'), { throwIfNoEntry: false });
    return page ? [s.mtimeMs, s.ino, page.size, page.mtimeMs, page.ino] : [];
  } catch {
    return [];
  }
}

export const sameStamp = (a: readonly number[], b: readonly number[]) => a.length > 0 && a.length === b.length && a.every((x, i) => x === b[i]);

/**
 * Whether a unit of the spare version is as recorded (`stamp`, see unitStamp), from one stat: a file's size,
 * mtime and inode, and for a folder its page's alone. The spare's files are shared by hard link with the live
 * site's (a unit the last build carried over), so a page edited in place through the site path changes the
 * spare's page too, and is seen here. A file added to, removed from or renamed over in the live site's copy of
 * a folder leaves the spare's copy as the build made it, which is the copy the new site gets; only the spare's
 * own folder changed inside the holding folder by hand goes unseen (its folder's stamp is not read: at 10,000
 * parts that stat was a tenth of a rebuild).
 */
export function spareUnchanged(path: string, folder: boolean, stamp: readonly number[]): boolean {
  if (!folder) return sameStamp(stamp, unitStamp(path, false));
  if (stamp.length !== 5) return false;
  try {
    const page = statSync(`${path}/index.html`, { throwIfNoEntry: false });
    return page !== undefined && page.isFile() && page.size === stamp[2] && page.mtimeMs === stamp[3] && page.ino === stamp[4];
  } catch {
    return false;
  }
}
