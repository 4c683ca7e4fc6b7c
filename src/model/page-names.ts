// Page names: the folder a part, rail plan, comparison or review gets in the site. Names come from ids and
// file names, so they are made safe for a path (letters, digits, ". _ -"), kept short (a long one is cut and
// ends in a hash of the whole name, so it stays unique and the same from build to build), and checked for
// collisions once letter case is ignored, as many file systems ignore it.

import { contentHash } from './source.js';

/** Longest page name; with the site's folders and "index.html" a path stays far below any system's limit. */
export const MAX_PAGE_NAME = 64;
/** Longest part id or rail name: they are page names as written, so they must fit one. */
export const MAX_ID_LENGTH = MAX_PAGE_NAME;

/** The folder name for `name`: unsafe runs become "-", and a name over MAX_PAGE_NAME is cut and hashed. */
export function pageName(name: string): string {
  const safe = name.replace(/[^A-Za-z0-9._-]+/g, '-');
  // "." and ".." are not folder names of their own; nor is an empty name.
  const usable = /^\.*$/.test(safe) ? `${safe}-${contentHash(name).slice(0, 8)}` : safe;
  if (usable.length <= MAX_PAGE_NAME) return usable;
  return `${usable.slice(0, MAX_PAGE_NAME - 17)}-${contentHash(name)}`;
}

/** A review's or comparison's handle: its path under `folder` without the extension ("decoupling-0402"). */
export function fileStem(path: string, folder: string): string {
  return path.slice(folder.length + 1).replace(/\.ya?ml$/i, '');
}
