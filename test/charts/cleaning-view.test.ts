// cleaningView (src/charts/cleaning-view.ts): a View that holds no item of rows it no longer has, and draws
// what a plain vega View draws. Checked against vega itself: a plain View on the same spec and rows, and the
// join lookups of vega's own DataJoin operators (vega-encode), read from the parsed runtime.

import { describe, expect, it } from 'vitest';
import type { Spec, View } from 'vega';
import { vega } from '../../src/charts/vega-runtime.js';
import { cleaningView } from '../../src/charts/cleaning-view.js';

const spec: Spec = {
  width: 100,
  height: 100,
  // The tick values of the axis are a parameter, as every chart kind's axes (render-order.ts).
  signals: [{ name: 'ticks', value: [] }],
  // As vega-lite writes a layer's data: a source derived from the named one, through a filter.
  data: [
    { name: 'points' },
    { name: 'shown', source: 'points', transform: [{ type: 'filter', expr: 'isValid(datum.a)' }] },
  ],
  scales: [
    { name: 'x', type: 'linear', domain: [0, 10], range: 'width' },
    { name: 'y', type: 'linear', domain: [0, 10], range: 'height' },
  ],
  axes: [{ orient: 'bottom', scale: 'x', values: { signal: 'ticks' } }],
  marks: [
    {
      type: 'symbol',
      from: { data: 'shown' },
      encode: { update: { x: { scale: 'x', field: 'a' }, y: { scale: 'y', field: 'b' }, size: { value: 20 } } },
    },
    {
      type: 'text',
      from: { data: 'shown' },
      encode: { update: { x: { scale: 'x', field: 'a' }, y: { scale: 'y', field: 'b' }, text: { field: 'label' } } },
    },
  ],
};

/** Items that have left but are still held by the View's join lookups (vega-encode DataJoin: `empty`). */
function heldLeftItems(view: View): number {
  const nodes = (view as unknown as { _runtime: { nodes: Record<string, { value?: unknown }> } })._runtime.nodes;
  let held = 0;
  for (const node of Object.values(nodes)) {
    const map = node.value as { empty?: unknown; clean?: unknown } | undefined;
    if (map && typeof map.clean === 'function' && typeof map.empty === 'number') held += map.empty;
  }
  return held;
}

const rows = (chart: number) => Array.from({ length: 30 }, (_, i) => ({ a: (i * 7 + chart) % 10, b: (i * 3 + chart) % 10, label: `p${chart}-${i}` }));

/** Five tick values of the chart's own (a tick and its label are keyed by value: each chart's leave). */
const ticks = (chart: number) => [1, 3, 5, 7, 9].map((t) => t + chart / 10);

async function drawAll(view: View, charts: number): Promise<string[]> {
  const svgs: string[] = [];
  for (let chart = 0; chart < charts; chart++) {
    view.data('points', rows(chart));
    view.signal('ticks', ticks(chart));
    await view.runAsync();
    svgs.push(await view.toSVG());
  }
  return svgs;
}

describe('cleaningView', () => {
  it('keeps no item that has left, where a plain View keeps every one', async () => {
    const plain = new vega.View(vega.parse(spec), { renderer: 'none' });
    const cleaning = cleaningView(vega.parse(spec));
    await drawAll(plain, 5);
    await drawAll(cleaning, 5);
    // Four times five ticks and labels have left the plain View's axis (its domain line stays).
    expect(heldLeftItems(plain)).toBe(4 * 5 * 2);
    expect(heldLeftItems(cleaning)).toBe(0);
  });

  it('draws what a plain View draws, chart after chart', async () => {
    const plain = await drawAll(new vega.View(vega.parse(spec), { renderer: 'none' }), 6);
    const cleaning = await drawAll(cleaningView(vega.parse(spec)), 6);
    expect(cleaning).toEqual(plain);
    expect(new Set(cleaning).size).toBe(6);
  });
});
