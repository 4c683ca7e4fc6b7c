// Keeping the PDFs of the last build. A build without --pdf (or one whose Chromium is missing) prints
// nothing; rather than dropping the PDFs an earlier `build --pdf` printed, it keeps each one whose inputs are
// unchanged and links it from its page as that build did. A part's datasheet depends on the code, the
// library's settings and the part file (the same key as its folder, reuse.ts); a review pack prints sheets of
// parts, plans and comparisons, so its key covers every file of the library, and its cover states the git
// revision of the files it draws on, so its key holds that revision too (a commit changes no file's content,
// yet a kept pack would name the commit before it). A PDF is kept only when its key
// matches the one recorded when it was printed and the file is the one that build wrote (size, mtime, inode).
// The others are removed with the old site, and the build says how many.

import { sha256Hex } from '../model/sha256.js';
import { constants, copyFileSync, linkSync, mkdirSync, readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { Library } from '../model/library.js';
import { measurementInputs } from '../model/measurement-entry.js';
import { partPdfPath, reviewPdfPath } from '../pages/site-paths.js';
import { reviewSlug } from '../present/slugs.js';
import { libraryRevision } from '../history/library-revision.js';
import { reviewSources } from '../pages/review-page.js';
import type { PdfLinks } from './assemble.js';

/** A printed PDF as the build record keeps it: its key, and the file's size, mtime and inode. */
export interface PdfStamp {
  key: string;
  size: number;
  mtimeMs: number;
  ino: number;
}

/**
 * The key of every PDF the library can have, by site-relative path. `site` is reuse.ts's siteKey;
 * `reviewInputs` names what else a review's pack is made from (the commit its `since:` names).
 */
export function pdfKeys(library: Library, site: string, reviewInputs: (slug: string) => string = () => ''): Map<string, string> {
  const hash = (...parts: string[]) => sha256Hex(['pdf', site, ...parts].join('\n')).slice(0, 32);
  const everything = [...library.sources.map((s) => `${s.path} ${s.hash}`), ...library.parts.map((p) => measurementInputs(p.measurements))].join('\n');
  return new Map([
    ...library.parts.map((p): [string, string] => [partPdfPath(p.id), hash('part', p.source.path, p.source.hash, measurementInputs(p.measurements))]),
    ...library.reviews.map((r): [string, string] => [reviewPdfPath(reviewSlug(r)), hash('review', reviewSlug(r), everything, revisionText(library, r), ...[reviewInputs(reviewSlug(r))].filter(Boolean))]),
  ]);
}

/** The git revision a review's cover states (commit, date, files changed since), as text; empty outside git. */
function revisionText(library: Library, review: Library['reviews'][number]): string {
  const revision = libraryRevision(library.root, reviewSources(review, library).map((s) => s.file));
  return revision ? `git ${revision.commit} ${revision.date} ${revision.uncommitted}` : '';
}

/** The PDFs in a built site, by site-relative path. */
export function pdfsIn(siteDir: string): string[] {
  const found: string[] = [];
  for (const folder of ['pdf/parts', 'pdf/reviews']) {
    try {
      for (const name of readdirSync(join(siteDir, folder)).sort()) if (name.endsWith('.pdf')) found.push(`${folder}/${name}`);
    } catch {
      // none of this kind
    }
  }
  return found;
}

/** The PDFs of the last site that can be kept: recorded with the key they would have now, and untouched. */
export function keptPdfs(recorded: Readonly<Record<string, PdfStamp>> | undefined, keys: ReadonlyMap<string, string>, siteDir: string): Set<string> {
  const kept = new Set<string>();
  for (const [path, key] of keys) {
    const stamp = recorded && Object.hasOwn(recorded, path) ? recorded[path] : undefined;
    if (!stamp || stamp.key !== key) continue;
    try {
      const s = statSync(join(siteDir, path));
      if (s.isFile() && s.size === stamp.size && s.mtimeMs === stamp.mtimeMs && s.ino === stamp.ino) kept.add(path);
    } catch {
      // gone
    }
  }
  return kept;
}

/** Link the kept PDFs into the new site (copies where hard links cannot be made). Call after every page is written. */
export function linkPdfs(paths: Iterable<string>, siteDir: string, stagingDir: string): void {
  for (const path of paths) {
    const to = join(stagingDir, path);
    mkdirSync(dirname(to), { recursive: true });
    try {
      linkSync(join(siteDir, path), to);
    } catch {
      copyFileSync(join(siteDir, path), to, constants.COPYFILE_EXCL);
    }
  }
}

/** The stamps to record for the PDFs now in `siteDir`. */
export function stampPdfs(paths: Iterable<string>, keys: ReadonlyMap<string, string>, siteDir: string): Record<string, PdfStamp> {
  const stamps: Record<string, PdfStamp> = {};
  for (const path of paths) {
    const key = keys.get(path);
    if (key === undefined) continue;
    const s = statSync(join(siteDir, path));
    stamps[path] = { key, size: s.size, mtimeMs: s.mtimeMs, ino: s.ino };
  }
  return stamps;
}

/** What the pages link: every PDF when this build prints, else the kept ones (`kept`, site-relative paths). */
export function pdfLinksFor(printing: boolean, kept: ReadonlySet<string>): PdfLinks {
  return { part: (id) => printing || kept.has(partPdfPath(id)), review: (slug) => printing || kept.has(reviewPdfPath(slug)) };
}
