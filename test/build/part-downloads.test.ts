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
import { referenceZAt } from '../reference/impedance.js';

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
    // No chart spec: the part charts link the site's shared specs (spec-download.ts).
    expect([...fromWorker.keys()]).toEqual(['DEMO-C-100N.s1p', 'DEMO-C-100N.subckt', 'figures.json', 'sweep.csv']);
    expect(files(join(root, 'here'))).toEqual(fromWorker);
    expect(files(join(root, 'cached'))).toEqual(fromWorker);

    // sweep.csv holds frequency, R and X over the analysis' sweep, each frequency to 6 significant digits
    // (JavaScript's own toPrecision as the reference) and R and X the model there (complex.js, test/reference).
    const rows = fromWorker.get('sweep.csv')!.trim().split('\n');
    expect(rows).toHaveLength(a.frequencies.length + 1);
    expect(rows[0]).toBe('frequency_Hz,R_ohm,X_ohm');
    for (const k of [0, Math.floor(a.frequencies.length / 2), a.frequencies.length - 1]) {
      const [f, r, x] = rows[k + 1].split(',').map(Number);
      expect(f).toBe(Number(a.frequencies[k].toPrecision(6)));
      const z = referenceZAt(part.network, f);
      expect(Math.abs(r - z.re)).toBeLessThanOrEqual(5.0001e-6 * Math.abs(z.re));
      expect(Math.abs(x - z.im)).toBeLessThanOrEqual(5.0001e-6 * Math.abs(z.im));
    }
    // The Touchstone file is at the same frequencies.
    const points = fromWorker.get('DEMO-C-100N.s1p')!.split('\n').filter((l) => /^\d/.test(l));
    expect(points.map((l) => Number(l.split(' ')[0]))).toEqual(rows.slice(1).map((l) => Number(l.split(',')[0])));
  }, 120_000);
});
