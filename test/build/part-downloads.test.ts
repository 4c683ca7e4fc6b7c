// A part's downloads are written by the thread that draws its charts: the same files whether a worker
// thread draws them, this thread draws them, or the charts come from the cache.

import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ChartPool } from '../../src/build/chart-pool.js';
import { partDownloads } from '../../src/build/part-downloads.js';
import type { Part } from '../../src/model/part.js';
import { analysed, capacitorPart, SWEEP } from '../charts/fixtures.js';

const root = mkdtempSync(join(tmpdir(), 'zfolio-downloads-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const part = { ...capacitorPart, source: { path: 'parts/c.yaml', hash: 'c0ffee' } } as unknown as Part;
const place = (name: string) => ({ folder: join(root, name), sweep: SWEEP });
const files = (dir: string) => new Map(readdirSync(dir).sort().map((f) => [f, readFileSync(join(dir, f), 'utf8')]));

describe('part downloads', () => {
  it('are plain data a worker can be sent (structured clone keeps every field)', () => {
    const d = partDownloads(analysed(part), place('clone'));
    const copy = structuredClone(d);
    expect(copy).toEqual(d);
    expect(copy.columns.magnitudeOhm).toBeInstanceOf(Float64Array);
  });

  it('are the same files from a worker thread, from this thread and from the cache', async () => {
    const a = analysed(part);
    const cacheDir = join(root, 'cache');
    const worker = new ChartPool({ workers: 1, settingsKey: 'test', cacheDir });
    try {
      await worker.partCharts(a, place('worker'));
      expect(worker.stats.rendered).toBe(1);
    } finally {
      await worker.close();
    }
    const inThread = new ChartPool({ workers: 0, settingsKey: 'test-0' });
    await inThread.partCharts(a, place('here'));
    await inThread.close();
    // The same part again, with the same settings: answered from the cache, its downloads written here.
    const again = new ChartPool({ workers: 1, settingsKey: 'test', cacheDir });
    try {
      await again.partCharts(a, place('cached'));
      expect(again.stats).toMatchObject({ fromCache: 1, rendered: 0 });
    } finally {
      await again.close();
    }
    const fromWorker = files(join(root, 'worker'));
    expect([...fromWorker.keys()]).toEqual(['DEMO-C-100N.s1p', 'DEMO-C-100N.subckt', 'admittance.vl.json', 'figures.json', 'impedance.vl.json', 'phase.vl.json', 'plane.vl.json', 'sweep.csv']);
    expect(files(join(root, 'here'))).toEqual(fromWorker);
    expect(files(join(root, 'cached'))).toEqual(fromWorker);

    // sweep.csv holds the analysis' sweep, each value to 6 significant digits (JavaScript's own toPrecision
    // as the reference), one row per sweep point.
    const rows = fromWorker.get('sweep.csv')!.trim().split('\n');
    expect(rows).toHaveLength(a.frequencies.length + 1);
    const header = rows[0].split(',');
    const at = (name: string) => header.indexOf(name);
    for (const k of [0, Math.floor(a.frequencies.length / 2), a.frequencies.length - 1]) {
      const cells = rows[k + 1].split(',').map(Number);
      expect(cells[at('frequency_Hz')]).toBe(Number(a.frequencies[k].toPrecision(6)));
      expect(cells[at('Zmag_ohm')]).toBe(Number(a.columns.magnitudeOhm[k].toPrecision(6)));
    }
    // The specs read their curves from it rather than carrying them.
    expect(JSON.parse(fromWorker.get('impedance.vl.json')!).layer.some((l: { data?: { url?: string } }) => l.data?.url === 'sweep.csv')).toBe(true);
  }, 120_000);
});
