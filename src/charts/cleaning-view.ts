// A vega View that lets go of a mark's items as soon as they leave.
//
// vega joins a mark's items to its rows and keeps an item that has left in the join's lookup, marked as
// gone, until more than the dataflow's `cleanThreshold` (10,000) have left; only then is the lookup
// cleaned. A View reused for chart after chart (render.ts) never got there, so it held every item that had
// left it and all they reach (a faceted curve's group item holds the curve's point items): rendering parts
// one after another, the heap after a full collection grew by about 6.5 MB every 100 parts (42, 49, 55 MB
// after 100, 200, 300 parts) and stayed at 35 MB with no threshold, which cleans the lookup after each run
// in which items left. What is drawn does not change: the scene holds only the items that are there, either
// way (test/charts/cleaning-view.test.ts).

import type { Runtime, View } from 'vega';
import { vega } from './vega-runtime.js';

export function cleaningView(runtime: Runtime): View {
  const view = new vega.View(runtime, { renderer: 'none' });
  (view as unknown as { cleanThreshold: number }).cleanThreshold = 0;
  return view;
}
