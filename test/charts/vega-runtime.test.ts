// The charts draw with vega's single-file build (src/charts/vega-runtime.ts); the package's own module
// entry is the reference here: the same release, the same API, and the same SVG for the same spec (scales,
// axes with formatted ticks, a log axis, lines, text), drawn by each.

import * as entry from 'vega';
import { describe, expect, it } from 'vitest';
import { vega } from '../../src/charts/vega-runtime.js';

/** A small spec that goes through d3's scales, tick formats and shapes (an invented sweep). */
const spec = {
  $schema: 'https://vega.github.io/schema/vega/v6.json',
  width: 300,
  height: 160,
  data: [{ name: 'sweep', values: Array.from({ length: 40 }, (_, i) => ({ f: 10 ** (3 + i / 8), z: Math.abs(1 / (2 * Math.PI * 10 ** (3 + i / 8) * 1e-7) - 2 * Math.PI * 10 ** (3 + i / 8) * 1e-9) + 0.01 })) }],
  scales: [
    { name: 'x', type: 'log', domain: { data: 'sweep', field: 'f' }, range: 'width' },
    { name: 'y', type: 'log', domain: { data: 'sweep', field: 'z' }, range: 'height', nice: true },
  ],
  axes: [
    { orient: 'bottom', scale: 'x', title: 'Frequency (Hz)', format: '~s' },
    { orient: 'left', scale: 'y', title: '|Z| (Ω)', grid: true },
  ],
  marks: [
    { type: 'line', from: { data: 'sweep' }, encode: { enter: { x: { scale: 'x', field: 'f' }, y: { scale: 'y', field: 'z' }, stroke: { value: '#333' } } } },
    { type: 'text', encode: { enter: { x: { value: 150 }, y: { value: 10 }, text: { value: 'minimum at the SRF' } } } },
  ],
};

async function svgOf(v: typeof entry): Promise<string> {
  const view = new v.View(v.parse(spec as unknown as entry.Spec), { renderer: 'none' });
  const svg = await view.toSVG();
  view.finalize();
  return svg;
}

describe("vega's single-file build", () => {
  it('is the release the package entry is, with the API the charts use', () => {
    expect(vega.version).toBe(entry.version);
    for (const name of ['parse', 'View', 'SVGStringRenderer', 'textMetrics', 'scale', 'expressionFunction']) expect(name in vega, name).toBe(true);
  });

  it('draws the same SVG as the package entry for the same spec', async () => {
    // Both measure text alike: the charts' own measure (text-metrics.ts), when installed, is set on the
    // single-file build only.
    type Metrics = { textMetrics: { width: unknown } };
    const entryMetrics = (entry as unknown as Metrics).textMetrics;
    const own = entryMetrics.width;
    entryMetrics.width = (vega as unknown as Metrics).textMetrics.width;
    const [bundled, modular] = await Promise.all([svgOf(vega), svgOf(entry)]).finally(() => (entryMetrics.width = own));
    expect(bundled).toContain('<path');
    expect(bundled).toContain('1k');
    expect(bundled).toBe(modular);
  });
});
