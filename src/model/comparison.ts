// comparisons/*.yaml: a titled set of parts drawn on common axes, named by id or chosen by a filter.
//
//   title: 0402 decoupling candidates
//   parts: [CAP-A, CAP-B]                 # either a list of ids ...
//   select: {kind: capacitor, tags: [decoupling], package: "0402"}   # ... or a filter (all fields optional)

import type { Node } from 'yaml';
import { Fields, describeNode, missingTarget, scalarText, type ReadContext } from './fields.js';
import { PART_KINDS, type Part, type PartKind } from './part.js';
import { positionOf, type SourceFile } from './source.js';
import { quote, type SourcePosition } from './diagnostics.js';

export interface PartFilter {
  kind?: PartKind;
  /** A part must carry every one of these tags. */
  tags: string[];
  package?: string;
}

export interface Comparison {
  title: string;
  description?: string;
  /** The parts in the order given (ids) or in library order (filter). */
  parts: Part[];
  filter?: PartFilter;
  source: SourceFile;
  at: SourcePosition;
}

/** A comparison is only readable once the parts are known, to check every id. */
export function readComparison(ctx: ReadContext, partsById: ReadonlyMap<string, Part>, allParts: readonly Part[]): Comparison | undefined {
  const before = ctx.diagnostics.errorCount;
  const root = Fields.of(ctx, ctx.source.document.contents as Node | null, '');
  if (!root) return undefined;
  root.expect(['title', 'description', 'parts', 'select'], ['title']);
  const title = root.text('title');
  const description = root.text('description');
  let parts: Part[] = [];
  let filter: PartFilter | undefined;

  if (root.has('parts') === root.has('select')) {
    root.error(undefined, 'a comparison needs either "parts" (a list of ids) or "select" (a filter), not both and not neither');
  } else if (root.has('parts')) {
    const list = root.seq('parts');
    for (const item of list?.items ?? []) {
      const id = scalarText(item as Node);
      const at = positionOf(ctx.source, item as Node);
      if (id === undefined) {
        ctx.diagnostics.error(at, `parts: expected a part id, found ${describeNode(item as Node)}`);
        continue;
      }
      const part = partsById.get(id);
      if (!part) {
        ctx.diagnostics.error(at, `parts: ${missingTarget(ctx, 'parts', 'part with id', id, partsById.keys())}`);
        continue;
      }
      if (parts.includes(part)) ctx.diagnostics.error(at, `parts: ${quote(id)} is listed twice`);
      else parts.push(part);
    }
    if (list && list.items.length === 0) root.error('parts', 'expected at least one part id');
  } else {
    const select = root.map('select');
    if (select) {
      select.expect(['kind', 'tags', 'package']);
      filter = {
        kind: select.text('kind', { oneOf: PART_KINDS }) as PartKind | undefined,
        tags: select.textList('tags'),
        package: select.text('package'),
      };
      parts = allParts.filter((p) => matches(p, filter!));
      if (parts.length === 0 && ctx.diagnostics.errorCount === before) {
        ctx.diagnostics.warning(root.position('select'), 'select: no part in the library matches this filter; the comparison will be empty');
      }
    }
  }
  if (ctx.diagnostics.errorCount > before || title === undefined) return undefined;
  return { title, description, parts, filter, source: ctx.source, at: root.position() };
}

/** How reviews name a comparison: its path under comparisons/ without the extension ("decoupling-0402"). */
export function comparisonKey(c: Comparison): string {
  return c.source.path.replace(/^comparisons\//, '').replace(/\.ya?ml$/i, '');
}

export function matches(part: Part, filter: PartFilter): boolean {
  if (filter.kind && part.kind !== filter.kind) return false;
  if (filter.package && part.package !== filter.package) return false;
  return filter.tags.every((t) => part.tags.includes(t));
}
