// A part from the part cache whose fields are read in two steps: those a build reads of every part of the
// library (its id and kind, what sorts it into families and rates it, its measurements and spread, where it
// is written) are parsed when the part is handed out; the others (title, model, parameters, tags, notes …),
// which only the pages and charts of the parts a build renders read, are read (and parsed) together when
// one of them is first read. A rebuild after one edit of 10,000 parts reads the whole of a
// few dozen. The part's own enumerable keys are the same as the part it was made from (the late ones are
// getters with setters, own and enumerable), so spreading, cloning or comparing it reads them as values.

import type { Part } from './part.js';

/** The fields parsed when a cached part is handed out: what is read of every part at every build. */
export const EARLY_FIELDS: readonly string[] = ['id', 'kind', 'behavesAs', 'nominal', 'package', 'dielectric', 'safetyClass', 'voltageRatings', 'voltageV', 'voltageAcV', 'currentA', 'powerW', 'spread', 'measurements', 'at'];
const EARLY = new Set(EARLY_FIELDS);

/** Where a part's late fields come from (read once, when the first is read or written). */
export interface LateSource {
  read(): Record<string, unknown>;
}

/** The late fields' source, and their values once read. */
interface Late {
  source?: LateSource;
  value?: Record<string, unknown>;
}

const LATE = Symbol('late fields');
type Held = Record<string, unknown> & { [LATE]: Late };

function late(part: Held): Record<string, unknown> {
  const held = part[LATE];
  if (!held.value) {
    held.value = held.source!.read();
    held.source = undefined;
  }
  return held.value;
}

/** One getter and setter per field name, shared by every part (they find the part's values through `this`). */
const accessors = new Map<string, PropertyDescriptor>();

function accessor(key: string): PropertyDescriptor {
  let found = accessors.get(key);
  if (!found) {
    found = {
      get(this: Held) {
        return late(this)[key];
      },
      set(this: Held, value: unknown) {
        late(this)[key] = value;
      },
      enumerable: true,
      configurable: true,
    };
    accessors.set(key, found);
  }
  return found;
}

/** A part (its source left out) split into its early fields and its late ones, each in key order. */
export function splitPart(part: Record<string, unknown>): { early: Record<string, unknown>; late: Record<string, unknown> } {
  const early: Record<string, unknown> = {};
  const rest: Record<string, unknown> = {};
  for (const key of Object.keys(part)) (EARLY.has(key) ? early : rest)[key] = part[key];
  return { early, late: rest };
}

/**
 * The part made of its early fields (`early`, taken as the part object) and its late fields (`lateKeys`,
 * read from `source` when one of them is first read or written). The caller sets its source file.
 */
export function lazyPart(early: Record<string, unknown>, lateKeys: readonly string[], source: LateSource): Omit<Part, 'source'> {
  Object.defineProperty(early, LATE, { value: { source } satisfies Late });
  for (const key of lateKeys) Object.defineProperty(early, key, accessor(key));
  return early as unknown as Omit<Part, 'source'>;
}

/** Whether a part's late fields have been parsed (always true of a part not made by lazyPart). */
export function lateFieldsRead(part: object): boolean {
  const held = (part as Partial<Held>)[LATE];
  return held === undefined || held.value !== undefined;
}
