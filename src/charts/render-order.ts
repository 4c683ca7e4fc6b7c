// Why a chart's SVG does not depend on the chart its View drew before, and what a spec may hold for that to
// stay true.
//
// vega joins a mark's items to its data by a key. An item whose key is still present after an update keeps
// its place among the mark's items, and new items are appended after the kept ones; the SVG lists items in
// that order. Items are keyed by their row (a tuple id) unless vega is told otherwise, and a render replaces
// every row of every source, so such items are all new and follow the data's order. Only two kinds of item
// are keyed by values the next chart can share:
//   - an axis's ticks, labels and grid lines, keyed by tick value: every axis takes its tick values from a
//     parameter, which the render resets to an empty list before setting it, unless the tick values, the
//     domain and the frame are all the last chart's (the same ticks, already in their order);
//   - the lines of a faceted mark (one group item per series), keyed by the series fields: the source the
//     facet reads is emptied before it is filled, unless its rows are the last chart's.
// A source or parameter that is the same as the last chart's is not set again: its items stay as they are,
// which is as this chart would make them.
// Anything else that keys items by value or keeps rows across updates would bring the old order back: a
// mark with its own key, a legend (keyed by value), a data transform that makes rows of its own (an
// aggregate's rows live as long as their group does) or a transform on a mark. `keyedItems` refuses a
// spec holding one, so a chart kind that needs one fails its tests instead of drawing in an order that
// depends on the chart before; test/charts/render-order.test.ts shows each kind of reordering happen on a
// View that is not cleared, and not happen through renderChart.

/** Data transforms that only drop rows or set fields on them: rows pass through, none are made. */
const PASS_THROUGH = new Set(['filter', 'formula']);

interface VegaData {
  name: string;
  source?: string | string[];
  transform?: { type: string }[];
}

interface VegaMark {
  name?: string;
  key?: unknown;
  transform?: unknown[];
  from?: { data?: string; facet?: { data: string } };
  marks?: VegaMark[];
  axes?: VegaAxis[];
  scales?: VegaScale[];
  legends?: unknown[];
}

interface VegaAxis {
  scale: string;
  values?: { signal?: string };
}

interface VegaScale {
  name: string;
  domain?: { signal?: string };
}

/** A compiled vega spec, as far as the order of its items goes. */
export interface VegaOrderSpec extends VegaMark {
  data?: VegaData[];
}

/** An axis: the parameter of its tick values and the parameter of its scale's domain (none: not a parameter). */
export interface AxisKeys {
  ticks: string;
  domain?: string;
}

/**
 * What keys items by value: the named sources (of `named`) whose rows feed a faceted mark, and each axis's
 * tick and domain parameters. Throws when the spec holds anything else that keeps items across renders (see
 * above), or an axis whose tick values are not one of `resetParams`.
 */
export function keyedItems(spec: VegaOrderSpec, named: readonly string[], resetParams: readonly string[], chart: string): { sources: Set<string>; axes: AxisKeys[] } {
  const refuse = (what: string) => {
    throw new Error(`chart "${chart}": ${what}, whose items vega keeps from one chart to the next (render-order.ts)`);
  };
  const data = new Map<string, VegaData>();
  for (const d of spec.data ?? []) {
    data.set(d.name, d);
    for (const t of d.transform ?? []) if (!PASS_THROUGH.has(t.type)) refuse(`data "${d.name}" has a "${t.type}" transform`);
  }
  /** The named sources a data set is derived from. */
  const roots = (name: string, seen = new Set<string>()): string[] => {
    if (seen.has(name)) return [];
    seen.add(name);
    const d = data.get(name);
    const sources = d?.source === undefined ? [] : Array.isArray(d.source) ? d.source : [d.source];
    return [...(named.includes(name) ? [name] : []), ...sources.flatMap((s) => roots(s, seen))];
  };
  const sources = new Set<string>();
  const axes: AxisKeys[] = [];
  const visit = (mark: VegaMark, scales: ReadonlyMap<string, VegaScale>) => {
    const inScope = new Map([...scales, ...(mark.scales ?? []).map((sc) => [sc.name, sc] as const)]);
    if (mark.key !== undefined) refuse(`mark "${mark.name}" has a key`);
    if (mark.transform?.length) refuse(`mark "${mark.name}" has a transform`);
    if (mark.legends?.length) refuse('a legend');
    for (const axis of mark.axes ?? []) {
      const ticks = axis.values?.signal;
      if (ticks === undefined || !resetParams.includes(ticks)) refuse(`an axis whose tick values are not a parameter reset before each render (${ticks ?? 'none'})`);
      else axes.push({ ticks, domain: inScope.get(axis.scale)?.domain?.signal });
    }
    if (mark.from?.facet) for (const root of roots(mark.from.facet.data)) sources.add(root);
    for (const child of mark.marks ?? []) visit(child, inScope);
  };
  visit(spec, new Map());
  return { sources, axes };
}

/** Rows of a size worth comparing with the next chart's (a key, a grid): larger ones (curves) always differ. */
export const COMPARED_ROWS = 64;

/** Whether two parameter values are the same: numbers by Object.is, lists and plain objects member by member. */
export function sameValue(a: unknown, b: unknown): boolean {
  if (Object.is(a, b)) return true;
  if (Array.isArray(a)) return Array.isArray(b) && a.length === b.length && a.every((v, i) => sameValue(v, b[i]));
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object' || Array.isArray(b)) return false;
  const ka = Object.keys(a);
  const kb = Object.keys(b);
  return ka.length === kb.length && ka.every((k, i) => k === kb[i] && sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}
