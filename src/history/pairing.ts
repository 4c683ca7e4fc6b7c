// Which part of one revision is which part of the other. By id first; then a part whose id is gone and a
// part whose id is new are one part renamed when they live in the same file, or when their files say the
// same apart from the id (a file moved and its id changed with it).

import type { Part } from '../model/part.js';
import { sameValue } from './field-changes.js';

export interface PartPair {
  before: Part;
  after: Part;
  /** The id changed and the part was matched by its file. */
  renamed: boolean;
}

export interface PartPairing {
  pairs: PartPair[];
  added: Part[];
  removed: Part[];
}

/** A part file's data without its id, for matching a renamed part whose file also moved. */
function dataWithoutId(part: Part): unknown {
  const data = part.source.document.toJS() as Record<string, unknown> | null;
  if (data === null || typeof data !== 'object') return data;
  const rest = { ...data };
  delete rest.id;
  return rest;
}

export function pairParts(before: readonly Part[], after: readonly Part[]): PartPairing {
  const afterById = new Map(after.map((p) => [p.id, p]));
  const beforeIds = new Set(before.map((p) => p.id));
  const pairs: PartPair[] = [];
  const removed: Part[] = [];
  for (const old of before) {
    const now = afterById.get(old.id);
    if (now) pairs.push({ before: old, after: now, renamed: false });
    else removed.push(old);
  }
  const added = after.filter((p) => !beforeIds.has(p.id));
  const matched = new Set<Part>();
  const stillRemoved: Part[] = [];
  // Same file first, then same data: a part is matched once, in path order.
  const byFile = new Map(added.map((p) => [p.source.path, p]));
  const unmatched: Part[] = [];
  for (const old of removed) {
    const now = byFile.get(old.source.path);
    if (now && !matched.has(now)) {
      matched.add(now);
      pairs.push({ before: old, after: now, renamed: true });
    } else unmatched.push(old);
  }
  const addedData = unmatched.length > 0 ? new Map(added.map((p) => [p, dataWithoutId(p)])) : new Map<Part, unknown>();
  for (const old of unmatched) {
    const data = dataWithoutId(old);
    const now = added.find((p) => !matched.has(p) && sameValue(addedData.get(p), data));
    if (now) {
      matched.add(now);
      pairs.push({ before: old, after: now, renamed: true });
    } else stillRemoved.push(old);
  }
  return { pairs, added: added.filter((p) => !matched.has(p)), removed: stillRemoved };
}
