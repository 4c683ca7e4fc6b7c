// JSON that gives a value back exactly, where JSON can: a plain tree of objects, arrays, strings, finite
// numbers, booleans and null, with `undefined` kept where it is a property's value (JSON would drop the key).
// Parsing JSON is several times faster than v8's deserialiser for such trees (a library's part cache is read
// at every build); the encoder checks its own output and refuses a value it would not give back exactly
// (-0, NaN, a Map, a typed array, a class instance …), so the caller can keep that one some other way.

import { isDeepStrictEqual } from 'node:util';

/** Where each `undefined` property value sits: the keys (and array indices) leading to it. */
export type Holes = (string | number)[][];

export interface ExactJson {
  /** JSON text, with null where the value has undefined. */
  text: string;
  holes: Holes;
}

/** The value as JSON text and its holes, or undefined when decoding would not give it back exactly. */
export function encodeExact(value: unknown): ExactJson | undefined {
  const holes: Holes = [];
  const walk = (v: unknown, path: (string | number)[]) => {
    if (Array.isArray(v)) v.forEach((x, i) => (x === undefined ? holes.push([...path, i]) : walk(x, [...path, i])));
    else if (v !== null && typeof v === 'object') {
      for (const [k, x] of Object.entries(v)) {
        if (x === undefined) holes.push([...path, k]);
        else walk(x, [...path, k]);
      }
    }
  };
  walk(value, []);
  const text = JSON.stringify(value, (_key, v: unknown) => (v === undefined ? null : v));
  if (text === undefined) return undefined;
  return isDeepStrictEqual(decodeExact(JSON.parse(text), holes), value) ? { text, holes } : undefined;
}

/** The value `encodeExact` was given, from its parsed text and holes (the parsed tree is changed in place). */
export function decodeExact<T = unknown>(parsed: unknown, holes: Holes): T {
  for (const path of holes) {
    let at = parsed as Record<string | number, unknown>;
    for (let i = 0; i < path.length - 1; i++) at = at[path[i]] as Record<string | number, unknown>;
    at[path[path.length - 1]] = undefined;
  }
  return parsed as T;
}
