// A chart cache entry is written by the thread that drew the charts and read back whole; one that cannot be
// written never stops a build, and one written in part is refused when read (and drawn again). The file a
// page's SVGs wait in is the same kind of file, a hard link to the entry when there is one.

import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { placeChartFile, readCacheEntry, readChartFileSvgs, storeCharts } from '../../src/build/chart-cache-entry.js';
import type { ChartArtifact } from '../../src/build/chart-maker.js';

const root = mkdtempSync(join(tmpdir(), 'zfolio-cache-entry-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const charts: ChartArtifact[] = [
  { key: 'impedance', title: '|Z| of P-1 (Ω)', description: 'from 1 kHz to 10 GHz, "quoted"\nand a NUL \u0000 in words', svg: '<svg>&#937; Ω µ°</svg>', spec: { layer: [{ data: { name: 'curves' } }], datasets: { curves: [{ f: 1e3, v: 0.5 }] } } },
  { key: 'phase', title: 'Phase', description: '', svg: '<svg/>', spec: {} },
];

describe('chart cache entry', () => {
  it('reads back what was written: the charts as JSON, then each SVG, NUL-separated UTF-8 text', () => {
    const file = join(root, 'a.charts');
    storeCharts(charts, file, undefined);
    expect(readCacheEntry(file)).toEqual(charts);
    // The layout read with nothing but the text: JSON (RFC 8259) before the first NUL, the SVGs after.
    const [head, ...svgs] = readFileSync(file, 'utf8').split('\0');
    expect(svgs).toEqual(charts.map((c) => c.svg));
    expect((JSON.parse(head) as { key: string }[]).map((c) => c.key)).toEqual(['impedance', 'phase']);
    // Written under another name and renamed into place: nothing else is left in the folder.
    expect(readdirSync(root).filter((n) => n.startsWith('a.'))).toEqual(['a.charts']);
  });

  it('does not throw when the entry cannot be written, and still writes the SVGs\' file', () => {
    const file = join(root, 'no-such-folder', 'b.charts');
    const svgFile = join(root, 'b-svgs');
    expect(() => storeCharts(charts, file, svgFile)).not.toThrow();
    expect(existsSync(file)).toBe(false);
    expect(readChartFileSvgs(svgFile)).toEqual(charts.map((c) => c.svg));
  });

  it('throws when the SVGs\' file cannot be written (a page would lose its charts)', () => {
    expect(() => storeCharts(charts, undefined, join(root, 'no-such-folder', 'svgs'))).toThrow();
  });

  it('refuses an entry written in part, cut anywhere', () => {
    const file = join(root, 'c.charts');
    storeCharts(charts, file, undefined);
    const whole = readFileSync(file);
    for (const length of [whole.length - 1, whole.length - 4, Math.floor(whole.length / 2), 3]) {
      writeFileSync(file, whole.subarray(0, length));
      expect(() => readCacheEntry(file)).toThrow();
    }
  });

  it('links the SVGs\' file to the entry, which a later entry of the same name replaces without changing the link', () => {
    const file = join(root, 'd.charts');
    const svgFile = join(root, 'd-svgs');
    storeCharts(charts, file, svgFile);
    expect(statSync(svgFile).ino).toBe(statSync(file).ino);
    const other = charts.map((c) => ({ ...c, svg: '<svg>other</svg>' }));
    storeCharts(other, file, undefined);
    expect(readCacheEntry(file).map((c) => c.svg)).toEqual(['<svg>other</svg>', '<svg>other</svg>']);
    expect(readChartFileSvgs(svgFile)).toEqual(charts.map((c) => c.svg));
  });

  it('places an entry read from the cache as a page\'s SVGs\' file: a link, or written when the entry is gone', () => {
    const file = join(root, 'e.charts');
    storeCharts(charts, file, undefined);
    placeChartFile(file, charts, join(root, 'e-linked'));
    expect(statSync(join(root, 'e-linked')).ino).toBe(statSync(file).ino);
    placeChartFile(join(root, 'gone.charts'), charts, join(root, 'e-written'));
    expect(readChartFileSvgs(join(root, 'e-written'))).toEqual(charts.map((c) => c.svg));
  });
});
