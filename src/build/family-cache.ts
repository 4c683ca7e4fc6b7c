// The library's part families (pages/families.ts) kept from one build to the next. Sorting 10,000 parts into
// families took 84 to 277 ms of a rebuild after one edit (CPU profiles), and an edit rarely changes what they are
// sorted by: the families are a function of the fields FAMILY_FIELDS names (and of zfolio's code), so they
// are kept under a hash of those fields of every part, in order, and of the code key, and read back when the
// hash is the same. The file is one per cache folder, written under a name of its own and renamed into place
// (a concurrent build reads the old one or the new one whole; a draft a stopped build left is removed at the next
// write), as ASCII (ascii-text.ts); one unreadable, of another hash or naming a
// part the library lacks is passed over and the families are made afresh.

import { readdirSync, rmSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { alive } from './output.js';
import type { Part } from '../model/part.js';
import { asciiJson, readText } from '../model/ascii-text.js';
import { draftOf, writeAtomically } from '../model/atomic-file.js';
import { sha256Hex } from '../model/sha256.js';
import { familyText } from '../model/part-facts.js';
import { partFamilies, type PartFamily } from '../pages/families.js';

interface FamiliesFile {
  key: string;
  /** The families with their parts by id. */
  families: (Omit<PartFamily, 'parts'> & { parts: string[] })[];
}

/**
 * What the families are made from: every part's FAMILY_FIELDS as JSON (numbers as JSON writes them, which
 * reads back as the same double), in the library's order, with the code key.
 */
export function familiesKey(parts: readonly Part[], code: string): string {
  // The same text as JSON.stringify of the array of each part's field values, made from each part's own text.
  return sha256Hex(`part families\n${code}\n[${parts.map(familyText).join(',')}]`);
}

/** The library's part families, read from `file` when it holds those of the same key, else made and written there. */
export function cachedFamilies(parts: readonly Part[], partsById: ReadonlyMap<string, Part>, code: string, file: string): PartFamily[] {
  const key = familiesKey(parts, code);
  const found = readFamilies(file, key, partsById);
  if (found) return found;
  const families = partFamilies(parts);
  const text = JSON.stringify({ key, families: families.map((f) => ({ ...f, parts: f.parts.map((p) => p.id) })) } satisfies FamiliesFile);
  try {
    writeAtomically(file, asciiJson(text));
  } catch {
    // Not kept: made again next time.
  }
  removeLeftovers(file);
  return families;
}

function readFamilies(file: string, key: string, partsById: ReadonlyMap<string, Part>): PartFamily[] | undefined {
  try {
    const read = JSON.parse(readText(file).text) as FamiliesFile;
    if (read?.key !== key || !Array.isArray(read.families)) return undefined;
    const families: PartFamily[] = [];
    for (const f of read.families) {
      const parts: Part[] = [];
      for (const id of f.parts) {
        const part = partsById.get(id);
        if (!part) return undefined;
        parts.push(part);
      }
      families.push({ ...f, parts });
    }
    return families;
  } catch {
    // Unreadable, or damaged under its key (a family or its list of parts not there): made afresh.
    return undefined;
  }
}

/**
 * Remove the drafts of `file` that builds stopped between the write and the rename left behind (their process is
 * gone); a draft of a build still running is its own, and stays. Done when the families are written, which a
 * build killed there would have been doing.
 */
function removeLeftovers(file: string): void {
  const base = basename(file);
  let names: string[];
  try {
    names = readdirSync(dirname(file));
  } catch {
    return;
  }
  for (const name of names) {
    // A draft's name is the file's, its writer's process id and a suffix (atomic-file.ts).
    const pid = Number(name.slice(base.length + 1).split('.')[0]);
    if (Number.isInteger(pid) && pid > 0 && name === draftOf(base, pid) && !alive(pid)) rmSync(join(dirname(file), name), { force: true });
  }
}
