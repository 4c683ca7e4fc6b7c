// What the build record keeps of a part between builds: the fields the pages that list parts show
// (ListedPart), and, for a part a review shows, its whole page data (so the review pack can be rendered
// without analysing it again). Kept only when JSON gives it back exactly (finite numbers, no -0).

import type { CarriedPart, RecordedPage } from './assemble.js';
import { listedPart, type ListedPart } from '../pages/listed-part.js';
import type { FolioData, PartPageData } from '../pages/site-data.js';
import type { Library } from '../model/library.js';
import type { Part } from '../model/part.js';
import type { SiteUnits } from './carry-over.js';
import { entryData, type UnitEntry } from './site-record.js';

interface PartData {
  listed: ListedPart;
  page?: RecordedPage;
}

/** True when JSON keeps the value as it is. */
function faithful(value: unknown): boolean {
  let ok = true;
  JSON.stringify(value, (_key, v: unknown) => {
    if (typeof v === 'number' && (!Number.isFinite(v) || Object.is(v, -0))) ok = false;
    return v;
  });
  return ok;
}

/** A part's page data as a build records it for the next: all but its charts, PDF link and measurements. */
function recordedPage(page: PartPageData): RecordedPage {
  const { charts: _charts, pdfFile: _pdfFile, measurements: _measurements, ...rest } = page;
  return rest;
}

/**
 * The carried part for what the record holds of it (`entry`, site-record.ts), read when a field is first
 * asked for: a rebuild reads the data of the parts on the pages it renders, not of every part.
 */
export function carriedPart(id: string, entry: UnitEntry | undefined): CarriedPart {
  return new RecordedPart(id, entry);
}

/**
 * Each part's folder key (`keyOf`), and the parts whose folders `units` keeps (none without a record) as
 * carried parts. Each part's id is read once (a cached part answers it through a Proxy: lazy-head.ts).
 */
export function carriedParts(parts: readonly Part[], units: SiteUnits | undefined, keyOf: (part: Part, id: string) => string): { partKeys: Map<string, string>; carried: Map<string, CarriedPart> } {
  const partKeys = new Map<string, string>();
  const carried = new Map<string, CarriedPart>();
  for (const part of parts) {
    const id = part.id;
    const key = keyOf(part, id);
    partKeys.set(id, key);
    const unit = `parts/${id}`;
    if (units?.kept(unit, key)) carried.set(id, carriedPart(id, units.recordedEntry(unit)));
  }
  return { partKeys, carried };
}

/** A carried part: two small objects a part (this and its RecordedListed), as a 10,000-part rebuild makes 10,000. */
class RecordedPart implements CarriedPart {
  #data?: Partial<PartData>;
  readonly listed?: ListedPart;

  constructor(
    id: string,
    private readonly entry: UnitEntry | undefined,
  ) {
    // partData records { listed, page? } (listed first) or nothing: with text, listed is there and is an object.
    this.listed = entry?.text?.startsWith('{"listed":{') ? new RecordedListed(id, this) : entry?.data !== undefined ? this.read().listed : undefined;
  }

  read(): Partial<PartData> {
    return (this.#data ??= (entryData(this.entry) as Partial<PartData> | undefined) ?? {});
  }

  get page(): RecordedPage | undefined {
    return this.entry ? this.read().page : undefined;
  }
}

/**
 * A part's listed data as the record holds it, parsed when a field other than its id is first read (templates
 * read fields by name; JSON.stringify calls toJSON). Its fields are getters on the prototype: `'field' in`
 * is true of all of them, and spreading it copies only the id.
 */
class RecordedListed implements ListedPart {
  constructor(
    readonly id: string,
    private readonly from: RecordedPart,
  ) {}

  private get d(): ListedPart {
    return this.from.read().listed!;
  }

  get kind() { return this.d.kind; }
  get title() { return this.d.title; }
  get package() { return this.d.package; }
  get ratingText() { return this.d.ratingText; }
  get mainsMark() { return this.d.mainsMark; }
  get tagsText() { return this.d.tagsText; }
  get searchText() { return this.d.searchText; }
  get text() { return this.d.text; }
  get sort() { return this.d.sort; }
  get srfImpedanceText() { return this.d.srfImpedanceText; }
  get sourceFile() { return this.d.sourceFile; }
  get sourceHash() { return this.d.sourceHash; }

  toJSON(): ListedPart {
    return this.d;
  }
}

/**
 * What to record of a part: the record's own data when it still serves (the same object, so its shard is
 * not written again), else made from its page data; undefined when JSON cannot keep it.
 */
export function partData(page: ListedPart | PartPageData, reviewed: boolean, recorded: unknown): unknown {
  const last = recorded as Partial<PartData> | undefined;
  if (last?.listed && (!reviewed || last.page)) return last;
  const data: PartData = { listed: listedPart(page) };
  if (reviewed && 'charts' in page) data.page = recordedPage(page);
  return faithful(data) ? data : undefined;
}

/** Set the data each part's unit records for the next build (partData). */
export function recordParts(units: Pick<SiteUnits, 'setData' | 'recorded'>, library: Library, folio: FolioData, carried: ReadonlyMap<string, CarriedPart>): void {
  const reviewed = new Set(library.reviews.flatMap((r) => r.parts.map((p) => p.id)));
  const full = new Map([...folio.reviews.flatMap((r) => r.parts), ...folio.partPages].map((p) => [p.id, p]));
  for (const p of folio.parts) {
    // A part carried over with its listed data recorded, which no review shows, keeps its record unread.
    if (!reviewed.has(p.id) && carried.get(p.id)?.listed) continue;
    units.setData(`parts/${p.id}`, partData(full.get(p.id) ?? p, reviewed.has(p.id), units.recorded(`parts/${p.id}`)));
  }
}
