// What a build reads of every part of the library, whether or not it renders the part: the fields its
// families are sorted by (as one text, for the key they are kept under) and whether the part has a
// temperature characteristic. A part from the part cache carries these, kept with its entry, so that a
// rebuild after one edit of 10,000 parts reads them without parsing the parts' fields (lazy-head.ts);
// any other part gives them from its fields.

import { asciiJson } from './ascii-text.js';
import { covers, ratedSpan, type TemperatureRange } from './spread.js';
import type { Part } from './part.js';

/**
 * Every field of a part that partFamilies reads (directly or through ratingText): the families are a function
 * of these fields of the library's parts, in order, and are kept from build to build under a hash of them
 * (src/build/family-cache.ts). test/pages/families.test.ts checks that no other field is read.
 */
export const FAMILY_FIELDS = ['id', 'kind', 'behavesAs', 'nominal', 'package', 'dielectric', 'voltageRatings', 'voltageV', 'voltageAcV', 'currentA', 'powerW'] as const satisfies readonly (keyof Part)[];

export interface PartFacts {
  /** FAMILY_FIELDS' values as JSON text (an array, undefined written as null), ASCII (ascii-text.ts). */
  family: string;
  /** Whether the part has a safety class (a mains part: the index then shows the mains legend). */
  safety: boolean;
  /** The part's temperature characteristic: absent (false), specified everywhere (true), or over a span. */
  temperature: boolean | TemperatureRange;
}

/** The property under which a cached part answers its facts without parsing its fields. */
export const PART_FACTS = Symbol('part facts');

/** FAMILY_FIELDS' values of a part as JSON text, made from its fields. */
const familyOf = (part: Pick<Part, (typeof FAMILY_FIELDS)[number]>) => asciiJson(JSON.stringify(FAMILY_FIELDS.map((f) => part[f])));

/** A part's temperature fact made from its fields. */
function temperatureFrom(part: Pick<Part, 'spread'>): PartFacts['temperature'] {
  const characteristic = part.spread.temperature;
  return characteristic === undefined ? false : (ratedSpan(characteristic) ?? true);
}

/** A part's facts made from its fields. */
export function factsFrom(part: Pick<Part, (typeof FAMILY_FIELDS)[number] | 'spread' | 'safetyClass'>): PartFacts {
  return { family: familyOf(part), safety: Boolean(part.safetyClass), temperature: temperatureFrom(part) };
}

const factsOf = (part: Part) => (part as unknown as { [PART_FACTS]?: PartFacts })[PART_FACTS];

/** FAMILY_FIELDS of the part as JSON text. */
export function familyText(part: Part): string {
  return factsOf(part)?.family ?? familyOf(part);
}

/** Whether the part has a safety class (read without parsing a cached part's fields). */
export function hasSafetyClass(part: Part): boolean {
  return factsOf(part)?.safety ?? Boolean(part.safetyClass);
}

/**
 * Whether the part has a temperature characteristic specified over less than the operating temperatures (the
 * spread then warns: library.ts), read without parsing a cached part's fields.
 */
export function temperatureGap(part: Part, operating: TemperatureRange): boolean {
  const known = factsOf(part)?.temperature ?? temperatureFrom(part);
  return known !== false && !covers(known === true ? undefined : known, operating);
}
