// Keys of reuse. A part's folder (its page, sweep CSV, figures and chart specs) is a function of the part
// file, the library's settings, the site-wide header its page shows, and the code and templates that made
// it. When all of those hash the same as in the last build, the folder is carried over rather than drawn,
// written and rendered again (carry-over.ts says how, site-record.ts what the record of the last build holds).

import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import { measurementInputs } from '../model/measurement-entry.js';
import { PACKAGE_ROOT, VERSION } from '../version.js';
import { sha256Hex } from '../model/sha256.js';
import { installedVersion } from '../charts/package-version.js';

const SOURCE_DIR = dirname(dirname(fileURLToPath(import.meta.url)));

/**
 * Packages whose output lands in the pages, by version (their code is not hashed file by file). vega draws
 * from its single-file build (charts/vega-runtime.ts), which carries its own scenegraph: vega's version names it.
 */
const RENDERING_PACKAGES = ['@11ty/eleventy', 'nunjucks', 'vega', 'vega-lite', 'markdown-it'];

function hashTree(hash: ReturnType<typeof createHash>, dir: string, base: string): void {
  for (const entry of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) hashTree(hash, path, `${base}${entry.name}/`);
    else if (entry.isFile()) hash.update(`${base}${entry.name}\n`).update(readFileSync(path));
  }
}

let codeKeyMemo: string | undefined;

/**
 * A hash of everything that turns a library into pages besides the library itself: zfolio's own code (every
 * source file, whichever layer), its templates and eleventy configuration, the versions of the packages
 * that render, and Node's version.
 */
export function codeKey(): string {
  if (codeKeyMemo) return codeKeyMemo;
  const hash = createHash('sha256').update(`zfolio ${VERSION}\nnode ${process.version}\n`);
  // A package not installed gets a version of its own, so the key still differs from one made with it.
  for (const name of RENDERING_PACKAGES) hash.update(`${name} ${installedVersion(name) ?? 'absent'}\n`);
  hashTree(hash, SOURCE_DIR, 'src/');
  hashTree(hash, join(PACKAGE_ROOT, 'templates'), 'templates/');
  try {
    hash.update('.eleventy.js\n').update(readFileSync(join(PACKAGE_ROOT, '.eleventy.js')));
  } catch {
    hash.update('no .eleventy.js\n');
  }
  codeKeyMemo = hash.digest('hex');
  return codeKeyMemo;
}

/**
 * What every part folder of this build shares: the code, the library's settings, and what the page frame
 * shows from the rest of the library (title, owner, version, which sections the navigation links to).
 */
export function siteKey(library: Library): string {
  return createHash('sha256')
    .update(codeKey())
    .update(JSON.stringify(library.settings))
    .update(JSON.stringify({ plans: library.plans.length > 0, reviews: library.reviews.length > 0 }))
    .digest('hex');
}

/**
 * The key of one part's folder: the shared key's first 16 hex digits, the part file's content hash, whether
 * its page links a PDF, its measurement files' paths and hashes (hashed, for a part that has any), and the
 * part file's path, which the page shows. Written out rather than hashed: every part's key is made at every
 * build, 10,000 of them in a large library, and a hash each was a thirtieth of a rebuild after one edit.
 * The fields before the path have fixed lengths (the measurements' hash is absent or 16 digits, and a space
 * follows it), so different inputs never give the same text.
 */
export function partKey(site: string, part: Part, linksPdf: boolean): string {
  const { source, measurements } = part;
  const measured = measurements.length > 0 ? sha256Hex(measurementInputs(measurements)).slice(0, 16) : '';
  return `${site.slice(0, 16)}${source.hash}${linksPdf ? 'p' : 'n'}${measured} ${source.path}`;
}
