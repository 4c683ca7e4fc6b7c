// The chart skeleton: its spec's layers come in one order (grid, band, zero line, the kind's marks, outline,
// key), its parameters are named after the axes, and a binding sizes the frame to the key and carries the
// axis datasets first, the key's last.

import { describe, expect, it } from 'vitest';
import { frame } from '../../src/charts/frame.js';
import { renderChart } from '../../src/charts/render.js';
import { curveLayer, seriesEncoding } from '../../src/charts/spec-parts.js';
import { xyChart } from '../../src/charts/xy-chart.js';

const FRAME = frame(300, 100, 28, 42);
const STYLE = seriesEncoding({ keys: ['a'], styles: [{ color: '#000000', dash: [], width: 1 }] });

const chart = xyChart<{ band: boolean }>({
  name: 'skeleton-test',
  frame: FRAME,
  x: { name: 'f', field: 'f', scale: 'log', title: 'X title' },
  y: { name: 'y', field: 'v', scale: 'linear', title: 'Y title' },
  keyStyle: STYLE,
  band: true,
  zeroLine: { color: '#888888', width: 1 },
  marks: (X, Y) => [curveLayer('curves', X, Y, STYLE)],
  draw: (input) => ({
    x: { domain: [1, 100], ticks: { values: [1, 10, 100], labels: ['1', '10', '100'], minor: [] } },
    y: { domain: [-1, 1], ticks: { values: [-1, 0, 1], labels: ['−1', '0', '1'], minor: [0.5] } },
    ...(input.band ? { band: { band: [{ f: 2, f2: 20 }], bandEdges: [{ f: 2 }] } } : {}),
    datasets: { curves: [{ f: 1, v: 0, s: 'a', i: 0 }, { f: 100, v: 0.5, s: 'a', i: 1 }] },
    key: [
      { kind: 'line', style: { s: 'a' }, text: 'a curve' },
      { kind: 'band', text: 'a band' },
    ],
  }),
});

describe('xyChart', () => {
  it('lays the spec out as grid, band, zero line, marks, outline, key', () => {
    const spec = chart.spec() as unknown as { params: { name: string }[]; layer: { data?: { name?: string } }[] };
    expect(spec.params.map((p) => p.name)).toEqual(['fDomain', 'fTicks', 'fLabels', 'yDomain', 'yTicks', 'yLabels']);
    expect(spec.layer.map((l) => l.data?.name ?? 'outline')).toEqual(['fMinor', 'fMajor', 'yMinor', 'yMajor', 'band', 'bandEdges', 'zero', 'curves', 'outline', 'keyBands', 'keySpread', 'keyLines', 'keyPoints', 'keyText']);
  });

  it('binds axes first, then band and zero line, the kind\'s data, and the key; the frame grows to the key', () => {
    const b = chart.bind({ band: true });
    expect(Object.keys(b.datasets)).toEqual(['fMinor', 'fMajor', 'yMinor', 'yMajor', 'band', 'bandEdges', 'zero', 'curves', 'keyBands', 'keySpread', 'keyLines', 'keyPoints', 'keyText']);
    expect(b.params).toMatchObject({ fDomain: [1, 100], fLabels: ['1', '10', '100'], yDomain: [-1, 1] });
    expect(b.datasets.zero).toEqual([{ v: 0 }]);
    expect(b.frame?.padding.top).toBeGreaterThan(0);
    expect(b.datasets.keyText.map((r) => r.t)).toEqual(['a curve', 'a band']);
    // Without a band, the band's datasets are there and empty.
    expect(chart.bind({ band: false }).datasets.band).toEqual([]);
  });

  it('renders through vega without a warning', async () => {
    const out = await renderChart(chart, { band: true }, { title: 'T', description: 'D' });
    expect(out.svg).toContain('X title');
    expect(out.svg).toContain('a band');
  });

  it('leaves its grid layers to the renderer, which draws them as two paths; the handed-out spec keeps them', async () => {
    expect(chart.underlaid).toEqual(['fMinor', 'fMajor', 'yMinor', 'yMajor']);
    const out = await renderChart(chart, { band: true }, { title: 'T', description: 'D' });
    // x: log over 1..100 on 300 px, ticks at 1, 10, 100 (0, 150, 300 px); y: linear over −1..1 on 100 px,
    // up from the bottom: −1, 0, 1 at 100, 50, 0 px, the minor 0.5 at 25 px.
    expect(out.svg).toContain('<path d="M0,25H300" stroke="#ececec" stroke-width="0.6"/><path d="M0,0V100M150,0V100M300,0V100M0,100H300M0,50H300M0,0H300" stroke="#c9c9c9" stroke-width="0.6"/>');
    expect(out.svg).not.toMatch(/<line[^>]*stroke="#(?:ececec|c9c9c9)"/);
    const spec = out.spec as { layer: { data?: { name?: string } }[]; datasets: Record<string, unknown[]> };
    expect(spec.layer.filter((l) => /Minor|Major/.test(l.data?.name ?? '')).map((l) => l.data?.name)).toEqual(['fMinor', 'fMajor', 'yMinor', 'yMajor']);
    expect(spec.datasets.yMinor).toEqual([{ v: 0.5 }]);
  });
});
