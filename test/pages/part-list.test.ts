// The parts index in pages: every part on exactly one page in id order, each page knowing its place, and
// the row scripts holding every row once, in the order the page's script reads (templates/assets/folio.js).

import { describe, expect, it } from 'vitest';
import { indexRow, indexRowFiles, partList } from '../../src/pages/part-list.js';
import type { PartPageData } from '../../src/pages/site-data.js';

/** Page data with only what the index reads; invented ids. */
function part(i: number): PartPageData {
  const id = `ORV-X-${String(i).padStart(4, '0')}`;
  return {
    id,
    kind: i % 2 ? 'inductor' : 'capacitor',
    title: `Invented part ${i} <b>`,
    package: '0402',
    ratingText: '16 V DC',
    tagsText: 'generated',
    searchText: `${id} invented`.toLowerCase(),
    text: { kindLabel: 'Capacitor', nominalText: '100 nF', srfText: '10 MHz', bandText: '≤ 100 Hz to 5 MHz' },
    sort: { nominal: 1e-7, rating: 16, srf: i % 3 ? 1e7 : '', band: 5e6 },
  } as unknown as PartPageData;
}

describe('the parts index in pages', () => {
  const parts = Array.from({ length: 1234 }, (_, i) => part(1233 - i));
  const list = partList(parts, 200, 500);

  it('puts every part on one page, in id order, 200 a page', () => {
    expect(list.pages.map((p) => p.parts.length)).toEqual([200, 200, 200, 200, 200, 200, 34]);
    expect(list.pages.flatMap((p) => p.parts.map((x) => x.id))).toEqual(parts.map((p) => p.id).sort());
    expect(list.pages.map((p) => [p.file, p.root, p.first, p.last])).toEqual([
      ['index.html', '', 1, 200],
      ['list/2.html', '../', 201, 400],
      ['list/3.html', '../', 401, 600],
      ['list/4.html', '../', 601, 800],
      ['list/5.html', '../', 801, 1000],
      ['list/6.html', '../', 1001, 1200],
      ['list/7.html', '../', 1201, 1234],
    ]);
    expect(list.total).toBe(1234);
  });

  it('writes every row once into the row scripts, which call the page with their index', () => {
    const files = indexRowFiles(list);
    expect([...files.keys()]).toEqual(['list/rows-1.js', 'list/rows-2.js', 'list/rows-3.js']);
    const rows: unknown[][] = [];
    [...files.values()].forEach((text, i) => {
      const call = /^zfolioIndexRows\((\d+), (.*)\);\n$/s.exec(text);
      expect(call).not.toBeNull();
      expect(Number(call![1])).toBe(i);
      // Markup in the data is escaped, and the JSON still parses to the same text.
      expect(call![2]).not.toContain('<');
      rows.push(...JSON.parse(call![2]));
    });
    expect(rows).toEqual(list.pages.flatMap((p) => p.parts).map(indexRow));
    expect(rows[0][1]).toBe('Invented part 0 <b>');
  });

  it('needs no pages of its own nor row scripts for a library that fits on one page', () => {
    const small = partList(parts.slice(0, 200), 200, 500);
    expect(small.pages).toHaveLength(1);
    expect(small.chunks).toEqual([]);
    expect(indexRowFiles(small).size).toBe(0);
  });
});
