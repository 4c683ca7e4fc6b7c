// Picking parts named on the command line, by id or by file path.

import { resolve, relative, sep } from 'node:path';
import type { Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import { closest } from '../model/suggest.js';
import { UsageError } from './io.js';

/** The parts named by `names` (ids or part-file paths), in the order given; all parts when none is named. */
export function selectParts(library: Library, names: string[], cwd: string): Part[] {
  if (names.length === 0) return library.parts;
  return names.map((name) => {
    const byId = library.partsById.get(name);
    if (byId) return byId;
    const path = relative(library.root, resolve(cwd, name)).split(sep).join('/');
    const byFile = library.parts.find((p) => p.source.path === path);
    if (byFile) return byFile;
    const guess = closest(name, library.partsById.keys());
    throw new UsageError(`no part with id or file ${JSON.stringify(name)}${guess ? `; did you mean ${guess}?` : ''}`);
  });
}
