import { describe, expect, it } from 'vitest';
import { frameForKey, layoutKey, type KeyItem } from '../../src/charts/key.js';
import { frame } from '../../src/charts/frame.js';

describe('chart key', () => {
  const items: KeyItem[] = [
    { kind: 'line', style: { s: 'mag' }, text: '|Z|' },
    { kind: 'point', color: '#000000', text: 'resonance' },
    { kind: 'band', text: 'usable band' },
  ];

  it('puts short items in one row just above the plot, one dataset row per symbol and text', () => {
    const k = layoutKey(items, 500);
    expect(k.rows).toBe(1);
    expect(k.topPadding).toBe(28);
    expect(k.datasets.keyLines).toEqual([{ x0: 0, x1: 26, y: -17, s: 'mag' }]);
    expect(k.datasets.keyPoints).toHaveLength(1);
    expect(k.datasets.keyBands).toHaveLength(1);
    expect(k.datasets.keyText.map((t) => t.t)).toEqual(['|Z|', 'resonance', 'usable band']);
    // Left to right, none overlapping the next.
    const xs = k.datasets.keyText.map((t) => t.x as number);
    expect([...xs].sort((a, b) => a - b)).toEqual(xs);
  });

  it('wraps to more rows when the width runs out, and the frame grows to hold them', () => {
    const many: KeyItem[] = Array.from({ length: 9 }, (_, i) => ({ kind: 'line', style: { c: `c${i}` }, text: `PART-${i}-WITH-A-LONG-ID` }));
    const k = layoutKey(many, 536, 3);
    expect(k.rows).toBe(3);
    expect(k.topPadding).toBe(3 * 16 + 12);
    expect(new Set(k.datasets.keyText.map((t) => t.x)).size).toBe(3);
    const f = frameForKey(frame(536, 300), k);
    expect(f.padding.top).toBe(60);
    // Every row sits above the plot (negative y) and below the top of the chart.
    for (const t of k.datasets.keyText) expect(t.y as number).toBeLessThan(0);
    for (const t of k.datasets.keyText) expect(t.y as number).toBeGreaterThan(-f.padding.top);
  });

  it('removes control characters from key texts', () => {
    const k = layoutKey([{ kind: 'band', text: 'a\u0001b' }], 300);
    expect(k.datasets.keyText[0].t).toBe('ab');
  });
});
