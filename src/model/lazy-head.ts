// A part from the part cache handed out before its head (its early fields, lazy-part.ts) is parsed. A build
// reads of every unchanged part only its id, its kind, its source, its measurements (none, for the parts
// handed out this way) and its facts (part-facts.ts): the part answers those from its cache row, and parses
// its head (then making itself as lazyPart does) when anything else is first read, written, listed or
// defined. At 10,000 parts, parsing every head at every build was about a tenth of a rebuild after one edit;
// a part whose fields a build reads is parsed as before, so the part behaves as a plain part throughout.
//
// The part is a Proxy over an object that stays empty until the head is parsed, and then holds the part as
// lazyPart makes it: its early fields in their order, its late fields (read when first read), its source.

import { lazyPart, type LateSource } from './lazy-part.js';
import { PART_FACTS, type PartFacts } from './part-facts.js';
import type { Part } from './part.js';

/** What a cached part answers without parsing its head. */
export interface KnownFields {
  id: string;
  kind: string;
  source: Part['source'];
  facts: PartFacts;
}

/** Where the head and the late fields come from. */
export interface HeadSource extends LateSource {
  head(): { early: Record<string, unknown>; lateKeys: readonly string[] };
}

type Target = Record<PropertyKey, unknown>;

/** Answered true by a part whose head is not parsed yet, without parsing it. */
const PENDING = Symbol('head not parsed');

/** The part's state: its known fields until its head is parsed. One handler a part; its traps are shared. */
class OnDemand implements ProxyHandler<Target> {
  private parsed = false;
  /** The part's measurements: an empty list, the same before and after the head is parsed. */
  private readonly measurements: never[] = [];

  constructor(
    private readonly known: KnownFields,
    private readonly from: HeadSource,
  ) {}

  /** The target, filled from the head on first use (as lazyPart makes a cached part, its source last). */
  private ready(target: Target): Target {
    if (this.parsed) return target;
    this.parsed = true;
    const { early, lateKeys } = this.from.head();
    Object.assign(target, early);
    target.measurements = this.measurements;
    lazyPart(target, lateKeys, this.from);
    target.source = this.known.source;
    return target;
  }

  get(target: Target, key: PropertyKey): unknown {
    if (!this.parsed) {
      if (key === 'id') return this.known.id;
      if (key === 'kind') return this.known.kind;
      if (key === 'source') return this.known.source;
      if (key === 'measurements') return this.measurements;
    }
    // Once parsed, the facts come from the fields (which the build may since have changed).
    if (key === PART_FACTS && !this.parsed) return this.known.facts;
    if (key === PENDING) return !this.parsed;
    // The target as the receiver: the late fields' getters find the part's values through it.
    return Reflect.get(this.ready(target), key);
  }

  set(target: Target, key: PropertyKey, value: unknown): boolean {
    return Reflect.set(this.ready(target), key, value);
  }

  has(target: Target, key: PropertyKey): boolean {
    if (!this.parsed && (key === 'id' || key === 'kind' || key === 'source' || key === 'measurements')) return true;
    return Reflect.has(this.ready(target), key);
  }

  ownKeys(target: Target): ArrayLike<string | symbol> {
    return Reflect.ownKeys(this.ready(target));
  }

  getOwnPropertyDescriptor(target: Target, key: PropertyKey): PropertyDescriptor | undefined {
    return Reflect.getOwnPropertyDescriptor(this.ready(target), key);
  }

  defineProperty(target: Target, key: PropertyKey, descriptor: PropertyDescriptor): boolean {
    return Reflect.defineProperty(this.ready(target), key, descriptor);
  }

  deleteProperty(target: Target, key: PropertyKey): boolean {
    return Reflect.deleteProperty(this.ready(target), key);
  }

  preventExtensions(target: Target): boolean {
    return Reflect.preventExtensions(this.ready(target));
  }

  isExtensible(target: Target): boolean {
    return Reflect.isExtensible(this.ready(target));
  }
}

/** A cached part without measurements, its head parsed when a field other than those known is first used. */
export function partOnDemand(known: KnownFields, from: HeadSource): Part {
  return new Proxy<Target>({}, new OnDemand(known, from)) as unknown as Part;
}

/** Whether the part's fields have been parsed (true of every part not made by partOnDemand, and of those once used). */
export function headParsed(part: object): boolean {
  return !(part as Partial<Record<typeof PENDING, boolean>>)[PENDING];
}
