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

  it('wraps a long entry at spaces, never between a number and its unit', () => {
    const text = 'absorbing band (R − Rdc ≥ |X|): 110 MHz – 2.64 GHz';
    for (const width of [180, 200, 230, 260, 300]) {
      const k = layoutKey([{ kind: 'band', text }], width);
      const lines = k.datasets.keyText.map((t) => String(t.t));
      expect(lines.join(' ')).toBe(text);
      for (const line of lines) expect(line, `${width} px: ${JSON.stringify(lines)}`).not.toMatch(/\d$/);
    }
  });

  it('takes at least the rows asked for, the empty ones between its entries and the plot', () => {
    const own = layoutKey(items, 500);
    const taller = layoutKey(items, 500, undefined, 3);
    expect(taller.rows).toBe(3);
    expect(taller.topPadding).toBe(3 * 16 + 12);
    // The entries keep their place counted from the top of the chart (the plot moved down by two rows).
    const fromTop = (k: typeof own) => k.datasets.keyText.map((t) => (t.y as number) + k.topPadding);
    expect(fromTop(taller)).toEqual(fromTop(own));
    expect(layoutKey(items, 500, undefined, 0)).toEqual(own);
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

describe('chart key: entries longer than the key is wide', () => {
  it('wrap at spaces beside their symbol, each line within the width, and the frame grows by the extra row', async () => {
    const { textWidth } = await import('../../src/charts/text-width.js');
    const long: KeyItem = { kind: 'band', text: 'absorbing band (R − Rdc ≥ |X|): 110 MHz – 1.51 GHz' };
    const k = layoutKey([{ kind: 'line', style: { s: 'mag' }, text: '|Z|' }, long], 240);
    const texts = k.datasets.keyText.filter((t) => t.t !== '|Z|');
    expect(texts.length).toBeGreaterThan(1);
    expect(texts.map((t) => t.t).join(' ')).toBe(long.text);
    for (const t of texts) {
      expect(t.x).toBe(26 + 5);
      expect((t.x as number) + textWidth(t.t as string, 10.5)).toBeLessThanOrEqual(240);
    }
    // One row for |Z| and the first line? No: the long entry does not fit beside |Z|, so it starts a row.
    expect(k.rows).toBe(1 + texts.length);
    expect(k.topPadding).toBe(k.rows * 16 + 12);
    // Lines of one entry sit one row apart, below its symbol's row.
    expect((texts[1].y as number) - (texts[0].y as number)).toBe(16);
  });
});
