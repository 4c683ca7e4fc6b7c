// A part's charts wait on disk from the moment they are drawn until the eleventy run that renders their page
// reads them back: the page data a build holds for thousands of parts has no SVG in it, and every page still
// shows its own charts.

import { readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeGeneratedLibrary } from '../../bench/generate.js';
import { buildFolio } from '../../src/build/build.js';
import type { ChartMaker } from '../../src/build/chart-maker.js';
import { ChartPool } from '../../src/build/chart-pool.js';
import type { Part } from '../../src/model/part.js';
import { analysed, inductorPart } from '../charts/fixtures.js';
import { SPILL_FOLDER, SvgSpill } from '../../src/build/svg-spill.js';
import type { PartPageData } from '../../src/pages/site-data.js';
import { filesUnder, tempDir } from '../site-helpers.js';
import { noCharts } from './no-charts.js';

const page = (id: string, svgs: string[]) => ({ id, charts: svgs.map((svg, i) => ({ key: `k${i}`, title: id, description: '', svg, specFile: '' })) }) as unknown as PartPageData;

describe('spilled part charts', () => {
  const dir = tempDir('spill');
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('empties the charts it keeps, gives them back for a run and takes them again after; a page not spilled keeps its own', () => {
    const spill = new SvgSpill(dir);
    // Characters beyond one byte and markup come back as they were.
    const a = page('A', ['<svg><text>1 &#937; \u03a9</text></svg>', '<svg a="1"/>']);
    const b = page('B', ['<svg>b</svg>']);
    const kept = page('C', ['<svg>c</svg>']);
    spill.put(a);
    spill.put(b);
    expect([...a.charts, ...b.charts].map((c) => c.svg)).toEqual(['', '', '']);
    spill.load([a, kept]);
    expect(a.charts.map((c) => c.svg)).toEqual(['<svg><text>1 &#937; \u03a9</text></svg>', '<svg a="1"/>']);
    expect(b.charts[0].svg).toBe('');
    expect(kept.charts[0].svg).toBe('<svg>c</svg>');
    spill.unload([a, kept]);
    expect(a.charts.map((c) => c.svg)).toEqual(['', '']);
    expect(kept.charts[0].svg).toBe('<svg>c</svg>');
    spill.load([b]);
    expect(b.charts[0].svg).toBe('<svg>b</svg>');
    expect(filesUnder(join(dir, SPILL_FOLDER))).toHaveLength(2);
    spill.remove();
    expect(filesUnder(dir)).toEqual([]);
  });

  it('reads the SVGs of charts drawn in a worker, in this thread or read from the cache from the file it reserved for them', async () => {
    const part = { ...inductorPart, source: { path: 'l.yaml', hash: 'spill-l' } } as unknown as Part;
    const a = analysed(part);
    const reference = new ChartPool({ workers: 0, settingsKey: 'reference' });
    const expected = (await reference.partCharts(a)).map((c) => c.svg);
    await reference.close();
    expect(expected).toHaveLength(4);
    const cacheDir = join(dir, 'cache');
    const spill = new SvgSpill(join(dir, 'staging'));
    const drawnInto = async (pool: ChartPool) => {
      const file = spill.reserve();
      const charts = await pool.partCharts(a, undefined, file);
      await pool.close();
      expect(charts.map((c) => c.svg)).toEqual(['', '', '', '']);
      const p = page('L', charts.map((c) => c.svg));
      spill.adopt(p, file);
      spill.load([p]);
      expect(p.charts.map((c) => c.svg)).toEqual(expected);
      return file;
    };
    await drawnInto(new ChartPool({ workers: 0, settingsKey: 'no cache' }));
    await drawnInto(new ChartPool({ workers: 1, settingsKey: 'no cache' }));
    await drawnInto(new ChartPool({ workers: 1, settingsKey: 'cached', cacheDir }));
    // The entry the worker wrote, read from the cache now: the page's file is a link to it.
    const cached = new ChartPool({ workers: 0, settingsKey: 'cached', cacheDir });
    const file = await drawnInto(cached);
    expect(cached.stats.fromCache).toBe(1);
    const [entry] = readdirSync(cacheDir);
    expect(statSync(file).ino).toBe(statSync(join(cacheDir, entry)).ino);
    spill.remove();
  }, 120_000);

  it('builds pages with their own charts from page data that holds none, and leaves no spill in the site', async () => {
    const root = writeGeneratedLibrary(12, 3);
    writeFileSync(join(root, 'folio.yaml'), 'title: Generated library (invented parts)\nsweep: {from: 100, to: 10G, per-decade: 10}\n');
    try {
      // Each part's one chart names the part, so a page showing another part's chart is caught.
      const charts: ChartMaker = { ...noCharts, partCharts: async (a) => [{ key: 'impedance', title: a.part.id, description: a.part.id, svg: `<svg data-part="${a.part.id}"></svg>` }] };
      const result = await buildFolio({ libraryRoot: root, cache: false, charts, partPagesPerRun: 5 });
      expect(result.ok).toBe(true);
      expect(result.folio!.partPages).toHaveLength(12);
      for (const p of result.folio!.partPages) {
        expect(p.charts.map((c) => c.svg)).toEqual(['']);
        const html = readFileSync(join(root, '_site', 'parts', p.id, 'index.html'), 'utf8');
        expect([...html.matchAll(/<svg data-part="([^"]+)"/g)].map((m) => m[1])).toEqual([p.id]);
      }
      expect(filesUnder(join(root, '_site')).filter((f) => f.includes(SPILL_FOLDER))).toEqual([]);
    } finally {
      rmSync(root, { recursive: true, force: true });
    }
  }, 120_000);
});
