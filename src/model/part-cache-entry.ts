// One entry of the part cache (part-cache.ts) as its shard files hold it (part-cache-files.ts), and the
// texts it is written as.

import { isDeepStrictEqual } from 'node:util';
import { serialize } from 'node:v8';
import type { Diagnostic, SourcePosition } from './diagnostics.js';
import { decodeExact, encodeExact, type Holes } from './exact-json.js';
import { splitPart } from './lazy-part.js';
import { factsFrom } from './part-facts.js';
import { flagsText, type ShardEntry } from './part-cache-files.js';
import type { Part } from './part.js';

export interface CachedRead {
  part: Part;
  declared: { id: string; at: SourcePosition };
  diagnostics: Diagnostic[];
}

/**
 * What a row's head holds, parsed when its part is handed out: the part's early fields (lazy-part.ts) and the
 * rest's names; the id the file declares when it is not the part's own id at the part's own position, and
 * the warnings reading it gave when there were any (most parts have neither: 10,000 heads are read a build).
 */
export interface Head {
  early: Record<string, unknown>;
  lateKeys: string[];
  declared?: { id: string; at: SourcePosition };
  diagnostics?: Diagnostic[];
}

/** A head that says the late text is the whole entry as base64 of v8 bytes (exact JSON would not give it back). */
export const V8 = 'v8';

/** [value, holes] as text, or undefined when exact JSON would not give the value back. */
function exactText(value: unknown): string | undefined {
  const exact = encodeExact(value);
  return exact && `[${exact.text},${JSON.stringify(exact.holes)}]`;
}

export function fromExactText<T>(text: string): T {
  const [value, holes] = JSON.parse(text) as [unknown, Holes];
  return decodeExact<T>(value, holes);
}

/** Whether two positions are the same (a part's own `at` and the position of the id it declares). */
const samePosition = (a: SourcePosition, b: unknown) => isDeepStrictEqual(a, b);

/** A head as its row's two texts: the value and its holes apart, so that the shard lists each holes text once. */
function headTexts(head: Head): { head: string; holes: string } | undefined {
  const exact = encodeExact(head);
  return exact && { head: exact.text, holes: JSON.stringify(exact.holes) };
}

/** An entry as its shard's files hold it (part-cache-files.ts). */
export function shardEntry(path: string, stamp: string, read: CachedRead): ShardEntry {
  const { source, ...fields } = read.part;
  const { early, late } = splitPart(fields);
  const own = read.declared.id === early.id && samePosition(read.declared.at, early.at);
  const head = headTexts({ early, lateKeys: Object.keys(late), ...(own ? {} : { declared: read.declared }), ...(read.diagnostics.length > 0 ? { diagnostics: read.diagnostics } : {}) });
  const rest = head && exactText(late);
  const facts = factsFrom(read.part);
  const parsed = !head || !rest || !own || read.diagnostics.length > 0 || read.part.measurements.length > 0;
  const at = { path, stamp, hash: source.hash, id: read.part.id, kind: read.part.kind, flags: flagsText(parsed, facts), family: facts.family };
  if (head && rest) return { ...at, ...head, late: rest };
  const whole = { part: { ...fields, source: undefined }, declared: read.declared, diagnostics: read.diagnostics };
  return { ...at, head: V8, holes: '[]', late: Buffer.from(serialize(whole)).toString('base64') };
}
